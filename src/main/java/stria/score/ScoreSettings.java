package stria.score;

/**
 * Filters and thresholds of the scorer. Their defaults, per mode, and their checks live with the scan's
 * options ({@code stria.pipeline.ScanOptions}).
 *
 * @param minPeriod  smallest period reported
 * @param maxPeriod  largest period reported (also bounds the engine and the window overlap)
 * @param minCopies  smallest copy number (length / period) reported
 * @param minLength  shortest locus reported, in bases
 * @param minPurity  lowest purity reported (imperfect mode)
 * @param minScore   lowest log-odds score reported, in bits (imperfect mode)
 * @param maxEvalue  highest evalue reported (imperfect mode; infinity for none)
 */
public record ScoreSettings(int minPeriod, int maxPeriod, double minCopies, int minLength, double minPurity,
                            double minScore, double maxEvalue) {
    /** Settings without an evalue bound. */
    public ScoreSettings(int minPeriod, int maxPeriod, double minCopies, int minLength, double minPurity,
                         double minScore) {
        this(minPeriod, maxPeriod, minCopies, minLength, minPurity, minScore, Double.POSITIVE_INFINITY);
    }
}
