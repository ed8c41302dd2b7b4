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
 * @param minScore   lowest alignment score reported (imperfect mode)
 */
public record ScoreSettings(int minPeriod, int maxPeriod, double minCopies, int minLength, double minPurity,
                            int minScore) {
}
