package stria.sim;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import stria.pipeline.Genome;
import stria.pipeline.GenomeScan;
import stria.pipeline.Progress;
import stria.pipeline.ScanOptions;
import stria.pipeline.ScanPlan;
import stria.pipeline.ScanSettings;
import stria.pipeline.Selection;

/**
 * Scores reported loci against the truth table of a simulated genome.
 *
 * <ul>
 *   <li>recall: share of planted loci with identity at least 0.85, length at least 24 bp and at least
 *       3 copies for which one reported locus of the planted period covers at least half the locus;
 *   <li>precision: share of reported loci of 30 bp or more that overlap a planted locus;
 *   <li>boundary error: for found loci, (|start difference| + |end difference|) / planted length, median;
 *   <li>purity error: for found loci, |reported purity - planted identity|, median.
 * </ul>
 * Either reads a stria TSV ({@code --calls}) or, with {@code --simulate}, generates the genome in memory
 * and scans it in-process with the scan's library call (default settings), without files in between.
 */
@Command(name = "TruthScorer", mixinStandardHelpOptions = true,
        description = "Scores reported tandem-repeat loci against a planted truth table.")
public final class TruthScorer implements Callable<Integer> {
    static final double RECALL_MIN_IDENTITY = 0.85;
    static final int RECALL_MIN_LENGTH = 24;
    static final double RECALL_MIN_COPIES = 3;
    static final int PRECISION_MIN_LENGTH = 30;

    @Option(names = "--truth", description = "truth table written by GenomeSimulator")
    Path truth;

    @Option(names = "--calls", description = "stria scan TSV output")
    Path calls;

    @Option(names = "--simulate", split = " ",
            description = "simulate in memory with these GenomeSimulator options (quoted, space separated) and scan in-process")
    List<String> simulate;

    @Option(names = "--verbose", description = "list missed planted loci and unexplained calls")
    boolean verbose;

    /** One reported locus reduced to what scoring needs. */
    public record Call(String contig, int start, int end, int period, double purity) {
    }

    /** Figures of one comparison. */
    public record Result(int plantedEligible, int found, int reportedLong, int reportedLongTrue, double boundaryError,
                         double purityError, Map<String, int[]> byKind, List<String> notes) {
        public double recall() {
            return plantedEligible == 0 ? 1 : found / (double) plantedEligible;
        }

        public double precision() {
            return reportedLong == 0 ? 1 : reportedLongTrue / (double) reportedLong;
        }

        public String summary() {
            StringBuilder sb = new StringBuilder();
            sb.append(String.format(Locale.ROOT, "recall      %.4f  (%d of %d planted loci, identity >= %.2f, >= %d bp, >= %.0f copies)%n",
                    recall(), found, plantedEligible, RECALL_MIN_IDENTITY, RECALL_MIN_LENGTH, RECALL_MIN_COPIES));
            sb.append(String.format(Locale.ROOT, "precision   %.4f  (%d of %d reported loci >= %d bp overlap a planted locus)%n",
                    precision(), reportedLongTrue, reportedLong, PRECISION_MIN_LENGTH));
            sb.append(String.format(Locale.ROOT, "boundary    %.4f  (median |start error| + |end error| over planted length)%n", boundaryError));
            sb.append(String.format(Locale.ROOT, "purity      %.4f  (median |purity - planted identity|)%n", purityError));
            for (Map.Entry<String, int[]> e : new java.util.TreeMap<>(byKind).entrySet()) {
                sb.append(String.format(Locale.ROOT, "  %-15s found %d of %d%n", e.getKey(), e.getValue()[1], e.getValue()[0]));
            }
            return sb.toString();
        }
    }

    public static void main(String[] args) {
        System.exit(new CommandLine(new TruthScorer()).execute(args));
    }

