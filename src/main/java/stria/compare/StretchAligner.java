package stria.compare;

import java.util.Arrays;
import stria.score.WrapAligner;

/**
 * Aligns B's bases between two anchors, end to end, against what A has between them: A's bases where A
 * has no repeat, and for every locus of A a loop over its consensus motif, so that each loop takes as
 * many of B's bases as B's copy of that repeat holds. This is wraparound dynamic programming (Fischetti,
 * Landau, Sellers &amp; Schmidt 1993) with the motif's cycle of template states embedded in a linear
 * template: a loop is entered at the phase A's locus starts with and left at any phase, and may be left
 * at once (nothing of the repeat in B). Scores are the scorer's ({@link WrapAligner#MATCH},
 * {@link WrapAligner#MISMATCH}, {@link WrapAligner#GAP} for each inserted or deleted base).
 *
 * <p>One loop is the target: the locus being measured. Along the best path the aligner carries the row at
 * which the target loop is entered and left (B's repeat is {@code [b0, b1)} of the text) and the
 * matches, mismatches, insertions and deletions inside it, so no traceback is kept and memory is two rows
 * of the template whatever the text's length. Loops of neighbouring loci matter because B's extra copies
 * of a neighbour would otherwise slide into the target at a lower cost than an insertion in flank.
 *
 * <p>Ties go, in this order, to the diagonal, an insertion, a deletion; a loop is entered as early as a
 * tie allows and an inserted base next to a loop is counted outside it, so a length change is only called
 * where the bases require it. One instance per thread.
 */
final class StretchAligner {
    static final int MATCH = WrapAligner.MATCH;
    static final int MISMATCH = WrapAligner.MISMATCH;
    static final int GAP = WrapAligner.GAP;
    private static final int NEG = Integer.MIN_VALUE / 4;
    private static final byte START = 0, PLAIN = 1, ENTRY = 2, EXIT = 3;

    // the template as a graph: node v is reached from pred[v] by consuming letter[v]; an ENTRY node (first
    // state of a loop's cycle) is also reached free from the node before it, and an EXIT node free from
    // every state of its cycle (aux[v] is the cycle's first state); aux of an ENTRY is the cycle's last state
    private int nodes;
    private int[] pred = new int[64];
    private byte[] letter = new byte[64];
    private byte[] kind = new byte[64];
    private int[] aux = new int[64];
    // for the last state of a cycle of two or more states, the first state, which deletions reach around
    // the cycle; -1 elsewhere
    private int[] wrap = new int[64];
    private int targetEntry = -1;
    private int targetLast = -1;
    private int targetExit = -1;

    private int[] prev = new int[64];
    private int[] cur = new int[64];
    // carried figures of the path into each node (from the target's entry on): entry row, exit row,
    // matches, mismatches, insertions, deletions
    private int[][] pStat = new int[6][64];
    private int[][] cStat = new int[6][64];

    private int score;
    private int[] result = new int[6];

    /** Starts a new template. */
    void reset() {
        nodes = 0;
        targetEntry = targetLast = targetExit = -1;
        add(START, -1, (byte) 0, -1);
    }

    /** Appends A's bases {@code codes[from, to)} (0..3). */
    void linear(byte[] codes, int from, int to) {
        for (int i = from; i < to; i++) {
            add(PLAIN, nodes - 1, codes[i], -1);
        }
    }

    /**
     * Appends a loop over {@code motif} (codes 0..3), entered at {@code phase}: the template letters it
     * offers are {@code motif[phase], motif[phase + 1], ...} around and around.
     */
    void loop(byte[] motif, int phase, boolean target) {
        int p = motif.length;
        int entry = nodes;
        int last = entry + p - 1;
        add(ENTRY, last, motif[(phase + p - 1) % p], last);
        for (int r = 1; r < p; r++) {
            add(PLAIN, entry + r - 1, motif[(phase + r - 1) % p], -1);
        }
        if (p >= 2) {
            wrap[last] = entry;
        }
        add(EXIT, -1, (byte) 0, entry);
        if (target) {
            targetEntry = entry;
            targetLast = last;
            targetExit = nodes - 1;
        }
    }

    int nodes() {
        return nodes;
    }

    private void add(byte k, int from, byte l, int ax) {
        if (nodes == pred.length) {
            int n = 2 * nodes;
            pred = Arrays.copyOf(pred, n);
            letter = Arrays.copyOf(letter, n);
            kind = Arrays.copyOf(kind, n);
            aux = Arrays.copyOf(aux, n);
            wrap = Arrays.copyOf(wrap, n);
        }
        pred[nodes] = from;
        letter[nodes] = l;
        kind[nodes] = k;
        aux[nodes] = ax;
        wrap[nodes] = -1;
        nodes++;
    }

