package stria.cli;

import java.io.OutputStream;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.function.Consumer;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import stria.StriaException;
import stria.io.ContigBytes;
import stria.io.ContigInfo;
import stria.io.GenomeReader;
import stria.io.Region;
import stria.out.AtomicOutputs;
import stria.out.ResultHeader;
import stria.out.ResultWriter;
import stria.out.Tabix;
import stria.pipeline.GenomeScan;
import stria.pipeline.Progress;
import stria.pipeline.ScanSettings;
import stria.pipeline.ScanUnit;
import stria.score.Locus;
import stria.score.ScoreSettings;
import stria.shard.ContigSpan;
import stria.shard.Partition;
import stria.shard.Piece;
import stria.shard.Shard;
import stria.out.MaskedFastaWriter;

/** {@code stria scan}: the main job. */
@Command(name = "scan", sortOptions = false, usageHelpAutoWidth = true, mixinStandardHelpOptions = true,
        versionProvider = Main.Version.class,
        description = {
            "Scans genomes for tandem repeats and writes one line per locus.",
            "",
            "By default loci are imperfect repeats built from exact runs and extended while they still match "
                + "their consensus motif; --exact reports the exact runs (maximal repetitions) instead.",
            "Output is BED on standard output unless --bed or --tsv name files; coordinates are 0-based, end "
                + "exclusive, sorted by input contig order, start, end and period. Files ending in .gz are "
                + "written block-gzipped (BGZF); a BED.gz gets a tabix index (.tbi) beside it.",
            ""},
        footer = {"",
            "Results are research-grade. Repeat-expansion loci matter clinically: a scan is not a diagnosis; "
                + "defer to validated assays, licensed practice and local rules.",
            "",
            "Exit status: 0 success, 1 bad input or I/O error, 2 usage error."})
public final class ScanCommand implements Callable<Integer> {
    /** Defaults of the exact mode: every run an annotator would mask, not every AA. */
    static final int EXACT_MIN_LENGTH = 12;
    static final double EXACT_MIN_COPIES = 2;
    static final int DEFAULT_MAX_PERIOD = ScoreSettings.DEFAULT_MAX_PERIOD;
    /**
     * Default window: 256,000 bases, or 64 max-periods when that is more (window overlap stays under 4 %),
     * up to 4,000,000. Chosen by bench/window.sh (README): smaller windows keep the engine's arrays in
     * cache; below 64 max-periods the overlap costs more than that gains.
     */
    static final int DEFAULT_WINDOW = 256_000;
    static final int DEFAULT_WINDOW_PERIODS = 64;
    static final int DEFAULT_WINDOW_MAX = 4_000_000;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Parameters(paramLabel = "FASTA", arity = "1..*",
            description = "Genome files: FASTA, plain, gzip or BGZF (with .fai/.gzi for random access); - reads "
                    + "standard input.")
    List<String> inputs = new ArrayList<>();

    @Option(names = "--exact", description = "Report exact runs (maximal repetitions, purity 1) instead of "
            + "imperfect loci.")
    boolean exact;

    @Option(names = "--min-period", paramLabel = "N", description = "Smallest period reported (default: 1).")
    Integer minPeriod;

    @Option(names = "--max-period", paramLabel = "N", description = "Largest period reported (default: "
            + DEFAULT_MAX_PERIOD + "; up to 1,000,000).")
    Integer maxPeriod;

    @Option(names = "--min-copies", paramLabel = "X", description = "Smallest copy number (length / period) "
            + "reported (default: 2 exact, " + ImperfectDefaults.MIN_COPIES + " imperfect).")
    Double minCopies;

    @Option(names = "--min-length", paramLabel = "N", description = "Shortest locus reported, in bases "
            + "(default: " + EXACT_MIN_LENGTH + " exact, " + ImperfectDefaults.MIN_LENGTH + " imperfect).")
    Integer minLength;

