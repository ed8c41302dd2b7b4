package stria.index;

import java.util.Arrays;

/**
 * Suffix array of a stretch of small-alphabet codes, built in linear time by induced sorting: SA-IS
 * (Nong, Zhang &amp; Chan 2009).
 *
 * <p>The string is compared as if followed by a sentinel smaller than every code; the sentinel itself is
 * not part of the result, so {@code sa[r]} is the start of the r-th smallest suffix of
 * {@code codes[from, from + n)}, relative to {@code from}.
 *
 * <p>Both induction passes carry the type of each entry's predecessor in the sign bit of the entry, so
 * no type array is kept; LMS positions are marked once per level in a bitset. Short LMS substrings, the
 * common case on DNA, are named by a key that packs their letters, not by comparing text.
 *
 * <p>An instance keeps the bucket arrays and bitsets of every recursion level between calls, so one
 * thread sorting many windows allocates only when a window needs more than any before it. The reduced
 * string of each level and its suffix array live in the output array itself, so the sort needs
 * {@code n} ints plus buckets and about n/32 bytes of bits. Instances are not thread safe.
 */
public final class SuffixArray {
    /** Count and pointer arrays of all levels, level after level (the alphabet of level 1+ is its name count). */
    private int[] pool = new int[64];
    /** LMS positions, one bit each, level after level like the buckets. */
    private long[] lmsBits = new long[0];

    /** Suffix array of {@code codes[from, from + n)}; every code must lie in {@code [0, sigma)}. */
    public static int[] build(byte[] codes, int from, int n, int sigma) {
        int[] sa = new int[n];
        new SuffixArray().sort(codes, from, n, sigma, sa);
        return sa;
    }

    /**
     * Writes the suffix array of {@code codes[from, from + n)} into {@code sa[0, n)}, reusing this
     * instance's buffers. Every code must lie in {@code [0, sigma)}.
     *
     * @throws IllegalArgumentException if a code is outside {@code [0, sigma)} or the ranges are wrong
     */
    public void sort(byte[] codes, int from, int n, int sigma, int[] sa) {
        if (from < 0 || n < 0 || from > codes.length - n) {
            throw new IllegalArgumentException("range " + from + "+" + n + " outside codes of length " + codes.length);
        }
        if (sa.length < n) {
            throw new IllegalArgumentException("suffix array buffer of length " + sa.length + " < " + n);
        }
        if (sigma < 1 || sigma > 256) {
            throw new IllegalArgumentException("alphabet size " + sigma + " outside 1..256");
        }
        if (n <= 1) {
            if (n == 1) {
                checkCode(codes[from], sigma, 0);
                sa[0] = 0;
            }
            return;
        }
        sortBytes(codes, from, n, sigma, sa);
    }

    private static void checkCode(int c, int sigma, int at) {
        if (c < 0 || c >= sigma) {
            throw new IllegalArgumentException("code " + c + " at offset " + at + " outside 0.." + (sigma - 1));
        }
    }

    private int[] pool(int size) {
        if (pool.length < size) {
            // a parent level's buckets sit below this level's, so growing must keep them
            pool = Arrays.copyOf(pool, Math.max(size, pool.length + (pool.length >> 1)));
        }
        return pool;
    }

    private static void bucketStarts(int[] b, int cnt, int ptr, int k) {
        int sum = 0;
        for (int c = 0; c < k; c++) {
            b[ptr + c] = sum;
            sum += b[cnt + c];
        }
    }

    private static void bucketEnds(int[] b, int cnt, int ptr, int k) {
        int sum = 0;
        for (int c = 0; c < k; c++) {
            sum += b[cnt + c];
            b[ptr + c] = sum;
        }
    }

    // ---------------------------------------------------------------- level 0: byte text