    /**
     * Aligns {@code text[0, n)} (codes; anything but 0..3 mismatches every letter) against the whole
     * template. Returns false, leaving nothing, when {@code (n + 1) x nodes} exceeds {@code maxCells}.
     */
    boolean align(byte[] text, int n, long maxCells) {
        int nn = nodes;
        if ((long) (n + 1) * nn > maxCells || targetEntry < 0) {
            return false;
        }
        if (prev.length < nn) {
            int sz = Math.max(nn, 2 * prev.length);
            prev = new int[sz];
            cur = new int[sz];
            pStat = new int[6][sz];
            cStat = new int[6][sz];
        }
        int statsFrom = targetEntry;
        for (int i = 0; i <= n; i++) {
            int t = i == 0 ? -1 : text[i - 1];
            int[] pv = prev;
            int[] cv = cur;
            for (int v = 0; v < nn; v++) {
                int best;
                int src;
                boolean fromPrev;
                int incr = -1;
                switch (kind[v]) {
                    case START -> {
                        cv[0] = i == 0 ? 0 : pv[0] + GAP;
                        continue;
                    }
                    case PLAIN -> {
                        int u = pred[v];
                        best = NEG;
                        src = u;
                        fromPrev = true;
                        if (i > 0) {
                            best = pv[u] + (t == letter[v] ? MATCH : MISMATCH);
                            incr = t == letter[v] ? 2 : 3;
                            int ins = pv[v] + GAP;
                            if (ins > best) {
                                best = ins;
                                src = v;
                                incr = 4;
                            }
                        }
                        int del = cv[u] + GAP;
                        if (del > best) {
                            best = del;
                            src = u;
                            fromPrev = false;
                            incr = 5;
                        }
                    }
                    case ENTRY -> {
                        // entered free from the node before, or around the cycle from its last state
                        best = cv[v - 1];
                        src = v - 1;
                        fromPrev = false;
                        incr = -2;
                        if (i > 0) {
                            int last = aux[v];
                            int d = pv[last] + (t == letter[v] ? MATCH : MISMATCH);
                            if (d > best) {
                                best = d;
                                src = last;
                                fromPrev = true;
                                incr = t == letter[v] ? 2 : 3;
                            }
                            int ins = pv[v] + GAP;
                            if (ins > best) {
                                best = ins;
                                src = v;
                                fromPrev = true;
                                incr = 4;
                            }
                        }
                    }
                    default -> {
                        // EXIT: a base inserted after the loop is flank; otherwise leave from the best state
                        best = NEG;
                        src = v;
                        fromPrev = true;
                        if (i > 0) {
                            best = pv[v] + GAP;
                        }
                        for (int q = aux[v]; q < v; q++) {
                            if (cv[q] > best) {
                                best = cv[q];
                                src = q;
                                fromPrev = false;
                                incr = -3;
                            }
                        }
                    }
                }
                cv[v] = best;
                if (v >= statsFrom) {
                    carry(v, src, fromPrev, incr, i);
                }
                int w = wrap[v];
                if (w >= 0) {
                    wrapDeletions(w, v, i, statsFrom);
                }
            }
            int[] sw = prev;
            prev = cur;
            cur = sw;
            int[][] ss = pStat;
            pStat = cStat;
            cStat = ss;
        }
        score = prev[nn - 1];
        for (int k = 0; k < 6; k++) {
            result[k] = pStat[k][nn - 1];
        }
        return true;
    }

    /**
     * Deletions from the last state of a cycle around to its first and on: the cycle's states were first
     * computed without them.
     */
    private void wrapDeletions(int entry, int last, int row, int statsFrom) {
        int[] cv = cur;
        int from = last;
        for (int q = entry; q < last; q++) {
            int d = cv[from] + GAP;
            if (d <= cv[q]) {
                return;
            }
            cv[q] = d;
            if (q >= statsFrom) {
                carry(q, from, false, 5, row);
            }
            from = q;
        }
    }

    /**
     * The figures of the path into node v: those of its source, plus what the step adds inside the
     * target (2 match, 3 mismatch, 4 insertion, 5 deletion), or the target's entry (-2, fresh figures) or
     * exit (-3, the exit row).
     */
    private void carry(int v, int src, boolean fromPrev, int incr, int row) {
        int[][] s = fromPrev ? pStat : cStat;
        int[][] c = cStat;
        if (v == targetEntry && incr == -2) {
            c[0][v] = row;
            c[1][v] = -1;
            c[2][v] = c[3][v] = c[4][v] = c[5][v] = 0;
            return;
        }
        for (int k = 0; k < 6; k++) {
            c[k][v] = s[k][src];
        }
        if (v == targetExit && incr == -3) {
            c[1][v] = row;
        } else if (v >= targetEntry && v <= targetLast && incr >= 2) {
            c[incr][v]++;
        }
    }

    /** Score of the last alignment. */
    int score() {
        return score;
    }

    /** First text base in the target loop. */
    int repeatStart() {
        return result[0];
    }

    /** One past the last text base in the target loop. */
    int repeatEnd() {
        return result[1];
    }

    int matches() {
        return result[2];
    }

    int mismatches() {
        return result[3];
    }

    int insertions() {
        return result[4];
    }

    int deletions() {
        return result[5];
    }

    /** Share of the target loop's alignment columns that agree with the motif; 0 for an empty loop. */
    double purity() {
        int cols = result[2] + result[3] + result[4] + result[5];
        return cols == 0 ? 0 : result[2] / (double) cols;
    }
}