    @Option(names = "--min-purity", paramLabel = "X", description = "Lowest purity (0..1) of an imperfect locus "
            + "(default: " + ImperfectDefaults.MIN_PURITY + ").")
    Double minPurity;

    @Option(names = "--min-score", paramLabel = "N", description = "Lowest alignment score of an imperfect "
            + "locus (default: " + ImperfectDefaults.MIN_SCORE + ").")
    Integer minScore;

    @Option(names = {"-o", "--bed"}, paramLabel = "FILE", description = "Write BED here (- for standard "
            + "output; the default when no other output is named).")
    String bed;

    @Option(names = "--tsv", paramLabel = "FILE", description = "Write the TSV table with every figure here "
            + "(- for standard output).")
    String tsv;

    @Option(names = "--region", paramLabel = "REGION", description = "Scan only this region, e.g. ctg2 or "
            + "ctg2:1,001-2,000 (1-based, inclusive; repeatable). Loci starting inside are reported whole. Uses "
            + "the .fai (and .gzi) index when present.")
    List<String> regions = new ArrayList<>();

    @Option(names = "--shard", paramLabel = "K/N", description = "Scan only shard K of N of a deterministic, "
            + "base-balanced split of the input (for cluster job arrays; combine with 'stria merge').")
    String shard;

    @Option(names = "--masked", paramLabel = "FILE", description = "Also write the genome with every reported "
            + "locus masked (FASTA, 60 bases a line; .gz gives BGZF that samtools faidx can index).")
    String masked;

    @Option(names = "--mask-style", paramLabel = "STYLE", description = "soft: loci in lower case, the rest "
            + "upper case (default); keep: loci in lower case, the rest as in the input; hard: loci as N.")
    MaskStyle maskStyle = MaskStyle.soft;

    enum MaskStyle { soft, keep, hard }

    @Option(names = {"-t", "--threads"}, paramLabel = "N", description = "Worker threads (default: all cores, "
            + "here ${DEFAULT-VALUE}). The output is the same for any value.")
    int threads = Runtime.getRuntime().availableProcessors();

    @Option(names = "--window", paramLabel = "SIZE", description = "Advanced: bases per window (default: 256K, or "
            + "64 x --max-period up to 4M when that is more). Memory grows with window x threads; the output is "
            + "the same for any value.")
    String window;

    @Option(names = "--progress", description = "Report progress on stderr even when it is not a terminal.")
    boolean progress;

    @Option(names = {"-q", "--quiet"}, description = "No progress and no warnings on stderr.")
    boolean quiet;

    @Option(names = "--debug", description = "Print stack traces of errors.")
    boolean debug;

