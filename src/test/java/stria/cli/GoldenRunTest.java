package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.zip.GZIPInputStream;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.sim.GenomeSimulator;
import stria.testutil.Cli;

/**
 * The golden run: the real command on three genomes (the demo, the planted benchmark genome, a 16 Mb scale
 * genome scanned in small windows, in shards and merged), every output compared byte for byte with the
 * copies kept in {@code src/test/resources/golden}. A refactor must leave all of them unchanged; a change
 * that means to change output regenerates them with {@code -Dstria.golden.update=true} and says in its
 * commit and the README which lines changed and why.
 *
 * <p>Text outputs (BED, TSV) are kept whole, gzipped, so a failure shows the first line that differs;
 * masked genomes are kept as SHA-256 only. The header line with the tool version is left out of the
 * comparison, so a version bump alone does not count as a change of output.
 */
@Tag("slow")
class GoldenRunTest {
    private static final Path GOLDEN = Cli.projectDir().resolve("src/test/resources/golden");
    private static final boolean UPDATE = Boolean.getBoolean("stria.golden.update");

    @TempDir
    Path dir;

    @Test
    void outputsMatchTheGoldenRun() throws IOException {
        // inputs by relative names: the #command header lines are then the same on every machine
        Files.copy(Cli.projectDir().resolve("testdata/demo.fa.gz"), dir.resolve("demo.fa.gz"));
        String demo = "demo.fa.gz";
        String planted = "planted.fa.gz";
        simulate("--seed", "11", "--size", "16000000", "--contigs", "4", "--satellites", "3", "--gaps", "12",
                "--lower", "40", "--out", dir.resolve(planted).toString(), "--truth",
                dir.resolve("planted.truth").toString());
        String scale = "scale.fa";
        simulate("--seed", "11", "--size", "16000000", "--contigs", "4", "--major", "0.75", "--satellites", "1",
                "--satellite-length", "400000", "--out", dir.resolve(scale).toString(), "--truth",
                dir.resolve("scale.truth").toString());

        Map<String, Path> outputs = new LinkedHashMap<>();
        run("--bed", "demo.bed", "--tsv", "demo.tsv", "--masked", "demo.masked.fa", demo);
        outputs.put("demo.bed", dir.resolve("demo.bed"));
        outputs.put("demo.tsv", dir.resolve("demo.tsv"));
        outputs.put("demo.masked.fa", dir.resolve("demo.masked.fa"));
        run("--exact", "--bed", "demo-exact.bed", "--masked", "demo-exact.hard.fa", "--mask-style", "hard",
                demo);
        outputs.put("demo-exact.bed", dir.resolve("demo-exact.bed"));
        outputs.put("demo-exact.hard.fa", dir.resolve("demo-exact.hard.fa"));
        run("--bed", "planted.bed", "--tsv", "planted.tsv", planted);
        outputs.put("planted.bed", dir.resolve("planted.bed"));
        outputs.put("planted.tsv", dir.resolve("planted.tsv"));
        run("--threads", "2", "--window", "64K", "--tsv", "scale.tsv", "--masked", "scale.keep.fa",
                "--mask-style", "keep", scale);
        outputs.put("scale.tsv", dir.resolve("scale.tsv"));
        outputs.put("scale.keep.fa", dir.resolve("scale.keep.fa"));
        List<String> parts = new ArrayList<>();
        for (int k = 1; k <= 3; k++) {
            String part = "scale-part" + k + ".tsv";
            run("--threads", "2", "--shard", k + "/3", "--tsv", part, scale);
            parts.add(part);
            outputs.put(part, dir.resolve(part));
        }
        List<String> merge = new ArrayList<>(List.of("merge", "--tsv", "scale-merged.tsv"));
        merge.addAll(parts);
        Cli.Result m = Cli.stria(dir, merge.toArray(String[]::new));
        assertThat(m.exit()).as(m.err()).isZero();
        outputs.put("scale-merged.tsv", dir.resolve("scale-merged.tsv"));
        run("--exact", "--region", "ctg01:2,000,001-5,000,000", "--region", "ctg03", "--tsv", "scale-regions.tsv",
                scale);
        outputs.put("scale-regions.tsv", dir.resolve("scale-regions.tsv"));

        if (UPDATE) {
            write(outputs);
            return;
        }
        List<String> differ = new ArrayList<>();
        Map<String, String> expected = manifest();
        assertThat(expected.keySet()).as("outputs of the golden run").containsExactlyElementsOf(outputs.keySet());
        for (var e : outputs.entrySet()) {
            String got = digest(e.getValue());
            if (!got.equals(expected.get(e.getKey()))) {
                differ.add(e.getKey() + ": " + firstDifference(e.getKey(), e.getValue()));
            }
        }
        assertThat(differ).as("outputs that differ from the golden run (regenerate with "
                + "-Dstria.golden.update=true only for an intended change)").isEmpty();
    }

