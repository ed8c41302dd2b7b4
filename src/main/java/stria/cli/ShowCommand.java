package stria.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.function.Consumer;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import stria.StriaException;
import stria.io.ContigBytes;
import stria.io.Region;
import stria.out.AtomicOutputs;
import stria.out.LocusSink;
import stria.out.LocusView;
import stria.pipeline.Genome;
import stria.pipeline.GenomeScan;
import stria.pipeline.Progress;
import stria.pipeline.ScanOptions;
import stria.pipeline.ScanPlan;
import stria.pipeline.ScanSettings;
import stria.pipeline.Selection;
import stria.score.Locus;

/**
 * {@code stria show}: scans one region and draws each locus that starts in it ({@link LocusView}), as text on
 * standard output or as an HTML page.
 */
@Command(name = "show",
        description = {
            "Scans a region and draws each locus that starts in it: the consensus on top, the copies below it "
                + "one per line, mismatches, insertions and deletions marked; long units are wrapped.",
            ""},
        footer = {"",
            "Results are research-grade: a drawing of a call, not a diagnosis; defer to validated assays, "
                + "licensed practice and local rules.",
            "",
            "Exit status: 0 success, 1 bad input or I/O error, 2 usage error."})
public final class ShowCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Parameters(paramLabel = "FASTA", arity = "1..*", description = "Genome files, as for scan.")
    List<String> inputs = new ArrayList<>();

    @Option(names = "--region", paramLabel = "REGION", required = true, description = "The region, e.g. "
            + "ctg2:1,001-2,000 (1-based, inclusive).")
    String region;

    @Option(names = "--exact", description = "Draw exact runs instead of imperfect loci.")
    boolean exact;

    @Option(names = "--min-period", paramLabel = "N", description = "Smallest period (as for scan).")
    Integer minPeriod;

    @Option(names = "--max-period", paramLabel = "N", description = "Largest period (as for scan).")
    Integer maxPeriod;

    @Option(names = "--min-length", paramLabel = "N", description = "Shortest locus (as for scan).")
    Integer minLength;

    @Option(names = "--width", paramLabel = "N", description = "Columns of the drawing (default: "
            + "${DEFAULT-VALUE}; at least " + LocusView.MIN_WIDTH + ").")
    int width = 100;

    @Option(names = "--html", paramLabel = "FILE", description = "Write the drawing as a self-contained HTML page "
            + "instead (- for standard output).")
    String html;

    @Option(names = {"-t", "--threads"}, paramLabel = "N", description = "Worker threads (default: all cores).")
    int threads = Runtime.getRuntime().availableProcessors();

    @CommandLine.Mixin(name = CommonOptions.NAME)
    CommonOptions common;

    @Override
    public Integer call() {
        if (width < LocusView.MIN_WIDTH) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--width must be at least "
                    + LocusView.MIN_WIDTH + " (got " + width + ")");
        }
        ScanSettings settings;
        try {
            settings = new ScanOptions(exact ? ScanSettings.Mode.EXACT : ScanSettings.Mode.IMPERFECT)
                    .minPeriod(minPeriod).maxPeriod(maxPeriod).minLength(minLength).threads(threads).settings();
        } catch (IllegalArgumentException e) {
            throw new CommandLine.ParameterException(spec.commandLine(), e.getMessage());
        }
        Consumer<String> warn = m -> System.err.println("stria: warning: " + m);
        List<LocusView> views = new ArrayList<>();
        try (Genome genome = Genome.open(inputs, warn); AtomicOutputs outputs = new AtomicOutputs()) {
            if (html != null) {
                AtomicOutputs.refuseInputs(List.of(html), inputs);
            }
            Region r;
            try {
                r = Region.parse(region, genome.contigs());
            } catch (IllegalArgumentException e) {
                throw new CommandLine.ParameterException(spec.commandLine(), "--region " + region + ": "
                        + e.getMessage());
            }
            ScanPlan plan = ScanPlan.of(genome, Selection.regions(List.of(r)));
            try (Progress p = new Progress(plan.bases(), false, System.err)) {
                new GenomeScan(settings, p).run(plan, new Drawer(views));
            }
            StringBuilder sb = new StringBuilder();
            if (html == null) {
                for (LocusView v : views) {
                    for (String l : v.text(width)) {
                        sb.append(l).append('\n');
                    }
                    sb.append('\n');
                }
                if (views.isEmpty()) {
                    System.err.println("stria show: no locus starts in " + region);
                }
                write(outputs, "-", sb);
            } else {
                sb.append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>stria show ")
                        .append(esc(region)).append("</title><style>").append(LocusView.CSS)
                        .append(" body{font:15px/1.5 system-ui,'DejaVu Sans',Arial,sans-serif;margin:24px}")
                        .append("</style></head><body>\n");
                sb.append("<p>Loci starting in <code>").append(esc(region)).append("</code>: ").append(views.size())
                        .append(". Upper case: as the consensus; lower case: mismatch, or insertion under '.'; "
                                + "-: deletion.</p>\n");
                for (LocusView v : views) {
                    sb.append(v.html(width)).append('\n');
                }
                sb.append("<footer><p>Research use only: a drawing of a call, not a diagnosis; defer to validated "
                        + "assays, licensed practice and local rules.</p></footer></body></html>\n");
                write(outputs, html, sb);
            }
            outputs.commit();
        }
        return 0;
    }

    private static void write(AtomicOutputs outputs, String path, StringBuilder sb) {
        OutputStream out = outputs.open(path);
        try {
            out.write(sb.toString().getBytes(StandardCharsets.UTF_8));
            out.flush();
        } catch (IOException e) {
            throw StriaException.io("cannot write " + path, e);
        }
    }

    private static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;");
    }

    /** Copies out each locus's bases while the scan holds them and draws it. */
    private static final class Drawer implements LocusSink {
        private final List<LocusView> views;
        private ContigBytes seq;

        Drawer(List<LocusView> views) {
            this.views = views;
        }

        @Override
        public void begin(Region stretch, ContigBytes seq) {
            this.seq = seq;
        }

        @Override
        public void locus(String contig, Locus l) {
            byte[] text = new byte[l.length()];
            seq.copy(l.start(), l.end(), text, 0);
            views.add(LocusView.of(contig, l, text));
        }
    }
}
