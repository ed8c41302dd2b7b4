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
 * After {@link #extend} the path to the best cell can be walked column by column ({@link #beginPath},
 * {@link #nextColumn}). Columns are scored by a {@link ScoringModel} (log-odds in tenths of a bit), the
 * same model that scores the reported locus.
 */
public final class WrapAligner {
    /** Half-width of the band: net drift tolerated between two rows is far smaller. */
    static final int HALF = 6;
    static final int BAND = 2 * HALF + 1;
    private static final int NEG = Integer.MIN_VALUE / 4;
    // traceback codes
    static final byte DIAG = 0, INS = 1, DEL = 2, START = 3;

    private static final int PAD = HALF + 2;
    private int[] prev = new int[BAND + 2 * PAD];
    private int[] cur = new int[BAND + 2 * PAD];

    // extend writes only the band of a row, so the pads read as unreachable for the aligner's lifetime
    {
        Arrays.fill(prev, NEG);
        Arrays.fill(cur, NEG);
    }
    // the ops of a row, two bits per band cell: one store per row instead of one per cell
    private int[] trace = new int[1024];
    private static final int START_ROW = (1 << (2 * BAND)) - 1;
    private int[] rowLo = new int[1024];
    // the template unrolled as scores: tscore[t][x] is the score of text base t against template letter x
    // (letter 0 unused), grown on demand; one load per cell instead of a comparison and a select
    private byte[][] tscore = new byte[4][1024];
    private int tmplLen;
    private ScoringModel model;

    // result of the last extend
    private int bestI;
    private int bestJ;
    private int bestScore;
    private int rows;

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

    /** Text rows the last extend computed before it stopped (end of text, cap or X-drop). */
    int rows() {
        return rows;
    }

    /** Template letter of the first cell of the band of text row {@code i} (1..{@link #rows}). */
    int bandStart(int i) {
        return rowLo[i];
    }

    /**
     * Extends from {@code pos0} in direction {@code dir} (+1 or -1) over at most {@code cap} bases. Text
     * base number {@code i} (from 1) is {@code codes(seq[pos0 + dir * (i - 1)])}; template letter number
     * {@code j} (from 1) is {@code motif[mod(phase + dir * (j - 1), p)]}. A base that is not A, C, G or T
     * ends the text. Columns score as {@code model} says; {@code xdrop} is in its units.
     */
    public void extend(ScoringModel model, byte[] seq, int pos0, int dir, byte[] motif, int p, int phase, int cap,
                       int xdrop) {
        this.model = model;
        int insScore = model.insertion();
        int delScore = model.deletion();
        // rows live in padded arrays so that cells outside the band, and column -1, read as unreachable;
        // the pads are never written, so only the band of the first row needs resetting
        int[] prev = this.prev;
        int[] cur = this.cur;
        Arrays.fill(prev, PAD, PAD + BAND, NEG);
        prev[PAD] = 0;
        rowLo[0] = 0;
        int[] trace = this.trace;
        trace[0] = START_ROW;
        int lo = 0;
        int prevBestK = 0;
        tmplLen = 0;
        int bestI = 0;
        int bestJ = 0;
        int bestScore = 0;
        int floor = -xdrop;
        int pos = pos0;
        int rows = 0;
        for (int i = 1; i <= cap; i++, pos += dir) {
            int t = Bases.code(seq[pos]);
            if (t < 0 || t > 3) {
                break;
            }
            // centre the band on the best cell of the row above, one template letter further on
            int prevLo = lo;
            lo = Math.max(0, prevLo + prevBestK + 1 - HALF);
            int shift = lo - prevLo + PAD;
            if (i >= rowLo.length) {
                ensureRows(i + 1);
                trace = this.trace;
            }
            rowLo[i] = lo;
            int rowMax = NEG;
            int rowMaxK = 0;
            if (lo + BAND > tmplLen) {
                unroll(motif, p, phase, dir, lo + BAND);
            }
            byte[] sc = tscore[t];
            int left = NEG;
            // the cell above-left of column k + 1 is the cell above column k: each cell of the row above is
            // read once
            int diag = prev[shift - 1];
            int ops = 0;
            for (int k = 0; k < BAND; k++) {
                int up = prev[shift + k];
                // in random sequence every comparison below goes either way at random, so they are written
                // as selects rather than branches; ties keep the same order of preference (diagonal, then
                // insertion, then deletion) and the first best cell of the row
                int best = diag + sc[lo + k];
                int ins = up + insScore;
                int op = ins > best ? INS : DIAG;
                best = Math.max(best, ins);
                int del = left + delScore;
                op = del > best ? DEL : op;
                best = Math.max(best, del);
                cur[PAD + k] = best;
                left = best;
                diag = up;
                ops |= op << (2 * k);
                rowMaxK = best > rowMax ? k : rowMaxK;
                rowMax = Math.max(rowMax, best);
            }
            trace[i] = ops;
            rows = i;
            int[] sw = prev;
            prev = cur;
            cur = sw;
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
        this.prev = prev;
        this.cur = cur;
        this.bestI = bestI;
        this.bestJ = bestJ;
        this.bestScore = bestScore;
        this.rows = rows;
    }

    // the walk along the best path: the cell reached so far, and the column last returned
    private int walkI;
    private int walkJ;
    int colI;
    int colJ;

    /** Starts a walk along the best path of the last extend, from the far end inwards. */
    void beginPath() {
        walkI = bestI;
        walkJ = bestJ;
    }

    /**
     * The op of the next column of the walk, with its text row (from 1, or 0 for a leading deletion) in
     * {@link #colI} and its template letter in {@link #colJ}; -1 at the anchor. Callers loop over it
     * directly instead of receiving a callback per column.
     */
    int nextColumn() {
        int i = walkI;
        int j = walkJ;
        if (i == 0 && j == 0) {
            return -1;
        }
        int k = j - rowLo[i];
        int op = (k >= 0 && k < BAND) ? (trace[i] >>> (2 * k)) & 3 : START;
        colJ = j;
        if (op == DIAG) {
            colI = i;
            walkI = i - 1;
            walkJ = j - 1;
        } else if (op == INS) {
            colI = i;
            walkI = i - 1;
        } else if (op == DEL) {
            colI = i;
            walkJ = j - 1;
        } else {
            // only the origin row may end here: leading deletions
            colI = 0;
            walkJ = j - 1;
            op = DEL;
        }
        return op;
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
        ScoringModel m = model;
        byte m0 = (byte) m.match(0), m1 = (byte) m.match(1), m2 = (byte) m.match(2), m3 = (byte) m.match(3);
        byte x0 = (byte) m.substitution(0), x1 = (byte) m.substitution(1), x2 = (byte) m.substitution(2);
        byte x3 = (byte) m.substitution(3);
        int x = Math.max(tmplLen, 1);
        int direct = Math.min(n, 1 + p);
        if (x < direct) {
            int ph = Math.floorMod(phase + dir * (x - 1), p);
            for (; x < direct; x++) {
                byte letter = motif[ph];
                s0[x] = letter == 0 ? m0 : x0;
                s1[x] = letter == 1 ? m1 : x1;
                s2[x] = letter == 2 ? m2 : x2;
                s3[x] = letter == 3 ? m3 : x3;
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

    private void ensureRows(int rows) {
        if (rows > rowLo.length) {
            int n = Math.max(rows, rowLo.length * 2);
            rowLo = Arrays.copyOf(rowLo, n);
            trace = Arrays.copyOf(trace, n);
        }
    }
}