    private void simulate(String... args) {
        int code = new picocli.CommandLine(new GenomeSimulator()).execute(args);
        assertThat(code).isZero();
    }

    private void run(String... args) {
        List<String> a = new ArrayList<>(List.of("scan", "--quiet"));
        a.addAll(List.of(args));
        Cli.Result r = Cli.stria(dir, a.toArray(String[]::new));
        assertThat(r.exit()).as("scan %s: %s", String.join(" ", args), r.err()).isZero();
    }

    private static boolean kept(String name) {
        return !name.endsWith(".fa");
    }

    /** Lines of an output, without the line of the tool's version. */
    private static List<String> lines(Path p) throws IOException {
        List<String> out = new ArrayList<>();
        for (String l : Files.readAllLines(p, StandardCharsets.UTF_8)) {
            if (!l.startsWith("#stria ")) {
                out.add(l);
            }
        }
        return out;
    }

    private static String digest(Path p) throws IOException {
        try {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            if (p.getFileName().toString().endsWith(".fa")) {
                try (InputStream in = Files.newInputStream(p)) {
                    byte[] buf = new byte[1 << 16];
                    for (int n; (n = in.read(buf)) > 0; ) {
                        md.update(buf, 0, n);
                    }
                }
            } else {
                for (String l : lines(p)) {
                    md.update((l + "\n").getBytes(StandardCharsets.UTF_8));
                }
            }
            return HexFormat.of().formatHex(md.digest());
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    private static Map<String, String> manifest() throws IOException {
        Map<String, String> m = new LinkedHashMap<>();
        for (String l : Files.readAllLines(GOLDEN.resolve("MANIFEST"), StandardCharsets.UTF_8)) {
            if (!l.isBlank() && !l.startsWith("#")) {
                String[] f = l.split("  ", 2);
                m.put(f[1], f[0]);
            }
        }
        return m;
    }

    private static String firstDifference(String name, Path got) throws IOException {
        if (!kept(name)) {
            return "SHA-256 differs";
        }
        List<String> want = new ArrayList<>();
        try (InputStream in = new GZIPInputStream(Files.newInputStream(GOLDEN.resolve(name + ".gz")))) {
            for (String l : new String(in.readAllBytes(), StandardCharsets.UTF_8).split("\n", -1)) {
                want.add(l);
            }
        }
        if (!want.isEmpty() && want.get(want.size() - 1).isEmpty()) {
            want.remove(want.size() - 1);
        }
        List<String> have = lines(got);
        for (int i = 0; i < Math.max(want.size(), have.size()); i++) {
            String w = i < want.size() ? want.get(i) : "(end of file)";
            String h = i < have.size() ? have.get(i) : "(end of file)";
            if (!w.equals(h)) {
                return "line " + (i + 1) + ": expected [" + w + "] but got [" + h + "] (" + want.size()
                        + " lines expected, " + have.size() + " written)";
            }
        }
        return "same lines, different bytes";
    }

    private static void write(Map<String, Path> outputs) {
        try {
            Files.createDirectories(GOLDEN);
            StringBuilder m = new StringBuilder("# SHA-256 of each output of GoldenRunTest (text outputs without "
                    + "the #stria version line)\n");
            for (var e : outputs.entrySet()) {
                m.append(digest(e.getValue())).append("  ").append(e.getKey()).append('\n');
                if (kept(e.getKey())) {
                    try (OutputStream os = new GZIPOutputStream(Files.newOutputStream(
                            GOLDEN.resolve(e.getKey() + ".gz")))) {
                        for (String l : lines(e.getValue())) {
                            os.write((l + "\n").getBytes(StandardCharsets.UTF_8));
                        }
                    }
                }
            }
            Files.writeString(GOLDEN.resolve("MANIFEST"), m.toString(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
