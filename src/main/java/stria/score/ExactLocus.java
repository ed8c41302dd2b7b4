package stria.score;

import stria.io.Bases;
import stria.io.ContigBytes;

/**
 * Builds the {@link Locus} of an exact run: purity 1, no edits, motif read at the run's first copy, and the
 * score every column of a perfect alignment earns (the sum of its match columns in the model of the run's
 * first base) with its evalue. Everything comes from the first copy alone, since an exact run repeats it: a
 * satellite array of megabases is never read whole.
 */
public final class ExactLocus {
    private ExactLocus() {
    }

    /** An exact run on the uniform background, its evalue from the shipped table. */
    public static Locus of(byte[] seq, int start, int end, int period) {
        return of(seq, start, start, end, period, ScoringModel.uniform(), Calibration.shipped());
    }

    public static Locus of(ContigBytes seq, int start, int end, int period, ScoringModel model,
                           Calibration calibration) {
        byte[] first = new byte[period];
        seq.copy(start, start + period, first, 0);
        return of(first, 0, start, end, period, model, calibration);
    }

    /** An exact run {@code [start, end)} whose first copy is {@code copy[at, at + period)}. */
    public static Locus of(byte[] copy, int at, int start, int end, int period, ScoringModel model,
                           Calibration calibration) {
        char[] m = new char[period];
        for (int i = 0; i < period; i++) {
            m[i] = Character.toUpperCase((char) copy[at + i]);
        }
        String motif = new String(m);
        int units = score(copy, at, end - start, period, model);
        return new Locus(start, end, period, motif, MotifClass.of(motif), (end - start) / (double) period, 1.0,
                0, 0, 0, ScoringModel.bits(units), calibration.evalue(model.gcClass(), units),
                entropy(copy, at, end - start, period));
    }

    /** Score units of a perfect alignment of {@code len} bases repeating {@code copy[at, at + period)}. */
    static int score(byte[] copy, int at, int len, int period, ScoringModel model) {
        int whole = len / period;
        int rest = len % period;
        long units = 0;
        for (int i = 0; i < period; i++) {
            int c = Bases.code(copy[at + i]);
            if (c >= 0 && c < 4) {
                units += (long) model.match(c) * (whole + (i < rest ? 1 : 0));
            }
        }
        return (int) Math.min(Integer.MAX_VALUE, units);
    }

    /**
     * Shannon entropy in bits of the A, C, G, T composition of {@code len} bases that repeat
     * {@code copy[at, at + period)}: whole copies count the unit's composition, the partial copy at the end
     * its prefix.
     */
    static double entropy(byte[] copy, int at, int len, int period) {
        int whole = len / period;
        int rest = len % period;
        int[] n = new int[4];
        int total = 0;
        for (int i = 0; i < period; i++) {
            int c = Bases.code(copy[at + i]);
            if (c >= 0 && c < 4) {
                int k = whole + (i < rest ? 1 : 0);
                n[c] += k;
                total += k;
            }
        }
        double h = 0;
        for (int c = 0; c < 4; c++) {
            if (n[c] > 0) {
                double f = n[c] / (double) total;
                h -= f * (Math.log(f) / Math.log(2));
            }
        }
        return h == 0 ? 0 : h;
    }
}
