package stria.report;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The summary as TSV for scripts: a header row, the genome row, then one row per contig in input order.
 * Column meanings are listed in {@link #COLUMN_HELP} (shown by {@code stria report --help}).
 */
public final class SummaryTsv {
    private SummaryTsv() {
    }

    /** One line per column, for the command's help. */
    public static final String COLUMN_HELP =
            "Columns of --summary (tab separated): a header row, the genome row, then one%n" +
            "row per contig in input order.%n" +
            "  level          genome or contig%n" +
            "  name           contig name ('.' on the genome row)%n" +
            "  bases_scanned  contig length, or its bases inside #region spans; without%n" +
            "                 the N gaps when --genome is given%n" +
            "  loci           number of loci%n" +
            "  repeat_bases   bases inside at least one locus (overlaps count once)%n" +
            "  repeat_share   repeat_bases / bases_scanned, 6 decimals%n" +
            "  loci_p1, bases_p1          homopolymers (period 1)%n" +
            "  loci_p2_6, bases_p2_6      micro (period 2-6)%n" +
            "  loci_p7_99, bases_p7_99    mini (period 7-99)%n" +
            "  loci_p100, bases_p100      satellite (period >= 100)%n" +
            "Within a class overlaps count once; a base in loci of two classes counts in%n" +
            "both, so the class columns can add up to more than repeat_bases.%n";

    public static List<String> columns() {
        List<String> c = new ArrayList<>(List.of("level", "name", "bases_scanned", "loci", "repeat_bases",
                "repeat_share"));
        for (PeriodClass p : PeriodClass.values()) {
            c.add("loci_" + p.key());
            c.add("bases_" + p.key());
        }
        return c;
    }

    /** Writes the table to {@code out} (UTF-8) and flushes it. */
    public static void write(Summary s, OutputStream out) {
        StringBuilder sb = new StringBuilder(String.join("\t", columns())).append('\n');
        row(sb, "genome", ".", s.genome());
        for (Summary.Row r : s.contigs()) {
            row(sb, "contig", r.name(), r);
        }
        try {
            out.write(sb.toString().getBytes(StandardCharsets.UTF_8));
            out.flush();
        } catch (IOException e) {
            throw stria.StriaException.io("cannot write the summary", e);
        }
    }

    private static void row(StringBuilder sb, String level, String name, Summary.Row r) {
        sb.append(level).append('\t').append(name).append('\t').append(r.scanned()).append('\t').append(r.loci())
                .append('\t').append(r.repeatBases()).append('\t')
                .append(String.format(Locale.ROOT, "%.6f", r.share()));
        for (PeriodClass p : PeriodClass.values()) {
            sb.append('\t').append(r.classLoci()[p.ordinal()]).append('\t').append(r.classBases()[p.ordinal()]);
        }
        sb.append('\n');
    }
}
