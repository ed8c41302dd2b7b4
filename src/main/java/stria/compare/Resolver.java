package stria.compare;

import java.util.ArrayList;
import java.util.List;
import stria.io.Bases;
import stria.score.Locus;

/**
 * Decides one locus of A after B has streamed by: which anchors pair it with B, and what B has between
 * them. One instance per thread; it reads the engine's state and writes nothing shared.
 */
final class Resolver {
    /** Anchors of one side agree when their diagonals differ by at most this (indels between them). */
    static final int DIAGONAL_SLACK = 32;

    private final Comparison c;
    private final AnchorTable t;
    private final int m;
    private final StretchAligner aligner = new StretchAligner();
    private final StretchAligner probe = new StretchAligner();
    private byte[] probeText = new byte[256];
    private byte[] as = new byte[1024];
    private byte[] bs = new byte[1024];
    // candidates of both sides: index side * m + j
    private final int[] cContig;
    private final boolean[] cPlus;
    private final long[] cDiag;
    private final int[] cPos;
    private final int[] nCand = new int[2];
    private final int[] candJ;
    // clusters of both sides: first member (innermost) and size
    private final int[] clFirst;
    private final int[] clSize;
    private final int[] nCl = new int[2];

    Resolver(Comparison c) {
        this.c = c;
        this.t = c.table;
        this.m = c.m;
        cContig = new int[2 * m];
        cPlus = new boolean[2 * m];
        cDiag = new long[2 * m];
        cPos = new int[2 * m];
        candJ = new int[2 * m];
        clFirst = new int[2 * m];
        clSize = new int[2 * m];
    }

    ComparedLocus resolve(int g) {
        Locus l = c.loci[g];
        String chrom = c.aNames.get(c.contigOf[g]);
        if (c.unanchored[g] != null) {
            return ComparedLocus.unplaced(chrom, l, c.unanchored[g]);
        }
        String whyL = candidates(g, Comparison.LEFT);
        String whyR = candidates(g, Comparison.RIGHT);
        if (whyL != null || whyR != null) {
            return ComparedLocus.unplaced(chrom, l, whyL != null ? whyL : whyR);
        }
        // the pair of clusters, one per side, on one contig and strand in the right order, with most anchors
        int best = -1;
        int bestL = -1;
        int bestR = -1;
        long span = c.maxSpan(g);
        for (int a = 0; a < nCl[0]; a++) {
            int li = clFirst[a];
            for (int b = 0; b < nCl[1]; b++) {
                int ri = clFirst[m + b];
                if (cContig[li] != cContig[ri] || cPlus[li] != cPlus[ri]) {
                    continue;
                }
                long gap = cPlus[li] ? (long) cPos[ri] - cPos[li] - Kmer.K : (long) cPos[li] - cPos[ri] - Kmer.K;
                if (gap < 0 || gap > span) {
                    continue;
                }
                int score = clSize[a] + clSize[m + b];
                if (score > best) {
                    best = score;
                    bestL = li;
                    bestR = ri;
                }
            }
        }
        if (best < 0) {
            return ComparedLocus.unplaced(chrom, l, "anchors-disagree");
        }
        int contig = cContig[bestL];
        boolean plus = cPlus[bestL];
        int lB = cPos[bestL];
        int rB = cPos[bestR];
        int lA = c.anchorPos[g * 2 * m + candJ[bestL]];
        int rA = c.anchorPos[g * 2 * m + m + candJ[bestR]];
        int lo = Math.min(lB, rB);
        int hi = Math.max(lB, rB) + Kmer.K;
        if (!c.kept.covers(g, contig, plus, lo, hi)) {
            return ComparedLocus.unplaced(chrom, l, "stretch-not-kept");
        }
        return measure(g, chrom, l, contig, plus, lA, rA, lB, rB);
    }

