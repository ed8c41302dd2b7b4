package stria.score;

import java.util.Arrays;
import stria.io.Bases;

/**
 * Aligns a stretch of DNA, read outwards from an anchor in one direction, against an unbounded repetition
 * of a motif, and stops where the alignment stops paying. This is wraparound dynamic programming
 * (Fischetti, Landau, Sellers &amp; Schmidt 1993) restricted to an adaptive band: the template is the
 * motif unrolled, so a path may drift by insertions and deletions, and each row keeps only the
 * {@link #BAND} cells around the best cell of the row before. Extension ends by X-drop: once every cell of
 * a row is more than {@code xdrop} below the best score seen, the best cell is the end.
 *
 * <p>One instance per thread; it reuses its buffers, so a call allocates nothing once they have grown.
 * After {@link #extend} the path to the best cell can be walked with {@link #traceback}.
 */
public final class WrapAligner {
    /** Reward of a text base equal to the motif letter it is aligned with. */
    public static final int MATCH = 2;
    /** Cost of a substitution: one and a half matches, so 60 % identity is the break-even point. */
    public static final int MISMATCH = -3;
    /** Cost of each inserted or deleted base: a little dearer than a substitution. */
    public static final int GAP = -5;

    /** Half-width of the band: net drift tolerated between two rows is far smaller. */
    static final int HALF = 6;
    static final int BAND = 2 * HALF + 1;
    private static final int NEG = Integer.MIN_VALUE / 4;
    // traceback codes
    static final byte DIAG = 0, INS = 1, DEL = 2, START = 3;

    private static final int PAD = HALF + 2;
    /**
     * Every row of the band is kept, padded so that cells outside the band, and column -1, read as
     * unreachable: row i occupies {@code [i * ROW, (i + 1) * ROW)} of {@link #cells}, band cell k at
     * {@code PAD + k}. The path is recovered from the scores themselves, which spares the inner loop the
     * choice of an operation for every cell; extension never writes the pads.
     */
    private static final int ROW = BAND + 2 * PAD;
    private int[] cells = newCells(1024);
    private int[] rowLo = new int[1024];
    // the template unrolled as scores: tscore[t][x] is the score of text base t against template letter x
    // (letter 0 unused), grown on demand; one load per cell instead of a comparison and a select
    private byte[][] tscore = new byte[4][1024];
    private int tmplLen;
    // the text of the last extend, read again by the traceback
    private byte[] seq;
    private int pos0;
    private int dir;

    // result of the last extend
    private int bestI;
    private int bestJ;
    private int bestScore;

    /** Text rows consumed by the best alignment. */
    public int bestI() {
        return bestI;
    }

    /** Template letters consumed by the best alignment. */
    public int bestJ() {
        return bestJ;
    }

    public int bestScore() {
        return bestScore;
    }

    /**
     * Extends from {@code pos0} in direction {@code dir} (+1 or -1) over at most {@code cap} bases. Text
     * base number {@code i} (from 1) is {@code codes(seq[pos0 + dir * (i - 1)])}; template letter number
     * {@code j} (from 1) is {@code motif[mod(phase + dir * (j - 1), p)]}. A base that is not A, C, G or T
     * ends the text.
     */
    public void extend(byte[] seq, int pos0, int dir, byte[] motif, int p, int phase, int cap, int xdrop) {
        this.seq = seq;
        this.pos0 = pos0;
        this.dir = dir;
        int[] h = cells;
        Arrays.fill(h, PAD, PAD + BAND, NEG);
        h[PAD] = 0;
        rowLo[0] = 0;
        int lo = 0;
        int prevBestK = 0;
        tmplLen = 0;
        int bestI = 0;
        int bestJ = 0;
        int bestScore = 0;
        int floor = -xdrop;
        int pos = pos0;
        for (int i = 1; i <= cap; i++, pos += dir) {
            int t = Bases.code(seq[pos]);
            if (t < 0 || t > 3) {
                break;
            }
            // centre the band on the best cell of the row above, one template letter further on
            int prevLo = lo;
            lo = Math.max(0, prevLo + prevBestK + 1 - HALF);
            if (i >= rowLo.length) {
                ensureRows(i + 1);
                h = cells;
            }
            rowLo[i] = lo;
            int rowMax = NEG;
            int rowMaxK = 0;
            if (lo + BAND > tmplLen) {
                unroll(motif, p, phase, dir, lo + BAND);
            }
            byte[] sc = tscore[t];
            int hb = i * ROW + PAD;
            // the same column of the row above, padded: column k is at up + k
            int up0 = hb - ROW + lo - prevLo;
            int left = NEG;
            // the cell above-left of column k + 1 is the cell above column k: each cell of the row above is
            // read once
            int diag = h[up0 - 1];
            for (int k = 0; k < BAND; k++) {
                int up = h[up0 + k];
                // the same preference as the traceback: diagonal, then insertion, then deletion
                int best = Math.max(diag + sc[lo + k], up + GAP);
                best = Math.max(best, left + GAP);
                h[hb + k] = best;
                left = best;
                diag = up;
                // the first best cell of the row
                rowMaxK = best > rowMax ? k : rowMaxK;
                rowMax = Math.max(rowMax, best);
            }
            prevBestK = rowMaxK;
            if (rowMax > bestScore) {
                bestScore = rowMax;
                bestI = i;
                bestJ = lo + rowMaxK;
                floor = rowMax - xdrop;
            }
            if (rowMax < floor) {
                break;
            }
        }
        this.bestI = bestI;
        this.bestJ = bestJ;
        this.bestScore = bestScore;
    }

