package stria.repeats;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import java.util.Set;
import java.util.TreeSet;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import net.jqwik.api.constraints.IntRange;

import stria.io.Bases;

/** Runs against a quadratic reference that follows the definition letter by letter. */
class RunFinderProperties {
    private static final byte N = Bases.BREAK;

    /**
     * For every period p and start i where a BREAK-free square of length 2p begins, extend it both ways
     * while the period holds, and keep the stretch if p is its smallest period.
     */
    static Set<String> referenceRuns(byte[] s, int maxPeriod) {
        Set<String> runs = new TreeSet<>();
        int n = s.length;
        for (int p = 1; 2 * p <= n && p <= maxPeriod; p++) {
            for (int i = 0; i + 2 * p <= n; i++) {
                boolean square = true;
                for (int k = 0; k < p && square; k++) {
                    square = s[i + k] != N && s[i + k] == s[i + k + p];
                }
                if (!square) {
                    continue;
                }
                int a = i;
                while (a > 0 && s[a - 1] != N && s[a - 1] == s[a - 1 + p]) {
                    a--;
                }
                int b = i + 2 * p;
                while (b < n && s[b] != N && s[b] == s[b - p]) {
                    b++;
                }
                if (smallestPeriod(s, a, b) == p) {
                    runs.add(a + "-" + b + "/" + p);
                }
            }
        }
        return runs;
    }

    private static int smallestPeriod(byte[] s, int a, int b) {
        for (int q = 1; ; q++) {
            boolean ok = true;
            for (int x = a; x + q < b && ok; x++) {
                ok = s[x] == s[x + q];
            }
            if (ok) {
                return q;
            }
        }
    }

    static Set<String> found(byte[] s, int from, int len, int maxPeriod, RunFinder finder) {
        RunList out = new RunList();
        finder.find(s, from, len, maxPeriod, out);
        Set<String> runs = new TreeSet<>();
        for (int i = 0; i < out.size(); i++) {
            boolean fresh = runs.add(out.start(i) + "-" + out.end(i) + "/" + out.period(i));
            assertThat(fresh).as("run reported twice: %s", out).isTrue();
        }
        return runs;
    }

    @Provide
    Arbitrary<byte[]> uniform() {
        return Arbitraries.integers().between(2, 4).flatMap(sigma ->
                Arbitraries.bytes().between((byte) 0, (byte) (sigma - 1)).array(byte[].class).ofMaxSize(70));
    }

    @Provide
    Arbitrary<byte[]> withBreaks() {
        return Arbitraries.frequency(Tuple.of(4, (byte) 0), Tuple.of(4, (byte) 1), Tuple.of(1, (byte) 2), Tuple.of(1, N))
                .array(byte[].class).ofMaxSize(70);
    }

    /** Copies of short motifs back to back, with point changes and BREAKs: many nested and touching runs. */
    @Provide
    Arbitrary<byte[]> repetitive() {
        return Arbitraries.longs().map(seed -> {
            Random rnd = new Random(seed);
            int n = 1 + rnd.nextInt(90);
            int sigma = 2 + rnd.nextInt(3);
            byte[] s = new byte[n];
            int i = 0;
            while (i < n) {
                int p = 1 + rnd.nextInt(7);
                byte[] motif = new byte[p];
                for (int k = 0; k < p; k++) {
                    motif[k] = (byte) rnd.nextInt(sigma);
                }
                int copies = 1 + rnd.nextInt(5);
                for (int k = 0; k < p * copies && i < n; k++) {
                    s[i++] = motif[k % p];
                }
            }
            for (int c = rnd.nextInt(4); c > 0; c--) {
                s[rnd.nextInt(n)] = rnd.nextInt(3) == 0 ? N : (byte) rnd.nextInt(sigma);
            }
            return s;
        });
    }