    @Override
    public Integer call() throws IOException {
        List<GenomeSimulator.Planted> planted;
        List<Call> reported;
        if (simulate != null && !simulate.isEmpty()) {
            long t0 = System.nanoTime();
            GenomeSimulator.Genome g = GenomeSimulator.generate(simulate.toArray(String[]::new));
            long t1 = System.nanoTime();
            reported = scanInProcess(g, new ScanOptions(ScanSettings.Mode.IMPERFECT).settings());
            long t2 = System.nanoTime();
            long bases = 0;
            for (byte[] s : g.sequences()) {
                bases += s.length;
            }
            System.out.printf(Locale.ROOT, "genome      %d bases, %d contigs, %d planted loci (simulated in %.2f s)%n",
                    bases, g.names().size(), g.truth().size(), (t1 - t0) / 1e9);
            System.out.printf(Locale.ROOT, "scan        %d loci in %.2f s (in-process)%n",
                    reported.size(), (t2 - t1) / 1e9);
            planted = g.truth();
        } else {
            if (truth == null || calls == null) {
                throw new CommandLine.ParameterException(new CommandLine(this), "need --truth and --calls, or --simulate");
            }
            planted = readTruth(truth);
            reported = readCalls(calls);
        }
        Result r = score(planted, reported);
        System.out.print(r.summary());
        if (verbose) {
            r.notes().forEach(System.out::println);
        }
        return 0;
    }

    /** Scans an in-memory genome through the real pipeline (windows, threads, stitching, scoring in chunks). */
    public static List<Call> scanInProcess(GenomeSimulator.Genome g, ScanSettings settings) {
        List<Call> out = new ArrayList<>();
        ScanPlan plan = ScanPlan.of(Genome.of(g.names(), g.sequences()), Selection.wholeGenome());
        new GenomeScan(settings, Progress.none()).run(plan,
                (contig, l) -> out.add(new Call(contig, l.start(), l.end(), l.period(), l.purity())));
        return out;
    }

    public static Result score(List<GenomeSimulator.Planted> planted, List<Call> reported) {
        Map<String, List<Call>> byContig = new HashMap<>();
        for (Call c : reported) {
            byContig.computeIfAbsent(c.contig(), k -> new ArrayList<>()).add(c);
        }
        Map<String, List<GenomeSimulator.Planted>> truthByContig = new HashMap<>();
        for (GenomeSimulator.Planted p : planted) {
            truthByContig.computeIfAbsent(p.contig(), k -> new ArrayList<>()).add(p);
        }
        for (List<Call> l : byContig.values()) {
            l.sort((a, b) -> Integer.compare(a.start(), b.start()));
        }
        for (List<GenomeSimulator.Planted> l : truthByContig.values()) {
            l.sort((a, b) -> Integer.compare(a.start(), b.start()));
        }
        List<String> notes = new ArrayList<>();
        Map<String, int[]> byKind = new HashMap<>();
        int eligible = 0;
        int found = 0;
        List<Double> boundary = new ArrayList<>();
        List<Double> purity = new ArrayList<>();
        for (GenomeSimulator.Planted p : planted) {
            int len = p.end() - p.start();
            if (p.identity() < RECALL_MIN_IDENTITY || len < RECALL_MIN_LENGTH || p.copies() < RECALL_MIN_COPIES) {
                continue;
            }
            eligible++;
            int[] k = byKind.computeIfAbsent(p.kind(), x -> new int[2]);
            k[0]++;
            Call best = null;
            int bestOv = 0;
            for (Call c : overlapping(byContig.get(p.contig()), p.start(), p.end())) {
                int ov = Math.min(c.end(), p.end()) - Math.max(c.start(), p.start());
                if (c.period() == p.period() && ov > bestOv) {
                    best = c;
                    bestOv = ov;
                }
            }
            if (best != null && 2L * bestOv >= len) {
                found++;
                k[1]++;
                boundary.add((Math.abs(best.start() - p.start()) + Math.abs(best.end() - p.end())) / (double) len);
                purity.add(Math.abs(best.purity() - p.identity()));
            } else {
                StringBuilder sb = new StringBuilder("missed ").append(p);
                for (Call c : overlapping(byContig.get(p.contig()), p.start(), p.end())) {
                    sb.append("\n    overlapping ").append(c);
                }
                notes.add(sb.toString());
            }
        }
        int longCalls = 0;
        int longTrue = 0;
        for (Call c : reported) {
            if (c.end() - c.start() < PRECISION_MIN_LENGTH) {
                continue;
            }
            longCalls++;
            if (!overlappingTruth(truthByContig.get(c.contig()), c.start(), c.end()).isEmpty()) {
                longTrue++;
            } else {
                notes.add("unexplained " + c);
            }
        }
        return new Result(eligible, found, longCalls, longTrue, median(boundary), median(purity), byKind, notes);
    }