    @Override
    public Integer call() {
        ScanSettings settings = settings();
        Consumer<String> warn = quiet ? m -> { } : m -> System.err.println("stria: warning: " + m);
        List<GenomeReader> readers = new ArrayList<>();
        try (AtomicOutputs outputs = new AtomicOutputs()) {
            List<ScanUnit> units = new ArrayList<>();
            List<ResultHeader.Contig> all = new ArrayList<>();
            Map<String, String> seen = new HashMap<>();
            List<ResultHeader.Span> spans = new ArrayList<>();
            for (String in : inputs) {
                GenomeReader r = GenomeReader.open(in, warn);
                readers.add(r);
                for (ContigInfo c : r.contigs()) {
                    String prev = seen.put(c.name(), r.displayName());
                    if (prev != null) {
                        throw new StriaException("contig name " + c.name() + " appears in both " + prev + " and "
                                + r.displayName());
                    }
                    all.add(new ResultHeader.Contig(c.name(), c.length()));
                }
            }
            units.addAll(units(readers, settings, spans));
            refuseOutputsOverInputs();
            String bedPath = bed;
            if (bedPath == null && tsv == null) {
                bedPath = "-";
            }
            if ("-".equals(bedPath) && "-".equals(tsv)) {
                throw new CommandLine.ParameterException(spec.commandLine(),
                        "--bed and --tsv cannot both write to standard output");
            }
            OutputStream bedOut = bedPath == null ? null : outputs.open(bedPath);
            OutputStream tsvOut = tsv == null ? null : outputs.open(tsv);
            if (bedPath != null && !bedPath.equals("-") && AtomicOutputs.isBgzf(bedPath)) {
                String tbi = bedPath + ".tbi";
                var tmpIndex = outputs.companion(bedPath, tbi);
                String bp = bedPath;
                outputs.afterClose(bedPath, () -> Tabix.indexBed(outputs.tempPath(bp), tmpIndex, bp));
            }
            ResultWriter writer = new ResultWriter(bedOut, bedPath, tsvOut, tsv);
            MaskedFastaWriter maskWriter = masked == null ? null : new MaskedFastaWriter(outputs.open(masked),
                    switch (maskStyle) {
                        case soft -> MaskedFastaWriter.Mode.SOFT;
                        case keep -> MaskedFastaWriter.Mode.SOFT_KEEP;
                        case hard -> MaskedFastaWriter.Mode.HARD;
                    });
            stria.repeats.RunList maskSpans = new stria.repeats.RunList();
            String shardText = settings.shardN() > 0 ? settings.shardK() + "/" + settings.shardN() : null;
            ResultHeader header = new ResultHeader(Main.VERSION, commandText(), settings.describe(), all,
                    shardText, spans);
            writer.header(header.lines());
            boolean showProgress = !quiet && (progress || Progress.stderrIsTerminal());
            try (Progress p = new Progress(GenomeScan.totalBases(units), showProgress, System.err)) {
                new GenomeScan(settings, p).run(units, new GenomeScan.Output() {
                    @Override
                    public void beginUnit(ScanUnit unit, ContigBytes seq) {
                        maskSpans.clear();
                    }

                    @Override
                    public void locus(ScanUnit unit, Locus locus) {
                        writer.locus(unit.contig().name(), locus);
                        if (maskWriter != null) {
                            maskSpans.add(locus.start(), locus.end(), locus.period());
                        }
                    }

                    @Override
                    public void endUnit(ScanUnit unit, ContigBytes seq) {
                        if (maskWriter != null) {
                            int n = maskSpans.size();
                            int[] starts = new int[n];
                            int[] ends = new int[n];
                            for (int i = 0; i < n; i++) {
                                starts[i] = maskSpans.start(i);
                                ends[i] = maskSpans.end(i);
                            }
                            maskWriter.writeContig(unit.contig().name(), seq, starts, ends, n);
                        }
                    }
                });
            }
            writer.flush();
            if (maskWriter != null) {
                maskWriter.close();
            }
            outputs.commit();
        } finally {
            for (GenomeReader r : readers) {
                try {
                    r.close();
                } catch (RuntimeException ignored) {
                    // closing a reader cannot lose results
                }
            }
        }
        return 0;
    }