    private void sortBytes(byte[] t, int f, int n, int k, int[] sa) {
        int[] b = pool(2 * k);
        int cnt = 0, ptr = k;
        Arrays.fill(b, 0, k, 0);
        for (int i = 0; i < n; i++) {
            int c = t[f + i];
            if (c < 0 || c >= k) {
                checkCode(c, k, i);
            }
            b[cnt + c]++;
        }

        // stage 1: LMS positions at the ends of their buckets
        long[] lms = markLms(t, f, n);
        int words = (n + 63) >>> 6;
        Arrays.fill(sa, 0, n, 0);
        bucketEnds(b, cnt, ptr, k);
        int m = 0;
        for (int w = 0; w < words; w++) {
            for (long x = lms[w]; x != 0; x &= x - 1) {
                int p = (w << 6) + Long.numberOfTrailingZeros(x);
                sa[--b[ptr + t[f + p]]] = p;
                m++;
            }
        }

        // stage 2: LMS substrings sorted and named; equal names leave a reduced string to sort first
        int names = 0;
        if (m > 1) {
            sortLmsSubstringsBytes(t, f, n, k, sa, b, cnt, ptr);
            names = nameLmsSubstringsBytes(t, f, n, m, sa, lms);
            if (names < m) {
                sortInts(sa, n - m, m, names, sa, 2 * k, words);
                b = pool;
                lms = lmsBits;
            } else {
                for (int i = 0; i < m; i++) {
                    sa[sa[n - m + i]] = i;
                }
            }
        } else {
            sa[0] = 0;
        }

        // stage 3: sorted LMS suffixes seed the final induction
        if (m > 0) {
            int j = n - m;
            for (int w = 0; w < words; w++) {
                for (long x = lms[w]; x != 0; x &= x - 1) {
                    sa[j++] = (w << 6) + Long.numberOfTrailingZeros(x);
                }
            }
            for (int i = 0; i < m; i++) {
                sa[i] = sa[n - m + sa[i]];
            }
        }
        Arrays.fill(sa, m, n, 0);
        bucketEnds(b, cnt, ptr, k);
        for (int i = m - 1; i >= 0; i--) {
            int p = sa[i];
            sa[i] = 0;
            sa[--b[ptr + t[f + p]]] = p;
        }
        induceBytes(t, f, n, k, sa, b, cnt, ptr);
    }

    /**
     * Marks the LMS positions (S-type after L-type; n - 1 is L-type against the sentinel). Types decide
     * unpredictably on DNA, so they are computed with arithmetic instead of branches, once; the later
     * stages walk the set bits.
     */
    private long[] markLms(byte[] t, int f, int n) {
        long[] bits = lmsWords(0, n);
        long word = 0;
        int nextS = 0;
        int nextC = t[f + n - 1];
        for (int i = n - 2; i >= 0; i--) {
            int c = t[f + i];
            // S-type iff smaller than the next letter, or equal to it and the next is S-type
            int s = ((c - nextC) >>> 31) | ((((c ^ nextC) - 1) >>> 31) & nextS);
            int p = i + 1;
            word |= (long) (nextS & ~s) << (p & 63);
            if ((p & 63) == 0) {
                bits[p >>> 6] = word;
                word = 0;
            }
            nextS = s;
            nextC = c;
        }
        bits[0] = word;
        return bits;
    }

    /** {@link #markLms} for a reduced string, into the words from {@code at} on (names are non-negative). */
    private long[] markLmsInts(int[] t, int f, int n, int at) {
        long[] bits = lmsWords(at, n);
        long word = 0;
        int nextS = 0;
        int nextC = t[f + n - 1];
        for (int i = n - 2; i >= 0; i--) {
            int c = t[f + i];
            int s = ((c - nextC) >>> 31) | ((((c ^ nextC) - 1) >>> 31) & nextS);
            int p = i + 1;
            word |= (long) (nextS & ~s) << (p & 63);
            if ((p & 63) == 0) {
                bits[at + (p >>> 6)] = word;
                word = 0;
            }
            nextS = s;
            nextC = c;
        }
        bits[at] = word;
        return bits;
    }

