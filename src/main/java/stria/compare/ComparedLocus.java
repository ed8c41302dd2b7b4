package stria.compare;

import stria.score.Locus;

/**
 * One row of a comparison: a locus of A and what B has in its place, or a locus of B with no counterpart
 * in A ({@link Status#NEW}). Coordinates are 0-based, end exclusive; B's are on B's + strand whatever
 * strand B holds the locus on.
 *
 * @param chrom        A's contig, null for a new locus
 * @param locus        A's locus as scanned, null for a new locus
 * @param status       what became of it
 * @param otherChrom   B's contig, null when unplaced
 * @param otherStart   first base of B's repeat (-1 when unplaced)
 * @param otherEnd     one past its last base; equal to {@code otherStart} when nothing of it is left
 * @param otherStrand  '+' when B reads the locus as A does, '-' when reverse-complemented, 0 when unplaced
 * @param otherPurity  share of the alignment columns of B's repeat that agree with A's consensus motif
 *                     (NaN when unplaced); for a new locus, B's own purity
 * @param otherLocus   B's locus as scanned, for a new locus only
 * @param note         why a locus is unplaced, or how it was measured when not base by base; null otherwise
 */
public record ComparedLocus(String chrom, Locus locus, Status status, String otherChrom, int otherStart,
                            int otherEnd, char otherStrand, double otherPurity, Locus otherLocus, String note) {

    static ComparedLocus unplaced(String chrom, Locus locus, String why) {
        return new ComparedLocus(chrom, locus, Status.UNPLACED, null, -1, -1, (char) 0, Double.NaN, null, why);
    }

    static ComparedLocus newInB(String otherChrom, Locus b) {
        return new ComparedLocus(null, null, Status.NEW, otherChrom, b.start(), b.end(), '+', b.purity(), b, null);
    }

    public boolean placed() {
        return otherChrom != null;
    }

    /** Motif length: A's, or B's for a new locus. */
    public int period() {
        return locus != null ? locus.period() : otherLocus.period();
    }

    public String motifClass() {
        return locus != null ? locus.motifClass() : otherLocus.motifClass();
    }

    public int otherLength() {
        return otherEnd - otherStart;
    }

    /** B's length minus A's; only for a placed locus of A. */
    public int lengthChange() {
        if (locus == null || !placed()) {
            throw new IllegalStateException("no length change for a " + status.word() + " locus");
        }
        return otherLength() - locus.length();
    }

    public boolean hasLengthChange() {
        return locus != null && placed();
    }
}
