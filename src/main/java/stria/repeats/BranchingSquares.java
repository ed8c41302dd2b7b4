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
    private long[] spare = new long[0];
    private final int[] histogram = new int[3 << RADIX_BITS];
    /** Per rank: the letters around its suffix, see {@link #packContexts}. */
    private long[] context = new long[0];
    private int count;

    long[] squares() {
        return squares;
    }

    int count() {
        return count;
    }

    /**
     * Collects every branching square with 1 &lt;= l &lt;= maxPeriod of {@code t[f, f + n)}, given its
     * suffix array, inverse suffix array and LCP array.
     */
    void collect(byte[] t, int f, int[] sa, int[] isa, int[] lcp, int n, int maxPeriod) {
        count = 0;
        if (n < 2 || maxPeriod < 1) {
            return;
        }
        // deeper intervals than maxPeriod are never reported; merging them keeps the stack shallow
        int cap = maxPeriod >= n ? n : maxPeriod + 1;
        packContexts(t, f, isa, n);
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
                    interval(t, f, sa, isa, n, l, from, k - 1, base, nb);
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

    /** Letters before and after i held in a rank's context word, and the widest l it decides alone. */
    private static final int BEFORE = 10, AFTER = 21, PACKED_PERIOD = 10;

    /**
     * Packs t[i - 10, i + 21) of the suffix i = sa[r] into context[r], two bits a letter, t[i - 10] lowest;
     * negative when that window leaves the string or holds a BREAK. The traversal touches each suffix once
     * per interval where it sits in a small child, about log n times; reading this word in rank order
     * instead of the text at a random place is what keeps the short periods cheap. The window moves
     * along the text and is scattered to the ranks, since random writes stall less than random reads.
     */
    private void packContexts(byte[] t, int f, int[] isa, int n) {
        if (context.length < n) {
            context = new long[n];
        }
        long[] ctx = context;
        int span = BEFORE + AFTER;
        long w = 0;
        int breaks = 0;
        // the window of i ends at i + AFTER - 1; preload the letters of the window of i = BEFORE
        for (int p = 0; p < Math.min(span - 1, n); p++) {
            int c = t[f + p];
            breaks += c >>> 2;
            w = (w >>> 2) | ((long) (c & 3) << (2 * (span - 1)));
        }
        for (int i = 0; i < n; i++) {
            if (i < BEFORE || i + AFTER > n) {
                ctx[isa[i]] = -1L;
                continue;
            }
            int c = t[f + i + AFTER - 1];
            breaks += c >>> 2;
            w = (w >>> 2) | ((long) (c & 3) << (2 * (span - 1)));
            ctx[isa[i]] = breaks == 0 ? w : -1L;
            breaks -= t[f + i - BEFORE] >>> 2;
        }
    }

    /**
     * The l-interval [lb, rb] whose children start at lb and at bnd[base, end). All its suffixes begin
     * with the same w, |w| = l, and a child is fixed by the letter after w. A partner i + l is in the
     * interval only if the letter after w at i is w[0], and a partner i - l is in the largest child only
     * if that child's letter is w[0]; so either the largest child has letter w[0] and the other children
     * are tried backwards, or only the child with letter w[0] is tried, forwards.
     */
    private void interval(byte[] t, int f, int[] sa, int[] isa, int n, int l, int lb, int rb, int base, int end) {
        if (rb - lb < SMALL) {
            pairs(sa, l, lb, rb, base, end);
            return;
        }
        int bigStart = lb, bigEnd = end == base ? rb : bnd[base] - 1;
        for (int c = base; c < end; c++) {
            int s = bnd[c];
            int e = c + 1 < end ? bnd[c + 1] - 1 : rb;
            if (e - s > bigEnd - bigStart) {
                bigStart = s;
                bigEnd = e;
            }
        }
        int first = letter(t, f, sa, n, lb, 0);
        boolean backward = letter(t, f, sa, n, bigStart, l) == first;
        int s = lb;
        for (int c = base - 1; c < end; c++) {
            if (c >= base) {
                s = bnd[c];
            }
            int e = c + 1 < end ? bnd[c + 1] - 1 : rb;
            if (s == bigStart) {
                continue;
            }
            if (backward) {
                backward(t, f, sa, isa, l, s, e, bigStart, bigEnd);
            } else if (letter(t, f, sa, n, s, l) == first) {
                forward(t, f, sa, isa, n, l, s, e, lb, rb);
                return;
            }
        }
    }

    /** Intervals up to this many suffixes are searched pair by pair. */
    private static final int SMALL = 4;

    /**
     * A small interval: two suffixes in different children whose starts differ by exactly l form a
     * branching square. Most intervals on DNA hold two or three suffixes, and comparing their starts needs
     * neither text nor context words. A suffix lies in fewer than SMALL such intervals (nested intervals
     * grow), so this stays linear.
     */
    private void pairs(int[] sa, int l, int lb, int rb, int base, int end) {
        for (int a = lb, ca = base; a < rb; a++) {
            while (ca < end && bnd[ca] <= a) {
                ca++;
            }
            int ia = sa[a];
            for (int b = a + 1, cb = ca; b <= rb; b++) {
                while (cb < end && bnd[cb] <= b) {
                    cb++;
                }
                if (cb == ca) {
                    continue;
                }
                int d = sa[b] - ia;
                if (d == l) {
                    add(ia + 2 * l, l);
                } else if (d == -l) {
                    add(sa[b] + 2 * l, l);
                }
            }
        }
    }

    /** Squares at i, i = sa[r] for r in [s, e], whose second copy starts in another child of [lb, rb]. */
    private void forward(byte[] t, int f, int[] sa, int[] isa, int n, int l, int s, int e, int lb, int rb) {
        long[] ctx = context;
        boolean packed = l <= PACKED_PERIOD;
        long copy = (1L << (2 * l)) - 1;
        // for longer l the word still holds the first AFTER - l letters of both copies: a cheap veto
        long part = l < AFTER ? (1L << (2 * (AFTER - l))) - 1 : 0;
        for (int r = s; r <= e; r++) {
            long x = ctx[r];
            if (x >= 0) {
                long y = x >>> (2 * BEFORE);
                long d = y ^ (y >>> (2 * l));
                if (packed) {
                    // w repeats right after itself, and the letters after the two copies differ
                    if ((d & copy) == 0 && ((d >>> (2 * l)) & 3) != 0) {
                        add(sa[r] + 2 * l, l);
                    }
                    continue;
                }
                if ((d & part) != 0) {
                    continue;
                }
            }
            int i = sa[r];
            int a = f + i;
            if (i + 2 * l <= n && (i + 2 * l == n || t[a + 2 * l] != t[a + l])
                    && repeats(t, a, l, isa, i + l, lb, rb)) {
                add(i + 2 * l, l);
            }
        }
    }

    /** Squares at i - l, i = sa[r] for r in [s, e], whose first copy starts in the largest child [bs, be]. */
    private void backward(byte[] t, int f, int[] sa, int[] isa, int l, int s, int e, int bs, int be) {
        long[] ctx = context;
        boolean packed = l <= PACKED_PERIOD;
        long copy = (1L << (2 * l)) - 1;
        // for longer l the word still holds the last BEFORE letters of the first copy and their partners
        boolean veto = l < AFTER;
        long part = (1L << (2 * BEFORE)) - 1;
        for (int r = s; r <= e; r++) {
            long x = ctx[r];
            if (x >= 0) {
                if (packed) {
                    long z = x >>> (2 * (BEFORE - l));
                    if (((z ^ (z >>> (2 * l))) & copy) == 0) {
                        add(sa[r] + l, l);
                    }
                    continue;
                }
                if (veto && ((x ^ (x >>> (2 * l))) & part) != 0) {
                    continue;
                }
            }
            int i = sa[r];
            if (i >= l && repeats(t, f + i - l, l, isa, i - l, bs, be)) {
                add(i + l, l);
            }
        }
    }

    /** Letter at offset d of the suffix of rank r, from its context word when it holds it; -1 past the end. */
    private int letter(byte[] t, int f, int[] sa, int n, int r, int d) {
        long x = context[r];
        if (x >= 0 && d < AFTER) {
            return (int) (x >>> (2 * (BEFORE + d))) & 3;
        }
        int p = sa[r] + d;
        return p < n ? t[f + p] : -1;
    }

    private static final int TEXT_PREFIX = 24;

    /**
     * Whether t[a, a + l) equals t[a + l, a + 2l), i.e. whether the suffix at p = a + l - f (forwards) or
     * p = a - f (backwards) shares w; past the text prefix, whether its rank lies in [lo, hi].
     */
    private static boolean repeats(byte[] t, int a, int l, int[] isa, int p, int lo, int hi) {
        int k = Math.min(l, TEXT_PREFIX);
        for (int x = 0; x < k; x++) {
            if (t[a + x] != t[a + l + x]) {
                return false;
            }
        }
        if (k == l) {
            return true;
        }
        int rp = isa[p];
        return rp >= lo && rp <= hi;
    }

    private static final int RADIX_BITS = 12;

    /**
     * Sorts the squares by end, then length: LSD radix sort on the key (end, l) squeezed into as many bits
     * as n and the largest l need, at most three passes of 12 bits for windows up to a few Mb, counted in
     * one read. A comparison sort of a million longs costs several times more.
     */
    void sortByEndThenLength(int n, int maxLength) {
        int lenBits = 32 - Integer.numberOfLeadingZeros(Math.max(1, maxLength));
        int keyBits = 32 - Integer.numberOfLeadingZeros(n) + lenBits;
        int passes = (keyBits + RADIX_BITS - 1) / RADIX_BITS;
        if (passes > 3 || count < 64) {
            Arrays.sort(squares, 0, count);
            return;
        }
        if (spare.length < count) {
            spare = new long[squares.length];
        }
        int[] h = histogram;
        Arrays.fill(h, 0);
        long lenMask = (1L << lenBits) - 1;
        int digit = (1 << RADIX_BITS) - 1;
        long[] src = squares, dst = spare;
        for (int i = 0; i < count; i++) {
            long x = src[i];
            long key = ((x >>> 32) << lenBits) | (x & lenMask);
            for (int p = 0; p < passes; p++) {
                h[(p << RADIX_BITS) + (int) ((key >>> (p * RADIX_BITS)) & digit)]++;
            }
        }
        for (int p = 0; p < passes; p++) {
            int off = p << RADIX_BITS;
            if (h[off + (int) ((((src[0] >>> 32) << lenBits) | (src[0] & lenMask)) >>> (p * RADIX_BITS) & digit)] == count) {
                continue; // every key has the same digit here
            }
            int sum = 0;
            for (int d = 0; d <= digit; d++) {
                int c = h[off + d];
                h[off + d] = sum;
                sum += c;
            }
            int shift = p * RADIX_BITS;
            for (int i = 0; i < count; i++) {
                long x = src[i];
                long key = ((x >>> 32) << lenBits) | (x & lenMask);
                dst[h[off + (int) ((key >>> shift) & digit)]++] = x;
            }
            long[] t = src;
            src = dst;
            dst = t;
        }
        if (src != squares) {
            spare = squares;
            squares = src;
        }
    }

    /** Replaces the collected squares, for tests of the sort. */
    void addAllForTest(long[] keys) {
        count = 0;
        for (long k : keys) {
            add((int) (k >>> 32), (int) k);
        }
    }

    private void add(int end, int l) {
        if (count == squares.length) {
            squares = Arrays.copyOf(squares, count * 2);
        }
        squares[count++] = ((long) end << 32) | l;
    }
}
