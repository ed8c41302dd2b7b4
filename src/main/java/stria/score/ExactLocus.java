package stria.score;

/**
 * Builds the {@link Locus} of an exact run: purity 1, no edits, motif read at the run's first copy, and the
 * score every column of a perfect alignment earns.
 */
public final class ExactLocus {
    private ExactLocus() {
    }

    public static Locus of(byte[] seq, int start, int end, int period) {
        char[] m = new char[period];
        for (int i = 0; i < period; i++) {
            m[i] = Character.toUpperCase((char) seq[start + i]);
        }
        String motif = new String(m);
        return new Locus(start, end, period, motif, MotifClass.of(motif), (end - start) / (double) period, 1.0,
                0, 0, 0, WrapAligner.MATCH * (end - start), entropy(seq, start, end));
    }

    /** Shannon entropy in bits of the A, C, G, T composition of {@code seq[start, end)}. */
    public static double entropy(byte[] seq, int start, int end) {
        int[] n = new int[4];
        int total = 0;
        for (int i = start; i < end; i++) {
            int c = stria.io.Bases.code(seq[i]);
            if (c >= 0 && c < 4) {
                n[c]++;
                total++;
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
