package stria.sim;

import static org.assertj.core.api.Assertions.assertThat;

import htsjdk.samtools.reference.ReferenceSequenceFile;
import htsjdk.samtools.reference.ReferenceSequenceFileFactory;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import java.util.zip.GZIPInputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/**
 * The satellite-array generator: the planted arrays have the sizes asked for, and the divergences in the
 * truth are measured back from the generated bases with an edit distance (Levenshtein), which counts
 * substituted, inserted and deleted bases the way the truth's divergence does (an optimal alignment
 * explains some changes more cheaply, so it reads slightly low at high divergence: about 0.27 for 0.30).
 */
class SatelliteArraysTest {
    private static final String[] SMALL = {"--seed", "7", "--arrays", "9", "--contigs", "3", "--lengths",
        "40000-120000", "--interrupted", "0.4", "--plain", "0.35"};

    @Test
    void sameSeedSameGenomeOtherSeedOtherGenome() {
        SatelliteArrays.Genome a = SatelliteArrays.generate(SMALL);
        SatelliteArrays.Genome b = SatelliteArrays.generate(SMALL);
        assertThat(b.truth()).isEqualTo(a.truth());
        assertThat(b.sequences()).hasSameSizeAs(a.sequences());
        for (int i = 0; i < a.sequences().size(); i++) {
            assertThat(b.sequences().get(i)).isEqualTo(a.sequences().get(i));
        }
        String[] other = SMALL.clone();
        other[1] = "8";
        assertThat(SatelliteArrays.generate(other).sequences().get(0)).isNotEqualTo(a.sequences().get(0));
    }

    @Test
    void arraysHaveTheAskedSizesAndLayout() {
        SatelliteArrays.Genome g = SatelliteArrays.generate(SMALL);
        assertThat(g.names()).containsExactly("sat01", "sat02", "sat03");
        assertThat(g.arrays()).hasSize(9);
        assertThat(g.arrays()).anyMatch(a -> a.blockUnits() == 1).anyMatch(a -> a.blockUnits() > 1)
                .anyMatch(SatelliteArrays.Array::interrupted).anyMatch(a -> !a.interrupted());
        String contig = "";
        int prevEnd = 0;
        for (SatelliteArrays.Array a : g.arrays()) {
            byte[] seq = g.sequences().get(g.names().indexOf(a.contig()));
            if (!a.contig().equals(contig)) {
                contig = a.contig();
                prevEnd = 0;
            }
            // 20-200 kb of background before each array and after the last
            assertThat(a.start() - prevEnd).isBetween(20000, 200000);
            prevEnd = a.end();
            assertThat(a.unit()).isBetween(150, 250);
            assertThat(a.ancestor()).hasSize(a.unit());
            assertThat(a.blockUnits()).isBetween(1, 16);
            int gap = a.interrupted() ? a.gapEnd() - a.gapStart() : 0;
            assertThat(a.end() - a.start() - gap).isBetween(40000, 120000);
            for (byte[] u : a.units()) {
                // indels move a unit's length by a few bases only
                assertThat(u.length).isBetween((int) (a.unit() * 0.9), (int) (a.unit() * 1.1));
            }
            if (a.blockUnits() == 1) {
                assertThat(a.divWithin()).isNaN();
                assertThat(a.divBetween()).isBetween(0.08, 0.25);
                assertThat(a.units()[0]).isEqualTo(a.ancestor());
            } else {
                assertThat(a.divWithin()).isBetween(0.15, 0.30);
                assertThat(a.divBetween()).isBetween(0.005, 0.03);
            }
            int[] cs = a.copyStarts();
            assertThat(cs[0]).isEqualTo(a.start());
            for (int i = 1; i < cs.length; i++) {
                assertThat(cs[i]).isGreaterThan(cs[i - 1]).isLessThan(a.end());
            }
            if (a.interrupted()) {
                assertThat(gap).isBetween(3000, 6000);
                // between two block copies, in the middle half of the array (give or take a copy)
                assertThat(cs).contains(a.gapEnd());
                int before = a.gapStart() - a.start();
                int all = a.end() - a.start() - gap;
                assertThat(before).isBetween(all / 4, all * 3 / 4 + 2 * a.blockLength());
                List<SatelliteArrays.TruthRow> rows = a.rows();
                assertThat(rows).hasSize(2);
                assertThat(rows.get(0).start()).isEqualTo(a.start());
                assertThat(rows.get(0).end()).isEqualTo(a.gapStart());
                assertThat(rows.get(1).start()).isEqualTo(a.gapEnd());
                assertThat(rows.get(1).end()).isEqualTo(a.end());
                assertThat(rows).allMatch(r -> r.pieces() == 2 && r.gapStart() == a.gapStart());
            } else {
                assertThat(a.rows()).singleElement().matches(r -> r.start() == a.start() && r.end() == a.end()
                        && r.pieces() == 1 && !r.interrupted());
            }
            assertThat(a.rows()).allMatch(r -> r.unit() == a.unit() && r.blockUnits() == a.blockUnits()
                    && r.blockLength() == a.blockLength() && r.contig().equals(a.contig()));
        }
        for (int c = 0; c < g.names().size(); c++) {
            byte[] seq = g.sequences().get(c);
            SatelliteArrays.Array last = null;
            for (SatelliteArrays.Array a : g.arrays()) {
                last = a.contig().equals(g.names().get(c)) ? a : last;
            }
            assertThat(seq.length - last.end()).isBetween(20000, 200000);
            for (byte b : seq) {
                assertThat(b == 'A' || b == 'C' || b == 'G' || b == 'T').isTrue();
            }
        }
    }