    /**
     * Longer strings of longer motifs (up to 40 letters), some copies slightly changed: periods beyond the
     * letters a suffix's packed context holds, and squares away from the string ends.
     */
    @Provide
    Arbitrary<byte[]> longMotifs() {
        return Arbitraries.longs().map(seed -> {
            Random rnd = new Random(seed);
            int n = 60 + rnd.nextInt(300);
            int sigma = 2 + rnd.nextInt(3);
            byte[] s = new byte[n];
            int i = 0;
            while (i < n) {
                int p = 1 + rnd.nextInt(rnd.nextBoolean() ? 40 : 12);
                byte[] motif = new byte[p];
                for (int k = 0; k < p; k++) {
                    motif[k] = (byte) rnd.nextInt(sigma);
                }
                int len = p * (1 + rnd.nextInt(4)) + rnd.nextInt(p);
                for (int k = 0; k < len && i < n; k++) {
                    s[i++] = rnd.nextInt(60) == 0 ? (byte) rnd.nextInt(sigma) : motif[k % p];
                }
            }
            if (rnd.nextInt(4) == 0) {
                s[rnd.nextInt(n)] = N;
            }
            return s;
        });
    }

    @Property(tries = 400)
    void equalsReferenceOnLongerStringsOfLongerMotifs(@ForAll("longMotifs") byte[] s,
                                                     @ForAll @IntRange(min = 1, max = 60) int maxPeriod) {
        assertThat(found(s, 0, s.length, maxPeriod, new RunFinder())).isEqualTo(referenceRuns(s, maxPeriod));
    }

    @Property(tries = 2000)
    void equalsReferenceOnRandomStrings(@ForAll("uniform") byte[] s) {
        assertThat(found(s, 0, s.length, Integer.MAX_VALUE, new RunFinder())).isEqualTo(referenceRuns(s, Integer.MAX_VALUE));
    }

    @Property(tries = 1500)
    void equalsReferenceWithBreaks(@ForAll("withBreaks") byte[] s) {
        assertThat(found(s, 0, s.length, Integer.MAX_VALUE, new RunFinder())).isEqualTo(referenceRuns(s, Integer.MAX_VALUE));
    }

    @Property(tries = 2000)
    void equalsReferenceOnRepetitiveStringsWithAPeriodLimit(@ForAll("repetitive") byte[] s,
                                                           @ForAll @IntRange(min = 1, max = 12) int maxPeriod) {
        assertThat(found(s, 0, s.length, maxPeriod, new RunFinder())).isEqualTo(referenceRuns(s, maxPeriod));
    }

    /** One finder over many slices of different sizes: reused buffers must not leak state between calls. */
    @Property(tries = 200)
    void reusedFinderOnSlicesEqualsReference(@ForAll("repetitive") byte[] a, @ForAll("uniform") byte[] b,
                                             @ForAll @IntRange(max = 20) int cut) {
        // period 40 takes the full suffix array, 12 the shallow one; one finder serves both in turn
        RunFinder finder = new RunFinder();
        for (byte[] s : new byte[][] {a, b, a, b}) {
            int from = Math.min(cut, s.length);
            byte[] slice = java.util.Arrays.copyOfRange(s, from, s.length);
            for (int maxPeriod : new int[] {12, 40, 12}) {
                assertThat(found(s, from, s.length - from, maxPeriod, finder))
                        .isEqualTo(referenceRuns(slice, maxPeriod));
            }
        }
    }

    /** Random DNA with planted exact and slightly changed repeats and a few BREAK letters and stretches. */
    static byte[] plantedDna(Random rnd, int n) {
        byte[] s = new byte[n];
        for (int i = 0; i < n; i++) {
            s[i] = (byte) rnd.nextInt(4);
        }
        for (int r = n / 150; r > 0; r--) {
            int p = 1 + rnd.nextInt(rnd.nextBoolean() ? 8 : 80);
            int len = Math.min(n, 2 * p + rnd.nextInt(4 * p + 40));
            int at = rnd.nextInt(n - len + 1);
            byte[] motif = new byte[p];
            for (int k = 0; k < p; k++) {
                motif[k] = (byte) rnd.nextInt(4);
            }
            boolean exact = rnd.nextBoolean();
            for (int k = 0; k < len; k++) {
                s[at + k] = !exact && rnd.nextInt(40) == 0 ? (byte) rnd.nextInt(4) : motif[k % p];
            }
        }
        for (int b = rnd.nextInt(4); b > 0; b--) {
            int at = rnd.nextInt(n);
            int len = rnd.nextBoolean() ? 1 : rnd.nextInt(Math.min(200, n - at) + 1);
            java.util.Arrays.fill(s, at, Math.min(n, at + len), N);
        }
        return s;
    }

