package stria.score;

/**
 * The log-odds scores of the columns of an alignment against a repeated consensus, in integer units of
 * {@code 1 / PER_BIT} bit (Karlin &amp; Altschul 1990: a column scores log2 of its probability when the
 * bases are a repeat over its probability when they are background). The alignment is read as the path of
 * a pair hidden Markov model (Durbin, Eddy, Krogh &amp; Mitchison 1998, Biological Sequence Analysis,
 * chapter 4) whose template is the consensus repeated without end (wraparound alignment):
 *
 * <ul>
 *   <li><b>Repeat model.</b> Each column is an insertion with probability {@link #INSERTION} (a base drawn
 *       from the background composition), a deletion with probability {@link #DELETION} (a template letter
 *       the sequence lacks), otherwise a base aligned with the next template letter: the same letter with
 *       probability {@code 1 - SUBSTITUTION}, each of the three others with {@code SUBSTITUTION / 3}.
 *       Copies are then at identity {@code (1 - INSERTION - DELETION)(1 - SUBSTITUTION)} = 82.7 % of
 *       columns.
 *   <li><b>Background.</b> Bases i.i.d. with the composition {@code q} of the scanned sequence: a
 *       strand-symmetric class of GC content ({@link #gcOfClass}, 0.20 to 0.80 in steps of 0.05), so
 *       {@code q(C) = q(G) = gc / 2} and {@code q(A) = q(T) = (1 - gc) / 2}.
 * </ul>
 *
 * A column that reads base {@code b} scores {@code log2(P_repeat / q(b))}, a deletion (no base read)
 * {@code log2(DELETION)}:
 * <pre>
 *   match of b         log2((1 - I - D)(1 - S) / q(b))
 *   substitution by b  log2((1 - I - D)(S / 3) / q(b))
 *   insertion of b     log2(I q(b) / q(b)) = log2(I)
 *   deletion           log2(D)
 * </pre>
 * The sum along a path is the log-odds of the locus given that path (Viterbi score), in bits when divided
 * by {@link #PER_BIT}. Its expectation on background is negative for every class (a random column matches
 * with probability {@code q(b)}), which the extreme-value calibration of {@link Calibration} needs.
 * Instances are immutable and shared: one per GC class.
 */
public final class ScoringModel {
    /** Score units per bit: columns are rounded to a tenth of a bit. */
    public static final int PER_BIT = 10;
    public static final double SUBSTITUTION = 0.12;
    public static final double INSERTION = 0.03;
    public static final double DELETION = 0.03;
    /** Fewest A, C, G, T bases whose composition is used; fewer give the uniform background. */
    public static final int MIN_BASES = 1000;
    /** GC classes 0.20, 0.25, ..., 0.80. */
    public static final int GC_CLASSES = 13;
    /** The class of GC 0.50: every base has probability 1/4. */
    public static final int UNIFORM_CLASS = 6;
    /** What the {@code #settings} header says about the model, one word. */
    public static final String DESCRIPTION = "log2-odds/sub" + SUBSTITUTION + "-ins" + INSERTION + "-del" + DELETION
            + "/bg-iid-gc" + gcOfClass(0) + "-" + gcOfClass(GC_CLASSES - 1) + "-per-Mb";

    private static final ScoringModel[] CLASSES = new ScoringModel[GC_CLASSES];

    static {
        for (int c = 0; c < GC_CLASSES; c++) {
            CLASSES[c] = new ScoringModel(c);
        }
    }

    private final int gcClass;
    private final int[] match = new int[4];
    private final int[] substitution = new int[4];
    private final int insertion;
    private final int deletion;

    private ScoringModel(int gcClass) {
        this.gcClass = gcClass;
        double gc = gcOfClass(gcClass);
        double aligned = 1 - INSERTION - DELETION;
        for (int b = 0; b < 4; b++) {
            double q = background(gc, b);
            match[b] = units(aligned * (1 - SUBSTITUTION) / q);
            substitution[b] = units(aligned * SUBSTITUTION / 3 / q);
        }
        insertion = units(INSERTION);
        deletion = units(DELETION);
    }

    /** log2(x) in score units, rounded to the nearest unit. */
    static int units(double x) {
        return (int) Math.round(PER_BIT * Math.log(x) / Math.log(2));
    }

    /** Probability of base code {@code b} (A, C, G, T = 0..3) in the strand-symmetric background of GC {@code gc}. */
    static double background(double gc, int b) {
        return b == 1 || b == 2 ? gc / 2 : (1 - gc) / 2;
    }

    public static double gcOfClass(int c) {
        return Math.round(100 * (0.20 + 0.05 * c)) / 100.0;
    }

    /**
     * The class of a composition of {@code gc} G or C among {@code acgt} A, C, G, T bases: the nearest GC
     * class, clamped to 0.20..0.80; the uniform class below {@link #MIN_BASES} bases.
     */
    public static int classOf(long gc, long acgt) {
        if (acgt < MIN_BASES) {
            return UNIFORM_CLASS;
        }
        // nearest multiple of 0.05 in exact integer arithmetic: floor(20 gc / acgt + 1/2)
        long k = (40 * gc + acgt) / (2 * acgt);
        return (int) Math.max(0, Math.min(GC_CLASSES - 1, k - 4));
    }

    public static ScoringModel forClass(int c) {
        return CLASSES[c];
    }

    /** The model of uniform background (each base 1/4). */
    public static ScoringModel uniform() {
        return CLASSES[UNIFORM_CLASS];
    }

    public int gcClass() {
        return gcClass;
    }

    public double gc() {
        return gcOfClass(gcClass);
    }

    /** Score of base {@code b} aligned with the same template letter. */
    public int match(int b) {
        return match[b];
    }

    /** Score of base {@code b} aligned with a different template letter. */
    public int substitution(int b) {
        return substitution[b];
    }

    /** Score of an inserted base, whatever it is. */
    public int insertion() {
        return insertion;
    }

    /** Score of a deleted template letter. */
    public int deletion() {
        return deletion;
    }

    /** Score units as bits. */
    public static double bits(long units) {
        return units / (double) PER_BIT;
    }
}
