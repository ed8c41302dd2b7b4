package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.statistics.Statistics;
import stria.io.Bases;

/**
 * The banded X-drop wraparound alignment against full, unbanded wraparound dynamic programming
 * (Fischetti, Landau, Sellers &amp; Schmidt 1993) over the same rows: text base i against template letter
 * j, with leading deletions and insertions allowed. Banded cells hold scores of real paths, so the banded
 * best never exceeds the full optimum; where an optimal path of the full table stays inside the band of
 * every row, the band cannot have cut it and the two agree. The path walked back from the best cell must
 * be a real path from the anchor whose columns add up to the reported score.
 */
class WrapAlignerProperties {
    private static final byte NOT_A_BASE = 'N';

    /** A repeat of {@code motif} read from {@code phase} in direction {@code dir}, with errors, then random. */
    private static byte[] text(Random r, byte[] motif, int phase, int dir, int repeatLen, int errorsPercent,
                               int flank) {
        int p = motif.length;
        StringBuilder sb = new StringBuilder();
        int j = 0;
        while (sb.length() < repeatLen) {
            int e = r.nextInt(100);
            char letter = (char) Bases.letter(motif[Math.floorMod(phase + dir * j, p)]);
            if (e < errorsPercent / 3) {
                sb.append("ACGT".charAt(r.nextInt(4))); // insertion
            } else if (e < 2 * errorsPercent / 3) {
                j++; // deletion
            } else if (e < errorsPercent) {
                sb.append("ACGT".charAt(r.nextInt(4)));
                j++;
            } else {
                sb.append(r.nextBoolean() ? letter : Character.toLowerCase(letter));
                j++;
            }
        }
        for (int i = 0; i < flank; i++) {
            sb.append("ACGT".charAt(r.nextInt(4)));
        }
        if (r.nextInt(4) == 0) {
            sb.setCharAt(r.nextInt(sb.length()), (char) NOT_A_BASE);
        }
        return sb.toString().getBytes(java.nio.charset.StandardCharsets.US_ASCII);
    }

    private static byte[] randomMotif(Random r, int p) {
        byte[] motif = new byte[p];
        for (int i = 0; i < p; i++) {
            motif[i] = (byte) r.nextInt(4);
        }
        return motif;
    }

    @Property(tries = 400)
    void bandedAgainstFullDynamicProgramming(@ForAll long seed, @ForAll @IntRange(min = 1, max = 14) int p,
                                            @ForAll @IntRange(min = 0, max = 30) int errorsPercent,
                                            @ForAll boolean leftwards) {
        Random r = new Random(seed);
        byte[] motif = randomMotif(r, p);
        int phase = r.nextInt(p);
        int dir = leftwards ? -1 : 1;
        byte[] reading = text(r, motif, phase, dir, 20 + r.nextInt(150), errorsPercent, r.nextInt(60));
        int cap = 1 + r.nextInt(reading.length);
        // score units are tenths of a bit: a uniform match is 17
        int xdrop = 80 + r.nextInt(640);
        // any background class: the scores then depend on the base, and insertions on the text side
        ScoringModel m = ScoringModel.forClass(r.nextInt(ScoringModel.GC_CLASSES));
        boolean inBand = check(m, reading, motif, phase, dir, cap, xdrop);
        Statistics.label("optimal path inside the band").collect(inBand);
    }

