package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.testutil.Cli;

/**
 * The report with the genome and a compare result: the share is counted over the sequenced bases (the N
 * gaps, counted here from the FASTA directly, are left out), the gaps are drawn, the longest loci are listed
 * longest first, and the most-changed loci of a hand-made compare result (columns found by name, in another
 * order and with a column more) are ranked by the size of the change.
 */
@org.junit.jupiter.api.Tag("slow")
class ReportGapsAndTablesTest {
    @TempDir
    Path dir;

    @Test
    void sharesOverSequencedBasesAndTheTwoTables() throws Exception {
        StringBuilder seq = new StringBuilder();
        java.util.Random rnd = new java.util.Random(9);
        for (int i = 0; i < 30000; i++) {
            seq.append("ACGT".charAt(rnd.nextInt(4)));
        }
        seq.replace(5000, 5040, "CA".repeat(20));
        seq.replace(9000, 9090, "TTG".repeat(30));
        seq.replace(12000, 14000, "N".repeat(2000));
        seq.replace(20000, 20500, "n".repeat(500));
        Files.writeString(dir.resolve("g.fa"), ">c1\n" + seq + "\n");
        long n = seq.chars().filter(c -> c == 'N' || c == 'n').count();
        Cli.Result r = Cli.stria(dir, "scan", "-q", "--tsv", "g.tsv", "g.fa");
        assertThat(r.exit()).as(r.err()).isZero();

        List<String> compare = new ArrayList<>(List.of("# a compare result, made by hand",
                "status\tchrom\tstart\tend\tperiod\tmotif_class\tother_chrom\tother_start\tother_end\tother_strand"
                        + "\tlength_change\textra"));
        for (int i = 0; i < 25; i++) {
            long change = (i % 2 == 0 ? 1 : -1) * (long) (i * 7 % 25);
            compare.add("changed\tc1\t" + (100 * i) + "\t" + (100 * i + 20) + "\t2\tAC\tq1\t" + (100 * i) + "\t"
                    + (100 * i + 20 + change) + "\t+\t" + change + "\tz");
        }
        compare.add("unpaired\tc1\t9999\t10020\t2\tAC\t.\t.\t.\t.\t.\tz");
        Files.write(dir.resolve("cmp.tsv"), compare);

        r = Cli.stria(dir, "report", "--genome", "g.fa", "--compare", "cmp.tsv", "--html", "r.html", "--summary",
                "g.tsv");
        assertThat(r.exit()).as(r.err()).isZero();
        String[] genomeRow = r.out().lines().filter(l -> l.startsWith("genome\t")).findFirst().orElseThrow()
                .split("\t");
        assertThat(Long.parseLong(genomeRow[2])).isEqualTo(30000 - n);
        double share = Long.parseLong(genomeRow[4]) / (double) (30000 - n);
        assertThat(Double.parseDouble(genomeRow[5])).isCloseTo(share, org.assertj.core.data.Offset.offset(1e-6));

        String html = Files.readString(dir.resolve("r.html"));
        assertThat(html).contains("N gaps excluded").contains("N gaps in grey").contains("The longest loci")
                .contains("The most-changed loci");
        // the longest locus (TTG x 30) comes first
        String longest = html.substring(html.indexOf("The longest loci"));
        String first = longest.substring(longest.indexOf("<tbody>"), longest.indexOf("</tr>", longest.indexOf("<tbody>")));
        assertThat(first).contains("c1:9,0").contains("<code>AAC</code>");
        // ranked by |length_change|: 24, then 23 ... ; the unpaired row is not ranked
        String changed = html.substring(html.indexOf("The most-changed loci"));
        List<Integer> order = new ArrayList<>();
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("<td>(-?\\d+)</td><td class=\"t\">changed")
                .matcher(changed);
        while (m.find()) {
            order.add(Math.abs(Integer.parseInt(m.group(1))));
        }
        assertThat(order).hasSize(20).isSortedAccordingTo(java.util.Comparator.reverseOrder());
        assertThat(order.get(0)).isEqualTo(24);
        assertThat(changed).contains("the 20 of 25 paired loci").doesNotContain("unpaired");

        // a genome that is not the one of the results is refused in one line
        Files.writeString(dir.resolve("other.fa"), ">c1\nACGT\n");
        r = Cli.stria(dir, "report", "--genome", "other.fa", "--summary", "g.tsv");
        assertThat(r.exit()).isEqualTo(1);
        assertThat(r.err()).contains("is not the genome of these results");
    }
}
