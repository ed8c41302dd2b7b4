package stria.score;

import java.util.Arrays;
import stria.repeats.RunList;

/**
 * Where nothing on one side of a position can affect the other. Every seed reaches {@link #reach} bases
 * beyond its ends, and extension never leaves the union of overlapping reaches that holds its seed (its
 * component). A position no reach crosses is quiet. Components are half-open stretches {@code [start,
 * end)} of contig positions, sorted and disjoint.
 */
final class QuietPoints {
    private final int[] start;
    private final int[] end;
    private final int count;

    private QuietPoints(int[] start, int[] end, int count) {
        this.start = start;
        this.end = end;
        this.count = count;
    }

    /** Bases beyond a seed of period p that its locus may reach, and the gap two seeds may be joined across. */
    static int reach(int p) {
        return 32 + 2 * p;
    }

    /** The components of the reaches of {@code seeds} on a sequence of {@code length} bases. */
    static QuietPoints of(RunList seeds, int length) {
        int n = seeds.size();
        long[] reachKey = new long[n];
        for (int i = 0; i < n; i++) {
            int r = reach(seeds.period(i));
            long a = Math.max(0, seeds.start(i) - r);
            long b = Math.min(length, (long) seeds.end(i) + r);
            reachKey[i] = (a << 32) | b;
        }
        Arrays.sort(reachKey);
        int[] cs = new int[n];
        int[] ce = new int[n];
        int comps = 0;
        for (int i = 0; i < n; i++) {
            int a = (int) (reachKey[i] >>> 32);
            int b = (int) reachKey[i];
            if (comps > 0 && a < ce[comps - 1]) {
                ce[comps - 1] = Math.max(ce[comps - 1], b);
            } else {
                cs[comps] = a;
                ce[comps] = b;
                comps++;
            }
        }
        return new QuietPoints(cs, ce, comps);
    }

    /** Index of the component whose half-open interior holds x, or -1. */
    int componentAt(int x) {
        int l = 0;
        int h = count - 1;
        int found = -1;
        while (l <= h) {
            int m = (l + h) >>> 1;
            if (start[m] <= x) {
                found = m;
                l = m + 1;
            } else {
                h = m - 1;
            }
        }
        return found >= 0 && x < end[found] ? found : -1;
    }

    int start(int component) {
        return start[component];
    }

    int end(int component) {
        return end[component];
    }

    /** The nearest quiet point at or left of x. */
    int atOrBefore(int x) {
        int c = componentAt(x);
        return c >= 0 ? start[c] : x;
    }

    /** The nearest quiet point at or right of x. */
    int atOrAfter(int x) {
        int c = componentAt(x);
        return c >= 0 && start[c] < x ? end[c] : x;
    }
}
