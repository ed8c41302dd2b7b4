package stria.repeats;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import java.util.Random;
import java.util.concurrent.TimeUnit;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

import stria.io.Bases;

/**
 * Run counts that published theorems fix. The values are quoted from memory, as given in the project's
 * field notes; the source is named beside each check.
 */
class RunFinderPublishedTest {
    private static final int NO_PERIOD_LIMIT = Integer.MAX_VALUE;

    /** Fibonacci words f0 = b, f1 = a, fn = f(n-1) f(n-2), with a = 0 and b = 1. */
    static byte[][] fibonacciWords(int upTo) {
        byte[][] f = new byte[upTo + 1][];
        f[0] = new byte[] {1};
        f[1] = new byte[] {0};
        for (int n = 2; n <= upTo; n++) {
            f[n] = Arrays.copyOf(f[n - 1], f[n - 1].length + f[n - 2].length);
            System.arraycopy(f[n - 2], 0, f[n], f[n - 1].length, f[n - 2].length);
        }
        return f;
    }

    static RunList runs(byte[] s, int maxPeriod) {
        RunList out = new RunList();
        new RunFinder().find(s, 0, s.length, maxPeriod, out);
        return out;
    }

    @Test
    void fibonacciWordsHaveTwiceTheLengthOfFnMinus2MinusThreeRuns() {
        byte[][] f = fibonacciWords(25);
        assertThat(f[25].length).isGreaterThanOrEqualTo(100_000);
        // Kolpakov & Kucherov 1999 (from memory, per the field notes): f10 has 89 letters and 65 runs
        assertThat(f[10]).hasSize(89);
        assertThat(runs(f[10], NO_PERIOD_LIMIT).size()).isEqualTo(65);
        RunFinder finder = new RunFinder();
        for (int n = 5; n <= 25; n++) {
            RunList out = new RunList();
            finder.find(f[n], 0, f[n].length, NO_PERIOD_LIMIT, out);
            // Kolpakov & Kucherov 1999: exactly 2|f(n-2)| - 3 runs for n >= 5
            assertThat(out.size()).as("runs of f%d", n).isEqualTo(2 * f[n - 2].length - 3);
        }
    }

    /** The number of 1s between consecutive 0s of the Thue-Morse sequence: a word over {0, 1, 2}. */
    static byte[] thueTernary(int minLength) {
        byte[] w = new byte[minLength];
        int len = 0;
        int ones = -1;
        for (int k = 0; len < minLength; k++) {
            if ((Integer.bitCount(k) & 1) == 0) {
                if (ones >= 0) {
                    w[len++] = (byte) ones;
                }
                ones = 0;
            } else {
                ones++;
            }
        }
        return w;
    }

    @Test
    void squareFreeTernaryWordHasNoRun() {
        byte[] w = thueTernary(100_000);
        assertThat(w).startsWith(2, 1, 0, 2, 0, 1, 2, 1, 0, 1, 2);
        // Thue 1912 (from memory, per the field notes): this word is square-free, so it holds no run at all
        assertThat(runs(w, NO_PERIOD_LIMIT).size()).isZero();
        // a single changed letter makes a square, which the finder must see
        byte[] changed = w.clone();
        changed[5001] = changed[5000];
        assertThat(runs(changed, NO_PERIOD_LIMIT).size()).isPositive();
    }

    @Test
    void runsTheoremHoldsOnRandomAndAdversarialStrings() {
        Random rnd = new Random(2017);
        byte[][] cases = new byte[12][];
        for (int c = 0; c < 4; c++) {
            byte[] s = new byte[20_000];
            int sigma = 2 + c % 3;
            for (int i = 0; i < s.length; i++) {
                s[i] = (byte) rnd.nextInt(sigma);
            }
            cases[c] = s;
        }
        byte[][] fib = fibonacciWords(22);
        cases[4] = fib[22];
        cases[5] = fib[15];
        byte[] tm = new byte[65_536];
        for (int i = 0; i < tm.length; i++) {
            tm[i] = (byte) (Integer.bitCount(i) & 1);
        }
        cases[6] = tm;
        for (int c = 7; c < 12; c++) {
            int p = 1 + rnd.nextInt(30);
            byte[] s = new byte[30_000];
            for (int i = 0; i < s.length; i++) {
                s[i] = (byte) ((i % p) * 7 % 4);
            }
            for (int e = 0; e < 60; e++) {
                s[rnd.nextInt(s.length)] = (byte) rnd.nextInt(4);
            }
            cases[c] = s;
        }
        for (byte[] s : cases) {
            RunList out = runs(s, NO_PERIOD_LIMIT);
            double exponents = 0;
            for (int i = 0; i < out.size(); i++) {
                exponents += (double) (out.end(i) - out.start(i)) / out.period(i);
            }
            // Bannai et al. 2017 (from memory, per the field notes): fewer than n runs, exponents sum below 3n
            assertThat(out.size()).isLessThan(s.length);
            assertThat(exponents).isLessThan(3.0 * s.length);
        }
    }

    @Tag("slow")
    @Test
    @Timeout(value = 30, unit = TimeUnit.SECONDS)
    void fiveMillionEqualLettersAreOneRun() {
        byte[] s = new byte[5_000_000];
        Arrays.fill(s, Bases.G);
        RunList out = runs(s, NO_PERIOD_LIMIT);
        assertThat(out.size()).isEqualTo(1);
        assertThat(new int[] {out.start(0), out.end(0), out.period(0)}).containsExactly(0, 5_000_000, 1);
    }
}