    private List<ScanUnit> units(List<GenomeReader> readers, ScanSettings settings, List<ResultHeader.Span> spans) {
        List<ScanUnit> units = new ArrayList<>();
        Map<GenomeReader, ScanUnit.Source> sources = new java.util.IdentityHashMap<>();
        for (GenomeReader r : readers) {
            sources.put(r, r::stream);
        }
        if (!settings.regions().isEmpty()) {
            List<ContigInfo> flat = new ArrayList<>();
            List<GenomeReader> owner = new ArrayList<>();
            for (GenomeReader r : readers) {
                for (ContigInfo c : r.contigs()) {
                    flat.add(c);
                    owner.add(r);
                }
            }
            // regions are scanned in genome order, overlapping ones merged, so output stays sorted and unique
            List<long[]> ranges = new ArrayList<>();
            for (String text : settings.regions()) {
                Region g = parseRegion(text, flat);
                int ordinal = -1;
                for (int i = 0; i < flat.size(); i++) {
                    if (flat.get(i).name().equals(g.contig())) {
                        ordinal = i;
                    }
                }
                ranges.add(new long[] {ordinal, g.start(), g.end()});
            }
            ranges.sort((a, b) -> a[0] != b[0] ? Long.compare(a[0], b[0]) : Long.compare(a[1], b[1]));
            List<long[]> merged = new ArrayList<>();
            for (long[] r : ranges) {
                long[] last = merged.isEmpty() ? null : merged.get(merged.size() - 1);
                if (last != null && last[0] == r[0] && r[1] <= last[2]) {
                    last[2] = Math.max(last[2], r[2]);
                } else {
                    merged.add(r.clone());
                }
            }
            for (long[] r : merged) {
                ContigInfo c = flat.get((int) r[0]);
                if (r[2] > r[1]) {
                    units.add(new ScanUnit(sources.get(owner.get((int) r[0])), c, (int) r[1], (int) r[2]));
                    spans.add(new ResultHeader.Span(c.name(), r[1], r[2]));
                }
            }
            return units;
        }
        if (settings.shardN() > 0) {
            List<ShardTarget> flat = new ArrayList<>();
            List<ContigSpan> spansForPartition = new ArrayList<>();
            for (GenomeReader r : readers) {
                for (ContigInfo c : r.contigs()) {
                    flat.add(new ShardTarget(r, c));
                    spansForPartition.add(new ContigSpan(c.name(), c.length()));
                }
            }
            Shard mine = Partition.of(spansForPartition, settings.shardN(), settings.grain())
                    .get(settings.shardK() - 1);
            Map<String, ShardTarget> byName = new HashMap<>();
            for (ShardTarget t : flat) {
                byName.put(t.contig().name(), t);
            }
            for (Piece p : mine.pieces()) {
                ShardTarget t = byName.get(p.contig());
                units.add(new ScanUnit(sources.get(t.reader()), t.contig(), p.start(), p.end()));
            }
            return units;
        }
        for (GenomeReader r : readers) {
            for (ContigInfo c : r.contigs()) {
                units.add(new ScanUnit(sources.get(r), c, 0, c.length()));
            }
        }
        return units;
    }

    /** An output path that names an input would destroy the genome being read: refuse it up front. */
    private void refuseOutputsOverInputs() {
        List<String> outs = new ArrayList<>();
        for (String o : new String[] {bed, tsv, masked}) {
            if (o != null && !o.equals("-")) {
                outs.add(o);
                outs.add(o + ".tbi");
            }
        }
        for (String in : inputs) {
            if (in.equals("-")) {
                continue;
            }
            java.nio.file.Path ip = java.nio.file.Path.of(in);
            for (String o : outs) {
                java.nio.file.Path op = java.nio.file.Path.of(o);
                boolean same = op.toAbsolutePath().normalize().equals(ip.toAbsolutePath().normalize());
                try {
                    same = same || (java.nio.file.Files.exists(op) && java.nio.file.Files.isSameFile(op, ip));
                } catch (java.io.IOException ignored) {
                    // cannot tell: the path comparison stands
                }
                if (same) {
                    throw new StriaException("output " + o + " is the input " + in + ": choose another output name");
                }
            }
        }
    }

    private record ShardTarget(GenomeReader reader, ContigInfo contig) {
    }