    @Property(tries = 40)
    void equalsReferenceOnPlantedDna(@ForAll long seed, @ForAll @IntRange(min = 1, max = 1000) int maxPeriod) {
        Random rnd = new Random(seed);
        byte[] s = plantedDna(rnd, 1500 + rnd.nextInt(1000));
        assertThat(found(s, 0, s.length, maxPeriod, new RunFinder())).isEqualTo(referenceRuns(s, maxPeriod));
    }

    /** A long string with BREAK stretches has exactly the runs of its BREAK-free pieces, each found alone. */
    @Property(tries = 15)
    void breakSplitsTheStringIntoIndependentPieces(@ForAll long seed) {
        Random rnd = new Random(seed);
        byte[] s = plantedDna(rnd, 20_000 + rnd.nextInt(40_000));
        for (int b = 0; b < 20; b++) {
            s[rnd.nextInt(s.length)] = N;
        }
        RunFinder finder = new RunFinder();
        Set<String> pieces = new TreeSet<>();
        for (int i = 0; i < s.length; ) {
            int j = i;
            while (j < s.length && s[j] != N) {
                j++;
            }
            RunList out = new RunList();
            finder.find(s, i, j - i, 2000, out);
            for (int r = 0; r < out.size(); r++) {
                pieces.add((i + out.start(r)) + "-" + (i + out.end(r)) + "/" + out.period(r));
            }
            i = j + 1;
        }
        assertThat(found(s, 0, s.length, 2000, finder)).isEqualTo(pieces);
    }

    /**
     * A reference that scales to long strings: for each period p, every maximal stretch where the letter p
     * ahead is equal (and not BREAK) for at least p positions is a repetition with period p; it is a run of
     * smallest period p unless a proper divisor of p is also a period (a smaller period of a stretch this
     * long would make their gcd, a divisor of p, a period too).
     */
    static Set<String> perPeriodScan(byte[] s, int maxPeriod) {
        Set<String> runs = new TreeSet<>();
        int n = s.length;
        for (int p = 1; p <= maxPeriod && 2 * p <= n; p++) {
            int k = 0;
            while (k + p < n) {
                if (s[k] == N || s[k] != s[k + p]) {
                    k++;
                    continue;
                }
                int a = k;
                while (k + p < n && s[k] != N && s[k] == s[k + p]) {
                    k++;
                }
                int end = k + p;
                if (k - a >= p && !hasDivisorPeriod(s, a, end, p)) {
                    runs.add(a + "-" + end + "/" + p);
                }
            }
        }
        return runs;
    }

    private static boolean hasDivisorPeriod(byte[] s, int a, int end, int p) {
        for (int d = 1; d < p; d++) {
            if (p % d != 0) {
                continue;
            }
            boolean period = true;
            for (int x = a; x + d < end && period; x++) {
                period = s[x] == s[x + d];
            }
            if (period) {
                return true;
            }
        }
        return false;
    }

    @Property(tries = 6)
    void equalsPerPeriodScanOnLongPlantedDna(@ForAll long seed) {
        Random rnd = new Random(seed);
        byte[] s = plantedDna(rnd, 40_000 + rnd.nextInt(40_000));
        int maxPeriod = 1 + rnd.nextInt(300);
        assertThat(found(s, 0, s.length, maxPeriod, new RunFinder())).isEqualTo(perPeriodScan(s, maxPeriod));
    }
}
