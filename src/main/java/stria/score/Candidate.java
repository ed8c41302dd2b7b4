package stria.score;

import stria.io.Bases;

/**
 * A candidate locus with the alignment figures needed to report it, trim it or vote on its consensus:
 * the motif as aligned ({@code motif}, read from phase {@code phaseA} at {@code start}) and the phase of
 * every base ({@code phaseAt}).
 */
final class Candidate {
    int start;
    int end;
    int period;
    byte[] motif;
    int phaseA;
    int score;
    int matches;
    int mismatches;
    int insertions;
    int deletions;
    int[] phaseAt;
    boolean tiled;

    double purity() {
        int cols = matches + mismatches + insertions + deletions;
        return cols == 0 ? 0 : matches / (double) cols;
    }

    Locus toLocus(byte[] seq) {
        char[] m = new char[period];
        for (int i = 0; i < period; i++) {
            m[i] = (char) Bases.letter(motif[(phaseA + i) % period]);
        }
        String motifText = new String(m);
        int len = end - start;
        return new Locus(start, end, period, motifText, MotifClass.of(motifText), len / (double) period,
                purity(), mismatches, insertions, deletions, score, entropy(seq, start, end));
    }

    static double entropy(byte[] seq, int start, int end) {
        int[] c = new int[4];
        int n = 0;
        for (int i = start; i < end; i++) {
            int x = Bases.code(seq[i]);
            if (x >= 0 && x < 4) {
                c[x]++;
                n++;
            }
        }
        double h = 0;
        for (int x : c) {
            if (x > 0) {
                double f = x / (double) n;
                h -= f * Math.log(f) / Math.log(2);
            }
        }
        return h;
    }
}
