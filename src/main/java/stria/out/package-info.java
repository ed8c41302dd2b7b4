/**
 * Results out: a scan delivers loci to {@link stria.out.LocusSink}s, of which the writers are some:
 * {@link stria.out.ResultWriter} (BED or TSV, {@link stria.out.ResultFormat}, lines by
 * {@link stria.out.LocusFormat}) and {@link stria.out.MaskedFastaWriter}. {@link stria.out.ResultHeader} is
 * the {@code #} header every result starts with; {@link stria.out.AtomicOutputs} writes every file of a
 * command all-or-nothing (BGZF for {@code .gz}), {@link stria.out.Tabix} indexes a BGZF BED, and
 * {@link stria.out.ResultInput} reads results back (merge, report).
 *
 * <p>May use {@code io} (contig records and bases) and {@code score} (the {@code Locus} record); knows
 * nothing of how loci are found.
 */
package stria.out;
