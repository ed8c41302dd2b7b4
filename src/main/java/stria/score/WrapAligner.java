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
 *
 * <p>Memory does not grow with the length of an extension. The traceback is kept for one segment of
 * {@link #SEGMENT_ROWS} rows at a time, with a checkpoint (the band of scores, its position and its best
 * cell) at the start of every segment: the walk back recomputes each earlier segment from its checkpoint,
 * row for row as the extension computed it, so the path is the same as with the whole trace kept, for
 * about twice the work on extensions longer than one segment. The template is unrolled once over a
 * bounded length and read at an offset that moves on by whole periods.
 */
public final class WrapAligner {
    /** Half-width of the band: net drift tolerated between two rows is far smaller. */
    static final int HALF = 6;
    static final int BAND = 2 * HALF + 1;
    /** Rows of traceback held at a time: 512 KB of trace and band starts. */
    static final int SEGMENT_ROWS = 1 << 16;
    /** Template letters unrolled before the template is read at a moving offset instead of grown. */
    static final int TEMPLATE_ROLL = 1 << 12;
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
    // the ops of a row, two bits per band cell: one store per row instead of one per cell; slot r holds
    // row base + r of the segment in the buffer
    private int[] trace = new int[1024];
    private static final int START_ROW = (1 << (2 * BAND)) - 1;
    private int[] rowLo = new int[1024];
    private final int segmentRows;
    private final int templateRoll;
    private int base;
    private int bufRows;
    // per segment g >= 1: the band of row g * segmentRows - 1, its first template letter and its best cell
    private static final int CHECKPOINT = BAND + 2;
    private int[] checkpoints = new int[0];
    // the template as scores: tscore[t][x - tbase] is the score of text base t against template letter x
    // (letter tbase unused), tbase a multiple of the period; one load per cell instead of a comparison
    // and a select
    private byte[][] tscore = new byte[4][1024];
    private int tmplLen;
    private int tbase;
    private ScoringModel model;
    // the inputs of the last extend, which a segment is recomputed from
    private byte[] seq;
    private int pos0;
    private int dir;
    private byte[] motif;
    private int p;
    private int phase;
    // the band of the last row computed: its first template letter and the offset of its best cell
    private int lo;
    private int bestK;

    // result of the last extend
    private int bestI;
    private int bestJ;
    private int bestScore;
    private int rows;

    public WrapAligner() {
        this(SEGMENT_ROWS, TEMPLATE_ROLL);
    }

