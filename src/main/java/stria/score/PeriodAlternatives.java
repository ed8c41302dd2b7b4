package stria.score;

import java.util.Arrays;
import stria.io.Bases;

/**
 * Periods other than a candidate's own that deserve a candidate of their own. A seed copy carrying an
 * indel, or a recurrence distance spanning several units, gives a period a little off or a multiple: the
 * period the locus' bases agree with best is tried too ({@link #otherPeriod}). And few copies of a long unit
 * vote unreliably on its length: units of {@link #NEIGHBOUR_MIN_PERIOD} bases or more with fewer than
 * {@link #NEIGHBOUR_MAX_COPIES} copies also try the periods one off.
 */
final class PeriodAlternatives {
    /** Units this long or longer with fewer than this many copies also try the periods one off. */
    static final int NEIGHBOUR_MIN_PERIOD = 20;
    static final int NEIGHBOUR_MAX_COPIES = 10;
    /** A sample of the locus says as much as all of it about which period fits. */
    private static final int AGREEMENT_SAMPLE = 600;
    private static final int[] NONE = new int[0];

    private PeriodAlternatives() {
    }

    /** The periods to try besides {@code k}'s, in the order to try them, without repeats. */
    static int[] of(byte[] seq, Candidate k) {
        int q = otherPeriod(seq, k.start, k.end, k.period);
        boolean fewCopies = k.period >= NEIGHBOUR_MIN_PERIOD && k.length() < NEIGHBOUR_MAX_COPIES * k.period;
        if (!fewCopies) {
            return q > 0 ? new int[] {q} : NONE;
        }
        int[] out = new int[3];
        int n = 0;
        if (q > 0) {
            out[n++] = q;
        }
        for (int qq = k.period - 1; qq <= k.period + 1; qq += 2) {
            if (qq > 0 && qq != q) {
                out[n++] = qq;
            }
        }
        return n == out.length ? out : Arrays.copyOf(out, n);
    }

    /**
     * A period other than p that the bases of [a, b) support at least as well: the best of p - 3 .. p + 3
     * when it beats p, else the shortest near-divisor of p that agrees nearly as well; -1 if none.
     */
    static int otherPeriod(byte[] seq, int a, int b, int p) {
        if (p < 4 || b - a < 2 * p) {
            return -1;
        }
        double base = agreement(seq, a, b, p);
        int best = -1;
        double bestAgree = base;
        for (int q = Math.max(1, p - 3); q <= p + 3; q++) {
            if (q != p && b - a >= 2 * q) {
                double g = agreement(seq, a, b, q);
                if (g > bestAgree + 0.02) {
                    bestAgree = g;
                    best = q;
                }
            }
        }
        if (best > 0) {
            return best;
        }
        for (int m = Math.min(p / 2, 12); m >= 2; m--) {
            // shortest first: the largest divisor count gives the shortest unit
            int c = Math.round(p / (float) m);
            for (int q = Math.max(1, c - 2); q <= c + 2 && q < p; q++) {
                double g = agreement(seq, a, b, q);
                if (g >= base - 0.05 && g >= 0.5) {
                    return q;
                }
            }
        }
        return -1;
    }

    /** Fraction of positions x in [a, b - q) whose base equals the base q later. */
    static double agreement(byte[] seq, int a, int b, int q) {
        b = Math.min(b, a + AGREEMENT_SAMPLE + q);
        int n = b - a - q;
        if (n <= 0) {
            return 0;
        }
        int hit = 0;
        for (int x = a; x < b - q; x++) {
            // zero exactly when the codes are equal and in 0..3; counted without branches
            int c = Bases.code(seq[x]);
            int v = (c ^ Bases.code(seq[x + q])) | (c & ~3);
            hit += 1 - ((v | -v) >>> 31);
        }
        return hit / (double) n;
    }
}
