package stria.score;

/**
 * The filters of {@link ScoreSettings}: which loci are reported. Exact runs (exact mode) are judged by
 * period and length alone ({@link #acceptsRun}); scored loci also by purity and alignment score
 * ({@link #accepts(int, int, double, int)}). The scorer applies the filter before its competition, so a
 * locus that would not be reported never suppresses one that would.
 */
public final class LocusFilter {
    /**
     * Slack of the copy-number test: {@code minCopies * period} is a product of doubles, and a length that
     * equals it in decimal (1.1 copies of 10 bases) must not fail by a rounding error.
     */
    private static final double COPIES_SLACK = 1e-9;

    private final int minPeriod;
    private final int maxPeriod;
    private final int minLength;
    private final double minCopies;
    private final double minPurity;
    private final int minScore;

    public LocusFilter(ScoreSettings s) {
        this.minPeriod = s.minPeriod();
        this.maxPeriod = s.maxPeriod();
        this.minLength = s.minLength();
        this.minCopies = s.minCopies();
        this.minPurity = s.minPurity();
        this.minScore = s.minScore();
    }

    /** Whether a repeat of this period and length passes the period, length and copy-number filters. */
    public boolean acceptsRun(int period, int length) {
        return period >= minPeriod && period <= maxPeriod && length >= minLength
                && length >= minCopies * period - COPIES_SLACK;
    }

    /** Whether a scored locus passes every filter. */
    public boolean accepts(int period, int length, double purity, int score) {
        return acceptsRun(period, length) && purity >= minPurity && score >= minScore;
    }

    boolean accepts(Candidate k) {
        return accepts(k.period, k.length(), k.purity(), k.score);
    }
}
