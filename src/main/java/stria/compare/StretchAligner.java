package stria.compare;

import java.util.Arrays;
import stria.score.ScoringModel;

/**
 * Aligns B's bases between two anchors, end to end, against what A has between them: A's bases where A
 * has no repeat, and for every locus of A a loop over its consensus motif, so that each loop takes as
 * many of B's bases as B's copy of that repeat holds. This is wraparound dynamic programming (Fischetti,
 * Landau, Sellers &amp; Schmidt 1993) with the motif's cycle of template states embedded in a linear
 * template: a loop is entered at the phase A's locus starts with and left at any phase, and may be left
 * at once (nothing of the repeat in B). Scores are the scorer's log-odds columns on the uniform background
 * ({@link ScoringModel#uniform}: one match, substitution and gap score whatever the base; an insertion
 * and a deletion cost the same).
 *
 * <p>One loop is the target: the locus being measured. Along the best path the aligner carries the row at
 * which the target loop is entered and left (B's repeat is {@code [b0, b1)} of the text) and the
 * matches, mismatches, insertions and deletions inside it, so no traceback is kept and memory is two rows
 * of the template whatever the text's length. Loops of neighbouring loci matter because B's extra copies
 * of a neighbour would otherwise slide into the target at a lower cost than an insertion in flank.
 *
 * <p>Ties go, in this order, to the diagonal, an insertion, a deletion; a loop is entered as early as a
 * tie allows and an inserted base next to a loop is counted outside it, so a length change is only called
 * where the bases require it. The cells of a row are computed segment by segment with selects rather than
 * branches (in unrelated bases every comparison goes either way at random). One instance per thread.
 */
final class StretchAligner {
    static final int MATCH = ScoringModel.uniform().match(0);
    static final int MISMATCH = ScoringModel.uniform().substitution(0);
    /** Each inserted or deleted base. */
    static final int GAP = ScoringModel.uniform().insertion();
    private static final int NEG = Integer.MIN_VALUE / 4;

    // the template: letter[v] is consumed on the way into node v from v - 1, and, for the first state of a
    // loop's cycle, from the cycle's last state; node 0 is the start
    private int nodes;
    private byte[] letter = new byte[64];
    // segments in order: linear runs of nodes [segA, segB], and loops with entry state segA and exit node
    // segB (cycle states segA..segB - 1); the node before a segment is the one it is entered from
    private int segs;
    private int[] segA = new int[16];
    private int[] segB = new int[16];
    private boolean[] segLoop = new boolean[16];
    private int targetEntry = -1;
    private int targetExit = -1;

    private int[] prev = new int[64];
    private int[] cur = new int[64];
    // figures carried along the best path into each node, from the target's entry on, for the previous
    // row at offset po and this row at co: rows of entry and exit (entry << 32 | exit), matches and
    // mismatches (m << 32 | x), insertions and deletions (i << 32 | d)
    private long[] fPos = new long[128];
    private long[] fMx = new long[128];
    private long[] fId = new long[128];
    private int cap = 64;
    private int po;
    private int co;

    private int score;
    private long rPos;
    private long rMx;
    private long rId;

    private static final long HI = 1L << 32;
    private static final long LO_MASK = 0xFFFFFFFFL;

    /** Starts a new template. */
    void reset() {
        nodes = 1;
        segs = 0;
        targetEntry = targetExit = -1;
    }

    /** Appends A's bases {@code codes[from, to)} (0..3). */
    void linear(byte[] codes, int from, int to) {
        if (from >= to) {
            return;
        }
        int a = nodes;
        for (int i = from; i < to; i++) {
            add(codes[i]);
        }
        if (segs > 0 && !segLoop[segs - 1] && segB[segs - 1] == a - 1) {
            segB[segs - 1] = nodes - 1;
        } else {
            segment(a, nodes - 1, false);
        }
    }

    /**
     * Appends a loop over {@code motif} (codes 0..3), entered at {@code phase}: the template letters it
     * offers are {@code motif[phase], motif[phase + 1], ...} around and around.
     */
    void loop(byte[] motif, int phase, boolean target) {
        int p = motif.length;
        int entry = nodes;
        // the entry state is reached around the cycle by the letter before the entry phase
        add(motif[(phase + p - 1) % p]);
        for (int r = 1; r < p; r++) {
            add(motif[(phase + r - 1) % p]);
        }
        add((byte) 0);
        segment(entry, nodes - 1, true);
        if (target) {
            targetEntry = entry;
            targetExit = nodes - 1;
        }
    }

