package stria.index;

/**
 * Longest-common-prefix array of a suffix array: {@code lcp[0] = 0} and {@code lcp[r]} is the length of
 * the longest common prefix of the suffixes at {@code sa[r - 1]} and {@code sa[r]}.
 *
 * <p>Two linear-time methods, equal in output: {@link #kasai} (Kasai, Lee, Arimura, Arikawa &amp; Park
 * 2001) walks the text in order and writes the LCP at each suffix's rank; {@link #phi}, the permuted-LCP
 * variant (Karkkainen, Manzini &amp; Puglisi 2009), computes the LCP of each suffix with its predecessor in
 * text order first and permutes once at the end. Phi touches memory in fewer random places and is the
 * one the engine uses; Kasai stays as a cross-check and for comparison in the benchmark.
 */
public final class LcpArray {
    private LcpArray() {
    }

    /** LCP array of {@code sa} over {@code codes[from, from + n)}, in a new array. */
    public static int[] build(byte[] codes, int from, int n, int[] sa) {
        int[] lcp = new int[n];
        phi(codes, from, n, sa, lcp, new int[n]);
        return lcp;
    }

    /**
     * Phi method: fills {@code lcp[0, n)} using {@code work[0, n)} as scratch (its content is lost).
     */
    public static void phi(byte[] codes, int from, int n, int[] sa, int[] lcp, int[] work) {
        if (n == 0) {
            return;
        }
        permutedLcp(codes, from, n, sa, work);
        for (int r = 0; r < n; r++) {
            lcp[r] = work[sa[r]];
        }
        lcp[0] = 0;
    }

    /**
     * Phi method that also leaves the inverse suffix array in {@code isa[0, n)}: the last step reads the
     * LCP of suffix i from slot i and, in the same visit, writes the rank of i there.
     */
    public static void phiWithInverse(byte[] codes, int from, int n, int[] sa, int[] lcp, int[] isa) {
        if (n == 0) {
            return;
        }
        permutedLcp(codes, from, n, sa, isa);
        for (int r = 0; r < n; r++) {
            int i = sa[r];
            lcp[r] = isa[i];
            isa[i] = r;
        }
        lcp[0] = 0;
    }

    /** Leaves in {@code plcp[i]} the LCP of suffix i with the suffix ranked just before it. */
    private static void permutedLcp(byte[] codes, int from, int n, int[] sa, int[] plcp) {
        int[] phi = plcp;
        phi[sa[0]] = -1;
        for (int r = 1; r < n; r++) {
            phi[sa[r]] = sa[r - 1];
        }
        // plcp[i + 1] >= plcp[i] - 1, so each comparison resumes one short of the last match
        int h = 0;
        for (int i = 0; i < n; i++) {
            int j = phi[i];
            if (j < 0) {
                phi[i] = 0;
                h = 0;
                continue;
            }
            int limit = n - Math.max(i, j);
            int a = from + i, b = from + j;
            while (h < limit && codes[a + h] == codes[b + h]) {
                h++;
            }
            phi[i] = h;
            if (h > 0) {
                h--;
            }
        }
    }

    /**
     * Kasai method: fills {@code lcp[0, n)} and leaves the inverse suffix array in {@code rank[0, n)}.
     */
    public static void kasai(byte[] codes, int from, int n, int[] sa, int[] lcp, int[] rank) {
        if (n == 0) {
            return;
        }
        for (int r = 0; r < n; r++) {
            rank[sa[r]] = r;
        }
        lcp[0] = 0;
        int h = 0;
        for (int i = 0; i < n; i++) {
            int r = rank[i];
            if (r == 0) {
                h = 0;
                continue;
            }
            int j = sa[r - 1];
            int limit = n - Math.max(i, j);
            int a = from + i, b = from + j;
            while (h < limit && codes[a + h] == codes[b + h]) {
                h++;
            }
            lcp[r] = h;
            if (h > 0) {
                h--;
            }
        }
    }
}
