package stria.score;

import java.util.Arrays;

/**
 * What the candidates built so far explain, so that a seed already inside a locus of its period (or, for
 * a recurrence seed, of a period its distance is about a multiple of) adds nothing. Per period, the
 * candidate reaching furthest right; and the candidates of recurrence periods still near the seeds to come.
 * Seeds must be offered in order of the end of their first copy.
 */
final class SeedCoverage {
    /** Candidates kept for the multiple test before those behind every later seed are dropped. */
    private static final int ACTIVE_PRUNE = 64;

    private final int maxPeriod;
    private final int[] covS;
    private final int[] covE;
    // the candidates of recurrence periods still near the seeds to come: start, end, period
    private int[] active = new int[3 * 16];
    private int activeCount;

    SeedCoverage(int maxPeriod) {
        this.maxPeriod = maxPeriod;
        covS = new int[maxPeriod + 3];
        covE = new int[maxPeriod + 3];
        Arrays.fill(covE, Integer.MIN_VALUE);
    }

    /** Whether the seed {@code [s, e)} of period p lies in a candidate already built. */
    boolean explains(int s, int e, int p) {
        if (activeCount > ACTIVE_PRUNE) {
            // every later seed starts at or after this one's first-copy end minus the largest period
            int horizon = s + p - maxPeriod;
            int n = 0;
            for (int i = 0; i < activeCount; i++) {
                if (active[3 * i + 1] > horizon) {
                    System.arraycopy(active, 3 * i, active, 3 * n, 3);
                    n++;
                }
            }
            activeCount = n;
        }
        return covered(s, e, p) || coveredByMultiple(s, e, p);
    }

    /** Records a candidate built from a seed of period {@code seedPeriod}. */
    void add(Candidate k, int seedPeriod) {
        add(k.start, k.end, k.period, seedPeriod);
    }

    /**
     * Records the stretch {@code [start, end)} of period {@code period} explained from a seed of period
     * {@code seedPeriod}: a built candidate, or the reach of one rejected early.
     */
    void add(int start, int end, int period, int seedPeriod) {
        mark(seedPeriod, start, end);
        mark(period, start, end);
        if (seedPeriod >= RecurrenceSeeds.MIN_PERIOD) {
            if (3 * activeCount == active.length) {
                active = Arrays.copyOf(active, 2 * active.length);
            }
            active[3 * activeCount] = start;
            active[3 * activeCount + 1] = end;
            active[3 * activeCount + 2] = period;
            activeCount++;
        }
    }

    private boolean covered(int s, int e, int p) {
        // recurrence distances wobble by a base or two around the period where copies carry indels
        int tol = p >= RecurrenceSeeds.MIN_PERIOD ? 2 : 0;
        for (int q = Math.max(1, p - tol); q <= Math.min(maxPeriod, p + tol); q++) {
            int ov = Math.min(e, covE[q]) - Math.max(s, covS[q]);
            if (2 * ov >= e - s) {
                return true;
            }
        }
        return false;
    }

    /**
     * Whether a recurrence seed lies in a locus whose period its distance is a multiple of: in a
     * satellite, words also recur two or three units apart wherever a unit between carries errors.
     */
    private boolean coveredByMultiple(int s, int e, int d) {
        if (d < RecurrenceSeeds.MIN_PERIOD) {
            return false;
        }
        for (int i = 0; i < activeCount; i++) {
            int ks = active[3 * i];
            int ke = active[3 * i + 1];
            int kp = active[3 * i + 2];
            if (ke <= s) {
                continue;
            }
            int ov = Math.min(e, ke) - Math.max(s, ks);
            if (2 * ov < e - s) {
                continue;
            }
            int m = Math.max(1, Math.round(d / (float) kp));
            // copies drift apart by their indels: allow 4 % of the distance
            if (Math.abs(d - m * kp) <= 2 + d / 25) {
                return true;
            }
        }
        return false;
    }

    private void mark(int p, int start, int end) {
        if (p < covE.length && end > covE[p]) {
            covS[p] = start;
            covE[p] = end;
        }
    }
}
