package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import stria.testutil.Cli;

/**
 * Genome-scale behaviour: byte-identical output for any thread count and window length (including tiny
 * windows that force thousands of stitches through a satellite array), BGZF + tabix output that tabix
 * queries like the plain BED, and region scans equal to the matching slice of the whole scan.
 */
@Tag("slow")
class DeterminismAndIndexTest {
    @TempDir
    static Path dir;
    static Path genome;

    @BeforeAll
    static void makeGenome() {
        genome = dir.resolve("g.fa");
        Cli.Result r = Cli.exec(dir, null, List.of("java", "-cp", System.getProperty("java.class.path"),
                "stria.sim.GenomeSimulator", "--seed", "5", "--size", "1500000", "--contigs", "3",
                "--satellites", "1", "--satellite-length", "300000", "--out", genome.toString(),
                "--truth", dir.resolve("g.truth.tsv").toString()));
        assertThat(r.exit()).as(r.err()).isZero();
    }

    static String data(Path p) throws IOException {
        StringBuilder sb = new StringBuilder();
        for (String l : Files.readAllLines(p)) {
            if (!l.startsWith("#")) {
                sb.append(l).append('\n');
            }
        }
        return sb.toString();
    }

    @ParameterizedTest
    @ValueSource(strings = {"--exact", "--min-length=12"})
    void sameBytesForAnyThreadsAndWindow(String mode) throws IOException {
        String[][] variants = {
            {"--threads", "1"}, {"--threads", "2"}, {"--threads", "4"},
            {"--threads", "2", "--window", "8008"}, {"--threads", "3", "--window", "77777"}};
        String reference = null;
        for (String[] v : variants) {
            Path bed = dir.resolve("d" + String.join("", v).replace("-", "") + mode.length() + ".bed");
            Path tsv = dir.resolve("d" + String.join("", v).replace("-", "") + mode.length() + ".tsv");
            Path gff = dir.resolve("d" + String.join("", v).replace("-", "") + mode.length() + ".gff");
            Path cat = dir.resolve("d" + String.join("", v).replace("-", "") + mode.length() + ".cat.tsv");
            List<String> args = new ArrayList<>(List.of("scan", mode, "--quiet", "--bed", bed.toString(), "--tsv",
                    tsv.toString(), "--gff", gff.toString(), "--catalog", cat.toString()));
            args.addAll(List.of(v));
            args.add(genome.toString());
            Cli.Result r = Cli.stria(dir, args.toArray(String[]::new));
            assertThat(r.exit()).as(r.err()).isZero();
            String both = data(bed) + data(tsv) + data(gff) + data(cat);
            if (reference == null) {
                reference = both;
                assertThat(both.lines().count()).isGreaterThan(200);
            } else {
                assertThat(both).as("output with %s", String.join(" ", v)).isEqualTo(reference);
            }
        }
    }

    @Tag("tools")
    @Test
    void bgzfBedIsIndexedAndQueriesMatchThePlainBed() throws IOException {
        Cli.needTool("tabix");
        Path plain = dir.resolve("p.bed");
        Path gz = dir.resolve("p.bed.gz");
        Cli.Result r = Cli.stria(dir, "scan", "--exact", "--quiet", "--bed", plain.toString(), genome.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        r = Cli.stria(dir, "scan", "--exact", "--quiet", "--bed", gz.toString(), genome.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        assertThat(dir.resolve("p.bed.gz.tbi")).exists();
        // tabix regions are 1-based inclusive; a record overlaps ctg01:200001-700000 when end > 200000 and
        // start < 700000 (0-based BED)
        String got = Cli.tool(dir, "tabix", gz.toString(), "ctg01:200001-700000");
        StringBuilder want = new StringBuilder();
        for (String l : data(plain).split("\n")) {
            String[] f = l.split("\t");
            if (f[0].equals("ctg01") && Long.parseLong(f[2]) > 200000 && Long.parseLong(f[1]) < 700000) {
                want.append(l).append('\n');
            }
        }
        assertThat(want.length()).isGreaterThan(0);
        assertThat(got).isEqualTo(want.toString());
        // the whole file decompresses to the plain BED, byte for byte after the header
        assertThat(Cli.tool(dir, "bgzip", "-dc", gz.toString()).replaceAll("(?m)^#.*\n", ""))
                .isEqualTo(data(plain));
    }

    @ParameterizedTest
    @ValueSource(strings = {"--exact", "--min-length=12"})
    void regionScanEqualsTheSliceOfTheWholeScan(String mode) throws IOException {
        Path whole = dir.resolve("w" + mode.length() + ".bed");
        Cli.Result r = Cli.stria(dir, "scan", mode, "--quiet", "--bed", whole.toString(), genome.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        Path part = dir.resolve("r" + mode.length() + ".bed");
        r = Cli.stria(dir, "scan", mode, "--quiet", "--region", "ctg01:300,001-450,000", "--region",
                "ctg02:10001-90000", "--bed", part.toString(), genome.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        StringBuilder want = new StringBuilder();
        for (String l : data(whole).split("\n")) {
            String[] f = l.split("\t");
            long s = Long.parseLong(f[1]);
            if ((f[0].equals("ctg01") && s >= 300000 && s < 450000) || (f[0].equals("ctg02") && s >= 10000
                    && s < 90000)) {
                want.append(l).append('\n');
            }
        }
        assertThat(want.length()).isGreaterThan(0);
        assertThat(data(part)).isEqualTo(want.toString());
        assertThat(Files.readString(part)).contains("#region: ctg01 300000 450000");
    }
}
