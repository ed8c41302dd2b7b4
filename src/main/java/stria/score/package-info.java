/**
 * Imperfect tandem-repeat loci from exact runs: the stage between the run finder and the writers.
 *
 * <p>{@link stria.score.LocusCaller} is the entry point and only orchestrates; it holds its settings and
 * nothing else, so one instance serves every thread, and each call works in a
 * {@link stria.score.ScoreWorkspace} (aligners, vote counts, the recurrence word table). The pieces, in the
 * order a call uses them: {@code Seeds} (exact runs of short period and word recurrences,
 * {@code RecurrenceSeeds}), {@code QuietPoints} (where a call may cut), {@code SeedCoverage} (which seeds a
 * candidate already explains), {@code CandidateBuilder} (extension by wraparound alignment,
 * {@link stria.score.WrapAligner}; consensus votes through one {@code VoteTally} and {@code Consensus}),
 * {@code PeriodAlternatives} and {@code CompoundSplit} (more candidates from one), the filter
 * ({@link stria.score.LocusFilter}, also the rule for exact runs) and {@code Competition} (one period per
 * base). {@link stria.score.Locus} is the record every writer prints, {@link stria.score.ExactLocus} builds
 * it for an exact run, {@link stria.score.MotifClass} gives the canonical motif. Every alignment is scored
 * by one {@link stria.score.ScoringModel} (log-odds in tenths of a bit) chosen by position from the contig's
 * {@link stria.score.Background} (composition blocks), and {@link stria.score.Calibration} turns a score into
 * its evalue. The pipeline may call with
 * any window or shard cut: the caller's contract makes the output independent of them.
 *
 * <p>May use: {@code stria.io} (base codes, {@code ContigBytes}) and {@code stria.repeats} ({@code RunList})
 * only, plus the JDK. Nothing here reads files (but the shipped calibration table, a class-path resource),
 * starts threads or knows about the command line; hot loops
 * stay on primitive arrays.
 */
package stria.score;
