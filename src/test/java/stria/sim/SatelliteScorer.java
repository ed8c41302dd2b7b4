package stria.sim;

import htsjdk.samtools.SAMException;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.Callable;
import java.util.function.Predicate;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * Scores a scan's loci against the truth of {@link SatelliteArrays}. Every truth row is an expected locus
 * (an interrupted array gives two). For each:
 *
 * <ul>
 *   <li>a <em>piece</em> is a reported locus overlapping the row whose period is within 5 % of the unit
 *       length or the block length, or of a multiple of them (within 5 % of the unit or the block: see
 *       {@link #nearMultiple}; multiples of the unit are taken of the block's mean unit); loci of other
 *       periods inside the row are counted apart ("other loci");
 *   <li><em>covered</em>: one piece overlaps at least 90 % of the row (target: 95 % of rows);
 *   <li><em>at most 2 pieces</em>: 1 or 2 pieces (target: 95 % of rows); printed also with the stricter
 *       reading that the pieces together overlap at least 90 % of the row;
 *   <li>for rows of higher-order arrays, <em>structure found</em>: the covering piece has a period within
 *       5 % of the block length and a subunit period within 5 % of the unit length (target: 80 %; needs a
 *       {@code --max-period} above the longest block and the {@code subunit_period} column);
 *   <li>an interruption is <em>bridged</em> when one reported locus of any period reaches into the array
 *       on both sides of it.
 * </ul>
 * The calls are a stria TSV: '#' lines, one header row, then loci; columns are found by name, and
 * {@code subunit_period} and {@code subunits} are read when present (empty = no nested structure).
 */
@Command(name = "SatelliteScorer", mixinStandardHelpOptions = true,
        description = "Scores reported loci against the truth table of a satellite-array genome.")
public final class SatelliteScorer implements Callable<Integer> {
    static final double PERIOD_TOLERANCE = 0.05;
    static final double COVER = 0.90;

    @Option(names = "--truth", required = true, description = "truth table written by SatelliteArrays")
    Path truth;

    @Option(names = "--calls", required = true, description = "stria scan TSV (plain or gzip)")
    Path calls;

    @Option(names = "--detail", description = "also list, per expected locus, the reported loci overlapping it (TSV)")
    boolean detail;

    /** One reported locus; {@code subunitPeriod} and {@code subunits} are 0 when not given. */
    public record Call(String contig, int start, int end, int period, int subunitPeriod, int subunits) {
        int length() {
            return end - start;
        }
    }

    /** How the scan treated one expected locus. {@code pieces} and {@code others} are sorted by start. */
    public record Outcome(SatelliteArrays.TruthRow row, List<Call> pieces, List<Call> others, double bestCover,
                          double unionCover, Call covering, boolean structured, boolean bridged) {
        public boolean covered() {
            return covering != null;
        }

        public boolean atMostTwo() {
            return !pieces.isEmpty() && pieces.size() <= 2;
        }

        public boolean atMostTwoCovering() {
            return atMostTwo() && unionCover >= COVER;
        }
    }

    /** The figures of one comparison. */
    public record Result(List<Outcome> outcomes, boolean subunitColumns) {
        public int rows() {
            return outcomes.size();
        }

        public int covered() {
            return count(Outcome::covered);
        }

        public int atMostTwo() {
            return count(Outcome::atMostTwo);
        }

        public int atMostTwoCovering() {
            return count(Outcome::atMostTwoCovering);
        }

        public int higherOrderRows() {
            return count(o -> o.row().higherOrder());
        }

        public int structured() {
            return count(o -> o.row().higherOrder() && o.structured());
        }

        /** Interruptions, each counted once (from its first piece). */
        public int interruptions() {
            return count(o -> o.row().interrupted() && o.row().piece() == 1);
        }

        /** Interruptions that one reported locus bridges. */
        public int bridged() {
            return count(o -> o.row().interrupted() && o.row().piece() == 1 && o.bridged());
        }

        private int count(Predicate<Outcome> what) {
            int n = 0;
            for (Outcome o : outcomes) {
                n += what.test(o) ? 1 : 0;
            }
            return n;
        }

        public String summary() {
            StringBuilder sb = new StringBuilder();
            int arrays = 0;
            for (Outcome o : outcomes) {
                arrays += o.row().piece() == 1 ? 1 : 0;
            }
            sb.append(String.format(Locale.ROOT, "arrays        %d (%d expected loci; %d interrupted arrays in two; %d rows higher-order)%n",
                    arrays, rows(), interruptions(), higherOrderRows()));
            sb.append(line("covered", covered(), rows(), "covered >= 90 % by one locus", 0.95));
            sb.append(line("<= 2 pieces", atMostTwo(), rows(), "in 1 or 2 pieces", 0.95));
            sb.append(line("  and >= 90 %", atMostTwoCovering(), rows(), "1 or 2 pieces covering >= 90 % together", 0.95));
            sb.append(line("structure", structured(), higherOrderRows(),
                    "higher-order, covering locus at the block with the unit as subunit"
                            + (subunitColumns ? "" : "; no subunit_period column in the calls"), 0.80));
            sb.append(String.format(Locale.ROOT, "bridged       %d of %d interruptions inside one reported locus%n",
                    bridged(), interruptions()));
            int[] counts = new int[outcomes.size()];
            List<Integer> pieceLengths = new ArrayList<>();
            for (int i = 0; i < outcomes.size(); i++) {
                counts[i] = outcomes.get(i).pieces().size();
                for (Call c : outcomes.get(i).pieces()) {
                    pieceLengths.add(c.length());
                }
            }
            Arrays.sort(counts);
            int[] lens = pieceLengths.stream().mapToInt(Integer::intValue).sorted().toArray();
            sb.append(String.format(Locale.ROOT, "pieces        per expected locus: median %d, max %d; piece length: median %d, max %d bp%n",
                    counts.length == 0 ? 0 : counts[counts.length / 2], counts.length == 0 ? 0 : counts[counts.length - 1],
                    lens.length == 0 ? 0 : lens[lens.length / 2], lens.length == 0 ? 0 : lens[lens.length - 1]));
            Map<String, Integer> kinds = new TreeMap<>();
            for (Outcome o : outcomes) {
                Call best = largest(o.pieces());
                String k = best == null ? "none" : periodKind(o.row(), best.period());
                kinds.merge(k, 1, Integer::sum);
            }
            sb.append("periods       of the largest piece:");
            kinds.forEach((k, n) -> sb.append(' ').append(k).append(' ').append(n));
            sb.append(String.format(Locale.ROOT, "%n"));
            return sb.toString();
        }

        private static String line(String name, int n, int of, String what, double target) {
            return String.format(Locale.ROOT, "%-13s %.4f  (%d of %d %s; target >= %.2f)%n", name,
                    of == 0 ? 0.0 : n / (double) of, n, of, what, target);
        }

        /** One TSV row per expected locus with the loci overlapping it: period[/subunit]:start-end each. */
        public void detail(PrintStream out) {
            out.print("array\tpiece\tcontig\tstart\tend\tunit\tblock_units\tblock_length\tpieces\tbest_cover"
                    + "\tunion_cover\tbridged\tother_loci\tloci\n");
            for (Outcome o : outcomes) {
                SatelliteArrays.TruthRow r = o.row();
                StringBuilder loci = new StringBuilder();
                List<Call> all = new ArrayList<>(o.pieces());
                all.addAll(o.others());
                all.sort((a, b) -> Integer.compare(a.start(), b.start()));
                for (Call c : all) {
                    if (loci.length() > 0) {
                        loci.append(',');
                    }
                    loci.append(o.pieces().contains(c) ? "" : "~").append(c.period());
                    if (c.subunitPeriod() > 0) {
                        loci.append('/').append(c.subunitPeriod());
                    }
                    loci.append(':').append(c.start()).append('-').append(c.end());
                }
                out.printf(Locale.ROOT, "%s\t%d/%d\t%s\t%d\t%d\t%d\t%d\t%d\t%d\t%.4f\t%.4f\t%s\t%d\t%s%n", r.array(), r.piece(),
                        r.pieces(), r.contig(), r.start(), r.end(), r.unit(), r.blockUnits(), r.blockLength(),
                        o.pieces().size(), o.bestCover(), o.unionCover(), r.interrupted() ? (o.bridged() ? "yes" : "no") : "-",
                        o.others().size(), loci.length() == 0 ? "-" : loci);
            }
        }
    }

    public static void main(String[] args) {
        System.exit(new CommandLine(new SatelliteScorer()).execute(args));
    }

    @Override
    public Integer call() {
        List<SatelliteArrays.TruthRow> rows;
        Calls c;
        try {
            rows = SatelliteArrays.readTruth(truth);
            c = readCalls(calls);
        } catch (IOException | SAMException e) {
            System.err.println("SatelliteScorer: " + e.getMessage());
            return 1;
        }
        Result r = score(rows, c.calls(), c.subunitColumns());
        System.out.print(r.summary());
        if (detail) {
            r.detail(System.out);
        }
        return 0;
    }

    /**
     * Whether period p is within 5 % of {@code base} of a whole multiple of it. The tolerance is a share of
     * the base, not of the multiple: with 5 % of m x base the intervals of m and m + 1 would meet from
     * m = 10 on, and every long period would pass.
     */
    static boolean nearMultiple(int p, double base) {
        long m = Math.max(1, Math.round(p / base));
        return Math.abs(p - m * base) <= PERIOD_TOLERANCE * base;
    }

    static boolean near(int p, double base) {
        return Math.abs(p - base) <= PERIOD_TOLERANCE * base;
    }

    /**
     * The unit length that multiples are measured on: the block's mean unit, so that m units of the block
     * are m x that length give or take the few bases indels moved (for plain arrays the unit itself).
     */
    static double meanUnit(SatelliteArrays.TruthRow row) {
        return row.blockLength() / (double) row.blockUnits();
    }

    static boolean isPiece(SatelliteArrays.TruthRow row, int period) {
        return near(period, row.unit()) || nearMultiple(period, meanUnit(row)) || nearMultiple(period, row.blockLength());
    }

    /** block, unit, Nx_block, Nx_unit or other: how a reported period relates to the array. */
    static String periodKind(SatelliteArrays.TruthRow row, int period) {
        if (row.higherOrder() && near(period, row.blockLength())) {
            return "block";
        }
        if (near(period, row.unit()) || near(period, meanUnit(row))) {
            return "unit";
        }
        if (row.higherOrder() && nearMultiple(period, row.blockLength())) {
            return Math.round(period / (double) row.blockLength()) + "x_block";
        }
        if (nearMultiple(period, meanUnit(row))) {
            return Math.round(period / meanUnit(row)) + "x_unit";
        }
        return "other";
    }

    private static Call largest(List<Call> cs) {
        Call best = null;
        for (Call c : cs) {
            if (best == null || c.length() > best.length()) {
                best = c;
            }
        }
        return best;
    }

    public static Result score(List<SatelliteArrays.TruthRow> rows, List<Call> calls, boolean subunitColumns) {
        Map<String, List<Call>> byContig = new HashMap<>();
        for (Call c : calls) {
            byContig.computeIfAbsent(c.contig(), k -> new ArrayList<>()).add(c);
        }
        Map<String, Integer> longest = new HashMap<>();
        for (Map.Entry<String, List<Call>> e : byContig.entrySet()) {
            e.getValue().sort((a, b) -> a.start() != b.start() ? Integer.compare(a.start(), b.start())
                    : Integer.compare(a.end(), b.end()));
            int max = 0;
            for (Call c : e.getValue()) {
                max = Math.max(max, c.length());
            }
            longest.put(e.getKey(), max);
        }
        List<Outcome> out = new ArrayList<>();
        for (SatelliteArrays.TruthRow row : rows) {
            List<Call> cs = byContig.getOrDefault(row.contig(), List.of());
            List<Call> pieces = new ArrayList<>();
            List<Call> others = new ArrayList<>();
            boolean bridged = false;
            // a call overlapping the row starts after row.start - longest call; skip to there
            int from = firstStartAtLeast(cs, row.start() - longest.getOrDefault(row.contig(), 0));
            for (int i = from; i < cs.size() && cs.get(i).start() < row.end(); i++) {
                Call c = cs.get(i);
                if (c.end() <= row.start()) {
                    continue;
                }
                (isPiece(row, c.period()) ? pieces : others).add(c);
                if (row.interrupted() && bridges(c, row)) {
                    bridged = true;
                }
            }
            double best = 0;
            Call covering = null;
            for (Call c : pieces) {
                double f = overlap(c, row) / (double) row.length();
                if (f > best) {
                    best = f;
                }
                if (f >= COVER && (covering == null || overlap(c, row) > overlap(covering, row))) {
                    covering = c;
                }
            }
            boolean structured = covering != null && row.higherOrder() && near(covering.period(), row.blockLength())
                    && covering.subunitPeriod() > 0 && near(covering.subunitPeriod(), row.unit());
            out.add(new Outcome(row, List.copyOf(pieces), List.copyOf(others), best, unionCover(pieces, row), covering,
                    structured, bridged));
        }
        return new Result(List.copyOf(out), subunitColumns);
    }

    /** Reaches at least one base into the array on both sides of the interruption. */
    private static boolean bridges(Call c, SatelliteArrays.TruthRow row) {
        return c.start() < row.gapStart() && c.end() > row.gapEnd();
    }

    private static int overlap(Call c, SatelliteArrays.TruthRow row) {
        return Math.max(0, Math.min(c.end(), row.end()) - Math.max(c.start(), row.start()));
    }

    /** Share of the row covered by the union of the calls (sorted by start). */
    static double unionCover(List<Call> sorted, SatelliteArrays.TruthRow row) {
        long covered = 0;
        int reach = row.start();
        for (Call c : sorted) {
            int s = Math.max(c.start(), reach);
            int e = Math.min(c.end(), row.end());
            if (e > s) {
                covered += e - s;
                reach = e;
            }
        }
        return row.length() == 0 ? 0 : covered / (double) row.length();
    }

    private static int firstStartAtLeast(List<Call> sorted, int x) {
        int lo = 0;
        int hi = sorted.size();
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (sorted.get(mid).start() < x) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** The calls of a TSV and whether it has the {@code subunit_period} column. */
    public record Calls(List<Call> calls, boolean subunitColumns) {
    }

    /** Reads a stria TSV (plain or gzip) by column name. */
    public static Calls readCalls(Path p) throws IOException {
        List<Call> out = new ArrayList<>();
        Map<String, Integer> cols = NamedColumns.read(p, new String[] {"chrom", "start", "end", "period"}, (col, f) ->
            out.add(new Call(f[col.get("chrom")], Integer.parseInt(f[col.get("start")]),
                    Integer.parseInt(f[col.get("end")]), Integer.parseInt(f[col.get("period")]),
                    optionalInt(f, col.get("subunit_period")), optionalInt(f, col.get("subunits")))));
        return new Calls(out, cols.containsKey("subunit_period"));
    }

    private static int optionalInt(String[] f, Integer at) {
        if (at == null || at >= f.length || f[at].isEmpty() || f[at].equals("-") || f[at].equals(".")) {
            return 0;
        }
        return Integer.parseInt(f[at]);
    }
}
