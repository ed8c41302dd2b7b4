package stria.pipeline;

import stria.io.Bases;
import stria.repeats.RunFinder;
import stria.repeats.RunList;

/** The exact runs of one window, in contig coordinates, sorted by start, end, period. */
final class WindowRuns {
    private static final ThreadLocal<RunFinder> FINDER = ThreadLocal.withInitial(RunFinder::new);
    private static final ThreadLocal<byte[][]> CODES = ThreadLocal.withInitial(() -> new byte[1][0]);

    final int start;
    final int end;
    final RunList runs;

    private WindowRuns(int start, int end, RunList runs) {
        this.start = start;
        this.end = end;
        this.runs = runs;
    }

    static WindowRuns compute(byte[] seq, int start, int end, int maxPeriod) {
        int len = end - start;
        byte[][] holder = CODES.get();
        if (holder[0].length < len) {
            holder[0] = new byte[len];
        }
        byte[] codes = holder[0];
        Bases.encode(seq, start, len, codes);
        RunList local = new RunList(Math.max(16, len / 16));
        FINDER.get().find(codes, 0, len, maxPeriod, local);
        RunList shifted = new RunList(local.size());
        for (int i = 0; i < local.size(); i++) {
            shifted.add(local.start(i) + start, local.end(i) + start, local.period(i));
        }
        shifted.sort();
        return new WindowRuns(start, end, shifted);
    }

    /** Index of the run with this start and period, or -1. */
    int find(int runStart, int period) {
        int lo = 0, hi = runs.size();
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (runs.start(mid) < runStart) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        for (int i = lo; i < runs.size() && runs.start(i) == runStart; i++) {
            if (runs.period(i) == period) {
                return i;
            }
        }
        return -1;
    }
}
