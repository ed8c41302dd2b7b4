package stria.cli;

import java.io.OutputStream;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import stria.out.AtomicOutputs;
import stria.report.Gaps;
import stria.report.HtmlReport;
import stria.report.ResultReader;
import stria.report.ResultSet;
import stria.report.Summary;
import stria.report.SummaryTsv;

/** {@code stria report}: a summary of finished TSV results, as an HTML page and/or as TSV on stdout. */
@Command(name = "report",
        description = {
                "Summarise TSV results of one genome: an HTML page with tables and charts, or a TSV summary.",
                "Several files are read as the parts of one genome's results (shards, regions); they must "
                        + "share the input fingerprint and the settings."},
        footerHeading = "%n",
        footer = {SummaryTsv.COLUMN_HELP})
public final class ReportCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Option(names = "--html", paramLabel = "FILE",
            description = "Write a self-contained HTML report (charts inline, nothing fetched) to FILE.")
    String html;

    @Option(names = "--genome", paramLabel = "FASTA",
            description = "The genome the results were made from: its N gaps are left out of the bases that "
                    + "shares are counted over, and drawn in the density charts.")
    String genome;

    @Option(names = "--compare", paramLabel = "FILE",
            description = "A compare result (TSV): the HTML report lists its 20 most-changed loci.")
    String compare;

    @Option(names = "--summary", description = "Print the summary table as TSV on stdout (columns below).")
    boolean summary;

    @Mixin(name = CommonOptions.NAME)
    CommonOptions common;

    @Parameters(arity = "1..*", paramLabel = "RESULTS.tsv",
            description = "TSV results of stria scan or merge (plain, gzip or BGZF; - for stdin).")
    List<String> results;

    @Override
    public Integer call() {
        if (html == null && !summary) {
            throw new ParameterException(spec.commandLine(), "choose an output: --html FILE and/or --summary");
        }
        if ("-".equals(html) && summary) {
            throw new ParameterException(spec.commandLine(), "--html - and --summary would both write to stdout");
        }
        if (results.stream().filter("-"::equals).count() > 1) {
            throw new ParameterException(spec.commandLine(), "standard input (-) can be read only once");
        }
        List<String> read = new java.util.ArrayList<>(results);
        read.addAll(java.util.Arrays.asList(genome, compare));
        read.removeIf(java.util.Objects::isNull);
        // outputs are checked against the inputs (and each other) before anything is read
        try (AtomicOutputs outs = new AtomicOutputs(read)) {
            OutputStream page = html == null ? null : outs.open(html);
            OutputStream table = summary ? outs.open("-") : null;
            ResultSet r = ResultReader.read(results);
            Gaps gaps = genome == null ? Gaps.unknown(r.header().contigs().size()) : Gaps.read(genome, r.header());
            Summary s = Summary.of(r, gaps);
            if (!r.missingShards().isEmpty()) {
                System.err.println("stria report: warning: shards " + r.missingShards() + " of "
                        + r.shards().get(0).n() + " are missing; the report covers only the shards given");
            }
            if (page != null) {
                HtmlReport.write(r, s, gaps, compare, page);
            }
            if (table != null) {
                SummaryTsv.write(s, table);
            }
            outs.commit();
        }
        return 0;
    }
}