    private void add(byte l) {
        if (nodes == letter.length) {
            letter = Arrays.copyOf(letter, 2 * nodes);
        }
        letter[nodes++] = l;
    }

    private void segment(int a, int b, boolean loop) {
        if (segs == segA.length) {
            segA = Arrays.copyOf(segA, 2 * segs);
            segB = Arrays.copyOf(segB, 2 * segs);
            segLoop = Arrays.copyOf(segLoop, 2 * segs);
        }
        segA[segs] = a;
        segB[segs] = b;
        segLoop[segs] = loop;
        segs++;
    }

    boolean align(byte[] text, int n, long maxCells) {
        return align(text, 0, n, maxCells);
    }

    /**
     * Aligns {@code text[from, from + n)} (codes; anything but 0..3 mismatches every letter) against the
     * whole template; rows count from {@code from}. Returns false, leaving nothing, when
     * {@code (n + 1) x nodes} exceeds {@code maxCells}.
     */
    boolean align(byte[] text, int from, int n, long maxCells) {
        int nn = nodes;
        if ((long) (n + 1) * nn > maxCells || targetEntry < 0) {
            return false;
        }
        if (cap < nn) {
            cap = Math.max(nn, 2 * cap);
            prev = new int[cap];
            cur = new int[cap];
            fPos = new long[2 * cap];
            fMx = new long[2 * cap];
            fId = new long[2 * cap];
        }
        // the row before the first is unreachable, so row 0 needs no case of its own
        Arrays.fill(prev, 0, nn, NEG);
        po = 0;
        co = cap;
        for (int i = 0; i <= n; i++) {
            int t = i == 0 ? -1 : text[from + i - 1];
            cur[0] = i == 0 ? 0 : prev[0] + GAP;
            for (int k = 0; k < segs; k++) {
                int a = segA[k];
                int b = segB[k];
                if (!segLoop[k]) {
                    if (a < targetEntry) {
                        linearScores(a, b, t);
                    } else {
                        linearCarried(a, b, t);
                    }
                } else {
                    loopRow(a, b, t, i);
                }
            }
            int[] sw = prev;
            prev = cur;
            cur = sw;
            int so = po;
            po = co;
            co = so;
        }
        score = prev[nn - 1];
        rPos = fPos[po + nn - 1];
        rMx = fMx[po + nn - 1];
        rId = fId[po + nn - 1];
        return true;
    }

    /** Nodes a..b of a run of A's bases before the target: scores only. */
    private void linearScores(int a, int b, int t) {
        int[] pv = prev;
        int[] cv = cur;
        byte[] let = letter;
        int left = cv[a - 1];
        for (int v = a; v <= b; v++) {
            int d = pv[v - 1] + (t == let[v] ? MATCH : MISMATCH);
            int best = Math.max(Math.max(d, pv[v] + GAP), left + GAP);
            cv[v] = best;
            left = best;
        }
    }

    /** As {@link #linearScores}, carrying the figures (the target is behind). */
    private void linearCarried(int a, int b, int t) {
        int[] pv = prev;
        int[] cv = cur;
        byte[] let = letter;
        long[] fp = fPos;
        long[] fm = fMx;
        long[] fi = fId;
        int p0 = po;
        int c0 = co;
        for (int v = a; v <= b; v++) {
            int d = pv[v - 1] + (t == let[v] ? MATCH : MISMATCH);
            int ins = pv[v] + GAP;
            int del = cv[v - 1] + GAP;
            int src = ins > d ? p0 + v : p0 + v - 1;
            int best = Math.max(d, ins);
            src = del > best ? c0 + v - 1 : src;
            cv[v] = Math.max(best, del);
            fp[c0 + v] = fp[src];
            fm[c0 + v] = fm[src];
            fi[c0 + v] = fi[src];
        }
    }

