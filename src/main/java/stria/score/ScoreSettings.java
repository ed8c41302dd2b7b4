package stria.score;

/**
 * Filters and thresholds of the scorer, parsed once by the command line.
 *
 * @param minPeriod  smallest period reported
 * @param maxPeriod  largest period reported (also bounds the engine and the window overlap)
 * @param minCopies  smallest copy number (length / period) reported
 * @param minLength  shortest locus reported, in bases
 * @param minPurity  lowest purity reported (imperfect mode)
 * @param minScore   lowest alignment score reported (imperfect mode)
 */
public record ScoreSettings(int minPeriod, int maxPeriod, double minCopies, int minLength, double minPurity,
                            int minScore) {

    /** Homopolymers are masked too: a long poly-A tract confuses gene prediction as much as (CA)n does. */
    public static final int DEFAULT_MIN_PERIOD = 1;
    /** Covers satellite units up to 2 kb; longer units are the business of interspersed-repeat tools. */
    public static final int DEFAULT_MAX_PERIOD = 2000;
    /** Two copies make a tandem repeat; shorter loci are left to the length and score filters. */
    public static final double DEFAULT_MIN_COPIES = 2.0;
    /** Below 12 bp, even pure tracts are frequent in random sequence and not worth masking. */
    public static final int DEFAULT_MIN_LENGTH = 12;
    /** Below 70 % the consensus explains too little of the locus to call it a repeat. */
    public static final double DEFAULT_MIN_PURITY = 0.70;
    /** 30 is 15 matching bases net of errors: rarely reached in random sequence of planted-benchmark size. */
    public static final int DEFAULT_MIN_SCORE = 30;

    /** The defaults of {@code stria scan}, chosen on the planted-truth benchmark (bench/planted.sh). */
    public static ScoreSettings defaults() {
        return new ScoreSettings(DEFAULT_MIN_PERIOD, DEFAULT_MAX_PERIOD, DEFAULT_MIN_COPIES, DEFAULT_MIN_LENGTH,
                DEFAULT_MIN_PURITY, DEFAULT_MIN_SCORE);
    }

    /** The same filters with another largest period. */
    public ScoreSettings withMaxPeriod(int p) {
        return new ScoreSettings(minPeriod, p, minCopies, minLength, minPurity, minScore);
    }
}
