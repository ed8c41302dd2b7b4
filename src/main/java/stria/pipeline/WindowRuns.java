package stria.pipeline;

import stria.io.Bases;
import stria.io.ContigBytes;
import stria.repeats.RunFinder;
import stria.repeats.RunList;

/** The exact runs of one window, in contig coordinates, sorted by start, end, period. */
final class WindowRuns {
    /** The engine and buffers one task works with; a task borrows one, so no two tasks share it. */
    static final class Workspace {
        private final RunFinder finder = new RunFinder();
        private byte[] codes = new byte[0];
        private final RunList found = new RunList(1 << 16);
    }

    /** Which complete runs a window keeps; runs touching a window end are always kept for stitching. */
    @FunctionalInterface
    interface Keep {
        boolean test(int start, int end, int period);
    }

    final int start;
    final int end;
    final RunList runs;

    private WindowRuns(int start, int end, RunList runs) {
        this.start = start;
        this.end = end;
        this.runs = runs;
    }

    /**
     * Runs of {@code seq[start, end)}. Only runs that touch a window end, or that {@code keep} accepts, are
     * kept: a run that does not touch an end is seen whole here, so dropping it loses nothing the filter
     * would have kept, and the window results stay small whatever the run density.
     */
    static WindowRuns compute(ContigBytes seq, int start, int end, int maxPeriod, Keep keep, Workspace ws) {
        int len = end - start;
        if (ws.codes.length < len) {
            ws.codes = new byte[len];
        }
        byte[] codes = ws.codes;
        byte[] whole = seq.array();
        if (whole != null) {
            Bases.encode(whole, start, len, codes);
        } else {
            // the letters are copied into the code buffer and encoded where they lie
            seq.copy(start, end, codes, 0);
            Bases.encode(codes, 0, len, codes);
        }
        RunList local = ws.found;
        local.clear();
        ws.finder.find(codes, 0, len, maxPeriod, local);
        int kept = 0;
        for (int i = 0; i < local.size(); i++) {
            if (local.start(i) == 0 || local.end(i) == len
                    || keep.test(local.start(i) + start, local.end(i) + start, local.period(i))) {
                kept++;
            }
        }
        RunList shifted = new RunList(kept);
        for (int i = 0; i < local.size(); i++) {
            int s = local.start(i) + start, e = local.end(i) + start, p = local.period(i);
            if (s == start || e == end || keep.test(s, e, p)) {
                shifted.add(s, e, p);
            }
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