    /**
     * Fills the candidates of one side (anchors once in A and once in B) and their clusters; returns why
     * the side has none, or null.
     */
    private String candidates(int g, int side) {
        int base = g * 2 * m + side * m;
        int n = 0;
        boolean twiceInB = false;
        boolean missingInB = false;
        for (int j = 0; j < m; j++) {
            int q = t.slotOfAnchor[base + j];
            if (q < 0) {
                continue;
            }
            if (t.countA(q) != 1) {
                continue;
            }
            int nb = t.countB(q);
            if (nb == 0) {
                missingInB = true;
                continue;
            }
            if (nb > 1) {
                twiceInB = true;
                continue;
            }
            int i = side * m + n;
            cContig[i] = t.hitContig(q);
            cPlus[i] = t.sameStrand(q);
            cPos[i] = t.hitPos(q);
            int ap = c.anchorPos[base + j];
            cDiag[i] = cPlus[i] ? (long) cPos[i] - ap : (long) cPos[i] + ap;
            candJ[i] = j;
            n++;
        }
        nCand[side] = n;
        String s = side == Comparison.LEFT ? "left" : "right";
        if (n == 0) {
            return s + (twiceInB ? "-anchor-not-unique-in-B" : missingInB ? "-anchor-missing-in-B"
                    : "-anchor-not-unique-in-A");
        }
        // nearest first: each candidate joins the first cluster it agrees with
        int k = 0;
        for (int x = 0; x < n; x++) {
            int i = side * m + x;
            int found = -1;
            for (int y = 0; y < k && found < 0; y++) {
                int f = clFirst[side * m + y];
                if (cContig[f] == cContig[i] && cPlus[f] == cPlus[i] && Math.abs(cDiag[f] - cDiag[i]) <= DIAGONAL_SLACK) {
                    found = y;
                }
            }
            if (found < 0) {
                clFirst[side * m + k] = i;
                clSize[side * m + k] = 1;
                found = k++;
            } else {
                clSize[side * m + found]++;
            }
        }
        nCl[side] = k;
        return null;
    }

    /**
     * B's repeat between the inner ends of the chosen anchors: A's stretch {@code [lA + K, rA)} against
     * B's {@code [lB + K, rB)} (plus strand) or the reverse complement of {@code [rB + K, lB)}.
     */
    private ComparedLocus measure(int g, String chrom, Locus l, int contig, boolean plus, int lA, int rA, int lB,
                                  int rB) {
        int lo = lA + Kmer.K;
        int hi = rA;
        int aLen = hi - lo;
        if (as.length < aLen) {
            as = new byte[Math.max(aLen, 2 * as.length)];
        }
        c.aBases.get(c.stretchAt[g] + (lo - c.outerL[g]), aLen, as, 0);
        int bLen = plus ? rB - lB - Kmer.K : lB - rB - Kmer.K;
        if (bs.length < bLen) {
            bs = new byte[Math.max(bLen, 2 * bs.length)];
        }
        if (plus) {
            c.kept.copy(g, lB + Kmer.K, bLen, bs);
        } else {
            c.kept.copy(g, rB + Kmer.K, bLen, bs);
            // read on A's strand: reversed and complemented
            for (int i = 0, j = bLen - 1; i <= j; i++, j--) {
                byte x = bs[i];
                byte y = bs[j];
                bs[i] = (byte) (y >= 0 && y <= 3 ? 3 - y : Bases.BREAK);
                bs[j] = (byte) (x >= 0 && x <= 3 ? 3 - x : Bases.BREAK);
            }
        }
        int s = l.start() - lo;
        int e = l.end() - lo;
        int b0;
        int b1;
        double purity;
        String note = null;
        int shift = bLen - aLen;
        if (shift == 0 && java.util.Arrays.equals(as, 0, aLen, bs, 0, bLen)) {
            b0 = s;
            b1 = e;
            purity = l.purity();
        } else {
            // where the two stretches differ by more than substitutions: after an insertion or deletion
            // they fall out of step, so the in-step prefix and suffix bound the place of every one
            int n = Math.min(aLen, bLen);
            int pre = inStep(as, 0, bs, 0, 1, n);
            int suf = inStep(as, aLen - 1, bs, bLen - 1, -1, n);
            int dLo = Math.max(0, Math.min(pre, aLen - suf) - STEP_SLACK);
            int dHi = Math.min(aLen, Math.max(pre, aLen - suf) + STEP_SLACK);
            if (shift == 0 && pre == n) {
                // substitutions only
                b0 = s;
                b1 = e;
                purity = calibrated(l, s, e, b0, b1);
            } else if (dHi <= s - MARGIN) {
                b0 = s + shift;
                b1 = e + shift;
                purity = calibrated(l, s, e, b0, b1);
            } else if (dLo >= e + MARGIN) {
                b0 = s;
                b1 = e;
                purity = calibrated(l, s, e, b0, b1);
            } else {
                // A's window and B's go through the same template: where the aligner would cut A otherwise
                // than the scan did (a locus split by the scan into two periods, say), B is cut the same way
                // and the difference is carried over, so that only a difference between the genomes shows.
                // Outside the window the stretches are in step, B's after it shifted by the length change.
                int x0 = Math.max(0, Math.min(dLo, s) - MARGIN);
                int x1 = Math.min(aLen, Math.max(dHi, e) + MARGIN);
                template(g, lo, lo + x0, lo + x1);
                long cells = c.settings.maxCells();
                if (aligner.align(as, x0, x1 - x0, cells)) {
                    int a0 = aligner.repeatStart() + x0;
                    int a1 = aligner.repeatEnd() + x0;
                    double pa = aligner.purity();
                    aligner.align(bs, x0, x1 + shift - x0, cells);
                    b0 = Math.max(0, Math.min(bLen, aligner.repeatStart() + x0 + (s - a0)));
                    b1 = Math.max(b0, Math.min(bLen, aligner.repeatEnd() + x0 + (e - a1)));
                    purity = b1 > b0 ? clamp(l.purity() + aligner.purity() - pa) : Double.NaN;
                } else {
                    // too long to align base by base: the flanks are taken as unchanged
                    b0 = s;
                    b1 = Math.max(s, bLen - (aLen - e));
                    purity = Double.NaN;
                    note = "measured-by-length";
                }
            }
        }
        int from;
        int to;
        if (plus) {
            from = lB + Kmer.K + b0;
            to = lB + Kmer.K + b1;
        } else {
            from = lB - b1;
            to = lB - b0;
        }
        int lenB = b1 - b0;
        int lenA = l.length();
        Status st;
        if (lenB == lenA) {
            st = Status.SAME;
        } else if (lenB < lenA && lenB < c.settings.minCopies() * l.period() - 1e-9) {
            st = Status.LOST;
        } else {
            st = Status.CHANGED;
        }
        if (st == Status.CHANGED && lenB > lenA && purity < l.purity() - UNCLEAR_PURITY_DROP) {
            // the loop took bases that do not repeat A's motif: unrelated sequence put in beside the repeat
            // costs less in the loop, as mismatches, than as an insertion in flank; no length is told
            return ComparedLocus.unplaced(chrom, l, "repeat-unclear-in-B");
        }
        return new ComparedLocus(chrom, l, st, c.bName(contig), from, to, plus ? '+' : '-', purity, null, note);
    }

