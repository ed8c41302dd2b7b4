/**
 * Invented genomes with planted tandem repeats, for the demo data, tests and the planted-truth benchmark.
 *
 * <p>{@link stria.sim.GenomeSimulator} writes a FASTA and the table of what it planted;
 * {@link stria.sim.TruthScorer} scores reported loci against that table (recall, precision, boundary and
 * purity errors), from a TSV or from an in-process scan through {@link stria.pipeline.GenomeScan};
 * {@link stria.sim.NaiveRuns} is a direct, quadratic source of exact runs for tests.
 *
 * <p>Test scope: not in the jar users install. {@code mvn package} puts it, with {@code stria.bench}, in
 * {@code target/stria-tools.jar} for {@code bench/} and {@code testdata/regenerate-demo.sh}. May use every
 * main package; no main package uses it.
 */
package stria.sim;