    private Region parseRegion(String text, List<ContigInfo> flat) {
        try {
            return Region.parse(text, flat);
        } catch (IllegalArgumentException e) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--region " + text + ": " + e.getMessage());
        }
    }

    private String commandText() {
        return String.join(" ", spec.commandLine().getParseResult().originalArgs());
    }

    /** Validates option values (usage errors, exit 2) and builds the settings object. */
    ScanSettings settings() {
        int minP = minPeriod == null ? 1 : minPeriod;
        int maxP = maxPeriod == null ? DEFAULT_MAX_PERIOD : maxPeriod;
        ScoreSettings base = exact ? null : ImperfectDefaults.settings(maxP);
        double minC = minCopies != null ? minCopies : exact ? EXACT_MIN_COPIES : base.minCopies();
        int minL = minLength != null ? minLength : exact ? EXACT_MIN_LENGTH : base.minLength();
        double minPur = minPurity != null ? minPurity : exact ? 1.0 : base.minPurity();
        int minS = minScore != null ? minScore : exact ? 0 : base.minScore();
        require(minP >= 1, "--min-period must be at least 1 (got " + minP + ")");
        require(maxP >= 1 && maxP <= 1_000_000, "--max-period must be between 1 and 1,000,000 (got " + maxP + ")");
        require(minP <= maxP, "--min-period " + minP + " is above --max-period " + maxP);
        require(minC >= 0 && !Double.isNaN(minC), "--min-copies must not be negative (got " + minC + ")");
        require(minL >= 0, "--min-length must not be negative (got " + minL + ")");
        require(minPur >= 0 && minPur <= 1, "--min-purity must be between 0 and 1 (got " + minPur + ")");
        require(threads >= 1 && threads <= 1024, "--threads must be between 1 and 1024 (got " + threads + ")");
        int win;
        int minWin = ScanSettings.minWindow(maxP);
        if (window == null) {
            win = (int) Math.max(minWin, Math.min(DEFAULT_WINDOW_MAX,
                    Math.max(DEFAULT_WINDOW, (long) DEFAULT_WINDOW_PERIODS * maxP)));
        } else {
            long w = parseSize(window, "--window");
            require(w >= minWin && w <= 1_000_000_000L, "--window must be between " + minWin
                    + " (4 x max-period + 8) and 1G (got " + window + ")");
            win = (int) w;
        }
        int k = 0, n = 0;
        if (shard != null) {
            String[] f = shard.split("/");
            require(f.length == 2, "--shard takes K/N, e.g. 3/16 (got " + shard + ")");
            try {
                k = Integer.parseInt(f[0].trim());
                n = Integer.parseInt(f[1].trim());
            } catch (NumberFormatException e) {
                require(false, "--shard takes K/N with whole numbers, e.g. 3/16 (got " + shard + ")");
            }
            require(n >= 1 && k >= 1 && k <= n, "--shard K/N needs 1 <= K <= N (got " + shard + ")");
            require(regions.isEmpty(), "--shard and --region cannot be combined");
        }
        require(masked == null || (shard == null && regions.isEmpty()),
                "--masked writes whole genomes: it cannot be combined with --shard or --region");
        ScoreSettings filters = new ScoreSettings(minP, maxP, minC, minL, minPur, minS);
        return new ScanSettings(exact, filters, threads, win, List.copyOf(regions), k, n, 1_000_000);
    }

    private void require(boolean ok, String message) {
        if (!ok) {
            throw new CommandLine.ParameterException(spec.commandLine(), message);
        }
    }

    /** Parses 4000000, 4,000,000, 4M, 500k. */
    long parseSize(String text, String option) {
        String t = text.trim().replace(",", "").replace("_", "");
        long mult = 1;
        char last = t.isEmpty() ? ' ' : Character.toLowerCase(t.charAt(t.length() - 1));
        if (last == 'k') {
            mult = 1_000;
        } else if (last == 'm') {
            mult = 1_000_000;
        } else if (last == 'g') {
            mult = 1_000_000_000;
        }
        if (mult != 1) {
            t = t.substring(0, t.length() - 1);
        }
        try {
            return Math.multiplyExact(Long.parseLong(t), mult);
        } catch (NumberFormatException | ArithmeticException e) {
            throw new CommandLine.ParameterException(spec.commandLine(), option + " takes a size such as 4000000, "
                    + "4,000,000 or 4M (got " + text + ")");
        }
    }
}
