package stria.compare;

/**
 * How loci are anchored and when a repeat counts as lost.
 *
 * @param anchorsPerSide most anchors taken on each side of a locus (non-overlapping words, nearest first)
 * @param flank          bases beside a locus, on each side, in which anchors are sought, not counting
 *                       other loci, which anchors never overlap and the search passes over
 * @param maxSkip        most bases of other loci the search for anchors passes over on each side
 * @param sampling       one word in {@code sampling} (a power of two, by hash) may anchor and is looked up
 *                       while a genome streams past the index
 * @param minCopies      copies of A's motif B must keep for the repeat to be there at all (else
 *                       {@code lost})
 * @param maxCells       largest alignment (B's bases times template states) measured base by base; a
 *                       longer stretch is measured by its length alone
 */
public record CompareSettings(int anchorsPerSide, int flank, int maxSkip, int sampling, double minCopies,
                              long maxCells) {
    public static final int DEFAULT_ANCHORS_PER_SIDE = 6;
    public static final int DEFAULT_FLANK = 400;
    public static final int DEFAULT_MAX_SKIP = 20_000;
    public static final int DEFAULT_SAMPLING = 8;
    public static final long DEFAULT_MAX_CELLS = 1L << 30;

    public CompareSettings {
        if (anchorsPerSide < 1 || anchorsPerSide > 16) {
            throw new IllegalArgumentException("anchors per side " + anchorsPerSide + " outside 1..16");
        }
        if (flank < Kmer.K) {
            throw new IllegalArgumentException("flank " + flank + " shorter than one anchor (" + Kmer.K + ")");
        }
        if (maxSkip < 0) {
            throw new IllegalArgumentException("max skip " + maxSkip + " is negative");
        }
        if (sampling < 1 || Integer.bitCount(sampling) != 1) {
            throw new IllegalArgumentException("sampling " + sampling + " is not a power of two");
        }
    }

    /** The words {@code #settings} adds for the comparison (the least copy number is the scan's). */
    public String describe() {
        return "anchors=" + anchorsPerSide + " flank=" + flank + " max-skip=" + maxSkip + " sampling=" + sampling
                + " max-cells=" + maxCells;
    }

    /** The defaults, with the scan's least copy number. */
    public static CompareSettings defaults(double minCopies) {
        return new CompareSettings(DEFAULT_ANCHORS_PER_SIDE, DEFAULT_FLANK, DEFAULT_MAX_SKIP, DEFAULT_SAMPLING, minCopies,
                DEFAULT_MAX_CELLS);
    }
}
