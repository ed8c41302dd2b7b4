package stria.score;

import java.util.List;
import stria.io.Bases;

/**
 * Splits a candidate whose copies change motif part way, as in (TGA)n(TGC)m: the alignment runs on
 * through such a change (two letters of three still match), so the split is found afterwards. The split
 * point is where separate majority consensuses for the two sides agree with the most bases; it is taken
 * when that gains at least {@link #SPLIT_GAIN} of the locus' bases (and {@link #SPLIT_MIN_GAIN} bases)
 * over one consensus, each side keeps two copies and both sides, realigned and voted on again on their own
 * alignments ({@link CandidateBuilder#settle}), pass the filter.
 */
final class CompoundSplit {
    /** Share of a locus' bases a split must gain, and the fewest bases, so chance variation never splits. */
    static final double SPLIT_GAIN = 0.08;
    static final int SPLIT_MIN_GAIN = 6;
    /** Purer candidates are one motif throughout: the split is not looked for. */
    private static final double MAX_PURITY = 0.97;

    private final LocusFilter filter;
    private final int minLength;

    CompoundSplit(LocusFilter filter, int minLength) {
        this.filter = filter;
        this.minLength = minLength;
    }

    /** Adds {@code k} to {@code out}, or the two loci it is made of; {@code ce} bounds the right side. */
    void add(CandidateBuilder b, Candidate k, int ce, List<Candidate> out) {
        int p = k.period;
        int len = k.length();
        if (len < 4 * p || len < 2 * minLength || k.purity() > MAX_PURITY) {
            out.add(k);
            return;
        }
        // the bases and their phases are read in order, never copied out: a locus may be megabases long
        byte[] seq = b.seq();
        int at = splitPoint(k, seq);
        if (at < 0) {
            out.add(k);
            return;
        }
        // the two consensuses, counted again on each side of the chosen point
        int[] left = new int[4 * p];
        int[] right = new int[4 * p];
        PhaseMap.Cursor phase = k.phases.cursor();
        int atPhase = 0;
        for (int i = 0; i < len; i++) {
            int ph = phase.next();
            if (i == at) {
                atPhase = ph;
            }
            (i < at ? left : right)[4 * ph + Bases.code(seq[k.start + i])]++;
        }
        byte[] ml = new byte[p];
        byte[] mr = new byte[p];
        for (int ph = 0; ph < p; ph++) {
            ml[ph] = (byte) argmax4(left, ph, k.motif[ph]);
            mr[ph] = (byte) argmax4(right, ph, k.motif[ph]);
        }
        if (MotifClass.primitiveRoot(ml) < p || MotifClass.primitiveRoot(mr) < p) {
            out.add(k);
            return;
        }
        int x = k.start + at;
        // each side votes again on its own alignment: the counts above follow k's, whose gaps a side
        // realigned alone may not have, and the motif reported must be the majority of the side's own copies
        Candidate l = b.settle(k.start, ml, k.phaseA, at);
        Candidate r = b.settle(x, mr, atPhase, ce - x);
        if (l == null || r == null || !filter.accepts(l) || !filter.accepts(r)) {
            out.add(k);
            return;
        }
        out.add(l);
        out.add(r);
    }

    /**
     * Offset in {@code k} of the best split point by the majority count, or -1 when no point leaves both
     * sides long enough and gains enough. {@code seq} holds the bases of {@code k}.
     */
    private int splitPoint(Candidate k, byte[] seq) {
        int p = k.period;
        int len = k.length();
        int[] left = new int[4 * p];
        int[] right = new int[4 * p];
        PhaseMap.Cursor phase = k.phases.cursor();
        for (int i = 0; i < len; i++) {
            right[4 * phase.next() + Bases.code(seq[k.start + i])]++;
        }
        int single = 0;
        for (int ph = 0; ph < p; ph++) {
            single += max4(right, ph);
        }
        int sum = single; // sum over phases of the left and right majorities
        int best = single;
        int bestAt = -1;
        int minSide = Math.max(2 * p, minLength);
        phase = k.phases.cursor();
        for (int i = 0; i < len - minSide; i++) {
            int ph = phase.next();
            int c = Bases.code(seq[k.start + i]);
            int before = max4(left, ph) + max4(right, ph);
            left[4 * ph + c]++;
            right[4 * ph + c]--;
            sum += max4(left, ph) + max4(right, ph) - before;
            if (i + 1 >= minSide && sum > best) {
                best = sum;
                bestAt = i + 1;
            }
        }
        return bestAt < 0 || best - single < Math.max(SPLIT_MIN_GAIN, SPLIT_GAIN * len) ? -1 : bestAt;
    }

    private static int max4(int[] c, int ph) {
        int o = 4 * ph;
        return Math.max(Math.max(c[o], c[o + 1]), Math.max(c[o + 2], c[o + 3]));
    }

    private static int argmax4(int[] c, int ph, int prefer) {
        int o = 4 * ph;
        int best = prefer;
        for (int b = 0; b < 4; b++) {
            if (c[o + b] > c[o + best]) {
                best = b;
            }
        }
        return best;
    }
}