    /** The bit words of one level, after those of the levels above it, which growing must keep. */
    private long[] lmsWords(int at, int n) {
        int need = at + ((n + 63) >>> 6);
        if (lmsBits.length < need) {
            lmsBits = Arrays.copyOf(lmsBits, Math.max(need, lmsBits.length + (lmsBits.length >> 1)));
        }
        return lmsBits;
    }

    /**
     * Induces from unsorted LMS seeds and leaves the LMS positions, sorted by their LMS substrings, in
     * {@code sa[0, m)}. Entries are cleared once they have induced, so only LMS marks survive both passes.
     * A positive entry asks for its predecessor to be induced in the current pass; a complemented one
     * defers (L pass) or marks an LMS position (S pass).
     */
    private static void sortLmsSubstringsBytes(byte[] t, int f, int n, int k, int[] sa, int[] b, int cnt, int ptr) {
        bucketStarts(b, cnt, ptr, k);
        int last = n - 1;
        int cl = t[f + last];
        sa[b[ptr + cl]++] = t[f + last - 1] < cl ? ~last : last;
        for (int i = 0; i < n; i++) {
            int j = sa[i];
            if (j > 0) {
                j--;
                int c = t[f + j];
                sa[b[ptr + c]++] = (j > 0 && t[f + j - 1] < c) ? ~j : j;
                sa[i] = 0;
            } else if (j < 0) {
                sa[i] = ~j;
            }
        }
        bucketEnds(b, cnt, ptr, k);
        for (int i = n - 1; i >= 0; i--) {
            int j = sa[i];
            if (j > 0) {
                j--;
                int c = t[f + j];
                sa[--b[ptr + c]] = (j > 0 && t[f + j - 1] > c) ? ~j : j;
                sa[i] = 0;
            }
        }
        int m = 0;
        for (int i = 0; i < n; i++) {
            int j = sa[i];
            if (j < 0) {
                sa[m++] = ~j;
            }
        }
    }

    /** Longest LMS substring packed into an int: base-6 digits 1..5 fix both letters and length. */
    private static final int PACKED_LETTERS = 11;

    /**
     * Names the sorted LMS substrings in {@code sa[0, m)} and leaves the reduced string in
     * {@code sa[n - m, n)}; returns the number of names. Each LMS position p first gets a key at
     * {@code sa[m + p / 2]} (LMS positions are at least two apart, so the slots never collide), later
     * replaced by its name. Most LMS substrings of DNA are short, and their key is the substring itself,
     * so neighbours compare without reading the text at two random places; longer ones keep
     * {@code -2 - length} and are compared letter by letter.
     */
    private static int nameLmsSubstringsBytes(byte[] t, int f, int n, int m, int[] sa, long[] lms) {
        Arrays.fill(sa, m, n, -1);
        int last = -1;
        for (int w = 0, words = (n + 63) >>> 6; w < words; w++) {
            for (long x = lms[w]; x != 0; x &= x - 1) {
                int q = (w << 6) + Long.numberOfTrailingZeros(x);
                if (last >= 0) {
                    sa[m + (last >> 1)] = lmsKey(t, f, last, q);
                }
                last = q;
            }
        }
        // the last LMS substring reaches the sentinel: never equal to another, whatever its length
        sa[m + (last >> 1)] = -2 - (n - last + 1);
        int name = -1;
        int prev = 0, prevKey = 0;
        for (int i = 0; i < m; i++) {
            int p = sa[i];
            int key = sa[m + (p >> 1)];
            boolean same = name >= 0 && key == prevKey;
            if (same && key < 0) {
                int len = -2 - key;
                same = p + len <= n && prev + len <= n;
                for (int x = 0; same && x < len; x++) {
                    same = t[f + p + x] == t[f + prev + x];
                }
            }
            if (!same) {
                name++;
                prev = p;
                prevKey = key;
            }
            sa[m + (p >> 1)] = name;
        }
        for (int i = n - 1, j = n; i >= m; i--) {
            if (sa[i] >= 0) {
                sa[--j] = sa[i];
            }
        }
        return name + 1;
    }