    /** B's longer repeat whose purity is this much below A's is not taken as a change of length. */
    static final double UNCLEAR_PURITY_DROP = 0.15;
    /** Bases of a window in which more than {@link #STEP_MISMATCHES} differ: the stretches are out of step. */
    static final int STEP_WINDOW = 16;
    static final int STEP_MISMATCHES = 4;
    /** How far before the first window out of step an insertion or deletion may lie. */
    static final int STEP_SLACK = 2 * STEP_WINDOW;
    /** Bases of A's and B's stretch beside the target and the place of the differences aligned with them. */
    static final int MARGIN = 64;

    /**
     * How many bases x[xi], x[xi + d], ... and y[yi], y[yi + d], ... stay in step (at most n): up to the first
     * window of {@link #STEP_WINDOW} with more than {@link #STEP_MISMATCHES} differences, or n.
     */
    private static int inStep(byte[] x, int xi, byte[] y, int yi, int d, int n) {
        int diff = 0;
        for (int i = 0; i < n; i++) {
            if (x[xi + d * i] != y[yi + d * i]) {
                diff++;
            }
            if (i >= STEP_WINDOW && x[xi + d * (i - STEP_WINDOW)] != y[yi + d * (i - STEP_WINDOW)]) {
                diff--;
            }
            if (diff > STEP_MISMATCHES) {
                return Math.max(0, i + 1 - STEP_WINDOW);
            }
        }
        return n;
    }

    private static double clamp(double p) {
        return Math.max(0, Math.min(1, p));
    }

