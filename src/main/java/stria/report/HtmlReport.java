package stria.report;

import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import stria.out.ResultHeader;
import stria.shard.ShardId;

/**
 * One self-contained HTML page: styles and charts (inline SVG) are in the file and nothing is fetched,
 * so the report can be mailed, archived next to the results, or opened on a host without network. No
 * script runs in the page.
 */
public final class HtmlReport {
    /** Contig rows beyond this are folded into one line: a table of 50,000 scaffolds helps no reader. */
    static final int MAX_TABLE_ROWS = 500;

    private HtmlReport() {
    }

    public static void write(ResultSet r, Summary s, OutputStream os) {
        write(r, s, Gaps.unknown(r.header().contigs().size()), null, os);
    }

    /**
     * The page, with the N gaps of the genome (shares over sequenced bases, gaps drawn) and, when
     * {@code changed} is not null, the most-changed loci of a compare result.
     */
    public static void write(ResultSet r, Summary s, Gaps gaps, String compareResult, OutputStream os) {
        PrintWriter out = new PrintWriter(new OutputStreamWriter(os, StandardCharsets.UTF_8), false);
        ChangedLoci changed = compareResult == null ? null : ChangedLoci.read(compareResult, LongestLoci.SHOWN);
        new Page(r, s, gaps, changed, out).write();
        out.flush();
        if (out.checkError()) {
            // PrintWriter keeps I/O errors to itself; a half-written page must not be committed
            throw new stria.StriaException("cannot write the HTML report");
        }
    }

    private static final class Page {
        private final ResultSet r;
        private final Summary s;
        private final PrintWriter out;
        private final Gaps gaps;
        private final ChangedLoci changed;

        Page(ResultSet r, Summary s, Gaps gaps, ChangedLoci changed, PrintWriter out) {
            this.r = r;
            this.s = s;
            this.out = out;
            this.gaps = gaps;
            this.changed = changed;
        }

