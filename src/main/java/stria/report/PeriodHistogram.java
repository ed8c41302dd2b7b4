package stria.report;

import java.util.Arrays;

/**
 * Loci and bases in loci by period, in bins: single periods where loci are many, wider bins above, none
 * straddling a {@link PeriodClass} boundary, so each bin has one class (and one colour). Periods 1-10 are
 * always present, so an empty micro class shows as empty, not as missing; bins above the longest period
 * found are left out.
 *
 * @param labels  bin labels as drawn: {@code 7}, {@code 11–20}, {@code ≥1000}
 * @param loci    loci per bin
 * @param bases   bases in loci per bin (a base in two loci counts twice)
 * @param classes the period class of each bin
 */
record PeriodHistogram(String[] labels, long[] loci, long[] bases, PeriodClass[] classes) {
    /** Bins as {first, last} period, inclusive. */
    static final int[][] BINS = {
            {1, 1}, {2, 2}, {3, 3}, {4, 4}, {5, 5}, {6, 6}, {7, 7}, {8, 8}, {9, 9}, {10, 10}, {11, 20}, {21, 50},
            {51, 99}, {100, 199}, {200, 499}, {500, 999}, {1000, Integer.MAX_VALUE}};
    /** The bin of period 10: bins up to it are always shown. */
    private static final int ALWAYS = 9;

    static PeriodHistogram of(ResultSet r) {
        long[] loci = new long[BINS.length];
        long[] bases = new long[BINS.length];
        int last = ALWAYS;
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                int b = bin(l.period(i));
                loci[b]++;
                bases[b] += l.end(i) - l.start(i);
                last = Math.max(last, b);
            }
        }
        int n = last + 1;
        String[] labels = new String[n];
        PeriodClass[] classes = new PeriodClass[n];
        for (int b = 0; b < n; b++) {
            labels[b] = label(BINS[b]);
            classes[b] = PeriodClass.of(BINS[b][0]);
        }
        return new PeriodHistogram(labels, Arrays.copyOf(loci, n), Arrays.copyOf(bases, n), classes);
    }

    static int bin(int period) {
        for (int b = 0; b < BINS.length; b++) {
            if (period <= BINS[b][1]) {
                return b;
            }
        }
        return BINS.length - 1;
    }

    static String label(int[] bin) {
        if (bin[0] == bin[1]) {
            return Integer.toString(bin[0]);
        }
        return bin[1] == Integer.MAX_VALUE ? "\u2265" + bin[0] : bin[0] + "\u2013" + bin[1];
    }

    int size() {
        return labels.length;
    }
}
