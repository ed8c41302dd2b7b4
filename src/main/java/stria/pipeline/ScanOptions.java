package stria.pipeline;

import stria.pipeline.ScanSettings.Mode;
import stria.score.ScoreSettings;

/**
 * The options of a scan, their defaults per mode and their checks, in one place: set what was asked for
 * (null keeps the default), then {@link #settings()} applies the defaults of the mode, checks every value and
 * builds the {@link ScanSettings}. The defaults are compile-time constants so that {@code --help} can show them.
 */
public final class ScanOptions {
    /** Homopolymers are masked too: a long poly-A tract confuses gene prediction as much as (CA)n does. */
    public static final int MIN_PERIOD = 1;
    /** Covers satellite units up to 2 kb; longer units are the business of interspersed-repeat tools. */
    public static final int MAX_PERIOD = 2000;
    /** The largest --max-period accepted. */
    public static final int MAX_PERIOD_LIMIT = 1_000_000;
    public static final int MAX_THREADS = 1024;

    /** Exact mode: every run an annotator would mask, not every AA. Two copies make a tandem repeat. */
    public static final double EXACT_MIN_COPIES = 2;
    /** Below 12 bp even pure tracts are common by chance and not worth masking. */
    public static final int EXACT_MIN_LENGTH = 12;

    /*
     * Imperfect mode, chosen on the planted-truth benchmark (bench/planted.sh).
     */
    /** Two copies make a tandem repeat; shorter loci are left to the length and score filters. */
    public static final double IMPERFECT_MIN_COPIES = 2.0;
    /** Below 12 bp, even pure tracts are common by chance (binds only with a low min score). */
    public static final int IMPERFECT_MIN_LENGTH = 12;
    /** The score already gates weak loci (0.60-0.75 give the same calls on the benchmark); 0.80 drops true ones. */
    public static final double IMPERFECT_MIN_PURITY = 0.70;
    /** No bound of its own: the evalue bound is the default score filter. */
    public static final double IMPERFECT_MIN_SCORE = 0;
    /**
     * At most 5 loci per Mb of random sequence, as many as the former fixed score bound let through. On
     * bench/planted.sh: recall 0.9755 at 1, 0.9823 at 5, 0.9835 at 10; precision 0.9983, 0.9967, 0.9951;
     * 5 is the loosest bound that keeps every figure of the fixed bound to the loci of each kind (10 lets
     * twice as many chance loci through).
     */
    public static final double IMPERFECT_MAX_EVALUE = 5;

    private final Mode mode;
    private Integer minPeriod;
    private Integer maxPeriod;
    private Double minCopies;
    private Integer minLength;
    private Double minPurity;
    private Double minScore;
    private Double maxEvalue;
    private int threads = Runtime.getRuntime().availableProcessors();
    private Long window;

    public ScanOptions(Mode mode) {
        this.mode = mode;
    }

    /** The filters of {@code mode} with every default. */
    public static ScoreSettings defaults(Mode mode) {
        return mode == Mode.EXACT
                ? new ScoreSettings(MIN_PERIOD, MAX_PERIOD, EXACT_MIN_COPIES, EXACT_MIN_LENGTH, 1.0, 0)
                : new ScoreSettings(MIN_PERIOD, MAX_PERIOD, IMPERFECT_MIN_COPIES, IMPERFECT_MIN_LENGTH,
                        IMPERFECT_MIN_PURITY, IMPERFECT_MIN_SCORE, IMPERFECT_MAX_EVALUE);
    }

    public ScanOptions minPeriod(Integer v) {
        minPeriod = v;
        return this;
    }

    public ScanOptions maxPeriod(Integer v) {
        maxPeriod = v;
        return this;
    }

    public ScanOptions minCopies(Double v) {
        minCopies = v;
        return this;
    }

    public ScanOptions minLength(Integer v) {
        minLength = v;
        return this;
    }

    public ScanOptions minPurity(Double v) {
        minPurity = v;
        return this;
    }

    /** Lowest score in bits. */
    public ScanOptions minScore(Double v) {
        minScore = v;
        return this;
    }

    /** Highest evalue; infinity for no bound. */
    public ScanOptions maxEvalue(Double v) {
        maxEvalue = v;
        return this;
    }

    public ScanOptions threads(int v) {
        threads = v;
        return this;
    }

    /** Bases per window; null for {@link Geometry#defaultWindow}. */
    public ScanOptions window(Long v) {
        window = v;
        return this;
    }

    /**
     * The settings, defaults applied.
     *
     * @throws IllegalArgumentException naming the option (as typed on the command line) and what is wrong
     */
    public ScanSettings settings() {
        ScoreSettings d = defaults(mode);
        int minP = minPeriod != null ? minPeriod : d.minPeriod();
        int maxP = maxPeriod != null ? maxPeriod : d.maxPeriod();
        double minC = minCopies != null ? minCopies : d.minCopies();
        int minL = minLength != null ? minLength : d.minLength();
        double minPur = minPurity != null ? minPurity : d.minPurity();
        double minS = minScore != null ? minScore : d.minScore();
        double maxE = maxEvalue != null ? maxEvalue : d.maxEvalue();
        require(minP >= 1, "--min-period must be at least 1 (got " + minP + ")");
        require(maxP >= 1 && maxP <= MAX_PERIOD_LIMIT,
                "--max-period must be between 1 and 1,000,000 (got " + maxP + ")");
        require(minP <= maxP, "--min-period " + minP + " is above --max-period " + maxP);
        require(Double.isFinite(minC), "--min-copies must be a finite number (got " + minC + ")");
        require(minC >= 0, "--min-copies must not be negative (got " + minC + ")");
        require(minL >= 0, "--min-length must not be negative (got " + minL + ")");
        require(minPur >= 0 && minPur <= 1, "--min-purity must be between 0 and 1 (got " + minPur + ")");
        require(minS >= 0 && !Double.isInfinite(minS) && !Double.isNaN(minS),
                "--min-score must be a number of bits, 0 or more (got " + minS + ")");
        require(maxE >= 0 && !Double.isNaN(maxE), "--max-evalue must not be negative (got " + maxE + ")");
        require(threads >= 1 && threads <= MAX_THREADS,
                "--threads must be between 1 and 1024 (got " + threads + ")");
        int minWin = Geometry.minWindow(maxP);
        require(window == null || (window >= minWin && window <= Geometry.MAX_WINDOW), "--window must be between "
                + minWin + " (4 x max-period + 8) and 1G (got " + window + ")");
        int win = window == null ? Geometry.defaultWindow(maxP) : (int) (long) window;
        return new ScanSettings(mode, new ScoreSettings(minP, maxP, minC, minL, minPur, minS, maxE), threads, win);
    }

    private static void require(boolean ok, String message) {
        if (!ok) {
            throw new IllegalArgumentException(message);
        }
    }
}