    /** Key of the LMS substring t[p, q]: the packed letters when short enough, else -2 - length. */
    private static int lmsKey(byte[] t, int f, int p, int q) {
        int len = q - p + 1;
        if (len > PACKED_LETTERS) {
            return -2 - len;
        }
        int code = 0;
        for (int a = f + q, stop = f + p; a >= stop; a--) {
            code = (t[a] + 1) + 6 * code;
        }
        return code;
    }

    private static void induceBytes(byte[] t, int f, int n, int k, int[] sa, int[] b, int cnt, int ptr) {
        bucketStarts(b, cnt, ptr, k);
        int last = n - 1;
        int cl = t[f + last];
        sa[b[ptr + cl]++] = (last > 0 && t[f + last - 1] < cl) ? ~last : last;
        for (int i = 0; i < n; i++) {
            int j = sa[i];
            sa[i] = ~j;
            if (j > 0) {
                j--;
                int c = t[f + j];
                sa[b[ptr + c]++] = (j > 0 && t[f + j - 1] < c) ? ~j : j;
            }
        }
        bucketEnds(b, cnt, ptr, k);
        for (int i = n - 1; i >= 0; i--) {
            int j = sa[i];
            if (j > 0) {
                j--;
                int c = t[f + j];
                sa[--b[ptr + c]] = (j == 0 || t[f + j - 1] > c) ? ~j : j;
            } else {
                sa[i] = ~j;
            }
        }
    }

    // ---------------------------------------------------------------- levels 1+: int text

    /** Same as {@link #sortBytes} on an int text; {@code t} may be {@code sa} itself, above {@code sa[n)}. */
    private void sortInts(int[] t, int f, int n, int k, int[] sa, int base, int bitBase) {
        if (n == 1) {
            sa[0] = 0;
            return;
        }
        int cnt = base, ptr = base + k;
        int[] b = pool(base + 2 * k);
        Arrays.fill(b, cnt, cnt + k, 0);
        for (int i = 0; i < n; i++) {
            b[cnt + t[f + i]]++;
        }

        int words = (n + 63) >>> 6;
        long[] lms = markLmsInts(t, f, n, bitBase);
        Arrays.fill(sa, 0, n, 0);
        bucketEnds(b, cnt, ptr, k);
        int m = 0;
        for (int w = 0; w < words; w++) {
            for (long x = lms[bitBase + w]; x != 0; x &= x - 1) {
                int p = (w << 6) + Long.numberOfTrailingZeros(x);
                sa[--b[ptr + t[f + p]]] = p;
                m++;
            }
        }

        if (m > 1) {
            sortLmsSubstringsInts(t, f, n, k, sa, b, cnt, ptr);
            int names = nameLmsSubstringsInts(t, f, n, m, sa, lms, bitBase);
            if (names < m) {
                sortInts(sa, n - m, m, names, sa, base + 2 * k, bitBase + words);
                b = pool;
                lms = lmsBits;
            } else {
                for (int i = 0; i < m; i++) {
                    sa[sa[n - m + i]] = i;
                }
            }
        } else {
            sa[0] = 0;
        }

        if (m > 0) {
            int j = n - m;
            for (int w = 0; w < words; w++) {
                for (long x = lms[bitBase + w]; x != 0; x &= x - 1) {
                    sa[j++] = (w << 6) + Long.numberOfTrailingZeros(x);
                }
            }
            for (int i = 0; i < m; i++) {
                sa[i] = sa[n - m + sa[i]];
            }
        }
        Arrays.fill(sa, m, n, 0);
        bucketEnds(b, cnt, ptr, k);
        for (int i = m - 1; i >= 0; i--) {
            int p = sa[i];
            sa[i] = 0;
            sa[--b[ptr + t[f + p]]] = p;
        }
        induceInts(t, f, n, k, sa, b, cnt, ptr);
    }