    /** A loop with entry state a, cycle states a..b - 1, exit node b, in row i. */
    private void loopRow(int a, int b, int t, int i) {
        int[] pv = prev;
        int[] cv = cur;
        byte[] let = letter;
        long[] fp = fPos;
        long[] fm = fMx;
        long[] fi = fId;
        int p0 = po;
        int c0 = co;
        int last = b - 1;
        boolean carried = a >= targetEntry;
        boolean target = a == targetEntry;
        // entry state: free from the node before, around the cycle from its last state, or an insertion
        int eps = cv[a - 1];
        int d = pv[last] + (t == let[a] ? MATCH : MISMATCH);
        int ins = pv[a] + GAP;
        int op = d > eps ? 0 : 3;
        int best = Math.max(eps, d);
        op = ins > best ? 1 : op;
        cv[a] = Math.max(best, ins);
        if (carried) {
            if (target && op == 3) {
                fp[c0 + a] = ((long) i << 32) | LO_MASK;
                fm[c0 + a] = 0;
                fi[c0 + a] = 0;
            } else {
                int src = op == 0 ? p0 + last : op == 1 ? p0 + a : c0 + a - 1;
                step(c0 + a, src, op, target && op != 3, t == let[a]);
            }
        }
        for (int v = a + 1; v <= last; v++) {
            d = pv[v - 1] + (t == let[v] ? MATCH : MISMATCH);
            ins = pv[v] + GAP;
            int del = cv[v - 1] + GAP;
            op = ins > d ? 1 : 0;
            best = Math.max(d, ins);
            op = del > best ? 2 : op;
            cv[v] = Math.max(best, del);
            if (carried) {
                int src = op == 0 ? p0 + v - 1 : op == 1 ? p0 + v : c0 + v - 1;
                step(c0 + v, src, op, target, t == let[v]);
            }
        }
        // deletions from the last state around to the first and on
        if (last > a) {
            int from = last;
            for (int q = a; q < last; q++) {
                int x = cv[from] + GAP;
                if (x <= cv[q]) {
                    break;
                }
                cv[q] = x;
                if (carried) {
                    step(c0 + q, c0 + from, 2, target, false);
                }
                from = q;
            }
        }
        // exit: a base inserted after the loop is flank; otherwise leave from the best state
        int xb = pv[b] + GAP;
        int xq = -1;
        for (int q = a; q <= last; q++) {
            if (cv[q] > xb) {
                xb = cv[q];
                xq = q;
            }
        }
        cv[b] = xb;
        if (carried) {
            if (xq < 0) {
                fp[c0 + b] = fp[p0 + b];
                fm[c0 + b] = fm[p0 + b];
                fi[c0 + b] = fi[p0 + b];
            } else {
                fp[c0 + b] = target ? (fp[c0 + xq] & ~LO_MASK) | i : fp[c0 + xq];
                fm[c0 + b] = fm[c0 + xq];
                fi[c0 + b] = fi[c0 + xq];
            }
        }
    }

    /** The figures into cell dst from cell src by op (0 diagonal, 1 insertion, 2 deletion), counted in the target. */
    private void step(int dst, int src, int op, boolean count, boolean match) {
        long[] fm = fMx;
        long[] fi = fId;
        fPos[dst] = fPos[src];
        long mx = fm[src];
        long id = fi[src];
        if (count) {
            mx += op == 0 ? (match ? HI : 1) : 0;
            id += op == 1 ? HI : op == 2 ? 1 : 0;
        }
        fm[dst] = mx;
        fi[dst] = id;
    }

    /** Score of the last alignment. */
    int score() {
        return score;
    }

    /** First text base in the target loop. */
    int repeatStart() {
        return (int) (rPos >>> 32);
    }

    /** One past the last text base in the target loop. */
    int repeatEnd() {
        return (int) rPos;
    }

    int matches() {
        return (int) (rMx >>> 32);
    }

    int mismatches() {
        return (int) rMx;
    }

    int insertions() {
        return (int) (rId >>> 32);
    }

    int deletions() {
        return (int) rId;
    }

    /** Share of the target loop's alignment columns that agree with the motif; 0 for an empty loop. */
    double purity() {
        int cols = matches() + mismatches() + insertions() + deletions();
        return cols == 0 ? 0 : matches() / (double) cols;
    }
}
