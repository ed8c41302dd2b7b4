/**
 * Invented genomes with planted tandem repeats, for the demo data, tests and the planted-truth benchmark.
 *
 * <p>{@link stria.sim.GenomeSimulator} writes a FASTA and the table of what it planted;
 * {@link stria.sim.TruthScorer} scores reported loci against that table (recall, precision, boundary and
 * purity errors); {@link stria.sim.NaiveRuns} is a direct, quadratic source of exact runs for tests and
 * for scoring in-process. Nothing here is used by a scan.
 */
package stria.sim;
