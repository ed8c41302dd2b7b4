package stria.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.io.ContigInfo;
import stria.testutil.ResultFixtures;

class HtmlReportTest {
    @TempDir
    Path dir;

    private String report(int contigs) throws Exception {
        Path tsv = ResultFixtures.genome(dir.resolve("g" + contigs + ".tsv"), contigs, 11);
        ResultSet r = ResultReader.read(List.of(tsv.toString()));
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        HtmlReport.write(r, Summary.of(r), bytes);
        return bytes.toString(StandardCharsets.UTF_8);
    }

    @Test
    void thePageFetchesNothingAndRunsNoScript() throws Exception {
        String html = report(300);
        assertThat(html).doesNotContainIgnoringCase("<script").doesNotContainIgnoringCase(" src=")
                .doesNotContainIgnoringCase("href=").doesNotContainIgnoringCase("@import");
        Matcher url = Pattern.compile("url\\(([^)]*)\\)").matcher(html);
        while (url.find()) {
            assertThat(url.group(1)).as("only references inside the page").startsWith("#");
        }
        // namespace names are identifiers, never fetched; any other address would be
        String rest = html.replaceAll("xmlns(:\\w+)?=['\"]https?://[^'\"]*['\"]", "");
        assertThat(rest).doesNotContain("http://").doesNotContain("https://");
    }

    @Test
    void idsAreUniqueAcrossTheInlinedCharts() throws Exception {
        String html = report(300);
        Matcher m = Pattern.compile("\\bid=['\"]([^'\"]+)['\"]").matcher(html);
        Set<String> seen = new HashSet<>();
        int n = 0;
        while (m.find()) {
            n++;
            assertThat(seen.add(m.group(1))).as("duplicate id %s", m.group(1)).isTrue();
        }
        assertThat(n).isGreaterThan(5);
    }

    @Test
    void manyContigsAreGroupedAndTheProvenanceAndNoteAreShown() throws Exception {
        String html = report(300);
        assertThat(html).contains("others (280)").contains("The 20 longest of 300 contigs are drawn")
                .contains("min-purity").contains("fingerprint=").contains("Research use only")
                .contains("validated assays");
        assertThat(count(html, "<svg")).isEqualTo(5);
        assertThat(count(contigTable(html), "<tr><td class=\"t\">scaffold_")).isEqualTo(300);
    }

    /** The page up to the table of the longest loci, whose rows also name contigs. */
    private static String contigTable(String html) {
        int end = html.indexOf("The longest loci");
        return end < 0 ? html : html.substring(0, end);
    }

    @Test
    void oneContigGetsAProfileAndNoOthers() throws Exception {
        String html = report(1);
        assertThat(html).doesNotContain("others (").contains("chrI").contains("bins of");
        // periods, motifs, one density profile, length-purity; no per-contig share chart for a single contig
        assertThat(count(html, "<svg")).isEqualTo(4);
    }

    @Test
    void tablesAreCappedForVeryFragmentedAssemblies() throws Exception {
        String html = report(HtmlReport.MAX_TABLE_ROWS + 40);
        assertThat(count(contigTable(html), "<tr><td class=\"t\">scaffold_")).isEqualTo(HtmlReport.MAX_TABLE_ROWS);
        assertThat(html).contains("40 shorter contigs").contains("--summary</code> lists every contig");
    }

    @Test
    void emptyAndRegionLimitedResultsStillMakeAPage() throws Exception {
        var contigs = List.of(new stria.io.ContigInfo("a", 50_000),
                new stria.io.ContigInfo("b", 8_000));
        Path empty = ResultFixtures.write(dir.resolve("empty.tsv"), ResultFixtures.header(contigs, null, List.of()),
                List.of());
        String html = render(empty);
        assertThat(html).contains("These results contain no loci").contains("</html>").doesNotContain("<svg");

        Path limited = ResultFixtures.write(dir.resolve("limited.tsv"), ResultFixtures.header(contigs, null,
                List.of(new stria.io.Region("a", 1_000, 21_000))),
                List.of(ResultFixtures.row("a", 2_000, 2_040, "AC", 0.95)));
        html = render(limited);
        assertThat(html).contains("limited to regions").contains("a:1,001-21,000").contains("bases scanned</th>")
                .contains("1 contig outside the scanned regions is not listed");
    }