    private static List<Call> overlapping(List<Call> sorted, int s, int e) {
        List<Call> out = new ArrayList<>();
        if (sorted == null) {
            return out;
        }
        for (Call c : sorted) {
            // calls are at most a few hundred kb long; a linear scan is fine at benchmark sizes
            if (c.start() >= e) {
                break;
            }
            if (c.end() > s) {
                out.add(c);
            }
        }
        return out;
    }

    private static List<GenomeSimulator.Planted> overlappingTruth(List<GenomeSimulator.Planted> sorted, int s, int e) {
        List<GenomeSimulator.Planted> out = new ArrayList<>();
        if (sorted == null) {
            return out;
        }
        for (GenomeSimulator.Planted p : sorted) {
            if (p.start() >= e) {
                break;
            }
            if (p.end() > s) {
                out.add(p);
            }
        }
        return out;
    }

    static double median(List<Double> xs) {
        if (xs.isEmpty()) {
            return 0;
        }
        double[] a = new double[xs.size()];
        for (int i = 0; i < a.length; i++) {
            a[i] = xs.get(i);
        }
        Arrays.sort(a);
        int n = a.length;
        return n % 2 == 1 ? a[n / 2] : (a[n / 2 - 1] + a[n / 2]) / 2;
    }

    public static List<GenomeSimulator.Planted> readTruth(Path p) throws IOException {
        List<GenomeSimulator.Planted> out = new ArrayList<>();
        try (BufferedReader r = Files.newBufferedReader(p, StandardCharsets.US_ASCII)) {
            String line;
            boolean header = true;
            while ((line = r.readLine()) != null) {
                if (header) {
                    header = false;
                    continue;
                }
                String[] f = line.split("\t");
                out.add(new GenomeSimulator.Planted(f[0], Integer.parseInt(f[1]), Integer.parseInt(f[2]),
                        Integer.parseInt(f[3]), f[4], Double.parseDouble(f[5]), Double.parseDouble(f[6]),
                        f.length > 7 ? f[7] : "planted"));
            }
        }
        return out;
    }

    /** Reads a stria TSV (gzip not supported): '#' lines, one header row naming the columns, then loci. */
    public static List<Call> readCalls(Path p) throws IOException {
        List<Call> out = new ArrayList<>();
        try (BufferedReader r = Files.newBufferedReader(p, StandardCharsets.UTF_8)) {
            String line;
            Map<String, Integer> col = null;
            while ((line = r.readLine()) != null) {
                if (line.startsWith("#") || line.isEmpty()) {
                    continue;
                }
                String[] f = line.split("\t");
                if (col == null) {
                    col = new HashMap<>();
                    for (int i = 0; i < f.length; i++) {
                        col.put(f[i], i);
                    }
                    continue;
                }
                Integer pur = col.get("purity");
                out.add(new Call(f[col.get("chrom")], Integer.parseInt(f[col.get("start")]),
                        Integer.parseInt(f[col.get("end")]), Integer.parseInt(f[col.get("period")]),
                        pur == null ? 1.0 : Double.parseDouble(f[pur])));
            }
        }
        return out;
    }
}
