package stria.bench;

import java.io.BufferedReader;
import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import stria.compare.CompareSettings;
import stria.compare.ComparedLocus;
import stria.compare.Comparison;
import stria.compare.Status;
import stria.io.ContigBytes;
import stria.io.ContigInfo;
import stria.io.GenomeReader;
import stria.score.Locus;

/**
 * Cost of the comparison engine on one thread: anchor index build, counting A's words, streaming B past
 * the index, and pairing and measuring every locus, with the memory the engine holds per locus.
 *
 * <p>Usage: {@code java -cp target/stria.jar stria.bench.CompareBench A.fa A.tsv [rounds]}, where A.tsv is
 * {@code stria scan --tsv} output for A. B is A twice over: A itself, and A with background substitutions
 * (0.1 %) and small insertions and deletions (0.01 %, 1-3 bases) drawn from a fixed seed. Rounds (default
 * 3) follow one warm-up round; the median thread CPU time of each step is reported. The system properties
 * {@code stria.compare.anchors} and {@code stria.compare.flank} override the anchors per side and the flank.
 */
public final class CompareBench {
    private CompareBench() {
    }

    public static void main(String[] args) throws IOException {
        if (args.length < 2) {
            System.err.println("usage: CompareBench A.fa A.tsv [rounds]");
            System.exit(2);
        }
        int rounds = args.length > 2 ? Integer.parseInt(args[2]) : 3;
        Map<String, List<Locus>> loci = readLoci(Path.of(args[1]));
        List<String> names = new ArrayList<>();
        List<byte[]> seqs = new ArrayList<>();
        try (GenomeReader r = GenomeReader.open(args[0], System.err::println)) {
            for (ContigInfo c : r.contigs()) {
                names.add(c.name());
                seqs.add(r.sequence(c));
            }
        }
        long bases = 0;
        int n = 0;
        for (int c = 0; c < names.size(); c++) {
            bases += seqs.get(c).length;
            n += loci.getOrDefault(names.get(c), List.of()).size();
        }
        System.out.printf(Locale.ROOT, "A: %s, %d contigs, %d bases, %d loci; %d cores, java %s%n", args[0],
                names.size(), bases, n, Runtime.getRuntime().availableProcessors(), System.getProperty("java.version"));
        List<byte[]> mutated = new ArrayList<>();
        for (byte[] s : seqs) {
            mutated.add(mutate(s, new SplittableRandom(0x5EED_C0DEL + mutated.size())));
        }
        for (String scenario : new String[] {"B = A", "B = A + 0.1 % substitutions + 0.01 % indels"}) {
            List<byte[]> b = scenario.equals("B = A") ? seqs : mutated;
            run(scenario, names, seqs, loci, b, rounds, bases);
        }
    }

    private static void run(String scenario, List<String> names, List<byte[]> a, Map<String, List<Locus>> loci,
                            List<byte[]> b, int rounds, long bases) {
        ThreadMXBean tm = ManagementFactory.getThreadMXBean();
        double[][] t = new double[4][rounds];
        Comparison last = null;
        List<ComparedLocus> rows = null;
        long heldBytes = 0;
        for (int round = -1; round < rounds; round++) {
            last = null;
            rows = null;
            System.gc();
            long before = used();
            long t0 = tm.getCurrentThreadCpuTime();
            Comparison.Builder bd = Comparison.builder(settings());
            for (int c = 0; c < names.size(); c++) {
                bd.addContig(names.get(c), ContigBytes.of(a.get(c)), loci.getOrDefault(names.get(c), List.of()));
            }
            Comparison cmp = bd.build();
            long t1 = tm.getCurrentThreadCpuTime();
            for (int c = 0; c < names.size(); c++) {
                cmp.countA(c, ContigBytes.of(a.get(c)));
            }
            long t2 = tm.getCurrentThreadCpuTime();
            for (int c = 0; c < names.size(); c++) {
                cmp.streamB(names.get(c), b.get(c));
            }
            long t3 = tm.getCurrentThreadCpuTime();
            rows = cmp.results(1);
            long t4 = tm.getCurrentThreadCpuTime();
            System.gc();
            heldBytes = used() - before;
            last = cmp;
            if (round >= 0) {
                t[0][round] = (t1 - t0) / 1e9;
                t[1][round] = (t2 - t1) / 1e9;
                t[2][round] = (t3 - t2) / 1e9;
                t[3][round] = (t4 - t3) / 1e9;
            }
        }
        Comparison.Figures f = last.figures();
        int loci0 = f.loci();
        Map<Status, Integer> counts = new EnumMap<>(Status.class);
        Map<String, Integer> why = new HashMap<>();
        for (ComparedLocus r : rows) {
            counts.merge(r.status(), 1, Integer::sum);
            if (r.note() != null) {
                why.merge(r.note(), 1, Integer::sum);
            }
        }
        System.out.printf(Locale.ROOT, "%n%s (%s)%n", scenario, settings());
        System.out.printf(Locale.ROOT, "  build index      %7.2f s CPU  (%d anchors, %.2f a locus, %d distinct words)%n",
                median(t[0]), f.anchors(), f.anchors() / (double) loci0, f.distinctWords());
        System.out.printf(Locale.ROOT, "  count A          %7.2f s CPU  %7.1f MB/s%n", median(t[1]), bases / 1e6 / median(t[1]));
        System.out.printf(Locale.ROOT, "  stream B         %7.2f s CPU  %7.1f MB/s%n", median(t[2]), bases / 1e6 / median(t[2]));
        System.out.printf(Locale.ROOT, "  pair and measure %7.2f s CPU  %7.0f loci/s%n", median(t[3]), loci0 / median(t[3]));
        System.out.printf(Locale.ROOT, "  memory: table %.1f MB, stretches and per-locus arrays %.1f MB, kept B %.1f MB"
                        + " = %.0f bytes a locus; heap held after the run %.1f MB (%.0f bytes a locus, results included)%n",
                f.tableBytes() / 1e6, f.stretchBytes() / 1e6, f.captureBytes() / 1e6, f.bytes() / (double) loci0,
                heldBytes / 1e6, heldBytes / (double) loci0);
        StringBuilder sb = new StringBuilder("  statuses:");
        for (Map.Entry<Status, Integer> e : counts.entrySet()) {
            sb.append(String.format(Locale.ROOT, " %s %d (%.2f %%)", e.getKey().word(), e.getValue(),
                    100.0 * e.getValue() / loci0));
        }
        System.out.println(sb);
        why.entrySet().stream().sorted((x, y) -> y.getValue() - x.getValue())
                .forEach(e -> System.out.printf(Locale.ROOT, "    %-32s %d%n", e.getKey(), e.getValue()));
    }

