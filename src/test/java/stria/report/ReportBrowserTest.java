package stria.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import stria.cli.ReportCommand;
import stria.testutil.ResultFixtures;

/**
 * Opens written reports in headless Chromium and checks what a reader would see: a screenshot with the
 * charts drawn in their colours, and a page that logs nothing to the console. Screenshots are kept in
 * target/report-screens for a look by eye.
 */
@Tag("tools")
class ReportBrowserTest {
    private static Path chromium;

    @TempDir
    Path dir;

    @BeforeAll
    static void findChromium() {
        for (String p : List.of("/usr/bin/chromium", "/usr/bin/chromium-browser")) {
            if (Files.isExecutable(Path.of(p))) {
                chromium = Path.of(p);
            }
        }
        if (stria.testutil.Cli.requireTools()) {
            assertThat(chromium).as("chromium installed (tools required: CI or stria.requireTools=true)").isNotNull();
        }
        assumeTrue(chromium != null, "chromium not installed");
    }

    record Run(BufferedImage screenshot, String log, String dom) {
    }

    @Test
    void aGenomeOfHundredsOfContigsRenders() throws Exception {
        Run run = render(ResultFixtures.genome(dir.resolve("many.tsv"), 300, 3), "many");
        assertRendered(run);
        assertThat(count(run.dom(), "<svg")).isEqualTo(5);
        assertThat(run.dom()).contains("others (280)");
    }

    @Test
    void aGenomeOfOneContigRenders() throws Exception {
        Run run = render(ResultFixtures.genome(dir.resolve("one.tsv"), 1, 3), "one");
        assertRendered(run);
        assertThat(count(run.dom(), "<svg")).isEqualTo(4);
    }

    /** The console check must be able to fail: a page that logs an error is caught. */
    @Test
    void consoleErrorsAreDetected() throws Exception {
        Path bad = Files.writeString(dir.resolve("bad.html"),
                "<!DOCTYPE html><html><body><p>x</p><script>console.error('planted failure')</script></body></html>");
        Run run = chromium(bad, "bad");
        assertThat(consoleLines(run.log())).anyMatch(l -> l.contains("planted failure"));
    }

    private Run render(Path tsv, String name) throws Exception {
        Path html = dir.resolve(name + ".html");
        StringWriter err = new StringWriter();
        CommandLine cl = new CommandLine(new ReportCommand());
        cl.setErr(new PrintWriter(err));
        assertThat(cl.execute("--html", html.toString(), tsv.toString())).as(err.toString()).isZero();
        return chromium(html, name);
    }

    private static void assertRendered(Run run) {
        assertThat(consoleLines(run.log())).as("console output of the page").isEmpty();
        BufferedImage img = run.screenshot();
        assertThat(img.getWidth()).isEqualTo(1400);
        Set<Integer> colours = new HashSet<>();
        long nonWhite = 0;
        long[] classPixels = new long[ChartStyle.CLASS_COLOURS.length];
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                int rgb = img.getRGB(x, y) & 0xffffff;
                colours.add(rgb);
                if (rgb != 0xffffff) {
                    nonWhite++;
                }
                for (int c = 0; c < classPixels.length; c++) {
                    if (near(rgb, ChartStyle.CLASS_COLOURS[c])) {
                        classPixels[c]++;
                    }
                }
            }
        }
        assertThat(colours.size()).as("distinct colours").isGreaterThan(200);
        assertThat((double) nonWhite / ((long) img.getWidth() * img.getHeight())).as("non-white share")
                .isGreaterThan(0.2);
        for (int c = 0; c < classPixels.length; c++) {
            assertThat(classPixels[c]).as("pixels of the %s colour", PeriodClass.values()[c].label())
                    .isGreaterThan(150);
        }
        assertThat(run.dom()).contains("Research use only").contains("How these results were made");
    }

    private static boolean near(int rgb, Color c) {
        return Math.abs(((rgb >> 16) & 0xff) - c.getRed()) <= 6 && Math.abs(((rgb >> 8) & 0xff) - c.getGreen()) <= 6
                && Math.abs((rgb & 0xff) - c.getBlue()) <= 6;
    }

    /** Messages the page wrote to the console, as Chromium logs them with --enable-logging=stderr. */
    private static List<String> consoleLines(String log) {
        return log.lines().filter(l -> l.contains(":CONSOLE")).toList();
    }

    private Run chromium(Path html, String name) throws Exception {
        Path png = dir.resolve(name + ".png");
        String url = html.toUri().toString();
        String log = runChromium(List.of("--enable-logging=stderr", "--v=0", "--screenshot=" + png,
                "--window-size=1400,3000", url), false);
        assertThat(png).as("screenshot written; chromium said:%n%s", log).exists();
        Path keep = Path.of(System.getProperty("stria.projectDir", "."), "target", "report-screens");
        Files.createDirectories(keep);
        Files.copy(png, keep.resolve(name + ".png"), StandardCopyOption.REPLACE_EXISTING);
        String dom = runChromium(List.of("--dump-dom", url), true);
        return new Run(ImageIO.read(png.toFile()), log, dom);
    }

    /** Runs Chromium once with a fresh profile; returns stdout when asked, otherwise stderr. */
    private String runChromium(List<String> extra, boolean wantStdout) throws IOException, InterruptedException {
        Path profile = Files.createTempDirectory(dir, "profile");
        List<String> cmd = new ArrayList<>(List.of(chromium.toString(), "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--user-data-dir=" + profile));
        cmd.addAll(extra);
        Path out = dir.resolve("chromium.out");
        Path err = dir.resolve("chromium.err");
        Process p = new ProcessBuilder(cmd).redirectOutput(out.toFile()).redirectError(err.toFile()).start();
        try {
            if (!p.waitFor(120, TimeUnit.SECONDS)) {
                p.descendants().forEach(ProcessHandle::destroyForcibly);
                p.destroyForcibly();
                throw new AssertionError("chromium did not finish within 120 s");
            }
        } finally {
            try (var files = Files.walk(profile)) {
                files.sorted(Comparator.reverseOrder()).forEach(f -> f.toFile().delete());
            }
        }
        return Files.readString(wantStdout ? out : err, StandardCharsets.UTF_8);
    }

    private static int count(String s, String what) {
        int n = 0;
        for (int i = s.indexOf(what); i >= 0; i = s.indexOf(what, i + 1)) {
            n++;
        }
        return n;
    }
}
