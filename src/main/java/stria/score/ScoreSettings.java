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
    /** Below 12 bp, even pure tracts are common by chance and not worth masking (binds only with a low min score). */
    public static final int DEFAULT_MIN_LENGTH = 12;
    /** The score already gates weak loci (0.60-0.75 give the same calls on the benchmark); 0.80 drops true ones. */
    public static final double DEFAULT_MIN_PURITY = 0.70;
    /** 18 net matches: keeps every planted locus 30 keeps, chance loci in random DNA drop from ~35 to ~6 per Mb. */
    public static final int DEFAULT_MIN_SCORE = 36;

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
