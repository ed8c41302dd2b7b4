package stria.index;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Arrays;
import java.util.Comparator;
import java.util.Random;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;

class SuffixArrayProperties {

    /** Reference: sort suffix starts by comparing suffixes letter by letter; a proper prefix sorts first. */
    static int[] naiveSuffixArray(byte[] s, int from, int n) {
        Integer[] idx = new Integer[n];
        for (int i = 0; i < n; i++) {
            idx[i] = i;
        }
        Comparator<Integer> bySuffix = (a, b) -> {
            int x = a, y = b;
            while (x < n && y < n) {
                int d = Integer.compare(s[from + x], s[from + y]);
                if (d != 0) {
                    return d;
                }
                x++;
                y++;
            }
            return Integer.compare(n - x, n - y);
        };
        Arrays.sort(idx, bySuffix);
        int[] sa = new int[n];
        for (int i = 0; i < n; i++) {
            sa[i] = idx[i];
        }
        return sa;
    }

    @Provide
    Arbitrary<byte[]> anyStrings() {
        return Arbitraries.integers().between(1, 5).flatMap(sigma ->
                Arbitraries.bytes().between((byte) 0, (byte) (sigma - 1)).array(byte[].class).ofMaxSize(300));
    }

    /** One letter, two letters, and periodic strings with a few changed letters: deep recursion, long LCPs. */
    @Provide
    Arbitrary<byte[]> degenerateStrings() {
        return Arbitraries.longs().map(seed -> degenerate(new Random(seed)));
    }

    static byte[] degenerate(Random rnd) {
        int n = rnd.nextInt(400);
        byte[] s = new byte[n];
        switch (rnd.nextInt(4)) {
            case 0 -> Arrays.fill(s, (byte) rnd.nextInt(4));
            case 1 -> {
                for (int i = 0; i < n; i++) {
                    s[i] = (byte) (rnd.nextInt(10) == 0 ? 1 : 0);
                }
            }
            default -> {
                int p = 1 + rnd.nextInt(12);
                byte[] motif = new byte[p];
                for (int i = 0; i < p; i++) {
                    motif[i] = (byte) rnd.nextInt(4);
                }
                for (int i = 0; i < n; i++) {
                    s[i] = motif[i % p];
                }
                int changes = rnd.nextInt(4);
                for (int c = 0; c < changes && n > 0; c++) {
                    s[rnd.nextInt(n)] = (byte) rnd.nextInt(5);
                }
            }
        }
        return s;
    }

    @Property(tries = 1500)
    void equalsNaiveSortOnRandomStrings(@ForAll("anyStrings") byte[] s) {
        assertThat(SuffixArray.build(s, 0, s.length, 5)).containsExactly(naiveSuffixArray(s, 0, s.length));
    }

    @Property(tries = 1500)
    void equalsNaiveSortOnDegenerateStrings(@ForAll("degenerateStrings") byte[] s) {
        assertThat(SuffixArray.build(s, 0, s.length, 5)).containsExactly(naiveSuffixArray(s, 0, s.length));
    }

    @Property(tries = 300)
    void sortsASliceAndReusesBuffers(@ForAll("degenerateStrings") byte[] s, @ForAll("anyStrings") byte[] t,
                                     @ForAll @IntRange(max = 50) int cut) {
        int from = Math.min(cut, s.length);
        int n = s.length - from;
        SuffixArray sorter = new SuffixArray();
        int[] sa = new int[Math.max(n, t.length) + 3];
        sorter.sort(s, from, n, 5, sa);
        assertThat(Arrays.copyOf(sa, n)).containsExactly(naiveSuffixArray(s, from, n));
        sorter.sort(t, 0, t.length, 5, sa);
        assertThat(Arrays.copyOf(sa, t.length)).containsExactly(naiveSuffixArray(t, 0, t.length));
    }

    @Example
    void largeRandomAndRepetitiveStringsAreSortedSuffixes() {
        Random rnd = new Random(7);
        int n = 200_000;
        byte[] s = new byte[n];
        for (int i = 0; i < n; i++) {
            s[i] = (byte) (i > n / 2 && i < n / 2 + 20_000 ? (i % 171 == 5 ? 2 : i % 3) : rnd.nextInt(4));
        }
        int[] sa = SuffixArray.build(s, 0, n, 4);
        boolean[] seen = new boolean[n];
        for (int r = 0; r < n; r++) {
            assertThat(seen[sa[r]]).isFalse();
            seen[sa[r]] = true;
        }
        for (int r = 1; r < n; r++) {
            assertThat(lessSuffix(s, sa[r - 1], sa[r])).as("rank %d", r).isTrue();
        }
    }

    private static boolean lessSuffix(byte[] s, int a, int b) {
        int n = s.length;
        while (a < n && b < n) {
            if (s[a] != s[b]) {
                return s[a] < s[b];
            }
            a++;
            b++;
        }
        return a == n;
    }

    @Example
    void rejectsCodesOutsideTheAlphabet() {
        assertThatThrownBy(() -> SuffixArray.build(new byte[] {0, 1, 4, 2}, 0, 4, 4))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("code 4");
        assertThatThrownBy(() -> SuffixArray.build(new byte[] {0, -1}, 0, 2, 4))
                .isInstanceOf(IllegalArgumentException.class);
    }
}