        void write() {
            ResultHeader h = r.header();
            out.println("<!DOCTYPE html>");
            out.println("<html lang=\"en\"><head><meta charset=\"utf-8\">");
            out.println("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">");
            out.println("<title>stria report \u00b7 " + esc(h.fingerprint()) + "</title>");
            out.println("<style>" + CSS + "</style></head><body><main>");
            out.println("<header><h1>Tandem repeats</h1><p class=\"sub\">stria " + esc(h.version())
                    + " \u00b7 input <code>" + esc(h.fingerprint()) + "</code> \u00b7 " + Fmt.count(h.contigs().size())
                    + (h.contigs().size() == 1 ? " contig" : " contigs") + " \u00b7 "
                    + Fmt.bases(h.totalBases()) + "</p></header>");
            warnings();
            cards();
            classTable();
            contigs();
            if (s.genome().loci() > 0) {
                periods();
                motifs();
                density();
                lengthPurity();
                longest();
            }
            if (changed != null) {
                changed();
            }
            provenance();
            out.println("<footer><p><strong>Research use only.</strong> These results describe sequence "
                    + "patterns in an assembly and are not a validated test. Some tandem-repeat loci matter "
                    + "clinically when expanded or contracted; any clinical question about them belongs to "
                    + "validated assays, interpreted under licensed practice and local rules.</p></footer>");
            out.println("</main></body></html>");
        }

        private void warnings() {
            List<String> w = new ArrayList<>();
            if (!r.missingShards().isEmpty()) {
                int n = r.shards().get(0).n();
                w.add("Incomplete set of shards: " + r.shards().size() + " of " + n + " present, missing "
                        + r.missingShards() + ". Counts cover only the loci of the shards given.");
            }
            if (r.regionLimited()) {
                w.add("The scan was limited to regions; bases scanned and shares refer to those regions only.");
            }
            if (s.genome().loci() == 0) {
                w.add("These results contain no loci, so there is nothing to chart.");
            }
            for (String m : w) {
                out.println("<p class=\"warn\">" + esc(m) + "</p>");
            }
        }

        private void cards() {
            Summary.Row g = s.genome();
            out.println("<section class=\"cards\">");
            if (gaps.known()) {
                card("sequenced bases", Fmt.bases(g.scanned()), Fmt.count(g.scanned()) + " bp; N gaps of "
                        + Fmt.bases(gaps.total(r)) + " excluded");
            } else {
                card("bases scanned", Fmt.bases(g.scanned()), Fmt.count(g.scanned()) + " bp");
            }
            card("loci", Fmt.count(g.loci()), perMb(g.loci(), g.scanned()));
            card("bases in repeats", Fmt.bases(g.repeatBases()), "overlaps counted once");
            card("share in repeats", Fmt.percent(g.share()), gaps.known() ? "of the sequenced bases (N gaps excluded)"
                    : "of the bases scanned (N gaps not known: report --genome excludes them)");
            out.println("</section>");
        }

        private static String perMb(long n, long bases) {
            if (bases == 0) {
                return "";
            }
            return String.format(java.util.Locale.ROOT, "%.1f per Mb", n / (bases / 1e6));
        }

        private void card(String label, String value, String note) {
            out.println("<div class=\"card\"><div class=\"label\">" + esc(label) + "</div><div class=\"value\">"
                    + esc(value) + "</div><div class=\"note\">" + esc(note) + "</div></div>");
        }

        private void classTable() {
            Summary.Row g = s.genome();
            out.println("<section><h2>By period class</h2>");
            out.println("<table class=\"num\"><thead><tr><th>class</th><th>period (bp)</th><th>loci</th>"
                    + "<th>bases in repeats</th><th>share of bases scanned</th></tr></thead><tbody>");
            for (PeriodClass pc : PeriodClass.values()) {
                out.println("<tr><td class=\"t\">" + dot(pc) + esc(pc.label()) + "</td><td>" + esc(pc.range())
                        + "</td><td>" + Fmt.count(g.classLoci()[pc.ordinal()]) + "</td><td>"
                        + Fmt.count(g.classBases()[pc.ordinal()]) + "</td><td>" + Fmt.percent(g.classShare(pc))
                        + "</td></tr>");
            }
            out.println("</tbody><tfoot><tr><td class=\"t\">all</td><td></td><td>" + Fmt.count(g.loci())
                    + "</td><td>" + Fmt.count(g.repeatBases()) + "</td><td>" + Fmt.percent(g.share())
                    + "</td></tr></tfoot></table>");
            out.println("<p class=\"caption\">Bases are counted on the union of loci: a base inside two "
                    + "overlapping loci counts once. A base inside loci of two classes counts in both classes.</p>");
            out.println("</section>");
        }

        private void contigs() {
            out.println("<section><h2>Contigs</h2>");
            int n = DrawnContigs.scanned(r);
            String intro = n > DrawnContigs.MAX
                    ? "The " + DrawnContigs.MAX + " longest contigs, the other " + Fmt.count(n - DrawnContigs.MAX)
                    + " together, and the genome."
                    : n > 1 ? "Each contig and the genome." : "";
            if (n > 1 && s.genome().loci() > 0) {
                figure("Share of each contig in repeats, by period class", intro,
                        Charts.contigShares(ContigShares.of(r, s)));
            }
            contigTable();
            out.println("</section>");
        }

        private void contigTable() {
            List<Integer> rows = new ArrayList<>();
            for (int c = 0; c < s.contigs().size(); c++) {
                if (s.contigs().get(c).scanned() > 0) {
                    rows.add(c);
                }
            }
            int hidden = 0;
            long hScanned = 0, hLoci = 0, hBases = 0;
            if (rows.size() > MAX_TABLE_ROWS) {
                rows.sort(Comparator.<Integer>comparingLong(c -> -s.contigs().get(c).scanned())
                        .thenComparingInt(c -> c));
                for (int c : rows.subList(MAX_TABLE_ROWS, rows.size())) {
                    Summary.Row row = s.contigs().get(c);
                    hidden++;
                    hScanned += row.scanned();
                    hLoci += row.loci();
                    hBases += row.repeatBases();
                }
                rows = new ArrayList<>(rows.subList(0, MAX_TABLE_ROWS));
            }
            boolean regions = r.regionLimited();
            out.println("<div class=\"scroll\"><table class=\"num\"><thead><tr><th>contig</th><th>length</th>"
                    + (regions ? "<th>bases scanned</th>" : "") + "<th>loci</th><th>bases in repeats</th>"
                    + "<th>share</th>");
            for (PeriodClass pc : PeriodClass.values()) {
                out.print("<th>" + dot(pc) + esc(pc.label()) + "</th>");
            }
            out.println("</tr></thead><tbody>");
            for (int c : rows) {
                Summary.Row row = s.contigs().get(c);
                StringBuilder sb = new StringBuilder("<tr><td class=\"t\">").append(esc(row.name())).append("</td><td>")
                        .append(Fmt.count(r.header().contigs().get(c).length())).append("</td>");
                if (regions) {
                    sb.append("<td>").append(Fmt.count(row.scanned())).append("</td>");
                }
                sb.append("<td>").append(Fmt.count(row.loci())).append("</td><td>").append(Fmt.count(row.repeatBases()))
                        .append("</td><td>").append(Fmt.percent(row.share())).append("</td>");
                for (PeriodClass pc : PeriodClass.values()) {
                    sb.append("<td>").append(Fmt.percent(row.classShare(pc))).append("</td>");
                }
                out.println(sb.append("</tr>"));
            }
            if (hidden > 0) {
                out.println("<tr class=\"others\"><td class=\"t\">" + Fmt.count(hidden) + " shorter contigs</td><td>"
                        + "</td>" + (regions ? "<td>" + Fmt.count(hScanned) + "</td>" : "") + "<td>" + Fmt.count(hLoci)
                        + "</td><td>" + Fmt.count(hBases) + "</td><td>"
                        + Fmt.percent(hScanned == 0 ? 0 : (double) hBases / hScanned) + "</td>"
                        + "<td></td>".repeat(PeriodClass.values().length) + "</tr>");
            }
            out.println("</tbody></table></div>");
            String order = hidden > 0 ? "The " + MAX_TABLE_ROWS + " longest contigs by length; "
                    + "<code>stria report --summary</code> lists every contig." : "In input order.";
            int unscanned = s.contigs().size() - rows.size() - hidden;
            if (unscanned > 0) {
                order += " " + Fmt.count(unscanned) + (unscanned == 1 ? " contig" : " contigs")
                        + " outside the scanned regions " + (unscanned == 1 ? "is" : "are") + " not listed.";
            }
            out.println("<p class=\"caption\">" + order + " Class columns give the share of the contig's "
                    + "scanned bases in repeats of that class.</p>");
        }

        private void periods() {
            out.println("<section><h2>Periods</h2>");
            figure("Loci and bases in loci by period", "Periods 1\u201310 one by one, longer periods in ranges.",
                    Charts.periods(PeriodHistogram.of(r)));
            out.println("</section>");
        }

        private void motifs() {
            out.println("<section><h2>Motif classes</h2>");
            MotifRanking m = MotifRanking.of(r);
            int shown = m.size();
            figure(shown == 1 ? "The motif class" : "The " + shown + " most frequent motif classes",
                    "A motif class joins a motif, its rotations and their reverse complements (AC, CA, GT, TG). "
                            + "Counts are loci; long motifs are shortened.",
                    Charts.motifs(m));
            out.println("</section>");
        }

        private void density() {
            out.println("<section><h2>Repeat density along the contigs</h2>");
            RepeatDensity d = RepeatDensity.of(r, gaps);
            String bin = "Share of the sequenced bases of each bin of " + Fmt.bases(d.bin()) + " that lies in repeats"
                    + (!gaps.known() ? " (N gaps not known)" : d.hasGaps() ? "; N gaps in grey" : "; no N gaps");
            int total = DrawnContigs.scanned(r);
            String rest = total > d.size()
                    ? " The " + d.size() + " longest of " + Fmt.count(total) + " contigs are drawn."
                    : "";
            if (d.size() <= 3) {
                StringBuilder svgs = new StringBuilder();
                for (int t = 0; t < d.size(); t++) {
                    svgs.append(Charts.densityProfile(d, t));
                }
                figure("Repeat density", bin + "." + rest, svgs.toString());
            } else {
                figure("Repeat density", bin + "; the colour scale ends at "
                        + Fmt.percent(d.scaleMax() / 100) + " (darker bins are at least that dense)." + rest,
                        Charts.densityStrips(d));
            }
            out.println("</section>");
        }

        private void lengthPurity() {
            if (r.allExact()) {
                out.println("<section><h2>Lengths</h2>");
                figure("Loci by length", "Every locus is an exact repeat (purity 1), so only length is shown; "
                                + "bins of equal width on a log scale.",
                        Charts.lengths(LengthHistogram.of(r)));
            } else {
                out.println("<section><h2>Length and purity</h2>");
                figure("Locus length against purity",
                        "Loci counted in cells of length (log scale) and purity; darker cells hold more loci "
                                + "(colour on a log scale).",
                        Charts.lengthPurity(LengthPurityGrid.of(r)));
            }
            out.println("</section>");
        }

        private void longest() {
            LongestLoci l = LongestLoci.of(r, LongestLoci.SHOWN);
            out.println("<section><h2>The longest loci</h2>");
            out.println("<div class=\"scroll\"><table class=\"num\"><thead><tr><th>locus</th><th>length</th>"
                    + "<th>period</th><th>subunit period</th><th>subunits</th><th>motif class</th><th>purity</th>"
                    + "</tr></thead><tbody>");
            for (LongestLoci.Row row : l.rows()) {
                boolean nested = row.subunits() > 0;
                out.println("<tr><td class=\"t\">" + esc(row.contig() + ":" + Fmt.count(row.start() + 1L) + "-"
                        + Fmt.count(row.end())) + "</td><td>" + Fmt.count(row.length()) + "</td><td>" + row.period()
                        + "</td><td>" + (nested ? Integer.toString(row.subunitPeriod()) : "")
                        + "</td><td>" + (nested ? Integer.toString(row.subunits()) : "")
                        + "</td><td class=\"t\"><code>" + esc(Fmt.ellipsize(row.motifClass(), 40)) + "</code></td><td>"
                        + String.format(java.util.Locale.ROOT, "%.3f", row.purity()) + "</td></tr>");
            }
            out.println("</tbody></table></div><p class=\"caption\">The " + l.rows().size() + " longest loci, "
                    + "longest first; positions 1-based, inclusive. Where a locus' unit is itself made of shorter "
                    + "diverged units (a higher-order satellite array), the subunit period is their length and "
                    + "subunits how many make one unit; empty when there is no such structure.</p></section>");
        }

        private void changed() {
            out.println("<section><h2>The most-changed loci</h2>");
            out.println("<div class=\"scroll\"><table class=\"num\"><thead><tr><th>locus</th><th>period</th>"
                    + "<th>motif class</th><th>in the other assembly</th><th>strand</th><th>length change</th>"
                    + "<th>status</th></tr></thead><tbody>");
            for (java.util.Map<String, String> row : changed.rows()) {
                out.println("<tr><td class=\"t\">" + esc(span(row.get("chrom"), row.get("start"), row.get("end")))
                        + "</td><td>" + esc(row.get("period")) + "</td><td class=\"t\"><code>"
                        + esc(Fmt.ellipsize(row.get("motif_class"), 40)) + "</code></td><td class=\"t\">"
                        + esc(span(row.get("other_chrom"), row.get("other_start"), row.get("other_end")))
                        + "</td><td>" + esc(row.get("other_strand")) + "</td><td>" + esc(row.get("length_change"))
                        + "</td><td class=\"t\">" + esc(row.get("status")) + "</td></tr>");
            }
            out.println("</tbody></table></div><p class=\"caption\">From " + esc(changed.file()) + ": the "
                    + changed.rows().size() + " of " + Fmt.count(changed.ranked()) + " paired loci whose length "
                    + "changed most (largest change in bases first); positions 1-based, inclusive.</p></section>");
        }

        /** A 0-based, end-exclusive span as people read it, or the fields as they are when not numbers. */
        private static String span(String chrom, String start, String end) {
            try {
                return chrom + ":" + Fmt.count(Long.parseLong(start) + 1) + "-" + Fmt.count(Long.parseLong(end));
            } catch (NumberFormatException e) {
                return chrom + ":" + start + "-" + end;
            }
        }

        private void provenance() {
            ResultHeader h = r.header();
            out.println("<section><h2>How these results were made</h2><table class=\"kv\"><tbody>");
            kv("result files", String.join("<br>", r.files().stream().map(HtmlReport::esc).toList()));
            kv("stria version", esc(h.version()));
            kv("input", "<code>" + esc(h.inputLine().substring(ResultHeader.PREFIX_INPUT.length())) + "</code>");
            StringBuilder set = new StringBuilder("<table class=\"settings\"><tbody>");
            for (String word : h.settings().trim().split("\\s+")) {
                if (word.isEmpty()) {
                    continue;
                }
                int eq = word.indexOf('=');
                set.append("<tr><td>").append(esc(eq < 0 ? word : word.substring(0, eq))).append("</td><td><code>")
                        .append(esc(eq < 0 ? "" : word.substring(eq + 1))).append("</code></td></tr>");
            }
            kv("settings", set.append("</tbody></table>").toString());
            kv(r.commands().size() == 1 ? "command" : "commands",
                    String.join("<br>", r.commands().stream().map(c -> "<code>" + esc(c) + "</code>").toList()));
            if (!r.shards().isEmpty()) {
                kv("shards", esc(String.join(", ", r.shards().stream().map(ShardId::toString).toList())));
            }
            if (r.regionLimited()) {
                List<String> spans = new ArrayList<>();
                for (int c = 0; c < h.contigs().size(); c++) {
                    long[] sp = r.scanned().get(c);
                    for (int i = 0; i < sp.length; i += 2) {
                        // people read regions 1-based and inclusive
                        spans.add(h.contigs().get(c).name() + ":" + Fmt.count(sp[i] + 1) + "-" + Fmt.count(sp[i + 1]));
                    }
                }
                String shown = String.join(", ", spans.size() > 50 ? spans.subList(0, 50) : spans);
                kv("regions", esc(shown + (spans.size() > 50 ? " and " + (spans.size() - 50) + " more" : "")));
            }
            out.println("</tbody></table></section>");
        }

        private void kv(String k, String htmlValue) {
            out.println("<tr><th>" + esc(k) + "</th><td>" + htmlValue + "</td></tr>");
        }

        private void figure(String title, String caption, String svg) {
            out.println("<figure><figcaption><strong>" + esc(title) + "</strong>"
                    + (caption.isEmpty() ? "" : " <span>" + esc(caption) + "</span>") + "</figcaption>");
            out.println(svg);
            out.println("</figure>");
        }

        private static String dot(PeriodClass pc) {
            java.awt.Color c = ChartStyle.CLASS_COLOURS[pc.ordinal()];
            return String.format("<span class=\"dot\" style=\"background:#%02x%02x%02x\"></span>", c.getRed(),
                    c.getGreen(), c.getBlue());
        }
    }

