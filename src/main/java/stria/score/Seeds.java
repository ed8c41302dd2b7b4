package stria.score;

import java.util.Arrays;
import stria.repeats.RunList;

/**
 * The seeds of a stretch: exact runs of short period that the pipeline found ({@link #isExact}) and
 * recurrence seeds found in the sequence itself ({@link RecurrenceSeeds}), as one list sorted by start,
 * end, period; and the order in which they are tried.
 */
final class Seeds {
    private Seeds() {
    }

    /**
     * Whether an exact run seeds: short periods only ({@link LocusCaller#SEED_MAX_PERIOD}, and not above
     * {@code maxPeriod}), at least {@link LocusCaller#SEED_EXTRA} bases longer than one copy.
     */
    static boolean isExact(int start, int end, int period, int maxPeriod) {
        return period <= LocusCaller.SEED_MAX_PERIOD && period <= maxPeriod
                && end - start - period >= LocusCaller.SEED_EXTRA;
    }

    /** All seeds known in {@code [lo, hi)}: the exact ones from {@code runs} and the recurrence ones. */
    static RunList known(RecurrenceSeeds recurrence, byte[] seq, int length, RunList runs, int lo, int hi,
                         int maxPeriod) {
        RunList all = new RunList(256);
        for (int i = 0; i < runs.size(); i++) {
            int s = runs.start(i);
            int e = runs.end(i);
            if (e > lo && s < hi && isExact(s, e, runs.period(i), maxPeriod)) {
                all.add(s, e, runs.period(i));
            }
        }
        recurrence.find(seq, length, lo, hi, maxPeriod, all);
        return sorted(all);
    }

    /**
     * Indices of the seeds in order of the end of their first copy (in the low 32 bits of each key): in a
     * repeat, recurrence at the unit's distance shows up before recurrence at two or three units, so the
     * right period is tried first.
     */
    static long[] byFirstCopyEnd(RunList seeds) {
        int n = seeds.size();
        long[] order = new long[n];
        for (int i = 0; i < n; i++) {
            order[i] = ((long) (seeds.start(i) + seeds.period(i)) << 32) | i;
        }
        Arrays.sort(order);
        return order;
    }

    /**
     * The seeds sorted by start, end, period. Seeds sharing a start are few, so a sort of packed
     * (start, index) keys followed by insertion sort within equal starts does the job with a primitive
     * sort instead of a general comparison sort.
     */
    static RunList sorted(RunList all) {
        int n = all.size();
        long[] key = new long[n];
        for (int i = 0; i < n; i++) {
            key[i] = ((long) all.start(i) << 32) | i;
        }
        Arrays.sort(key);
        int[] idx = new int[n];
        for (int i = 0; i < n; i++) {
            idx[i] = (int) key[i];
        }
        for (int g = 0; g < n; ) {
            int s = all.start(idx[g]);
            int h = g + 1;
            while (h < n && all.start(idx[h]) == s) {
                h++;
            }
            for (int i = g + 1; i < h; i++) {
                int v = idx[i];
                int ve = all.end(v);
                int vp = all.period(v);
                int j = i - 1;
                while (j >= g && (all.end(idx[j]) > ve || all.end(idx[j]) == ve && all.period(idx[j]) > vp)) {
                    idx[j + 1] = idx[j];
                    j--;
                }
                idx[j + 1] = v;
            }
            g = h;
        }
        RunList out = new RunList(Math.max(n, 1));
        for (int i = 0; i < n; i++) {
            int k = idx[i];
            out.add(all.start(k), all.end(k), all.period(k));
        }
        return out;
    }
}
