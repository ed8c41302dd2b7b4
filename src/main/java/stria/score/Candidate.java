package stria.score;

import stria.io.Bases;

/**
 * A candidate locus {@code [start, end)} in the coordinates of the sequence it was aligned on (0-based, end
 * exclusive), with the alignment figures needed to report it, trim it or vote on its consensus: the motif
 * as aligned (codes 0..3, read from phase {@code phaseA} at {@code start}; its length is the period) and the
 * phase of every base ({@code phases.at(x - start)}). Immutable by convention: the arrays are never written
 * after construction.
 */
final class Candidate {
    final int start;
    final int end;
    final int period;
    final byte[] motif;
    final int phaseA;
    /** Alignment score in units of {@link ScoringModel}. */
    final int score;
    /** The model the score is in: that of the block holding {@code start}. */
    final ScoringModel model;
    final int matches;
    final int mismatches;
    final int insertions;
    final int deletions;
    final PhaseMap phases;
    /** Length of the shorter diverged unit the motif is made of, and how many make one motif; 0 when none. */
    final int subunitPeriod;
    final int subunits;

    Candidate(int start, byte[] motif, int phaseA, int score, ScoringModel model, VoteTally.PathCounts counts,
              PhaseMap phases) {
        this(start, motif, phaseA, score, model, counts.matches(), counts.mismatches(), counts.insertions(),
                counts.deletions(), phases, 0, 0);
    }

    private Candidate(int start, byte[] motif, int phaseA, int score, ScoringModel model, int matches,
                      int mismatches, int insertions, int deletions, PhaseMap phases, int subunitPeriod, int subunits) {
        this.start = start;
        this.end = start + phases.length();
        this.period = motif.length;
        this.motif = motif;
        this.phaseA = phaseA;
        this.score = score;
        this.model = model;
        this.matches = matches;
        this.mismatches = mismatches;
        this.insertions = insertions;
        this.deletions = deletions;
        this.phases = phases;
        this.subunitPeriod = subunitPeriod;
        this.subunits = subunits;
    }

    /** The same candidate with its motif made of {@code subunits} diverged units of {@code subunitPeriod}. */
    Candidate withSubunits(int subunitPeriod, int subunits) {
        return new Candidate(start, motif, phaseA, score, model, matches, mismatches, insertions, deletions, phases,
                subunitPeriod, subunits);
    }

    int length() {
        return end - start;
    }

    double purity() {
        int cols = matches + mismatches + insertions + deletions;
        return cols == 0 ? 0 : matches / (double) cols;
    }

    /** The locus, with its score in bits and its evalue under {@code calibration}. */
    Locus toLocus(byte[] seq, Calibration calibration) {
        char[] m = new char[period];
        for (int i = 0; i < period; i++) {
            m[i] = (char) Bases.letter(motif[(phaseA + i) % period]);
        }
        String motifText = new String(m);
        int len = end - start;
        return new Locus(start, end, period, motifText, MotifClass.of(motifText), len / (double) period,
                purity(), mismatches, insertions, deletions, ScoringModel.bits(score),
                calibration.evalue(model.gcClass(), score), entropy(seq, start, end), subunitPeriod, subunits);
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
