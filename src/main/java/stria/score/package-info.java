/**
 * Imperfect tandem-repeat loci from exact runs: the stage between the run finder and the writers.
 *
 * <p>{@link stria.score.LocusCaller} is the entry point: it seeds candidates from short exact runs and
 * from word recurrences ({@code RecurrenceSeeds}), extends and measures them by aligning against the
 * repeated consensus ({@link stria.score.WrapAligner}), lets overlapping candidates compete so that each
 * base belongs to one period, and applies the filters of {@link stria.score.ScoreSettings}.
 * {@link stria.score.Locus} is the record every writer prints; {@link stria.score.MotifClass} gives the
 * canonical motif. The pipeline may call with any window or shard cut: the caller's contract makes the
 * output independent of them.
 */
package stria.score;
