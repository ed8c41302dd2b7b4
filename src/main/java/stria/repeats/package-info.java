/**
 * The exact engine: every run (maximal repetition) of a stretch of DNA codes, from branching tandem
 * repeats found on the enhanced suffix array ({@link stria.repeats.RunFinder}), collected in a
 * {@link stria.repeats.RunList} of primitive arrays. Coordinates are relative to the stretch; placing
 * stretches in a contig and stitching windows is the pipeline's job.
 *
 * <p>May use: the JDK, {@code stria.index} and the base codes of {@code stria.io.Bases}; nothing that
 * reads files, schedules work or scores.
 */
package stria.repeats;