    /**
     * The operation that gave the cell of row i (from 1) at band column k, chosen as the extension chose
     * it: the diagonal unless an insertion beats it, then a deletion if it beats both.
     */
    private int op(int i, int k) {
        int[] h = cells;
        int lo = rowLo[i];
        int hb = i * ROW + PAD;
        int up0 = hb - ROW + lo - rowLo[i - 1];
        int t = Bases.code(seq[pos0 + dir * (i - 1)]);
        int best = h[up0 + k - 1] + tscore[t][lo + k];
        int op = DIAG;
        int ins = h[up0 + k] + GAP;
        if (ins > best) {
            best = ins;
            op = INS;
        }
        // column -1 of the row is a pad
        if (h[hb + k - 1] + GAP > best) {
            op = DEL;
        }
        return op;
    }

    /**
     * Walks the best path back to the anchor into {@link #pathI}, {@link #pathJ} and {@link #pathOp}, from
     * the far end inwards, and returns the number of columns: text row i from 1 (0 for a leading
     * deletion), template letter j, op. Callers loop over plain arrays instead of a callback per column.
     */
    int path() {
        int i = bestI;
        int j = bestJ;
        int need = i + j;
        if (pathI.length < need) {
            int n = Math.max(need, 2 * pathI.length);
            pathI = new int[n];
            pathJ = new int[n];
            pathOp = new byte[n];
        }
        int[] pi = pathI;
        int[] pj = pathJ;
        byte[] po = pathOp;
        int[] rowLo = this.rowLo;
        int n = 0;
        while (i > 0 || j > 0) {
            int k = j - rowLo[i];
            int op = (i > 0 && k >= 0 && k < BAND) ? op(i, k) : START;
            if (op == DIAG) {
                pi[n] = i;
                pj[n] = j;
                po[n++] = DIAG;
                i--;
                j--;
            } else if (op == INS) {
                pi[n] = i;
                pj[n] = j;
                po[n++] = INS;
                i--;
            } else if (op == DEL) {
                pi[n] = i;
                pj[n] = j;
                po[n++] = DEL;
                j--;
            } else {
                // only the origin row may end here: leading deletions
                pi[n] = 0;
                pj[n] = j;
                po[n++] = DEL;
                j--;
            }
        }
        return n;
    }

    // columns of the last path(), grown on demand
    int[] pathI = new int[1024];
    int[] pathJ = new int[1024];
    byte[] pathOp = new byte[1024];

    /**
     * Walks the best path back to the anchor and reports each column to the sink, from the far end
     * inwards. Returns nothing; the sink sees (text row i from 1 or 0 for a deletion, template letter j,
     * op).
     */
    public void traceback(Sink sink) {
        int n = path();
        for (int c = 0; c < n; c++) {
            sink.column(pathI[c], pathJ[c], pathOp[c]);
        }
    }

    private void unroll(byte[] motif, int p, int phase, int dir, int need) {
        int n = Math.max(need + 64, 2 * tmplLen);
        if (tscore[0].length < n) {
            for (int b = 0; b < 4; b++) {
                tscore[b] = Arrays.copyOf(tscore[b], n);
            }
        }
        byte[] s0 = tscore[0];
        byte[] s1 = tscore[1];
        byte[] s2 = tscore[2];
        byte[] s3 = tscore[3];
        // letter x (from 1) is motif[mod(phase + dir * (x - 1), p)]; the first period is read from the
        // motif, the rest is copied from whole periods before, in blocks
        int x = Math.max(tmplLen, 1);
        int direct = Math.min(n, 1 + p);
        if (x < direct) {
            int ph = Math.floorMod(phase + dir * (x - 1), p);
            for (; x < direct; x++) {
                byte letter = motif[ph];
                s0[x] = (byte) (letter == 0 ? MATCH : MISMATCH);
                s1[x] = (byte) (letter == 1 ? MATCH : MISMATCH);
                s2[x] = (byte) (letter == 2 ? MATCH : MISMATCH);
                s3[x] = (byte) (letter == 3 ? MATCH : MISMATCH);
                ph += dir;
                if (ph == p) {
                    ph = 0;
                } else if (ph < 0) {
                    ph = p - 1;
                }
            }
        }
        while (x < n) {
            int back = (x - 1) / p * p;
            int len = Math.min(n - x, back);
            System.arraycopy(s0, x - back, s0, x, len);
            System.arraycopy(s1, x - back, s1, x, len);
            System.arraycopy(s2, x - back, s2, x, len);
            System.arraycopy(s3, x - back, s3, x, len);
            x += len;
        }
        tmplLen = n;
    }

    /** Receives the columns of a traced alignment. */
    public interface Sink {
        void column(int i, int j, byte op);
    }

    private void ensureRows(int rows) {
        if (rows > rowLo.length) {
            int n = Math.max(rows, rowLo.length * 2);
            rowLo = Arrays.copyOf(rowLo, n);
            int[] grown = newCells(n);
            System.arraycopy(cells, 0, grown, 0, cells.length);
            cells = grown;
        }
    }

    private static int[] newCells(int rows) {
        int[] h = new int[rows * ROW];
        Arrays.fill(h, NEG);
        return h;
    }
}
