package stria.score;

/**
 * The filters of {@link ScoreSettings}: which loci are reported. Exact runs (exact mode) are judged by
 * period and length alone ({@link #acceptsRun}); scored loci also by purity, score and evalue
 * ({@link #accepts(int, int, double, int, int)}). The evalue falls as the score rises, so the evalue bound is
 * a lowest score per GC class, worked out once ({@link Calibration#scoreFor}). The scorer applies the filter
 * before its competition, so a locus that would not be reported never suppresses one that would.
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
    private final Calibration calibration;
    /** Lowest passing score in units, per GC class: the score bound and the evalue bound together. */
    private final int[] minUnits = new int[ScoringModel.GC_CLASSES];

    public LocusFilter(ScoreSettings s) {
        this(s, Calibration.shipped());
    }

    public LocusFilter(ScoreSettings s, Calibration table) {
        this.minPeriod = s.minPeriod();
        this.maxPeriod = s.maxPeriod();
        this.minLength = s.minLength();
        this.minCopies = s.minCopies();
        this.minPurity = s.minPurity();
        this.calibration = table.forPeriods(s.minPeriod(), s.maxPeriod());
        // a score typed in bits that equals a whole number of units must pass
        int fromBits = (int) Math.ceil(s.minScore() * ScoringModel.PER_BIT - 1e-9);
        for (int g = 0; g < ScoringModel.GC_CLASSES; g++) {
            minUnits[g] = Math.max(fromBits, calibration.scoreFor(g, s.maxEvalue()));
        }
    }

    /** The calibration loci are given their evalue by: the table, over the scan's period range. */
    public Calibration calibration() {
        return calibration;
    }

    /** Lowest score, in units, that passes in GC class {@code gcClass}. */
    public int minUnits(int gcClass) {
        return minUnits[gcClass];
    }

    /** Whether a repeat of this period and length passes the period, length and copy-number filters. */
    public boolean acceptsRun(int period, int length) {
        return period >= minPeriod && period <= maxPeriod && length >= minLength
                && length >= minCopies * period - COPIES_SLACK;
    }

    /** Whether a scored locus (score in units, in the model of GC class {@code gcClass}) passes every filter. */
    public boolean accepts(int period, int length, double purity, int units, int gcClass) {
        return acceptsRun(period, length) && purity >= minPurity && units >= minUnits[gcClass];
    }

    boolean accepts(Candidate k) {
        return accepts(k.period, k.length(), k.purity(), k.score, k.model.gcClass());
    }
}
