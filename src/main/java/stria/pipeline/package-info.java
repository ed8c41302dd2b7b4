/**
 * The scan as a library call. A {@link stria.pipeline.Genome} (the contigs of the inputs) and a
 * {@link stria.pipeline.Selection} (whole genome, regions, one shard) make a {@link stria.pipeline.ScanPlan}:
 * the {@link stria.pipeline.ScanUnit}s to scan and what the result header says about them.
 * {@link stria.pipeline.GenomeScan} runs a plan with {@link stria.pipeline.ScanSettings} (built by
 * {@link stria.pipeline.ScanOptions}, the home of the options, their defaults per mode and their checks) and
 * delivers the loci to a {@link stria.out.LocusSink}.
 *
 * <p>Inside: windows ({@link stria.pipeline.WindowPlan}, cut by {@link stria.pipeline.Geometry}) computed on
 * a pool ({@code WindowRunner}), stitched in order ({@code Stitcher}), turned into loci by the mode
 * ({@code ExactMode}, {@code ImperfectMode}); the bases of a contig sit in a {@code ContigStore}.
 *
 * <p>May use {@code io}, {@code repeats}, {@code score}, {@code shard} (the partition) and {@code out} (the sink
 * and the header a plan describes); nothing here formats output.
 */
package stria.pipeline;
