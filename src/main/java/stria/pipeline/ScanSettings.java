package stria.pipeline;

import stria.score.ScoreSettings;
import stria.score.ScoringModel;

/**
 * What the engine and the scorer need, built once (by {@link ScanOptions}) and passed down unchanged. What to
 * scan is a {@link Selection}; how windows are cut is {@link Geometry}'s.
 *
 * @param mode    exact runs or imperfect loci
 * @param filters period range, copies, length, purity and score filters
 * @param threads worker threads
 * @param window  window length in bases (at least {@link Geometry#minWindow})
 */
public record ScanSettings(Mode mode, ScoreSettings filters, int threads, int window) {
    /** What a scan reports. */
    public enum Mode {
        /** Exact runs (maximal repetitions), purity 1. */
        EXACT,
        /** Imperfect loci seeded by exact runs and aligned against their consensus. */
        IMPERFECT
    }

    public ScanSettings {
        if (threads < 1 || window < Geometry.minWindow(filters.maxPeriod())) {
            throw new IllegalArgumentException("threads " + threads + ", window " + window + " for max period "
                    + filters.maxPeriod());
        }
    }

    public boolean exact() {
        return mode == Mode.EXACT;
    }

    /** The words of the {@code #settings} header line: every option that changes data lines. */
    public String describe() {
        ScoreSettings f = filters;
        StringBuilder sb = new StringBuilder();
        sb.append("mode=").append(exact() ? "exact" : "imperfect");
        sb.append(" min-period=").append(f.minPeriod());
        sb.append(" max-period=").append(f.maxPeriod());
        sb.append(" min-copies=").append(stripZeros(f.minCopies()));
        sb.append(" min-length=").append(f.minLength());
        if (!exact()) {
            sb.append(" min-purity=").append(stripZeros(f.minPurity()));
            sb.append(" min-score=").append(stripZeros(f.minScore()));
            sb.append(" max-evalue=").append(Double.isInfinite(f.maxEvalue()) ? "none" : stripZeros(f.maxEvalue()));
        }
        // exact runs are scored too: the model shapes their score and evalue columns
        sb.append(" score-model=").append(ScoringModel.DESCRIPTION);
        return sb.toString();
    }

    static String stripZeros(double v) {
        return java.math.BigDecimal.valueOf(v).stripTrailingZeros().toPlainString();
    }
}
