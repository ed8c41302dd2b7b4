package stria.sim;

import stria.io.Bases;
import stria.repeats.RunList;

/**
 * Every run of small period by direct comparison, O(length x maxPeriod): a reference for tests and a
 * stand-in seed source for the benchmark where only short periods are needed. A stretch where
 * {@code s[i] == s[i + p]} holds for at least p consecutive i is a run of period p unless a divisor of p
 * is a period of it too (for a stretch of length at least 2p, its smallest period divides p).
 */
public final class NaiveRuns {
    private NaiveRuns() {
    }

    /** Runs of {@code seq[0, length)} (ASCII) with smallest period at most maxPeriod, sorted. */
    public static RunList find(byte[] seq, int length, int maxPeriod) {
        byte[] c = new byte[length];
        for (int i = 0; i < length; i++) {
            c[i] = Bases.code(seq[i]);
        }
        RunList out = new RunList();
        for (int p = 1; p <= maxPeriod; p++) {
            int i = 0;
            while (i + p < length) {
                if (c[i] < 0 || c[i] > 3 || c[i] != c[i + p]) {
                    i++;
                    continue;
                }
                int j = i;
                while (j + p < length && c[j] == c[j + p] && c[j] >= 0 && c[j] <= 3) {
                    j++;
                }
                // [i, j + p) has period p
                if (j - i >= p && primitiveIn(c, i, j + p, p)) {
                    out.add(i, j + p, p);
                }
                i = j + 1;
            }
        }
        out.sort();
        return out;
    }

    private static boolean primitiveIn(byte[] c, int s, int e, int p) {
        for (int q = 1; q < p; q++) {
            if (p % q != 0) {
                continue;
            }
            boolean periodic = true;
            for (int i = s; i + q < e; i++) {
                if (c[i] != c[i + q]) {
                    periodic = false;
                    break;
                }
            }
            if (periodic) {
                return false;
            }
        }
        return true;
    }
}
