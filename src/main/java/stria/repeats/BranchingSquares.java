package stria.repeats;

import java.util.Arrays;

/**
 * Branching tandem repeats of a string from its enhanced suffix array: a bottom-up traversal of the LCP
 * intervals (Abouelhoda, Kurtz &amp; Ohlebusch 2004) with the smaller-half trick (Stoye &amp; Gusfield 2002).
 *
 * <p>A square uu at i with |u| = l is branching (the letter after it breaks period l) exactly when the
 * suffixes i and i + l share a prefix of length l and no more, i.e. they lie in different child intervals
 * of the same l-interval. For each l-interval only the suffixes of the children other than the largest
 * are tried, forwards (partner i + l in another child) and backwards (partner i - l in the largest child,
 * so no square is found twice). A suffix sits in a non-largest child of at most log2 n intervals, so the
 * traversal costs O(n log n) and finds each branching square once, never the square occurrences that are
 * rotations of it.
 *
 * <p>Squares are appended as packed longs, {@code (end << 32) | l} with end = i + 2l, so sorting the longs
 * orders them by end and then by length. Instances keep their stacks between calls; not thread safe.
 */
final class BranchingSquares {
    private int[] stackLcp = new int[256];
    private int[] stackLb = new int[256];
    private int[] stackBnd = new int[256];
    /** Child boundaries (l-indices) of the intervals on the stack, innermost last. */
    private int[] bnd = new int[256];
    private long[] squares = new long[1024];
    private int count;

    long[] squares() {
        return squares;
    }

    int count() {
        return count;
    }

    /**
     * Collects every branching square with 1 &lt;= l &lt;= maxPeriod of a string of length n, given its
     * suffix array, inverse suffix array and LCP array.
     */
    void collect(int[] sa, int[] isa, int[] lcp, int n, int maxPeriod) {
        count = 0;
        if (n < 2 || maxPeriod < 1) {
            return;
        }
        // deeper intervals than maxPeriod are never reported; merging them keeps the stack shallow
        int cap = maxPeriod >= n ? n : maxPeriod + 1;
        int top = 0;
        stackLcp[0] = 0;
        stackLb[0] = 0;
        stackBnd[0] = 0;
        int nb = 0;
        for (int k = 1; k <= n; k++) {
            int v = k < n ? Math.min(lcp[k], cap) : 0;
            int lb = k - 1;
            while (v < stackLcp[top]) {
                int l = stackLcp[top];
                int from = stackLb[top];
                int base = stackBnd[top];
                if (l <= maxPeriod) {
                    interval(sa, isa, n, l, from, k - 1, base, nb);
                }
                lb = from;
                nb = base;
                top--;
            }
            if (v > stackLcp[top]) {
                top++;
                if (top == stackLcp.length) {
                    int c = top * 2;
                    stackLcp = Arrays.copyOf(stackLcp, c);
                    stackLb = Arrays.copyOf(stackLb, c);
                    stackBnd = Arrays.copyOf(stackBnd, c);
                }
                stackLcp[top] = v;
                stackLb[top] = lb;
                stackBnd[top] = nb;
            }
            if (k < n) {
                if (nb == bnd.length) {
                    bnd = Arrays.copyOf(bnd, nb * 2);
                }
                bnd[nb++] = k;
            }
        }
    }

    /** The l-interval [lb, rb] whose children start at lb and at bnd[base, end). */
    private void interval(int[] sa, int[] isa, int n, int l, int lb, int rb, int base, int end) {
        int bigStart = lb, bigEnd = end == base ? rb : bnd[base] - 1;
        for (int c = base; c < end; c++) {
            int s = bnd[c];
            int e = c + 1 < end ? bnd[c + 1] - 1 : rb;
            if (e - s > bigEnd - bigStart) {
                bigStart = s;
                bigEnd = e;
            }
        }
        int s = lb;
        for (int c = base - 1; c < end; c++) {
            if (c >= base) {
                s = bnd[c];
            }
            int e = c + 1 < end ? bnd[c + 1] - 1 : rb;
            if (s == bigStart) {
                continue;
            }
            for (int r = s; r <= e; r++) {
                int i = sa[r];
                int j = i + l;
                if (j < n) {
                    int rj = isa[j];
                    if (rj >= lb && rj <= rb && (rj < s || rj > e)) {
                        add(i + 2 * l, l);
                    }
                }
                j = i - l;
                if (j >= 0) {
                    int rj = isa[j];
                    if (rj >= bigStart && rj <= bigEnd) {
                        add(i + l, l);
                    }
                }
            }
        }
    }

    private void add(int end, int l) {
        if (count == squares.length) {
            squares = Arrays.copyOf(squares, count * 2);
        }
        squares[count++] = ((long) end << 32) | l;
    }
}
