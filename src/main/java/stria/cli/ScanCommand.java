package stria.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.function.Consumer;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import stria.io.Region;
import stria.out.AtomicOutputs;
import stria.out.CatalogLines;
import stria.out.Gff3;
import stria.out.GffLines;
import stria.out.LocusSink;
import stria.out.MaskedFastaWriter;
import stria.out.ResultFormat;
import stria.out.ResultHeader;
import stria.out.ResultWriter;
import stria.out.Tabix;
import stria.pipeline.Genome;
import stria.pipeline.GenomeScan;
import stria.pipeline.Progress;
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
            "Output is BED on standard output unless --bed, --tsv, --gff or --catalog name files; coordinates are 0-based, end "
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

    @CommandLine.Mixin
    ScanSettingOptions scanOptions = new ScanSettingOptions();

    @Option(names = {"-o", "--bed"}, paramLabel = "FILE", description = "Write BED here (- for standard "
            + "output; the default when no other output is named).")
    String bed;

    @Option(names = "--tsv", paramLabel = "FILE", description = "Write the TSV table with every figure here "
            + "(- for standard output).")
    String tsv;

    @Option(names = "--gff", paramLabel = "FILE", description = "Also write the loci as GFF3 with Sequence "
            + "Ontology types by period: 1 tandem_repeat, 2-10 microsatellite, 11-40 minisatellite, longer "
            + "satellite_DNA (- for standard output; .gz gives BGZF with a tabix index).")
    String gff;

    @Option(names = "--catalog", paramLabel = "FILE", description = "Also write an STR catalogue: one row per "
            + "locus up to --catalog-max-period, with a stable id and the genome's bases beside it (TSV; - for "
            + "standard output; .gz gives BGZF).")
    String catalog;

    @Option(names = "--catalog-max-period", paramLabel = "N", description = "Largest period in the catalogue "
            + "(default: " + CatalogLines.DEFAULT_MAX_PERIOD + ").")
    int catalogMaxPeriod = CatalogLines.DEFAULT_MAX_PERIOD;

    @Option(names = "--flank", paramLabel = "N", description = "Bases of each flank in the catalogue (default: "
            + CatalogLines.DEFAULT_FLANK + ", at most " + CatalogLines.MAX_FLANK + "; shorter at contig ends).")
    int flank = CatalogLines.DEFAULT_FLANK;

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
        try (Genome genome = Genome.open(inputs, warn); AtomicOutputs outputs = new AtomicOutputs(inputs)) {
            ScanPlan plan = ScanPlan.of(genome, selection(genome));
            String bedPath = bed == null && tsv == null && gff == null && catalog == null ? "-" : bed;
            List<String> toStdout = new ArrayList<>();
            String[][] named = {{"--bed", bedPath}, {"--tsv", tsv}, {"--gff", gff}, {"--catalog", catalog}};
            for (String[] o : named) {
                if ("-".equals(o[1])) {
                    toStdout.add(o[0]);
                }
            }
            if (toStdout.size() > 1) {
                throw new CommandLine.ParameterException(spec.commandLine(),
                        String.join(" and ", toStdout) + " cannot all write to standard output");
            }
            ResultHeader resultHeader = plan.header(Main.VERSION, commandText(), settings);
            List<String> header = resultHeader.lines();
            // a shard's result proves it is complete with a closing line, which merge checks
            boolean sealed = resultHeader.shard() != null;
            List<LocusSink> sinks = new ArrayList<>();
            if (bedPath != null) {
                sinks.add(resultWriter(outputs, bedPath, ResultFormat.BED, header, sealed));
                Tabix.indexOnCommit(outputs, bedPath);
            }
            if (tsv != null) {
                sinks.add(resultWriter(outputs, tsv, ResultFormat.TSV, header, sealed));
            }
            if (gff != null) {
                List<String> lines = new ArrayList<>(Gff3.pragmas(genome.contigs()));
                lines.addAll(header);
                sinks.add(resultWriter(outputs, gff, new GffLines(), null, lines, sealed));
                Tabix.indexGffOnCommit(outputs, gff);
            }
            if (catalog != null) {
                CatalogLines rows = new CatalogLines(catalogMaxPeriod, flank);
                List<String> lines = new ArrayList<>(header);
                lines.addAll(rows.headerLines());
                sinks.add(resultWriter(outputs, catalog, rows, CatalogLines.COLUMNS, lines, sealed));
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
                                             List<String> header, boolean sealed) {
        ResultWriter w = new ResultWriter(outputs.open(path), AtomicOutputs.displayName(path), format);
        if (sealed) {
            w.sealed();
        }
        w.header(header);
        return w;
    }

    private static ResultWriter resultWriter(AtomicOutputs outputs, String path, ResultWriter.Lines lines,
                                             String columnRow, List<String> header, boolean sealed) {
        ResultWriter w = new ResultWriter(outputs.open(path), AtomicOutputs.displayName(path), lines, columnRow);
        if (sealed) {
            w.sealed();
        }
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
        require(inputs.stream().filter("-"::equals).count() <= 1,
                "standard input (-) is given more than once; it can be read only once");
        require(shard == null || regions.isEmpty(), "--shard and --region cannot be combined");
        require(catalogMaxPeriod >= 1, "--catalog-max-period must be at least 1 (got " + catalogMaxPeriod + ")");
        require(flank >= 0 && flank <= CatalogLines.MAX_FLANK, "--flank must be 0 to " + CatalogLines.MAX_FLANK
                + " (got " + flank + ")");
        require(masked == null || (shard == null && regions.isEmpty()),
                "--masked writes whole genomes: it cannot be combined with --shard or --region");
        return scanOptions.settings(spec.commandLine());
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
}