    /**
     * B's purity where its repeat {@code bs[b0, b1)} has A's length or A's bases shifted: A's purity, moved by
     * the difference between the two repeats aligned alone against the motif.
     */
    private double calibrated(Locus l, int s, int e, int b0, int b1) {
        if (e - s == b1 - b0 && java.util.Arrays.equals(as, s, e, bs, b0, b1)) {
            return l.purity();
        }
        long cells = c.settings.maxCells();
        probe.reset();
        probe.loop(motifCodes(l), 0, true);
        if (!probe.align(as, s, e - s, cells)) {
            return Double.NaN;
        }
        double pa = probe.purity();
        probe.align(bs, b0, b1 - b0, cells);
        return clamp(l.purity() + probe.purity() - pa);
    }

    /**
     * The template for A's bases {@code [from, hi)} (contig coordinates; {@code as[x - lo]} holds base x):
     * A's bases, with the target and every other locus of A there as loops. A neighbour is clipped to the
     * window and off the target; one shorter than its period after that, or one whose bases fit the
     * target's motif about as well as its own, stays bases.
     */
    private void template(int g, int lo, int from, int hi) {
        Locus target = c.loci[g];
        List<int[]> iv = new ArrayList<>();
        iv.add(new int[] {target.start(), target.end(), g});
        int first = c.contigFirst[c.contigOf[g]];
        int last = c.contigFirst[c.contigOf[g] + 1];
        for (int h = g - 1; h >= first && c.reachEnd[h] > from; h--) {
            neighbour(iv, h, target, from, hi);
        }
        for (int h = g + 1; h < last && c.loci[h].start() < hi; h++) {
            neighbour(iv, h, target, from, hi);
        }
        iv.sort((x, y) -> x[0] != y[0] ? Integer.compare(x[0], y[0]) : Integer.compare(x[2], y[2]));
        aligner.reset();
        int pos = from;
        for (int[] x : iv) {
            Locus k = c.loci[x[2]];
            int s = Math.max(x[0], pos);
            if (x[2] != g && (x[1] - s < k.period() || !distinct(k, Math.floorMod(s - k.start(), k.period()), s - lo, x[1] - lo, target))) {
                continue;
            }
            aligner.linear(as, pos - lo, s - lo);
            aligner.loop(motifCodes(k), Math.floorMod(s - k.start(), k.period()), x[2] == g);
            pos = x[1];
        }
        aligner.linear(as, pos - lo, hi - lo);
    }

    /**
     * Whether neighbour k's bases {@code as[from, to)} (entered at {@code phase}) fit its own motif clearly better than the target's
     * (the target's scores at most half of its own). Only then is it a loop of its own: two loops that
     * fit the same bases about equally would trade bases between them on a single substitution, where A's
     * bases, kept as they are, hold them in place.
     */
    private boolean distinct(Locus k, int phase, int from, int to, Locus target) {
        int n = to - from;
        if (probeText.length < n) {
            probeText = new byte[Math.max(n, 2 * probeText.length)];
        }
        System.arraycopy(as, from, probeText, 0, n);
        long cells = c.settings.maxCells();
        probe.reset();
        probe.loop(motifCodes(k), phase, true);
        if (!probe.align(probeText, n, cells)) {
            return false;
        }
        int own = probe.score();
        probe.reset();
        probe.loop(motifCodes(target), 0, true);
        if (!probe.align(probeText, n, cells)) {
            return false;
        }
        return 2L * probe.score() <= own;
    }

    /** Adds locus h, clipped to [lo, hi) and off the target (which keeps its own bases), if a period is left. */
    private void neighbour(List<int[]> iv, int h, Locus target, int lo, int hi) {
        Locus k = c.loci[h];
        int s = Math.max(k.start(), lo);
        int e = Math.min(k.end(), hi);
        if (s < target.end() && e > target.start()) {
            if (k.start() < target.start()) {
                e = Math.min(e, target.start());
            } else {
                s = Math.max(s, target.end());
            }
        }
        if (e - s >= k.period()) {
            iv.add(new int[] {s, e, h});
        }
    }

    private static byte[] motifCodes(Locus k) {
        String mo = k.motif();
        byte[] out = new byte[mo.length()];
        for (int i = 0; i < out.length; i++) {
            int x = Bases.code((byte) mo.charAt(i));
            out[i] = (byte) (x >= 0 && x <= 3 ? x : 0);
        }
        return out;
    }
}