    private static void sortLmsSubstringsInts(int[] t, int f, int n, int k, int[] sa, int[] b, int cnt, int ptr) {
        bucketStarts(b, cnt, ptr, k);
        int last = n - 1;
        int cl = t[f + last];
        sa[b[ptr + cl]++] = t[f + last - 1] < cl ? ~last : last;
        for (int i = 0; i < n; i++) {
            int j = sa[i];
            if (j > 0) {
                j--;
                int c = t[f + j];
                sa[b[ptr + c]++] = (j > 0 && t[f + j - 1] < c) ? ~j : j;
                sa[i] = 0;
            } else if (j < 0) {
                sa[i] = ~j;
            }
        }
        bucketEnds(b, cnt, ptr, k);
        for (int i = n - 1; i >= 0; i--) {
            int j = sa[i];
            if (j > 0) {
                j--;
                int c = t[f + j];
                sa[--b[ptr + c]] = (j > 0 && t[f + j - 1] > c) ? ~j : j;
                sa[i] = 0;
            }
        }
        int m = 0;
        for (int i = 0; i < n; i++) {
            int j = sa[i];
            if (j < 0) {
                sa[m++] = ~j;
            }
        }
    }

    /** Names as {@link #nameLmsSubstringsBytes} does, parking the lengths of the LMS substrings first. */
    private static int nameLmsSubstringsInts(int[] t, int f, int n, int m, int[] sa, long[] lms, int bitBase) {
        Arrays.fill(sa, m, n, -1);
        int last = -1;
        for (int w = 0, words = (n + 63) >>> 6; w < words; w++) {
            for (long x = lms[bitBase + w]; x != 0; x &= x - 1) {
                int q = (w << 6) + Long.numberOfTrailingZeros(x);
                if (last >= 0) {
                    sa[m + (last >> 1)] = q - last + 1;
                }
                last = q;
            }
        }
        // reaching the sentinel makes it longer than what is left of the string, so never equal
        sa[m + (last >> 1)] = n - last + 1;
        int name = -1;
        int prev = 0, prevLen = 0;
        for (int i = 0; i < m; i++) {
            int p = sa[i];
            int len = sa[m + (p >> 1)];
            boolean same = len == prevLen && p + len <= n && prev + len <= n && name >= 0;
            if (same) {
                for (int x = 0; x < len; x++) {
                    if (t[f + p + x] != t[f + prev + x]) {
                        same = false;
                        break;
                    }
                }
            }
            if (!same) {
                name++;
                prev = p;
                prevLen = len;
            }
            sa[m + (p >> 1)] = name;
        }
        for (int i = n - 1, j = n; i >= m; i--) {
            if (sa[i] >= 0) {
                sa[--j] = sa[i];
            }
        }
        return name + 1;
    }

    private static void induceInts(int[] t, int f, int n, int k, int[] sa, int[] b, int cnt, int ptr) {
        bucketStarts(b, cnt, ptr, k);
        int last = n - 1;
        int cl = t[f + last];
        sa[b[ptr + cl]++] = (last > 0 && t[f + last - 1] < cl) ? ~last : last;
        for (int i = 0; i < n; i++) {
            int j = sa[i];
            sa[i] = ~j;
            if (j > 0) {
                j--;
                int c = t[f + j];
                sa[b[ptr + c]++] = (j > 0 && t[f + j - 1] < c) ? ~j : j;
            }
        }
        bucketEnds(b, cnt, ptr, k);
        for (int i = n - 1; i >= 0; i--) {
            int j = sa[i];
            if (j > 0) {
                j--;
                int c = t[f + j];
                sa[--b[ptr + c]] = (j == 0 || t[f + j - 1] > c) ? ~j : j;
            } else {
                sa[i] = ~j;
            }
        }
    }
}
