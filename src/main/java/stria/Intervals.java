package stria;

/**
 * Union of half-open intervals {@code [start, end)} held in two parallel arrays: the one implementation behind
 * the merged {@code --region}s of a scan, the masked bases of a genome and the bases in repeats of a report.
 */
public final class Intervals {
    private Intervals() {
    }

    /**
     * Merges the first {@code n} intervals, which must be sorted by start, into their union: overlapping and
     * touching intervals become one, empty ones go. The result is written over the input, sorted and
     * disjoint; returns how many intervals it has.
     */
    public static int union(int[] starts, int[] ends, int n) {
        int out = 0;
        int previous = Integer.MIN_VALUE;
        for (int i = 0; i < n; i++) {
            int s = starts[i];
            int e = ends[i];
            if (s < previous) {
                throw new IllegalArgumentException("intervals not sorted by start at index " + i);
            }
            previous = s;
            if (e <= s) {
                continue;
            }
            if (out > 0 && s <= ends[out - 1]) {
                ends[out - 1] = Math.max(ends[out - 1], e);
            } else {
                starts[out] = s;
                ends[out] = e;
                out++;
            }
        }
        return out;
    }

    /** Bases covered by the first {@code n} intervals of a union (sorted, disjoint). */
    public static long covered(int[] starts, int[] ends, int n) {
        long t = 0;
        for (int i = 0; i < n; i++) {
            t += ends[i] - starts[i];
        }
        return t;
    }
}
