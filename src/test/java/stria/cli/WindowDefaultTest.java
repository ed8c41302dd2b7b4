package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import picocli.CommandLine;

/**
 * The default window follows the largest period: 256,000 bases, 64 max-periods when that is more, at
 * most 4,000,000, never below the smallest window a period allows (4 max-periods + 8). An explicit
 * --window wins.
 */
class WindowDefaultTest {
    private static int window(String... args) {
        ScanCommand scan = new ScanCommand();
        new CommandLine(scan).parseArgs(args);
        return scan.settings().window();
    }

    @ParameterizedTest(name = "max-period {0} -> window {1}")
    @CsvSource({
        "1, 256000",
        "2000, 256000",
        "4000, 256000",
        "4096, 262144",
        "10000, 640000",
        "62500, 4000000",
        "100000, 4000000",
        "1000000, 4000008"})
    void defaultWindowFollowsTheLargestPeriod(int maxPeriod, int window) {
        assertThat(window("--max-period", String.valueOf(maxPeriod), "genome.fa")).isEqualTo(window);
    }

    @ParameterizedTest(name = "--window {0}")
    @CsvSource({"64k, 64000", "4M, 4000000", "300000, 300000"})
    void anExplicitWindowWins(String given, int window) {
        assertThat(window("--window", given, "genome.fa")).isEqualTo(window);
    }
}
