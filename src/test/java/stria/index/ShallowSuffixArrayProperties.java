package stria.index;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Random;

import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/**
 * The suffix array truncated at a depth against a letter-by-letter reference and against the full
 * enhanced suffix array (SA-IS and the Phi LCP) capped at the same depth.
 */
class ShallowSuffixArrayProperties {

    /** Compares the first {@code depth} letters of two suffixes; a suffix that ends first is smaller. */
    private static int compare(byte[] s, int from, int n, int a, int b, int depth) {
        for (int k = 0; k < depth; k++) {
            boolean endA = a + k >= n;
            boolean endB = b + k >= n;
            if (endA || endB) {
                return endA == endB ? 0 : endA ? -1 : 1;
            }
            int d = Integer.compare(s[from + a + k], s[from + b + k]);
            if (d != 0) {
                return d;
            }
        }
        return 0;
    }

    private static int commonPrefix(byte[] s, int from, int n, int a, int b, int depth) {
        int k = 0;
        while (k < depth && a + k < n && b + k < n && s[from + a + k] == s[from + b + k]) {
            k++;
        }
        return k;
    }

    /** Random codes in [0, sigma), with long stretches of one short word so that deep ties are common. */
    private static byte[] text(long seed, int n, int sigma) {
        Random rnd = new Random(seed);
        byte[] s = new byte[n];
        int i = 0;
        while (i < n) {
            if (rnd.nextInt(3) == 0) {
                int p = 1 + rnd.nextInt(6);
                int len = Math.min(n - i, p * (1 + rnd.nextInt(12)));
                for (int k = 0; k < len; k++) {
                    s[i + k] = k < p ? (byte) rnd.nextInt(sigma) : s[i + k - p];
                }
                i += len;
            } else {
                s[i++] = (byte) rnd.nextInt(sigma);
            }
        }
        return s;
    }

    @Property(tries = 400)
    void ordersByTheFirstLettersWithTiesInTextOrder(@ForAll long seed, @ForAll @IntRange(min = 0, max = 600) int n,
                                                     @ForAll @IntRange(min = 1, max = 17) int depth,
                                                     @ForAll @IntRange(min = 1, max = 5) int sigma,
                                                     @ForAll @IntRange(min = 0, max = 7) int from) {
        byte[] s = text(seed, from + n + 3, sigma);
        int[] sa = new int[n];
        int[] lcp = new int[n];
        int[] isa = new int[n];
        new ShallowSuffixArray().build(s, from, n, depth, sigma, sa, lcp, isa);
        boolean[] seen = new boolean[n];
        for (int r = 0; r < n; r++) {
            assertThat(seen[sa[r]]).isFalse();
            seen[sa[r]] = true;
            assertThat(isa[sa[r]]).isEqualTo(r);
            if (r > 0) {
                int c = compare(s, from, n, sa[r - 1], sa[r], depth);
                assertThat(c).isLessThanOrEqualTo(0);
                if (c == 0) {
                    assertThat(sa[r - 1]).isLessThan(sa[r]);
                }
                assertThat(lcp[r]).isEqualTo(commonPrefix(s, from, n, sa[r - 1], sa[r], depth));
            }
        }
        if (n > 0) {
            assertThat(lcp[0]).isZero();
        }
    }

    /** Capped at the depth, the LCP array of the full suffix array is the same, rank by rank. */
    @Property(tries = 300)
    void cappedLcpEqualsTheFullEnhancedSuffixArray(@ForAll long seed, @ForAll @IntRange(min = 1, max = 2000) int n,
                                                   @ForAll @IntRange(min = 1, max = 16) int depth) {
        byte[] s = text(seed, n, 5);
        int[] sa = new int[n];
        int[] lcp = new int[n];
        int[] isa = new int[n];
        new ShallowSuffixArray().build(s, 0, n, depth, 5, sa, lcp, isa);
        int[] fullSa = SuffixArray.build(s, 0, n, 5);
        int[] fullLcp = LcpArray.build(s, 0, n, fullSa);
        for (int r = 0; r < n; r++) {
            assertThat(lcp[r]).isEqualTo(Math.min(depth, fullLcp[r]));
            // the same suffix sits at a rank of the full array within the same run of ties
            assertThat(compare(s, 0, n, sa[r], fullSa[r], depth)).isZero();
        }
    }

    @Example
    void keysThatDoNotFitAreRefused() {
        assertThat(ShallowSuffixArray.fits(1 << 24, 13, 5)).isTrue();
        assertThat(ShallowSuffixArray.fits((1 << 24) + 1, 13, 5)).isFalse();
        assertThat(ShallowSuffixArray.fits(1000, 21, 5)).isFalse();
        byte[] s = new byte[100];
        assertThatThrownBy(() -> new ShallowSuffixArray().build(s, 0, 100, 40, 5, new int[100], new int[100],
                new int[100])).isInstanceOf(IllegalArgumentException.class);
        s[7] = 5;
        assertThatThrownBy(() -> new ShallowSuffixArray().build(s, 0, 100, 4, 5, new int[100], new int[100],
                new int[100])).isInstanceOf(IllegalArgumentException.class).hasMessageContaining("at 7");
    }
}