    @Test
    void unitsOfABlockDifferByTheWithinBlockDivergence() {
        double sumTruth = 0;
        double sumMeasured = 0;
        for (SatelliteArrays.Array a : hor(SatelliteArrays.generate("--seed", "3", "--arrays", "16", "--plain", "0",
                "--lengths", "20000"))) {
            byte[][] u = a.units();
            double sum = 0;
            int pairs = 0;
            for (int i = 0; i < u.length; i++) {
                for (int j = i + 1; j < u.length; j++) {
                    sum += divergence(u[i], u[j]);
                    pairs++;
                }
            }
            double measured = sum / pairs;
            // one pair of 200 bp differs by about 40 +- 6 positions
            assertThat(measured).as(a.id()).isBetween(a.divWithin() - 0.07, a.divWithin() + 0.07);
            sumTruth += a.divWithin();
            sumMeasured += measured;
        }
        assertThat(sumMeasured / sumTruth).isBetween(0.85, 1.03);
    }

    @Test
    void blockCopiesDifferByTheBetweenCopyDivergenceAndDescendFromTheBlock() {
        SatelliteArrays.Genome g = SatelliteArrays.generate("--seed", "5", "--arrays", "12", "--plain", "0.5",
                "--lengths", "40000-60000");
        double sumTruth = 0;
        double sumMeasured = 0;
        Random pick = new Random(1);
        for (SatelliteArrays.Array a : g.arrays()) {
            byte[] seq = g.sequences().get(g.names().indexOf(a.contig()));
            byte[] block = concat(a.units());
            int[] cs = a.copyStarts();
            double pairSum = 0;
            double fromBlock = 0;
            int n = 12;
            for (int t = 0; t < n; t++) {
                byte[] x = copy(seq, a, 1 + pick.nextInt(cs.length - 3));
                byte[] y = copy(seq, a, 1 + pick.nextInt(cs.length - 3));
                pairSum += divergence(x, y);
                fromBlock += divergence(x, block);
            }
            double measured = pairSum / n;
            double r = SatelliteArrays.rateFor(a.divBetween());
            // a copy carries about half the pairwise divergence: substitutions 0.85 r, indel bases 0.2 r
            double perCopy = 0.85 * r + 0.15 * r * SatelliteArrays.INDEL_MEAN;
            double slack = 0.002 + 0.3 * a.divBetween();
            assertThat(measured).as(a.id()).isBetween(a.divBetween() - slack, a.divBetween() + slack);
            assertThat(fromBlock / n).as(a.id()).isBetween(perCopy * 0.6 - 0.002, perCopy * 1.4 + 0.002);
            sumTruth += a.divBetween();
            sumMeasured += measured;
        }
        assertThat(sumMeasured / sumTruth).isBetween(0.85, 1.05);
    }

    @Test
    void expectedDivergenceMatchesSisterSequencesOfTheMutationModel() {
        Random rnd = new Random(11);
        for (double d : new double[] {0.01, 0.05, 0.15, 0.25}) {
            double r = SatelliteArrays.rateFor(d);
            assertThat(SatelliteArrays.expectedDivergence(r)).isCloseTo(d, org.assertj.core.data.Offset.offset(1e-9));
            double sum = 0;
            int n = 200;
            for (int t = 0; t < n; t++) {
                byte[] anc = new byte[200];
                for (int i = 0; i < anc.length; i++) {
                    anc[i] = (byte) "ACGT".charAt(rnd.nextInt(4));
                }
                sum += divergence(SatelliteArrays.mutate(anc, r, rnd), SatelliteArrays.mutate(anc, r, rnd));
            }
            assertThat(sum / n).as("d = " + d).isBetween(d * 0.88, d * 1.05);
        }
    }

