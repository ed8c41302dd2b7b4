package stria.index;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

class LcpArrayProperties {

    static int[] naiveLcp(byte[] s, int[] sa) {
        int n = sa.length;
        int[] lcp = new int[n];
        for (int r = 1; r < n; r++) {
            int a = sa[r - 1], b = sa[r], h = 0;
            while (a + h < n && b + h < n && s[a + h] == s[b + h]) {
                h++;
            }
            lcp[r] = h;
        }
        return lcp;
    }

    @Provide
    Arbitrary<byte[]> strings() {
        return Arbitraries.oneOf(
                Arbitraries.integers().between(1, 5).flatMap(sigma ->
                        Arbitraries.bytes().between((byte) 0, (byte) (sigma - 1)).array(byte[].class).ofMaxSize(300)),
                Arbitraries.longs().map(seed -> SuffixArrayProperties.degenerate(new Random(seed))));
    }

    @Property(tries = 1500)
    void phiEqualsNaive(@ForAll("strings") byte[] s) {
        int n = s.length;
        int[] sa = SuffixArrayProperties.naiveSuffixArray(s, 0, n);
        int[] lcp = new int[n];
        LcpArray.phi(s, 0, n, sa, lcp, new int[n]);
        assertThat(lcp).containsExactly(naiveLcp(s, sa));
    }

    @Property(tries = 1000)
    void phiWithInverseEqualsNaiveAndLeavesTheInverse(@ForAll("strings") byte[] s) {
        int n = s.length;
        int[] sa = SuffixArrayProperties.naiveSuffixArray(s, 0, n);
        int[] lcp = new int[n];
        int[] isa = new int[n];
        LcpArray.phiWithInverse(s, 0, n, sa, lcp, isa);
        assertThat(lcp).containsExactly(naiveLcp(s, sa));
        for (int r = 0; r < n; r++) {
            assertThat(isa[sa[r]]).isEqualTo(r);
        }
    }

    @Property(tries = 1500)
    void kasaiEqualsNaiveAndLeavesTheInverse(@ForAll("strings") byte[] s) {
        int n = s.length;
        int[] sa = SuffixArrayProperties.naiveSuffixArray(s, 0, n);
        int[] lcp = new int[n];
        int[] rank = new int[n];
        LcpArray.kasai(s, 0, n, sa, lcp, rank);
        assertThat(lcp).containsExactly(naiveLcp(s, sa));
        for (int r = 0; r < n; r++) {
            assertThat(rank[sa[r]]).isEqualTo(r);
        }
    }

    @Property(tries = 300)
    void worksOnASliceOfALargerArray(@ForAll("strings") byte[] s) {
        int pad = 7;
        byte[] padded = new byte[s.length + 2 * pad];
        java.util.Arrays.fill(padded, (byte) 0);
        System.arraycopy(s, 0, padded, pad, s.length);
        int n = s.length;
        int[] sa = SuffixArray.build(padded, pad, n, 5);
        assertThat(LcpArray.build(padded, pad, n, sa)).containsExactly(naiveLcp(s, sa));
    }
}
