package stria.score;

import java.util.Arrays;

/**
 * The phase in the motif of every base of an aligned stretch {@code [0, length)} (offsets from the
 * stretch's first base), kept as runs in which the phase steps on by one per base, modulo the period. An
 * exact repeat is one run and an imperfect one starts a run at each insertion or deletion, so the map of a
 * long locus is a small fraction of its length, where an array of phases would take four bytes a base.
 */
final class PhaseMap {
    private final int period;
    private final int length;
    /** Offsets where a run starts, ascending from 0, and the phase of the base there. */
    private final int[] starts;
    private final int[] phases;

    private PhaseMap(int period, int length, int[] starts, int[] phases) {
        this.period = period;
        this.length = length;
        this.starts = starts;
        this.phases = phases;
    }

    /** A stretch without insertions or deletions: the phase steps on by one from {@code phase} at offset 0. */
    static PhaseMap steady(int period, int length, int phase) {
        return length == 0 ? new PhaseMap(period, 0, new int[0], new int[0])
                : new PhaseMap(period, length, new int[] {0}, new int[] {phase});
    }

    int length() {
        return length;
    }

    /** Runs in the map: 1 for an alignment without insertions or deletions. */
    int runs() {
        return starts.length;
    }

    /** The phase of the base at offset {@code x} (0 <= x < length). */
    int at(int x) {
        int r = Arrays.binarySearch(starts, x);
        if (r < 0) {
            r = -r - 2;
        }
        return (int) ((phases[r] + (long) (x - starts[r])) % period);
    }

    /** Reads the phases in order from offset 0: {@link Cursor#next} gives one base's phase per call. */
    Cursor cursor() {
        return new Cursor();
    }

    final class Cursor {
        private int run;
        private int x;
        private int ph = starts.length == 0 ? 0 : phases[0];

        /** The phase of the next base. */
        int next() {
            if (run + 1 < starts.length && x == starts[run + 1]) {
                run++;
                ph = phases[run];
            }
            int out = ph;
            x++;
            ph = ph + 1 == period ? 0 : ph + 1;
            return out;
        }
    }

    /** Collects the phases of a path as it is walked back: from the last base of the stretch to the first. */
    static final class Builder {
        private final int period;
        private int[] starts = new int[8];
        private int[] phases = new int[8];
        private int n;
        private int next = -1;

        Builder(int period) {
            this.period = period;
        }

        /** The base at offset {@code x}, which is one before the base added last (or the last base). */
        void add(int x, int phase) {
            if (next >= 0 && x != next) {
                throw new IllegalStateException("base " + x + " after " + (next + 1));
            }
            next = x - 1;
            if (n > 0 && phase == (phases[n - 1] == 0 ? period - 1 : phases[n - 1] - 1)) {
                // the run of the base after this one starts one base earlier
                starts[n - 1] = x;
                phases[n - 1] = phase;
                return;
            }
            if (n == starts.length) {
                starts = Arrays.copyOf(starts, 2 * n);
                phases = Arrays.copyOf(phases, 2 * n);
            }
            starts[n] = x;
            phases[n] = phase;
            n++;
        }

        /** The map of {@code [0, length)}; every base must have been added. */
        PhaseMap build(int length) {
            if (length > 0 && next != -1) {
                throw new IllegalStateException("bases 0.." + next + " of " + length + " missing");
            }
            int[] s = new int[n];
            int[] f = new int[n];
            for (int i = 0; i < n; i++) {
                s[i] = starts[n - 1 - i];
                f[i] = phases[n - 1 - i];
            }
            return new PhaseMap(period, length, s, f);
        }
    }
}
