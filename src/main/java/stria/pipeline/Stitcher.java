package stria.pipeline;

import stria.repeats.RunList;

/**
 * Joins the runs of consecutive windows into the runs of the whole stretch, each exactly once, and hands
 * them on in sorted order. Windows must be given in order. A run owned by one window that reaches that
 * window's end is followed into the next windows (same period, start clipped to the window start) until it
 * ends; output waits until no such run is open, so the order stays sorted.
 */
final class Stitcher {
    interface Sink {
        void run(int start, int end, int period);
    }

    private final WindowPlan plan;
    private final Sink sink;
    private final RunList ready = new RunList();
    private int[] openStart = new int[8];
    private int[] openPeriod = new int[8];
    private int open;
    private int next;

    Stitcher(WindowPlan plan, Sink sink) {
        this.plan = plan;
        this.sink = sink;
    }

    void accept(int k, WindowRuns w) {
        if (k != next) {
            throw new IllegalStateException("window " + k + " out of order, expected " + next);
        }
        next++;
        boolean last = plan.isLast(k);
        int kept = 0;
        for (int i = 0; i < open; i++) {
            int a = openStart[i];
            int p = openPeriod[i];
            int j = w.find(Math.max(a, w.start), p);
            if (j < 0) {
                // the run starts inside this window and ends before its end, so the window saw it whole
                // and its filter dropped it: the whole run fails the same filter
                continue;
            }
            int e = w.runs.end(j);
            if (e == w.end && !last) {
                openStart[kept] = a;
                openPeriod[kept] = p;
                kept++;
            } else {
                ready.add(a, e, p);
            }
        }
        open = kept;
        int from = plan.ownedFrom(k);
        int to = plan.ownedTo(k);
        RunList r = w.runs;
        for (int i = 0; i < r.size(); i++) {
            int s = r.start(i);
            if (s < from || s >= to) {
                continue;
            }
            if (r.end(i) == w.end && !last) {
                addOpen(s, r.period(i));
            } else {
                ready.add(s, r.end(i), r.period(i));
            }
        }
        if (open == 0) {
            flush();
        }
    }

    void finish() {
        if (open != 0 || next != plan.count()) {
            throw new IllegalStateException("stitching ended early");
        }
        flush();
    }

    private void addOpen(int s, int p) {
        if (open == openStart.length) {
            openStart = java.util.Arrays.copyOf(openStart, open * 2);
            openPeriod = java.util.Arrays.copyOf(openPeriod, open * 2);
        }
        openStart[open] = s;
        openPeriod[open] = p;
        open++;
    }

    private void flush() {
        ready.sort();
        for (int i = 0; i < ready.size(); i++) {
            sink.run(ready.start(i), ready.end(i), ready.period(i));
        }
        ready.clear();
    }
}
