package stria.cli;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.function.Consumer;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import stria.io.Region;
import stria.out.AtomicOutputs;
import stria.out.LocusSink;
import stria.out.MaskedFastaWriter;
import stria.out.ResultFormat;
import stria.out.ResultWriter;
import stria.out.Tabix;
import stria.pipeline.Genome;
import stria.pipeline.GenomeScan;
import stria.pipeline.Progress;
import stria.pipeline.ScanOptions;
import stria.pipeline.ScanPlan;
import stria.pipeline.ScanSettings;
import stria.pipeline.Selection;
import stria.shard.ShardId;

/**
 * {@code stria scan}, the main job: parses the options, opens the genome, and hands a {@link ScanPlan} and the
 * writers (a list of {@link LocusSink}s) to {@link GenomeScan}.
 */
@Command(name = "scan",
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
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Parameters(paramLabel = "FASTA", arity = "1..*",
            description = "Genome files: FASTA, plain, gzip or BGZF (with .fai/.gzi for random access); - reads "
                    + "standard input.")
    List<String> inputs = new ArrayList<>();

    @Option(names = "--exact", description = "Report exact runs (maximal repetitions, purity 1) instead of "
            + "imperfect loci.")
    boolean exact;

    @Option(names = "--min-period", paramLabel = "N", description = "Smallest period reported (default: "
            + ScanOptions.MIN_PERIOD + ").")
    Integer minPeriod;

    @Option(names = "--max-period", paramLabel = "N", description = "Largest period reported (default: "
            + ScanOptions.MAX_PERIOD + "; up to 1,000,000).")
    Integer maxPeriod;

    @Option(names = "--min-copies", paramLabel = "X", description = "Smallest copy number (length / period) "
            + "reported (default: " + ScanOptions.EXACT_MIN_COPIES + " exact, " + ScanOptions.IMPERFECT_MIN_COPIES
            + " imperfect).")
    Double minCopies;

    @Option(names = "--min-length", paramLabel = "N", description = "Shortest locus reported, in bases "
            + "(default: " + ScanOptions.EXACT_MIN_LENGTH + " exact, " + ScanOptions.IMPERFECT_MIN_LENGTH
            + " imperfect).")
    Integer minLength;

    @Option(names = "--min-purity", paramLabel = "X", description = "Lowest purity (0..1) of an imperfect locus "
            + "(default: " + ScanOptions.IMPERFECT_MIN_PURITY + ").")
    Double minPurity;

    @Option(names = "--min-score", paramLabel = "BITS", description = "Lowest score of an imperfect locus, in "
            + "bits (default: " + ScanOptions.IMPERFECT_MIN_SCORE + "). A score of S bits means the repeated "
            + "consensus explains the locus' bases 2^S times better than random bases of the genome's "
            + "composition do.")
    Double minScore;

    @Option(names = "--max-evalue", paramLabel = "X", description = "Highest evalue of an imperfect locus "
            + "(default: " + ScanOptions.IMPERFECT_MAX_EVALUE + "; Infinity for none). The evalue of a locus is "
            + "the number of loci scoring at least as well that chance alone would give in one million bases. "
            + "It assumes random i.i.d. sequence of the scanned composition; real genomes are not random, so "
            + "it ranks loci and is not the probability that a locus is real.")
    Double maxEvalue;

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

    @Option(names = "--shard", paramLabel = "K/N", converter = ShardIdConverter.class, description = "Scan only "
            + "shard K of N of a deterministic, base-balanced split of the input (for cluster job arrays; combine "
            + "with 'stria merge').")
    ShardId shard;

    @Option(names = "--masked", paramLabel = "FILE", description = "Also write the genome with every reported "
            + "locus masked (FASTA, 60 bases a line; .gz gives BGZF that samtools faidx can index).")
    String masked;

    @Option(names = "--mask-style", paramLabel = "STYLE", description = "soft: loci in lower case, the rest "
            + "upper case (default); keep: loci in lower case, the rest as in the input; hard: loci as N.")
    MaskStyle maskStyle = MaskStyle.soft;

    enum MaskStyle {
        soft(MaskedFastaWriter.Mode.SOFT), keep(MaskedFastaWriter.Mode.SOFT_KEEP), hard(MaskedFastaWriter.Mode.HARD);

        final MaskedFastaWriter.Mode mode;

        MaskStyle(MaskedFastaWriter.Mode mode) {
            this.mode = mode;
        }
    }

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

    @CommandLine.Mixin(name = CommonOptions.NAME)
    CommonOptions common;

    @Override
    public Integer call() {
        ScanSettings settings = settings();
        Consumer<String> warn = quiet ? m -> { } : m -> System.err.println("stria: warning: " + m);
        try (Genome genome = Genome.open(inputs, warn); AtomicOutputs outputs = new AtomicOutputs()) {
            ScanPlan plan = ScanPlan.of(genome, selection(genome));
            AtomicOutputs.refuseInputs(Arrays.asList(bed, tsv, masked), inputs);
            String bedPath = bed == null && tsv == null ? "-" : bed;
            if ("-".equals(bedPath) && "-".equals(tsv)) {
                throw new CommandLine.ParameterException(spec.commandLine(),
                        "--bed and --tsv cannot both write to standard output");
            }
            List<String> header = plan.header(Main.VERSION, commandText(), settings).lines();
            List<LocusSink> sinks = new ArrayList<>();
            if (bedPath != null) {
                sinks.add(resultWriter(outputs, bedPath, ResultFormat.BED, header));
                Tabix.indexOnCommit(outputs, bedPath);
            }
            if (tsv != null) {
                sinks.add(resultWriter(outputs, tsv, ResultFormat.TSV, header));
            }
            if (masked != null) {
                sinks.add(new MaskedFastaWriter(outputs.open(masked), maskStyle.mode));
            }
            boolean showProgress = !quiet && (progress || Progress.stderrIsTerminal());
            try (Progress p = new Progress(plan.bases(), showProgress, System.err)) {
                new GenomeScan(settings, p).run(plan, LocusSink.all(sinks));
            }
            outputs.commit();
        }
        return 0;
    }

    private static ResultWriter resultWriter(AtomicOutputs outputs, String path, ResultFormat format,
                                             List<String> header) {
        ResultWriter w = new ResultWriter(outputs.open(path), path, format);
        w.header(header);
        return w;
    }

    /** What to scan: the regions (parsed against the genome's contigs), the shard, or everything. */
    private Selection selection(Genome genome) {
        if (shard != null) {
            return Selection.shard(shard);
        }
        if (regions.isEmpty()) {
            return Selection.wholeGenome();
        }
        List<Region> parsed = new ArrayList<>();
        for (String text : regions) {
            try {
                parsed.add(Region.parse(text, genome.contigs()));
            } catch (IllegalArgumentException e) {
                throw new CommandLine.ParameterException(spec.commandLine(), "--region " + text + ": "
                        + e.getMessage());
            }
        }
        return Selection.regions(parsed);
    }

    private String commandText() {
        return String.join(" ", spec.commandLine().getParseResult().originalArgs());
    }

    /** Checks the options (usage errors, exit 2) and builds the settings through {@link ScanOptions}. */
    ScanSettings settings() {
        require(shard == null || regions.isEmpty(), "--shard and --region cannot be combined");
        require(masked == null || (shard == null && regions.isEmpty()),
                "--masked writes whole genomes: it cannot be combined with --shard or --region");
        try {
            return new ScanOptions(exact ? ScanSettings.Mode.EXACT : ScanSettings.Mode.IMPERFECT)
                    .minPeriod(minPeriod).maxPeriod(maxPeriod).minCopies(minCopies).minLength(minLength)
                    .minPurity(minPurity).minScore(minScore).maxEvalue(maxEvalue).threads(threads)
                    .window(window == null ? null : parseSize(window, "--window")).settings();
        } catch (IllegalArgumentException e) {
            throw new CommandLine.ParameterException(spec.commandLine(), e.getMessage());
        }
    }

    private void require(boolean ok, String message) {
        if (!ok) {
            throw new CommandLine.ParameterException(spec.commandLine(), message);
        }
    }

    /** {@code --shard K/N}: a usage error unless {@code 1 <= K <= N}. */
    static final class ShardIdConverter implements CommandLine.ITypeConverter<ShardId> {
        @Override
        public ShardId convert(String text) {
            try {
                return ShardId.parse(text);
            } catch (IllegalArgumentException e) {
                throw new CommandLine.TypeConversionException(e.getMessage());
            }
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
