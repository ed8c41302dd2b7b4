package stria.bench;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import stria.pipeline.Genome;
import stria.pipeline.GenomeScan;
import stria.pipeline.Progress;
import stria.pipeline.ScanOptions;
import stria.pipeline.ScanPlan;
import stria.pipeline.ScanSettings;
import stria.pipeline.Selection;
import stria.score.Calibration;
import stria.score.Locus;
import stria.score.ScoringModel;

/**
 * Fits the evalue table ({@link Calibration}) by simulation: for every GC class, {@code MB} contigs of one
 * million i.i.d. bases of that composition (fixed seed per class) are scanned by the real pipeline with the
 * default filters and no score or evalue bound, and for every period class the right tail of the scores is
 * fitted as an exponential, the tail of a Gumbel law:
 * the {@code max(MIN_TAIL, TAIL_PER_MB * MB)} highest scores (all of them when fewer; ties with the last one
 * included) above {@code u}, half a score unit below the lowest of them, give by maximum likelihood
 * {@code lambda = n / (ln 2 * sum(S - u))} per bit and {@code K = (n / MB) 2^(lambda u)} per Mb, so that
 * {@code K 2^(-lambda S)} is the number per Mb scoring at least S. A period class with fewer than
 * {@link #MIN_FIT} loci gets {@code K = 0}: chance gives it (almost) nothing.
 *
 * <p>Usage: {@code java -cp target/stria.jar:target/stria-tools.jar stria.bench.Calibrate OUT.tsv [MB [THREADS]]}
 * (bench/calibrate.sh). The same arguments write the same bytes.
 */
public final class Calibrate {
    static final int TAIL_PER_MB = 20;
    static final int MIN_TAIL = 200;
    static final int MIN_FIT = 20;
    /** Seed of the calibration genomes; the tests draw theirs from other seeds. */
    public static final long SEED = 0x5EED_CA11L;
    static final int CONTIG = 1_000_000;

    private Calibrate() {
    }

    public static void main(String[] args) throws IOException {
        if (args.length < 1 || args.length > 3) {
            System.err.println("usage: Calibrate OUT.tsv [MB [THREADS]]");
            System.exit(2);
        }
        int mb = args.length > 1 ? Integer.parseInt(args[1]) : 20;
        int threads = args.length > 2 ? Integer.parseInt(args[2]) : Runtime.getRuntime().availableProcessors();
        List<String> lines = new ArrayList<>();
        lines.add("# stria evalue calibration: E(S) = sum over period classes c of K_c * 2^(-lambda_c * S) loci per Mb"
                + " scoring at least S bits, per GC class");
        lines.add("# fitted by stria.bench.Calibrate: " + mb + " Mb of i.i.d. sequence per GC class, seed "
                + Long.toHexString(SEED) + ", default filters without score bound, exponential tail MLE of the top "
                + "max(" + MIN_TAIL + ", " + TAIL_PER_MB + " per Mb) scores per period class");
        lines.add("# score model " + ScoringModel.DESCRIPTION);
        lines.add(Calibration.HEADER);
        for (int g = 0; g < ScoringModel.GC_CLASSES; g++) {
            long t0 = System.nanoTime();
            List<double[]> byClass = scores(g, mb, threads, SEED + g);
            for (int c = 0; c < Calibration.PERIOD_CLASSES; c++) {
                lines.add(fit(ScoringModel.gcOfClass(g), c, byClass.get(c), mb));
            }
            System.err.printf(Locale.ROOT, "GC %.2f: %d loci, %.1f s%n", ScoringModel.gcOfClass(g),
                    byClass.stream().mapToInt(a -> a.length).sum(), (System.nanoTime() - t0) / 1e9);
        }
        Path out = Path.of(args[0]);
        try (PrintStream p = new PrintStream(Files.newOutputStream(out), false, "UTF-8")) {
            for (String l : lines) {
                p.print(l);
                p.print('\n');
            }
        }
    }

    /** Scores (bits) of the loci of {@code mb} random contigs of GC class {@code g}, by period class. */
    public static List<double[]> scores(int g, int mb, int threads, long seed) {
        List<List<Double>> by = new ArrayList<>();
        for (int c = 0; c < Calibration.PERIOD_CLASSES; c++) {
            by.add(new ArrayList<>());
        }
        for (Locus l : scan(ScoringModel.gcOfClass(g), mb, threads, seed)) {
            by.get(Calibration.periodClass(l.period())).add(l.score());
        }
        List<double[]> out = new ArrayList<>();
        for (List<Double> l : by) {
            out.add(l.stream().mapToDouble(Double::doubleValue).toArray());
        }
        return out;
    }

    /**
     * The loci, with the imperfect-mode defaults but no score or evalue bound, of {@code mb} contigs of one
     * million random bases of GC content {@code gc}, drawn from {@code seed}.
     */
    public static List<Locus> scan(double gc, int mb, int threads, long seed) {
        List<String> names = new ArrayList<>();
        List<byte[]> seqs = new ArrayList<>();
        SplittableRandom rnd = new SplittableRandom(seed);
        for (int i = 0; i < mb; i++) {
            names.add("r" + i);
            seqs.add(random(rnd, CONTIG, gc));
        }
        List<Locus> out = new ArrayList<>();
        ScanPlan plan = ScanPlan.of(Genome.of(names, seqs), Selection.wholeGenome());
        new GenomeScan(unbounded(threads), Progress.none()).run(plan, (contig, l) -> out.add(l));
        return out;
    }

    /** Imperfect-mode defaults without a score or evalue bound. */
    public static ScanSettings unbounded(int threads) {
        return new ScanOptions(ScanSettings.Mode.IMPERFECT).minScore(0.0).maxEvalue(Double.POSITIVE_INFINITY)
                .threads(threads).settings();
    }

    /** {@code n} i.i.d. bases with P(C) = P(G) = gc / 2 and P(A) = P(T) = (1 - gc) / 2. */
    public static byte[] random(SplittableRandom rnd, int n, double gc) {
        byte[] b = new byte[n];
        for (int i = 0; i < n; i++) {
            double x = rnd.nextDouble();
            b[i] = (byte) (x < gc / 2 ? 'C' : x < gc ? 'G' : x < gc + (1 - gc) / 2 ? 'A' : 'T');
        }
        return b;
    }

    static String fit(double gc, int c, double[] scores, int mb) {
        double[] s = scores.clone();
        Arrays.sort(s);
        int size = s.length;
        double k = 0;
        double lambda = 1;
        int n = 0;
        double u = 0;
        if (size >= MIN_FIT) {
            int want = Math.min(size, Math.max(MIN_TAIL, TAIL_PER_MB * mb));
            double last = s[size - want];
            // ties with the last score are in the tail; u lies half a unit below it
            u = last - 0.5 / ScoringModel.PER_BIT;
            double sum = 0;
            for (int i = size - 1; i >= 0 && s[i] >= last; i--) {
                sum += s[i] - u;
                n++;
            }
            lambda = n / (Math.log(2) * sum);
            k = n / (double) mb * Math.pow(2, lambda * u);
        } else {
            n = size;
        }
        return String.format(Locale.ROOT, "%.2f\t%s\t%.6g\t%.6g\t%d\t%.2f", gc, Calibration.className(c), k, lambda,
                n, u);
    }
}