    /** The defaults, or anchors per side and flank from -Dstria.compare.anchors and -Dstria.compare.flank. */
    private static CompareSettings settings() {
        CompareSettings d = CompareSettings.defaults(2.0);
        return new CompareSettings(Integer.getInteger("stria.compare.anchors", d.anchorsPerSide()),
                Integer.getInteger("stria.compare.flank", d.flank()), d.maxSkip(), d.sampling(), d.minCopies(),
                d.maxCells());
    }

    private static long used() {
        Runtime rt = Runtime.getRuntime();
        return rt.totalMemory() - rt.freeMemory();
    }

    private static double median(double[] x) {
        double[] y = x.clone();
        Arrays.sort(y);
        return y[y.length / 2];
    }

    private static final byte[] ACGT = {'A', 'C', 'G', 'T'};

    /** Substitutions at 0.1 % and indels of 1-3 bases at 0.01 % of the bases, N kept. */
    static byte[] mutate(byte[] s, SplittableRandom rnd) {
        byte[] out = new byte[s.length + s.length / 1000 + 16];
        int w = 0;
        for (int i = 0; i < s.length; i++) {
            double u = rnd.nextDouble();
            byte x = s[i];
            if (x == 'N' || x == 'n' || u >= 0.0011) {
                out[w++] = x;
            } else if (u < 0.001) {
                byte y;
                do {
                    y = ACGT[rnd.nextInt(4)];
                } while (y == Character.toUpperCase(x));
                out[w++] = y;
            } else if (rnd.nextBoolean()) {
                out[w++] = x;
                for (int k = rnd.nextInt(3); k >= 0; k--) {
                    out[w++] = ACGT[rnd.nextInt(4)];
                }
            } else {
                i += rnd.nextInt(3);
            }
        }
        return Arrays.copyOf(out, w);
    }

    /** Loci of a stria TSV by contig, in file order. */
    static Map<String, List<Locus>> readLoci(Path tsv) throws IOException {
        Map<String, List<Locus>> out = new HashMap<>();
        try (BufferedReader r = Files.newBufferedReader(tsv, StandardCharsets.US_ASCII)) {
            String line;
            Map<String, Integer> col = null;
            while ((line = r.readLine()) != null) {
                if (line.startsWith("#")) {
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
                Locus l = new Locus(Integer.parseInt(f[col.get("start")]), Integer.parseInt(f[col.get("end")]),
                        Integer.parseInt(f[col.get("period")]), f[col.get("motif")], f[col.get("motif_class")],
                        Double.parseDouble(f[col.get("copies")]), Double.parseDouble(f[col.get("purity")]),
                        Integer.parseInt(f[col.get("mismatches")]), Integer.parseInt(f[col.get("insertions")]),
                        Integer.parseInt(f[col.get("deletions")]), Double.parseDouble(f[col.get("score")]),
                        Double.parseDouble(f[col.get("evalue")]),
                        Double.parseDouble(f[col.get("entropy")]));
                out.computeIfAbsent(f[col.get("chrom")], k -> new ArrayList<>()).add(l);
            }
        }
        return out;
    }
}
