package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.io.Bases;
import stria.testutil.Cli;

/** The scan command end to end, run as a user runs it: {@code scripts/stria scan ...}. */
class ScanCommandTest {
    @TempDir
    Path dir;

    static final Path DEMO = Cli.projectDir().resolve("testdata/demo.fa.gz");

    /** Every run of a string, by brute force: for each period, maximal stretches with s[i] == s[i+p]. */
    static List<String> bruteForceRuns(String name, byte[] s) {
        List<String> out = new ArrayList<>();
        int n = s.length;
        for (int p = 1; 2 * p <= n; p++) {
            int i = 0;
            while (i + p < n) {
                int j = i;
                while (j + p < n && Bases.code(s[j]) < 4 && Bases.code(s[j]) == Bases.code(s[j + p])) {
                    j++;
                }
                if (j - i >= p) {
                    boolean smallest = true;
                    for (int q = 1; q < p && smallest; q++) {
                        boolean periodic = true;
                        for (int k = i + q; k < j + p && periodic; k++) {
                            periodic = Bases.code(s[k]) == Bases.code(s[k - q]);
                        }
                        smallest = !periodic;
                    }
                    if (smallest) {
                        out.add(name + "\t" + i + "\t" + (j + p) + "\t" + p);
                    }
                }
                i = j + 1;
            }
        }
        out.sort((a, b) -> {
            String[] x = a.split("\t"), y = b.split("\t");
            for (int k = 1; k < 4; k++) {
                int c = Integer.compare(Integer.parseInt(x[k]), Integer.parseInt(y[k]));
                if (c != 0) {
                    return c;
                }
            }
            return 0;
        });
        return out;
    }

    @Test
    void contractPrintsExactlyOneBedLinePerRun() throws IOException {
        Random rnd = new Random(7);
        StringBuilder fa = new StringBuilder();
        List<String> expected = new ArrayList<>();
        for (int c = 0; c < 3; c++) {
            byte[] s = new byte[400 + 200 * c];
            String alphabet = c == 0 ? "AC" : c == 1 ? "ACG" : "ACGTN";
            for (int i = 0; i < s.length; i++) {
                s[i] = (byte) alphabet.charAt(rnd.nextInt(alphabet.length()));
            }
            fa.append(">seq").append(c).append(" test record\n");
            for (int i = 0; i < s.length; i += 70) {
                fa.append(new String(s, i, Math.min(70, s.length - i))).append('\n');
            }
            expected.addAll(bruteForceRuns("seq" + c, s));
        }
        Path f = dir.resolve("small.fa");
        Files.writeString(f, fa);
        Cli.Result r = Cli.stria(dir, "scan", "--exact", "--min-period", "1", "--max-period", "1000000",
                "--min-copies", "2", "--min-length", "2", f.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        for (String line : r.out().split("\n")) {
            assertThat(line.startsWith("#") || line.startsWith("track") || line.split("\t").length >= 3)
                    .as(line).isTrue();
        }
        List<String> got = new ArrayList<>();
        for (String l : r.dataLines()) {
            String[] x = l.split("\t");
            got.add(x[0] + "\t" + x[1] + "\t" + x[2] + "\t" + x[6]);
        }
        assertThat(got).isEqualTo(expected);
    }

    @Tag("tools")
    @Test
    void demoGenomeGivesBedThatBedtoolsSortLeavesUnchanged() throws IOException {
        Cli.needTool("bedtools");
        assertThat(DEMO).exists();
        for (String mode : new String[] {"--exact", "--min-length=12"}) {
            Path bed = dir.resolve("demo" + mode.length() + ".bed");
            Cli.Result r = Cli.stria(dir, "scan", mode, "--bed", bed.toString(), DEMO.toString());
            assertThat(r.exit()).as(r.err()).isZero();
            List<String> data = new ArrayList<>();
            StringBuilder genome = new StringBuilder();
            for (String l : Files.readAllLines(bed)) {
                if (l.startsWith("#contig: ")) {
                    String[] f = l.substring(9).split(" ");
                    genome.append(f[0]).append('\t').append(f[1]).append('\n');
                } else if (!l.startsWith("#")) {
                    data.add(l);
                    String[] f = l.split("\t");
                    assertThat(f).hasSize(9);
                    assertThat(Long.parseLong(f[1])).isLessThan(Long.parseLong(f[2]));
                    assertThat(Integer.parseInt(f[4])).isBetween(0, 1000);
                }
            }
            assertThat(data).hasSizeGreaterThan(100);
            Path g = dir.resolve("genome.txt");
            Files.writeString(g, genome);
            // bedtools sort orders by chromosome and start only, and its order among records with the same
            // start is not stable on large inputs; so: same records, same (chrom, start) sequence
            String sorted = Cli.tool(dir, "bedtools", "sort", "-i", bed.toString());
            assertSameUpToEqualStarts(List.of(sorted.split("\n")), data);
            String byGenome = Cli.tool(dir, "bedtools", "sort", "-g", g.toString(), "-i", bed.toString());
            assertSameUpToEqualStarts(List.of(byGenome.split("\n")), data);
            // and the full order (chrom, start, end) is what coreutils sort checks
            Path body = dir.resolve("body.bed");
            Files.write(body, data);
            Cli.tool(dir, "sort", "-c", "-k1,1", "-k2,2n", "-k3,3n", body.toString());
        }
    }

    static void assertSameUpToEqualStarts(List<String> sorted, List<String> ours) {
        assertThat(sorted).containsExactlyInAnyOrderElementsOf(ours);
        List<String> a = new ArrayList<>(), b = new ArrayList<>();
        for (int i = 0; i < ours.size(); i++) {
            String[] x = sorted.get(i).split("\t"), y = ours.get(i).split("\t");
            a.add(x[0] + ":" + x[1]);
            b.add(y[0] + ":" + y[1]);
        }
        assertThat(a).isEqualTo(b);
    }

    @Tag("slow")
    @Test
    void helpVersionAndUsageErrors() {
        Cli.Result help = Cli.stria(dir, "scan", "--help");
        assertThat(help.exit()).isZero();
        assertThat(help.out()).contains("--exact", "--min-period", "--max-period", "--min-copies", "--min-length",
                "--bed", "--tsv", "research-grade");
        Cli.Result version = Cli.stria(dir, "--version");
        assertThat(version.exit()).as(version.err() + version.out()).isZero();
        assertThat(version.out()).startsWith("stria ");
        Cli.Result unknown = Cli.stria(dir, "scan", "--no-such-option", "x.fa");
        assertThat(unknown.exit()).isEqualTo(2);
        assertThat(unknown.err()).contains("--no-such-option").contains("Usage");
        Cli.Result missing = Cli.stria(dir, "scan", dir.resolve("absent.fa").toString());
        assertThat(missing.exit()).isEqualTo(1);
        assertThat(missing.err().strip().lines().count()).isEqualTo(1);
        assertThat(missing.err()).contains("absent.fa");
    }
}
