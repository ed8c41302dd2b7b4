/**
 * Benchmark main classes, run by the scripts in {@code bench/} (never by the tests): speed is measured by
 * scripts, not asserted. {@link stria.bench.EngineBench} times the engine stages on one core.
 *
 * <p>Test scope: not in the jar users install; {@code mvn package} puts it in {@code target/stria-tools.jar}.
 * May use every main package and {@code stria.sim}.
 */
package stria.bench;
