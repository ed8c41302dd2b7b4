package stria.score;

/**
 * One reported tandem-repeat locus in contig coordinates (0-based, end exclusive).
 *
 * @param start       first base
 * @param end         one past the last base
 * @param period      motif length
 * @param motif       consensus motif as read on the + strand (majority letter at each phase)
 * @param motifClass  canonical motif: smallest rotation of the motif or of its reverse complement
 * @param copies      (end - start) / period
 * @param purity      fraction of aligned positions that agree with the consensus (1 for exact runs)
 * @param mismatches  substituted bases in the alignment against the repeated consensus
 * @param insertions  bases present in the sequence but not in the repeated consensus
 * @param deletions   consensus bases missing from the sequence
 * @param score       log-odds score in bits: how much better the repeated consensus explains the bases than
 *                    the background does ({@link ScoringModel})
 * @param evalue      loci expected per Mb of random i.i.d. sequence of the same composition with at least this
 *                    score ({@link Calibration})
 * @param entropy     Shannon entropy (bits, 0..2) of the base composition of the locus
 * @param subunitPeriod length of the shorter diverged unit the motif is made of (0: no nested structure)
 * @param subunits    how many such units make one motif (0: no nested structure)
 */
public record Locus(int start, int end, int period, String motif, String motifClass, double copies,
                    double purity, int mismatches, int insertions, int deletions, double score, double evalue,
                    double entropy, int subunitPeriod, int subunits) {

    /** A locus without nested structure. */
    public Locus(int start, int end, int period, String motif, String motifClass, double copies, double purity,
                 int mismatches, int insertions, int deletions, double score, double evalue, double entropy) {
        this(start, end, period, motif, motifClass, copies, purity, mismatches, insertions, deletions, score, evalue,
                entropy, 0, 0);
    }

    public int length() {
        return end - start;
    }

    /** The same locus {@code d} bases further along. */
    public Locus shifted(int d) {
        return new Locus(start + d, end + d, period, motif, motifClass, copies, purity, mismatches, insertions,
                deletions, score, evalue, entropy, subunitPeriod, subunits);
    }
}