    /**
     * The traceback kept one segment at a time (recomputed from checkpoints on the walk back) and the
     * template read at a moving offset give exactly the alignment of the whole trace and the whole template:
     * the same end, score and rows, and the same path column by column. Segments of 2 to 40 rows and
     * template rolls down to one letter make every extension cross many segment boundaries and rebases.
     */
    @Property(tries = 300)
    void segmentedTraceIsTheWholeTrace(@ForAll long seed, @ForAll @IntRange(min = 1, max = 40) int p,
                                       @ForAll @IntRange(min = 0, max = 30) int errorsPercent,
                                       @ForAll @IntRange(min = 2, max = 40) int segment,
                                       @ForAll @IntRange(min = 1, max = 64) int roll, @ForAll boolean leftwards) {
        Random r = new Random(seed);
        byte[] motif = randomMotif(r, p);
        int phase = r.nextInt(p);
        int dir = leftwards ? -1 : 1;
        byte[] reading = text(r, motif, phase, dir, 50 + r.nextInt(1500), errorsPercent, r.nextInt(100));
        int n0 = reading.length;
        byte[] seq = new byte[n0];
        for (int i = 0; i < n0; i++) {
            seq[dir > 0 ? i : n0 - 1 - i] = reading[i];
        }
        int pos0 = dir > 0 ? 0 : n0 - 1;
        int cap = 1 + r.nextInt(n0);
        int xdrop = 80 + r.nextInt(640);
        ScoringModel m = ScoringModel.forClass(r.nextInt(ScoringModel.GC_CLASSES));
        WrapAligner whole = new WrapAligner();
        WrapAligner cut = new WrapAligner(segment, roll);
        // twice on the same aligners: the second extend must not see anything of the first
        for (int round = 0; round < 2; round++) {
            whole.extend(m, seq, pos0, dir, motif, p, phase, cap, xdrop);
            cut.extend(m, seq, pos0, dir, motif, p, phase, cap, xdrop);
            assertThat(cut.rows()).isEqualTo(whole.rows());
            assertThat(cut.bestI()).isEqualTo(whole.bestI());
            assertThat(cut.bestJ()).isEqualTo(whole.bestJ());
            assertThat(cut.bestScore()).isEqualTo(whole.bestScore());
            // two walks of one extend: the first leaves the buffer on the first segment
            for (int walk = 0; walk < 2; walk++) {
                whole.beginPath();
                cut.beginPath();
                int columns = 0;
                for (int op = whole.nextColumn(); op >= 0; op = whole.nextColumn(), columns++) {
                    assertThat(cut.nextColumn()).isEqualTo(op);
                    assertThat(cut.colI).isEqualTo(whole.colI);
                    assertThat(cut.colJ).isEqualTo(whole.colJ);
                }
                assertThat(cut.nextColumn()).isEqualTo(-1);
                Statistics.label("segments crossed").collect(Math.min(columns / segment, 10));
            }
            for (int i = 1; i <= whole.rows(); i += 1 + r.nextInt(50)) {
                assertThat(cut.bandStart(i)).isEqualTo(whole.bandStart(i));
            }
            cap = 1 + r.nextInt(n0);
        }
    }

    /** An error burst early: the best path leaves the diagonal by several bases at once. */
    @Example
    void aLongInsertionNearTheAnchor() {
        byte[] motif = {1, 0, 2}; // CAG
        byte[] reading = "CAGCAGTTTTTTTCAGCAGCAGCAGCAGCAGCAG".getBytes(java.nio.charset.StandardCharsets.US_ASCII);
        check(ScoringModel.uniform(), reading, motif, 0, 1, reading.length, 500);
        check(ScoringModel.forClass(2), reading, motif, 0, -1, reading.length, 500);
    }

    /**
     * Runs the banded aligner on {@code reading} laid out for {@code dir} and checks it against the full
     * table; returns whether an optimal path lies inside the band (and so equality was asserted).
     */
    private static boolean check(ScoringModel m, byte[] reading, byte[] motif, int phase, int dir, int cap, int xdrop) {
        int n0 = reading.length;
        byte[] seq = new byte[n0];
        for (int i = 0; i < n0; i++) {
            seq[dir > 0 ? i : n0 - 1 - i] = reading[i];
        }
        int pos0 = dir > 0 ? 0 : n0 - 1;
        int p = motif.length;
        WrapAligner a = new WrapAligner();
        a.extend(m, seq, pos0, dir, motif, p, phase, cap, xdrop);

        // text ends at the cap or the first letter that is not a base
        int n = 0;
        while (n < cap && Bases.code(reading[n]) >= 0 && Bases.code(reading[n]) <= 3) {
            n++;
        }
        int rows = a.rows();
        assertThat(rows).isBetween(0, n);
        int cols = 2 * n + WrapAligner.BAND + 2;
        int[][] d = full(m, reading, n, motif, phase, dir, cols);

        int bestI = 0;
        int bestJ = 0;
        for (int i = 0; i <= rows; i++) {
            for (int j = 0; j <= cols; j++) {
                if (d[i][j] > d[bestI][bestJ]) {
                    bestI = i;
                    bestJ = j;
                }
            }
        }
        int optimum = d[bestI][bestJ];
        assertThat(a.bestI()).isBetween(0, rows);
        assertThat(a.bestScore()).isLessThanOrEqualTo(optimum);
        assertThat(a.bestScore()).isLessThanOrEqualTo(d[a.bestI()][a.bestJ()]);
        assertThat(walkedScore(m, a, reading, motif, phase, dir)).isEqualTo(a.bestScore());

        boolean inBand = pathInBand(m, d, reading, motif, phase, dir, a, bestI, bestJ);
        if (inBand) {
            assertThat(a.bestScore()).isEqualTo(optimum);
        }
        return inBand;
    }

