package stria.index;

import java.util.Arrays;

/**
 * The suffixes of a stretch of small-alphabet codes ordered by their first {@code depth} letters only,
 * with the LCP array capped at {@code depth} and the inverse suffix array: the enhanced suffix array
 * truncated at a depth. An LCP-interval traversal that looks at intervals shallower than {@code depth}
 * sees exactly what the full enhanced suffix array shows it: the intervals of depth below {@code depth}
 * and their children are the same sets of suffixes in the same order, every capped LCP value is the
 * same, and only the order of suffixes that share their first {@code depth} letters is left open (here
 * they stay in text order). A square of period l lies in an l-interval, so runs of period below
 * {@code depth} need nothing deeper.
 *
 * <p>Each suffix gets a key, its first {@code depth} letters packed above its position in one long (a
 * letter as its code + 1, a letter past the end as 0, which sorts a suffix before the longer ones it is a
 * prefix of, as the sentinel of {@link SuffixArray} does), and the keys are sorted by least significant
 * digit radix passes over the letter bits: a few sequential passes instead of the random accesses of
 * induced sorting. The LCP of two neighbours is read off their keys. Keys must fit a long:
 * {@link #fits} says when they do.
 *
 * <p>An instance keeps its key arrays between calls (16 bytes per letter of the largest stretch so far).
 * Not thread safe.
 */
public final class ShallowSuffixArray {
    private static final int RADIX_BITS = 13;
    private static final int BUCKETS = 1 << RADIX_BITS;
    private long[] keys = new long[0];
    private long[] spare = new long[0];
    private int[] counts = new int[0];

    /** Bits of one letter of an alphabet of {@code sigma} codes, with 0 kept for "past the end". */
    private static int letterBits(int sigma) {
        return 32 - Integer.numberOfLeadingZeros(sigma);
    }

    /** Bits of a position in a stretch of {@code n} letters. */
    private static int positionBits(int n) {
        return Math.max(1, 32 - Integer.numberOfLeadingZeros(Math.max(1, n - 1)));
    }

    /** Whether keys of {@code depth} letters of an alphabet of {@code sigma} codes and a position fit a long. */
    public static boolean fits(int n, int depth, int sigma) {
        return depth >= 1 && sigma >= 1 && sigma <= 255
                && (long) depth * letterBits(sigma) + positionBits(n) <= 63;
    }

    /**
     * Writes the suffixes of {@code codes[from, from + n)} ordered by their first {@code depth} letters
     * into {@code sa[0, n)} (ties in text order), their LCP capped at {@code depth} into {@code lcp[0, n)}
     * ({@code lcp[0] = 0}) and the rank of each suffix into {@code isa[0, n)}. Every code must lie in
     * {@code [0, sigma)}.
     *
     * @throws IllegalArgumentException if the keys do not {@link #fits fit}, a code is outside
     *                                  {@code [0, sigma)} or the ranges are wrong
     */
    public void build(byte[] codes, int from, int n, int depth, int sigma, int[] sa, int[] lcp, int[] isa) {
        if (from < 0 || n < 0 || from > codes.length - n) {
            throw new IllegalArgumentException("range " + from + "+" + n + " outside codes of length " + codes.length);
        }
        if (sa.length < n || lcp.length < n || isa.length < n) {
            throw new IllegalArgumentException("buffers shorter than " + n);
        }
        if (!fits(n, depth, sigma)) {
            throw new IllegalArgumentException(depth + " letters of " + sigma + " codes and " + n
                    + " positions do not fit a key");
        }
        if (n == 0) {
            return;
        }
        int b = letterBits(sigma);
        int shift = positionBits(n);
        int letterBits = depth * b;
        if (keys.length < n) {
            keys = new long[n];
            spare = new long[n];
        }
        long[] src = keys;
        // from the last suffix back: the key of i is its letter on top of the key of i + 1 moved down
        long prefix = 0;
        int top = (depth - 1) * b;
        for (int i = n - 1; i >= 0; i--) {
            int c = codes[from + i];
            if (c < 0 || c >= sigma) {
                throw new IllegalArgumentException("code " + c + " at " + i + " outside 0.." + (sigma - 1));
            }
            prefix = ((long) (c + 1) << top) | (prefix >>> b);
            src[i] = (prefix << shift) | i;
        }
        int digits = (letterBits + RADIX_BITS - 1) / RADIX_BITS;
        if (counts.length < digits * BUCKETS) {
            counts = new int[digits * BUCKETS];
        }
        int[] count = counts;
        Arrays.fill(count, 0, digits * BUCKETS, 0);
        for (int i = 0; i < n; i++) {
            long k = src[i] >>> shift;
            for (int d = 0; d < digits; d++) {
                count[d * BUCKETS + (int) ((k >>> (d * RADIX_BITS)) & (BUCKETS - 1))]++;
            }
        }
        long[] dst = spare;
        for (int d = 0; d < digits; d++) {
            int base = d * BUCKETS;
            int dshift = shift + d * RADIX_BITS;
            if (count[base + (int) ((src[0] >>> dshift) & (BUCKETS - 1))] == n) {
                // every key has the same digit here: the order stands
                continue;
            }
            int sum = 0;
            for (int v = 0; v < BUCKETS; v++) {
                int c = count[base + v];
                count[base + v] = sum;
                sum += c;
            }
            for (int i = 0; i < n; i++) {
                long k = src[i];
                dst[count[base + (int) ((k >>> dshift) & (BUCKETS - 1))]++] = k;
            }
            long[] t = src;
            src = dst;
            dst = t;
        }
        int posMask = (1 << shift) - 1;
        // common letters of two keys: the leading zeros of their difference within the letter bits
        int unused = 64 - shift - letterBits;
        long prev = src[0];
        sa[0] = (int) (prev & posMask);
        lcp[0] = 0;
        isa[sa[0]] = 0;
        for (int r = 1; r < n; r++) {
            long k = src[r];
            int i = (int) (k & posMask);
            sa[r] = i;
            isa[i] = r;
            long x = (prev ^ k) >>> shift;
            lcp[r] = x == 0 ? depth : (Long.numberOfLeadingZeros(x) - unused - shift) / b;
            prev = k;
        }
    }
}
