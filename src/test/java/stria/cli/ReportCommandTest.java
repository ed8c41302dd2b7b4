package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import stria.StriaException;
import stria.io.ContigInfo;
import stria.testutil.ResultFixtures;

class ReportCommandTest {
    @TempDir
    Path dir;

    private final List<ContigInfo> contigs = List.of(new ContigInfo("chr1", 1_000),
            new ContigInfo("chr2", 4_000));

    private Path smallResult() throws Exception {
        return ResultFixtures.write(dir.resolve("r.tsv"), ResultFixtures.header(contigs, null, List.of()), List.of(
                ResultFixtures.row("chr1", 100, 120, "A", 1.0),
                ResultFixtures.row("chr1", 110, 140, "AC", 0.9),
                ResultFixtures.row("chr2", 0, 300, "AACCGGTTAC".repeat(12), 0.85)));
    }

    private static CommandLine command(StringWriter err) {
        CommandLine cl = new CommandLine(new ReportCommand());
        cl.setErr(new PrintWriter(err));
        return cl;
    }

    /** Runs the command outside picocli's error handling, so a StriaException reaches the test as thrown. */
    private static int call(String... args) {
        CommandLine cl = new CommandLine(new ReportCommand());
        cl.parseArgs(args);
        return ((ReportCommand) cl.getCommand()).call();
    }

    private static String stdout(Runnable r) {
        PrintStream old = System.out;
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        System.setOut(new PrintStream(bytes, true, StandardCharsets.UTF_8));
        try {
            r.run();
        } finally {
            System.setOut(old);
        }
        return bytes.toString(StandardCharsets.UTF_8);
    }

    @Test
    void summaryPrintsTheGenomeRowThenOneRowPerContig() throws Exception {
        Path f = smallResult();
        int[] rc = new int[1];
        String out = stdout(() -> rc[0] = command(new StringWriter()).execute("--summary", f.toString()));
        assertThat(rc[0]).isZero();
        List<String> lines = out.lines().toList();
        assertThat(lines).hasSize(4);
        assertThat(lines.get(0).split("\t")).containsExactly("level", "name", "bases_scanned", "loci", "repeat_bases",
                "repeat_share", "loci_p1", "bases_p1", "loci_p2_6", "bases_p2_6", "loci_p7_99", "bases_p7_99",
                "loci_p100", "bases_p100");
        // chr1: union of 100-120 and 110-140 is 40 bases; chr2: one satellite of 300 bases
        assertThat(lines.get(1)).isEqualTo("genome\t.\t5000\t3\t340\t0.068000\t1\t20\t1\t30\t0\t0\t1\t300");
        assertThat(lines.get(2)).isEqualTo("contig\tchr1\t1000\t2\t40\t0.040000\t1\t20\t1\t30\t0\t0\t0\t0");
        assertThat(lines.get(3)).isEqualTo("contig\tchr2\t4000\t1\t300\t0.075000\t0\t0\t0\t0\t0\t0\t1\t300");
    }

    @Test
    void htmlIsWrittenAndHelpDocumentsTheColumns() throws Exception {
        Path f = smallResult();
        Path html = dir.resolve("report.html");
        assertThat(command(new StringWriter()).execute("--html", html.toString(), f.toString())).isZero();
        assertThat(Files.readString(html)).startsWith("<!DOCTYPE html>").contains("chr2").endsWith("</html>\n");
        StringWriter help = new StringWriter();
        CommandLine cl = command(new StringWriter());
        cl.setOut(new PrintWriter(help));
        assertThat(cl.execute("--help")).isZero();
        assertThat(help.toString()).contains("repeat_share").contains("bases_p100").contains("--html");
    }

    @Test
    void usageErrorsExitWithTwo() throws Exception {
        Path f = smallResult();
        StringWriter err = new StringWriter();
        assertThat(command(err).execute(f.toString())).isEqualTo(2);
        assertThat(err.toString()).contains("--html FILE and/or --summary");
        assertThat(command(new StringWriter()).execute("--summary")).isEqualTo(2);
        assertThat(command(new StringWriter()).execute("--summary", "--html", "-", f.toString())).isEqualTo(2);
    }

    @Test
    void refusesResultsOfTwoGenomesNamingBothFiles() throws Exception {
        Path a = smallResult();
        Path b = ResultFixtures.write(dir.resolve("other.tsv"), ResultFixtures.header(
                List.of(new ContigInfo("chr1", 999)), null, List.of()), List.of());
        Path html = dir.resolve("never.html");
        assertThatThrownBy(() -> call("--html", html.toString(), a.toString(), b.toString()))
                .isInstanceOf(StriaException.class).hasMessageContaining("r.tsv").hasMessageContaining("other.tsv");
        assertThat(html).doesNotExist();
    }

    @Test
    void anUnwritableReportLeavesNothingBehind() throws Exception {
        Path f = smallResult();
        Path html = dir.resolve("no-such-dir").resolve("r.html");
        assertThatThrownBy(() -> call("--html", html.toString(), f.toString()))
                .isInstanceOf(StriaException.class).hasMessageContaining("does not exist");
        try (var files = Files.list(dir)) {
            assertThat(files.map(p -> p.getFileName().toString()).toList()).containsExactly("r.tsv");
        }
    }
}