    private static int letter(byte[] motif, int phase, int dir, int j) {
        return motif[Math.floorMod(phase + dir * (j - 1), motif.length)];
    }

    private static int sub(ScoringModel m, byte[] reading, byte[] motif, int phase, int dir, int i, int j) {
        int b = Bases.code(reading[i - 1]);
        return b == letter(motif, phase, dir, j) ? m.match(b) : m.substitution(b);
    }

    /** The full table: d[i][j] is the best score of a path from the anchor to text row i, template letter j. */
    private static int[][] full(ScoringModel m, byte[] reading, int n, byte[] motif, int phase, int dir, int cols) {
        int[][] d = new int[n + 1][cols + 1];
        for (int j = 1; j <= cols; j++) {
            d[0][j] = d[0][j - 1] + m.deletion();
        }
        for (int i = 1; i <= n; i++) {
            d[i][0] = d[i - 1][0] + m.insertion();
            for (int j = 1; j <= cols; j++) {
                int v = d[i - 1][j - 1] + sub(m, reading, motif, phase, dir, i, j);
                v = Math.max(v, d[i - 1][j] + m.insertion());
                v = Math.max(v, d[i][j - 1] + m.deletion());
                d[i][j] = v;
            }
        }
        return d;
    }

    /** The score of the path the aligner walks back, checked step by step to be a path to the anchor. */
    private static int walkedScore(ScoringModel m, WrapAligner a, byte[] reading, byte[] motif, int phase, int dir) {
        int i = a.bestI();
        int j = a.bestJ();
        int score = 0;
        a.beginPath();
        for (int op = a.nextColumn(); op >= 0; op = a.nextColumn()) {
            assertThat(a.colJ).isEqualTo(j);
            if (op == WrapAligner.DIAG) {
                assertThat(a.colI).isEqualTo(i);
                score += sub(m, reading, motif, phase, dir, i, j);
                i--;
                j--;
            } else if (op == WrapAligner.INS) {
                assertThat(a.colI).isEqualTo(i);
                score += m.insertion();
                i--;
            } else {
                assertThat(op).isEqualTo(WrapAligner.DEL);
                assertThat(a.colI).isEqualTo(i);
                score += m.deletion();
                j--;
            }
            assertThat(i).isNotNegative();
            assertThat(j).isNotNegative();
        }
        assertThat(i).isZero();
        assertThat(j).isZero();
        return score;
    }

    /**
     * Whether one optimal path to (bi, bj) of the full table, traced back preferring the diagonal, then
     * insertion, then deletion, stays inside the band of every row (row 0 holds only the anchor).
     */
    private static boolean pathInBand(ScoringModel m, int[][] d, byte[] reading, byte[] motif, int phase, int dir, WrapAligner a,
                                      int bi, int bj) {
        int i = bi;
        int j = bj;
        while (i > 0 || j > 0) {
            if (i == 0) {
                return false;
            }
            int lo = a.bandStart(i);
            if (j < lo || j >= lo + WrapAligner.BAND) {
                return false;
            }
            if (j > 0 && d[i][j] == d[i - 1][j - 1] + sub(m, reading, motif, phase, dir, i, j)) {
                i--;
                j--;
            } else if (d[i][j] == d[i - 1][j] + m.insertion()) {
                i--;
            } else {
                j--;
            }
        }
        return true;
    }
}