    /**
     * An aligner that holds the traceback of {@code segmentRows} rows at a time and unrolls at least
     * {@code templateRoll} template letters (tests use short ones; any values give the same alignments).
     */
    WrapAligner(int segmentRows, int templateRoll) {
        if (segmentRows < 2 || templateRoll < 1) {
            throw new IllegalArgumentException("segment of " + segmentRows + " rows, template of " + templateRoll);
        }
        this.segmentRows = segmentRows;
        this.templateRoll = templateRoll;
    }

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
        return rowLo[slot(i)];
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
        this.seq = seq;
        this.pos0 = pos0;
        this.dir = dir;
        this.motif = motif;
        this.p = p;
        this.phase = phase;
        tmplLen = 0;
        tbase = 0;
        origin();
        rows = 0;
        bestI = 0;
        bestJ = 0;
        bestScore = 0;
        compute(1, cap, xdrop, true);
        bufRows = rows - base + 1;
    }

    /** The state before the first text row: only the anchor cell is reached. */
    private void origin() {
        Arrays.fill(prev, PAD, PAD + BAND, NEG);
        prev[PAD] = 0;
        base = 0;
        rowLo[0] = 0;
        trace[0] = START_ROW;
        lo = 0;
        bestK = 0;
    }

    /**
     * Rows {@code from..to} from the band of row {@code from - 1} (in {@code prev}, {@link #lo},
     * {@link #bestK}). The extension ({@code extend}) also keeps the best cell, stops by X-drop and leaves a
     * checkpoint where a segment begins; a recomputation only fills the trace of the segment in the buffer.
     */
    private void compute(int from, int to, int xdrop, boolean extend) {
        int insScore = model.insertion();
        int delScore = model.deletion();
        // rows live in padded arrays so that cells outside the band, and column -1, read as unreachable;
        // the pads are never written
        int[] prev = this.prev;
        int[] cur = this.cur;
        int[] trace = this.trace;
        int[] rowLo = this.rowLo;
        byte[] seq = this.seq;
        int lo = this.lo;
        int prevBestK = this.bestK;
        int base = this.base;
        int bestI = this.bestI;
        int bestJ = this.bestJ;
        int bestScore = this.bestScore;
        int floor = bestScore - xdrop;
        int pos = pos0 + dir * (from - 1);
        int rows = this.rows;
        for (int i = from; i <= to; i++, pos += dir) {
            int t = Bases.code(seq[pos]);
            if (t < 0 || t > 3) {
                break;
            }
            int slot = i - base;
            if (slot == segmentRows) {
                // row i begins a segment: keep what computing it again needs
                checkpoint(i / segmentRows, prev, lo, prevBestK);
                base = i;
                slot = 0;
            }
            // centre the band on the best cell of the row above, one template letter further on
            int prevLo = lo;
            lo = Math.max(0, prevLo + prevBestK + 1 - HALF);
            int shift = lo - prevLo + PAD;
            if (slot >= rowLo.length) {
                ensureRows(slot + 1);
                trace = this.trace;
                rowLo = this.rowLo;
            }
            rowLo[slot] = lo;
            int rowMax = NEG;
            int rowMaxK = 0;
            int x0 = lo - tbase;
            // the band may also move back, below a template read at an offset
            if (x0 + BAND > tmplLen || x0 < 1 && tbase > 0) {
                template(lo);
                x0 = lo - tbase;
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
                int best = diag + sc[x0 + k];
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
            trace[slot] = ops;
            int[] sw = prev;
            prev = cur;
            cur = sw;
            prevBestK = rowMaxK;
            if (extend) {
                rows = i;
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
        }
        this.prev = prev;
        this.cur = cur;
        this.lo = lo;
        this.bestK = prevBestK;
        this.base = base;
        if (extend) {
            this.bestI = bestI;
            this.bestJ = bestJ;
            this.bestScore = bestScore;
            this.rows = rows;
        }
    }

    /** Keeps the band before the first row of segment {@code g}. */
    private void checkpoint(int g, int[] band, int lo, int bestK) {
        int at = (g - 1) * CHECKPOINT;
        if (at + CHECKPOINT > checkpoints.length) {
            checkpoints = Arrays.copyOf(checkpoints, Math.max(at + CHECKPOINT, 2 * checkpoints.length));
        }
        System.arraycopy(band, PAD, checkpoints, at, BAND);
        checkpoints[at + BAND] = lo;
        checkpoints[at + BAND + 1] = bestK;
    }

    /** The buffer slot of text row {@code i}, after computing its segment again when another is held. */
    private int slot(int i) {
        int slot = i - base;
        if (slot < 0 || slot >= bufRows) {
            load(i / segmentRows);
            slot = i - base;
        }
        return slot;
    }

    /** Computes the trace of segment {@code g} of the last extend again, from its checkpoint. */
    private void load(int g) {
        int first;
        if (g == 0) {
            origin();
            first = 1;
        } else {
            int at = (g - 1) * CHECKPOINT;
            System.arraycopy(checkpoints, at, prev, PAD, BAND);
            lo = checkpoints[at + BAND];
            bestK = checkpoints[at + BAND + 1];
            base = g * segmentRows;
            first = base;
        }
        int last = Math.min(rows, (g + 1) * segmentRows - 1);
        compute(first, last, 0, false);
        bufRows = last - base + 1;
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
        int slot = slot(i);
        int k = j - rowLo[slot];
        int op = (k >= 0 && k < BAND) ? (trace[slot] >>> (2 * k)) & 3 : START;
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

    /**
     * Makes the template cover letters {@code lo .. lo + BAND - 1}: unrolled further while it is short, else
     * read from the whole period at or before {@code lo} (the letters repeat with the period).
     */
    private void template(int lo) {
        if (tmplLen >= Math.max(templateRoll, p + BAND + 1)) {
            tbase = (lo - 1) / p * p;
        } else {
            unroll(motif, p, phase, dir, lo - tbase + BAND);
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
            int n = Math.min(segmentRows, Math.max(rows, rowLo.length * 2));
            rowLo = Arrays.copyOf(rowLo, n);
            trace = Arrays.copyOf(trace, n);
        }
    }
}