    @Test
    void exactResultsShowLengthsInsteadOfPurity() throws Exception {
        var contigs = List.of(new stria.io.ContigInfo("a", 50_000));
        Path exact = ResultFixtures.write(dir.resolve("exact.tsv"), ResultFixtures.header(contigs, null, List.of()),
                List.of(ResultFixtures.row("a", 100, 124, "AC", 1.0), ResultFixtures.row("a", 500, 530, "AAG", 1.0)));
        assertThat(render(exact)).contains("Loci by length").doesNotContain("Locus length against purity");
        Path imperfect = ResultFixtures.write(dir.resolve("imperfect.tsv"), ResultFixtures.header(contigs, null,
                List.of()), List.of(ResultFixtures.row("a", 100, 124, "AC", 1.0),
                ResultFixtures.row("a", 500, 530, "AAG", 0.9)));
        assertThat(render(imperfect)).contains("Locus length against purity").doesNotContain("Loci by length");
    }

    @Test
    void theLongestLociShowBothPeriodsOfHigherOrderArrays() throws Exception {
        var contigs = List.of(new stria.io.ContigInfo("chrA", 2_000_000));
        String block = ResultFixtures.randomMotif(new java.util.Random(3), 684);
        String plain = ResultFixtures.randomMotif(new java.util.Random(4), 171);
        // the scan's TSV with its two nested-structure columns: a block of 4 units of 171, a plain array,
        // and a short repeat
        List<String> rows = List.of(
                ResultFixtures.row("chrA", 1_000, 1_040, "AC", 0.95) + "\t\t",
                ResultFixtures.row("chrA", 100_000, 400_000, block, 0.97) + "\t171\t4",
                ResultFixtures.row("chrA", 500_000, 560_000, plain, 0.82) + "\t\t");
        List<String> lines = new java.util.ArrayList<>(ResultFixtures.header(contigs, null, List.of()).lines());
        lines.add(ResultFixtures.TSV_HEADER + "\tsubunit_period\tsubunits");
        lines.addAll(rows);
        Path nested = java.nio.file.Files.write(dir.resolve("nested.tsv"), lines, StandardCharsets.UTF_8);
        List<List<String>> table = longestTable(render(nested));
        assertThat(table.get(0)).containsExactly("locus", "length", "period", "subunit period", "subunits",
                "motif class", "purity");
        // longest first; the cells are the TSV's columns (positions 1-based)
        assertThat(table.get(1).subList(0, 5)).containsExactly("chrA:100,001-400,000", "300,000", "684", "171", "4");
        assertThat(table.get(2).subList(0, 5)).containsExactly("chrA:500,001-560,000", "60,000", "171", "", "");
        assertThat(table.get(3).subList(0, 5)).containsExactly("chrA:1,001-1,040", "40", "2", "", "");

        // results written before the two columns existed read as loci without nested structure
        Path old = ResultFixtures.write(dir.resolve("old.tsv"), ResultFixtures.header(contigs, null, List.of()),
                List.of(ResultFixtures.row("chrA", 100_000, 400_000, block, 0.97)));
        assertThat(longestTable(render(old)).get(1).subList(2, 5)).containsExactly("684", "", "");

        // one of the pair alone is not a nested structure: refused with the line
        lines.set(lines.size() - 1, ResultFixtures.row("chrA", 500_000, 560_000, plain, 0.82) + "\t171\t");
        Path half = java.nio.file.Files.write(dir.resolve("half.tsv"), lines, StandardCharsets.UTF_8);
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> render(half))
                .isInstanceOf(stria.StriaException.class).hasMessageContaining("half.tsv line")
                .hasMessageContaining("subunit_period and subunits");
    }

    /** The cells of the table of the longest loci, header row first, tags stripped. */
    private static List<List<String>> longestTable(String html) {
        int from = html.indexOf("<h2>The longest loci</h2>");
        String t = html.substring(from, html.indexOf("</table>", from));
        List<List<String>> out = new java.util.ArrayList<>();
        Matcher row = Pattern.compile("<tr>(.*?)</tr>").matcher(t);
        while (row.find()) {
            List<String> cells = new java.util.ArrayList<>();
            Matcher cell = Pattern.compile("<t[hd][^>]*>(.*?)</t[hd]>").matcher(row.group(1));
            while (cell.find()) {
                cells.add(cell.group(1).replaceAll("<[^>]+>", ""));
            }
            out.add(cells);
        }
        return out;
    }

    private static String render(Path tsv) {
        ResultSet r = ResultReader.read(List.of(tsv.toString()));
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        HtmlReport.write(r, Summary.of(r), bytes);
        return bytes.toString(StandardCharsets.UTF_8);
    }

    @Test
    void escapesWhatComesFromTheFiles() {
        assertThat(HtmlReport.esc("<a href=\"x\">&'")).isEqualTo("&lt;a href=&quot;x&quot;&gt;&amp;&#39;");
    }

    private static int count(String s, String what) {
        int n = 0;
        for (int i = s.indexOf(what); i >= 0; i = s.indexOf(what, i + 1)) {
            n++;
        }
        return n;
    }
}
