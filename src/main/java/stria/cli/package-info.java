/**
 * The commands ({@code scan}, {@code merge}, {@code partition}, {@code report}) on picocli: each parses its
 * options, checks them (usage errors, exit 2), calls the library and maps failures to exit codes
 * ({@link stria.cli.Main}). Options shared by all commands come from one mixin ({@code CommonOptions}).
 *
 * <p>No work is done here that a library caller would need too: {@code scan} builds a
 * {@link stria.pipeline.ScanPlan} and a list of {@link stria.out.LocusSink}s and calls
 * {@link stria.pipeline.GenomeScan}. May use every other package; nothing uses it.
 */
package stria.cli;