    static String esc(String s) {
        StringBuilder b = new StringBuilder(s.length() + 8);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '&' -> b.append("&amp;");
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> b.append(c);
            }
        }
        return b.toString();
    }

    private static final String CSS = """
            :root{--ink:#1f2933;--muted:#52606d;--line:#e4e7eb;--soft:#f5f7fa;--accent:#2f6db5}
            *{box-sizing:border-box}
            body{margin:0;background:var(--soft);color:var(--ink);
             font:15px/1.5 system-ui,-apple-system,'Segoe UI','DejaVu Sans',Arial,sans-serif}
            main{max-width:1160px;margin:0 auto;padding:28px 28px 40px}
            header h1{margin:0;font-size:28px;letter-spacing:-.01em}
            header .sub{margin:4px 0 18px;color:var(--muted)}
            h2{font-size:19px;margin:0 0 12px}
            section{background:#fff;border:1px solid var(--line);border-radius:10px;padding:20px 22px;margin:0 0 18px}
            section.cards{display:grid;grid-template-columns:repeat(4,1fr);gap:14px;background:none;border:0;padding:0}
            .card{background:#fff;border:1px solid var(--line);border-radius:10px;padding:14px 18px;
             border-top:4px solid var(--accent)}
            .card .label{color:var(--muted);font-size:13px;text-transform:uppercase;letter-spacing:.04em}
            .card .value{font-size:26px;font-weight:650;margin:2px 0}
            .card .note{color:var(--muted);font-size:13px}
            table{border-collapse:collapse;width:100%}
            th,td{padding:6px 10px;border-bottom:1px solid var(--line)}
            thead th{background:#fff;color:var(--muted);font-weight:600;font-size:13px;text-align:right;
             position:sticky;top:0;border-bottom:2px solid var(--line)}
            table.num td{text-align:right;font-variant-numeric:tabular-nums}
            table.num td.t,table.num th:first-child{text-align:left}
            tfoot td{font-weight:650;border-bottom:0}
            tr.others td{color:var(--muted);font-style:italic}
            .scroll{max-height:440px;overflow:auto;border:1px solid var(--line);border-radius:8px;margin-top:12px}
            .dot{display:inline-block;width:10px;height:10px;border-radius:2px;margin-right:7px;vertical-align:0}
            figure{margin:0 0 8px}
            figcaption{margin:0 0 6px}
            figcaption span{color:var(--muted)}
            svg{display:block;width:100%;height:auto}
            .caption{color:var(--muted);font-size:13px;margin:8px 0 0}
            .warn{background:#fff7e6;border:1px solid #f5c26b;border-radius:8px;padding:10px 14px;margin:0 0 14px}
            table.kv th{text-align:left;vertical-align:top;width:150px;color:var(--muted);font-weight:600}
            table.settings{width:auto}
            table.settings td{border:0;padding:1px 28px 1px 0}
            code{font-family:'DejaVu Sans Mono',Menlo,Consolas,monospace;font-size:13px;word-break:break-all}
            footer{color:var(--muted);font-size:13px;border-top:1px solid var(--line);margin-top:22px;padding-top:10px}
            @media (max-width:800px){section.cards{grid-template-columns:repeat(2,1fr)}}
            """;
}
