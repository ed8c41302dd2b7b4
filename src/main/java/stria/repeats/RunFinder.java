package stria.repeats;

/** Temporary O(n * maxPeriod) run finder, replaced by the suffix-array engine. */
public final class RunFinder {
    public void find(byte[] codes, int from, int len, int maxPeriod, RunList out) {
        int maxP = Math.min(maxPeriod, len / 2);
        for (int p = 1; p <= maxP; p++) {
            int i = 0;
            while (i + p < len) {
                if (codes[from + i] == codes[from + i + p] && codes[from + i] != 4) {
                    int j = i;
                    while (j + p < len && codes[from + j] == codes[from + j + p] && codes[from + j] != 4) {
                        j++;
                    }
                    if (j - i >= p && primitive(codes, from + i, p)) {
                        out.add(i, j + p, p);
                    }
                    i = j + 1;
                } else {
                    i++;
                }
            }
        }
    }

    private static boolean primitive(byte[] c, int s, int p) {
        for (int d = 1; d < p; d++) {
            if (p % d != 0) {
                continue;
            }
            boolean per = true;
            for (int k = d; k < p && per; k++) {
                per = c[s + k] == c[s + k - d];
            }
            if (per) {
                return false;
            }
        }
        return true;
    }
}
