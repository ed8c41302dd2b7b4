package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import stria.testutil.InProcess;

/**
 * Option values a user can type by mistake or on purpose: the command line either takes them or says, as a
 * usage error (exit 2), what is wrong; it never gets as far as an internal error.
 */
class HostileInputTest {
    @TempDir
    Path dir;

    @ParameterizedTest
    @CsvSource({"--min-copies,Infinity", "--min-copies,1e309", "--min-copies,-Infinity", "--min-copies,NaN",
        "--min-purity,NaN", "--min-purity,Infinity", "--min-purity,1e400", "--min-copies,0x1p3",
        "--min-length,1e309", "--min-score,Infinity", "--max-period,NaN", "--threads,1e3"})
    void numbersThatAreNotFiniteAreUsageErrors(String option, String value) {
        InProcess.Result r = InProcess.stria("scan", option, value, "--bed", dir.resolve("o.bed").toString(),
                ScanCommandTest.DEMO.toString());
        assertThat(r.exit()).as(r.err()).isEqualTo(2);
        assertThat(r.err()).startsWith("stria: ").contains(option).doesNotContain("internal error");
        assertThat(dir.resolve("o.bed")).doesNotExist();
    }
}