    @Test
    void writesBgzfOrPlainFastaWithIndexAndTheTruthTable(@TempDir Path dir) throws IOException {
        SatelliteArrays.Genome g = SatelliteArrays.generate(SMALL);
        for (String name : new String[] {"g.fa.gz", "g.fa"}) {
            Path fa = dir.resolve(name);
            Path tsv = dir.resolve(name + ".truth.tsv");
            String[] args = new String[SMALL.length + 4];
            System.arraycopy(SMALL, 0, args, 0, SMALL.length);
            args[SMALL.length] = "--out";
            args[SMALL.length + 1] = fa.toString();
            args[SMALL.length + 2] = "--truth";
            args[SMALL.length + 3] = tsv.toString();
            assertThat(new CommandLine(new SatelliteArrays()).execute(args)).isZero();
            assertThat(SatelliteArrays.readTruth(tsv)).isEqualTo(g.truth());
            assertThat(Files.readAllLines(tsv).get(0)).isEqualTo(SatelliteArrays.TruthRow.HEADER);
            String text;
            try (InputStream raw = Files.newInputStream(fa);
                 InputStream in = name.endsWith(".gz") ? new GZIPInputStream(raw) : raw) {
                text = new String(in.readAllBytes(), StandardCharsets.US_ASCII);
            }
            assertThat(text).startsWith(">sat01 ").contains("\n>sat02 ", "\n>sat03 ");
            if (!name.endsWith(".gz")) {
                // the .fai, read by htsjdk's indexed reader, reaches the right bases
                assertThat(dir.resolve("g.fa.fai")).exists();
                try (ReferenceSequenceFile ref = ReferenceSequenceFileFactory.getReferenceSequenceFile(fa)) {
                    assertThat(ref.isIndexed()).isTrue();
                    SatelliteArrays.Array a = g.arrays().get(4);
                    byte[] seq = g.sequences().get(g.names().indexOf(a.contig()));
                    byte[] got = ref.getSubsequenceAt(a.contig(), a.start() + 1, a.start() + 500).getBases();
                    assertThat(new String(got, StandardCharsets.US_ASCII))
                            .isEqualTo(new String(seq, a.start(), 500, StandardCharsets.US_ASCII));
                }
            }
        }
        try (var files = Files.list(dir)) {
            // no scratch directory or temporary left behind
            assertThat(files.map(p -> p.getFileName().toString()).sorted().toList())
                    .containsExactly("g.fa", "g.fa.fai", "g.fa.gz", "g.fa.gz.truth.tsv", "g.fa.truth.tsv");
        }
    }

    @Test
    void nonsenseOptionsAreUsageErrors() {
        CommandLine cl = new CommandLine(new SatelliteArrays());
        cl.setErr(new java.io.PrintWriter(java.io.Writer.nullWriter()));
        assertThat(cl.execute("--out", "x.fa", "--truth", "x.tsv", "--lengths", "9-3")).isEqualTo(2);
        assertThat(cl.execute("--out", "x.fa", "--truth", "x.tsv", "--within", "0.2-0.9")).isEqualTo(2);
    }

    private static List<SatelliteArrays.Array> hor(SatelliteArrays.Genome g) {
        return g.arrays().stream().filter(a -> a.blockUnits() > 1).toList();
    }

    /** Block copy {@code i} as it lies in the sequence (copies next to the interruption end at it). */
    private static byte[] copy(byte[] seq, SatelliteArrays.Array a, int i) {
        int s = a.copyStarts()[i];
        int e = a.copyStarts()[i + 1];
        if (a.interrupted() && s < a.gapStart() && e > a.gapStart()) {
            e = a.gapStart();
        }
        return java.util.Arrays.copyOfRange(seq, s, e);
    }

    private static byte[] concat(byte[][] parts) {
        int n = 0;
        for (byte[] p : parts) {
            n += p.length;
        }
        byte[] out = new byte[n];
        int at = 0;
        for (byte[] p : parts) {
            System.arraycopy(p, 0, out, at, p.length);
            at += p.length;
        }
        return out;
    }

    /** Edit distance over the mean length of the two. */
    static double divergence(byte[] a, byte[] b) {
        return editDistance(a, b) / ((a.length + b.length) / 2.0);
    }

    /**
     * Levenshtein distance in a diagonal band of 60 bases plus the length difference (copies here drift by
     * a few bases only; a path leaving the band could only make the distance read high, never low).
     */
    static int editDistance(byte[] a, byte[] b) {
        int band = 60 + Math.abs(a.length - b.length);
        int inf = Integer.MAX_VALUE / 2;
        int[] prev = new int[b.length + 2];
        int[] cur = new int[b.length + 2];
        java.util.Arrays.fill(prev, inf);
        for (int j = 0; j <= Math.min(b.length, band); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length; i++) {
            int lo = Math.max(1, i - band);
            int hi = Math.min(b.length, i + band);
            // the cells just outside the band are all a row reads of itself or the next row reads of it
            cur[lo - 1] = lo == 1 && i <= band ? i : inf;
            for (int j = lo; j <= hi; j++) {
                int best = prev[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1);
                best = Math.min(best, prev[j] + 1);
                best = Math.min(best, cur[j - 1] + 1);
                cur[j] = best;
            }
            cur[hi + 1] = inf;
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length];
    }
}
