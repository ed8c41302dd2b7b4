package stria.score;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/**
 * How many loci chance gives: the evalue of a score {@code S} (bits) is the expected number of loci scoring at
 * least {@code S} in one million bases of random i.i.d. sequence of the same GC class, found with the default
 * filters other than the score. Its form is one extreme-value (Gumbel) tail per period class {@code c}:
 * <pre>
 *   E(S) = sum over c of K_c * 2^(-lambda_c * S)      (per Mb, per GC class)
 * </pre>
 * the right tail of a Gumbel law of the best local score, {@code P(max >= S) ~ K 2^(-lambda S)}, as
 * Karlin &amp; Altschul 1990 give it for local alignment scores, with {@code K} folding in the number of
 * starting points per Mb. The constants are fitted by simulation ({@code stria.bench.Calibrate}, fixed seed)
 * and shipped as {@link #RESOURCE}; only the period classes that meet the scan's period range are summed.
 * Immutable.
 */
public final class Calibration {
    /** The shipped table. */
    public static final String RESOURCE = "/stria/score/calibration.tsv";
    /** Smallest period of each period class: 1, 2, 3, 4, 5-6, 7-12, 13-30, 31-100, 101+. */
    private static final int[] CLASS_FROM = {1, 2, 3, 4, 5, 7, 13, 31, 101};
    public static final int PERIOD_CLASSES = CLASS_FROM.length;
    /** The column header of the table. */
    public static final String HEADER = "gc\tperiod_class\tK_per_Mb\tlambda_per_bit\ttail_points\ttail_from_bits";

    private final double[][] k;
    private final double[][] lambda;
    private final boolean[] used;

    private Calibration(double[][] k, double[][] lambda, boolean[] used) {
        this.k = k;
        this.lambda = lambda;
        this.used = used;
    }

    private static final class Shipped {
        static final Calibration TABLE = load();

        private static Calibration load() {
            try (InputStream in = Calibration.class.getResourceAsStream(RESOURCE)) {
                if (in == null) {
                    throw new IllegalStateException("missing resource " + RESOURCE);
                }
                BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
                List<String> lines = new ArrayList<>();
                for (String l = r.readLine(); l != null; l = r.readLine()) {
                    lines.add(l);
                }
                return parse(lines);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
    }

    /** The shipped table, every period class. */
    public static Calibration shipped() {
        return Shipped.TABLE;
    }

    /** Name of period class {@code c}, as in the table: 1, 2, ..., 5-6, ..., 101+. */
    public static String className(int c) {
        if (c == PERIOD_CLASSES - 1) {
            return CLASS_FROM[c] + "+";
        }
        int to = CLASS_FROM[c + 1] - 1;
        return to == CLASS_FROM[c] ? Integer.toString(to) : CLASS_FROM[c] + "-" + to;
    }

    /** The period class of period {@code p}. */
    public static int periodClass(int p) {
        int c = 0;
        while (c + 1 < PERIOD_CLASSES && p >= CLASS_FROM[c + 1]) {
            c++;
        }
        return c;
    }

    /**
     * A table from its text: {@code #} lines, the {@link #HEADER} row, then one row per GC class and period
     * class with {@code K} (per Mb) and {@code lambda} (per bit); every pair must be present.
     */
    public static Calibration parse(List<String> lines) {
        double[][] k = new double[ScoringModel.GC_CLASSES][PERIOD_CLASSES];
        double[][] lambda = new double[ScoringModel.GC_CLASSES][PERIOD_CLASSES];
        boolean[][] seen = new boolean[ScoringModel.GC_CLASSES][PERIOD_CLASSES];
        for (String l : lines) {
            if (l.isEmpty() || l.startsWith("#") || l.startsWith("gc\t")) {
                continue;
            }
            String[] f = l.split("\t");
            int g = gcClass(Double.parseDouble(f[0]));
            int c = -1;
            for (int i = 0; i < PERIOD_CLASSES; i++) {
                if (className(i).equals(f[1])) {
                    c = i;
                }
            }
            if (g < 0 || c < 0) {
                throw new IllegalArgumentException("calibration row of an unknown class: " + l);
            }
            k[g][c] = Double.parseDouble(f[2]);
            lambda[g][c] = Double.parseDouble(f[3]);
            seen[g][c] = true;
        }
        for (int g = 0; g < ScoringModel.GC_CLASSES; g++) {
            for (int c = 0; c < PERIOD_CLASSES; c++) {
                if (!seen[g][c]) {
                    throw new IllegalArgumentException("calibration lacks GC " + ScoringModel.gcOfClass(g)
                            + " period class " + className(c));
                }
            }
        }
        boolean[] all = new boolean[PERIOD_CLASSES];
        java.util.Arrays.fill(all, true);
        return new Calibration(k, lambda, all);
    }

    private static int gcClass(double gc) {
        for (int g = 0; g < ScoringModel.GC_CLASSES; g++) {
            if (Math.abs(ScoringModel.gcOfClass(g) - gc) < 1e-9) {
                return g;
            }
        }
        return -1;
    }

    /** The same table summing only the period classes that meet {@code [minPeriod, maxPeriod]}. */
    public Calibration forPeriods(int minPeriod, int maxPeriod) {
        boolean[] u = new boolean[PERIOD_CLASSES];
        for (int c = 0; c < PERIOD_CLASSES; c++) {
            int to = c == PERIOD_CLASSES - 1 ? Integer.MAX_VALUE : CLASS_FROM[c + 1] - 1;
            u[c] = CLASS_FROM[c] <= maxPeriod && to >= minPeriod;
        }
        return new Calibration(k, lambda, u);
    }

    /** Expected loci per Mb of random sequence of GC class {@code gcClass} scoring at least {@code units}. */
    public double evalue(int gcClass, int units) {
        double bits = ScoringModel.bits(units);
        double e = 0;
        for (int c = 0; c < PERIOD_CLASSES; c++) {
            if (used[c] && k[gcClass][c] > 0) {
                e += k[gcClass][c] * StrictMath.pow(2, -lambda[gcClass][c] * bits);
            }
        }
        return e;
    }

    /**
     * The lowest score, in units (at least 0), whose {@link #evalue} is at most {@code maxEvalue}: the evalue
     * falls as the score rises, so a locus passes an evalue bound exactly when its score reaches this.
     */
    public int scoreFor(int gcClass, double maxEvalue) {
        if (evalue(gcClass, 0) <= maxEvalue) {
            return 0;
        }
        long lo = 0; // fails
        long hi = 1;
        while (evalue(gcClass, (int) hi) > maxEvalue) {
            lo = hi;
            hi *= 2;
            if (hi > Integer.MAX_VALUE / 2) {
                return Integer.MAX_VALUE;
            }
        }
        while (hi - lo > 1) {
            long mid = (lo + hi) >>> 1;
            if (evalue(gcClass, (int) mid) <= maxEvalue) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return (int) hi;
    }

    /** {@code K} per Mb of a GC class and period class. */
    public double k(int gcClass, int periodClass) {
        return k[gcClass][periodClass];
    }

    /** {@code lambda} per bit of a GC class and period class. */
    public double lambda(int gcClass, int periodClass) {
        return lambda[gcClass][periodClass];
    }
}
