package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.testutil.Cli;

/**
 * {@code stria show} on planted loci whose edits are known: every copy line gives back the genome's bases
 * (drop the marks and they spell the locus), the planted substitution, insertion and deletion are marked
 * where they were planted, and every line fits 100 columns even for a unit of 150 bases.
 */
class ShowCommandTest {
    @TempDir
    Path dir;

    static String random(int n, long seed) {
        java.util.Random r = new java.util.Random(seed);
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < n; i++) {
            sb.append("ACGT".charAt(r.nextInt(4)));
        }
        return sb.toString();
    }

    @Test
    void copiesSpellTheLocusAndTheEditsAreMarkedWhereTheyWerePlanted() throws Exception {
        String unit = "ACGTTGCA";
        StringBuilder locus = new StringBuilder();
        for (int c = 0; c < 12; c++) {
            String copy = unit;
            if (c == 3) {
                copy = "ACGATGCA"; // substitution T>A at phase 3
            } else if (c == 6) {
                copy = "ACGTTGGCA"; // G inserted after phase 5
            } else if (c == 9) {
                copy = "ACGTGCA"; // deletion of the T at phase 4
            }
            locus.append(copy);
        }
        String left = random(300, 1), right = random(300, 2);
        Files.writeString(dir.resolve("g.fa"), ">c1\n" + left + locus + right + "\n");
        Cli.Result r = Cli.stria(dir, "show", "--region", "c1:280-320", "g.fa");
        assertThat(r.exit()).as(r.err()).isZero();
        List<String> lines = r.out().lines().toList();
        assertThat(lines).allSatisfy(l -> assertThat(l.length()).isLessThanOrEqualTo(100));
        assertThat(lines.get(0)).startsWith("c1:301-").contains("period 8");
        int cons = lines.indexOf(lines.stream().filter(l -> l.trim().startsWith("consensus")).findFirst().orElseThrow());
        List<String> copies = lines.subList(cons + 1, cons + 13);
        StringBuilder spelled = new StringBuilder();
        for (String c : copies) {
            spelled.append(c.substring(c.indexOf("  ", c.indexOf(c.trim().split(" ")[0])) + 2).replaceAll("[ .\\-]", ""));
        }
        assertThat(spelled.toString().toUpperCase()).isEqualTo(locus.toString());
        // the label of copy 4 is its 1-based position; the marks sit under the planted columns
        assertThat(copies.get(3)).contains(String.valueOf(301 + 3 * 8));
        assertThat(copies.get(3).replace(".", "")).contains("ACGaTGCA");
        // the inserted G: one lower-case base, under a '.' of the consensus (either G of GG may be the one)
        String ins = copies.get(6);
        int at = -1;
        for (int i = 0; i < ins.length(); i++) {
            if (Character.isLowerCase(ins.charAt(i))) {
                assertThat(at).as("one lower-case base in %s", ins).isEqualTo(-1);
                at = i;
            }
        }
        assertThat(ins.charAt(at)).isEqualTo('g');
        assertThat(lines.get(cons).charAt(at)).isEqualTo('.');
        assertThat(copies.get(9)).contains("-");
        assertThat(lines.get(cons)).contains(".");
    }

    @Test
    void longUnitsWrapAndHtmlMarksTheEdits() throws Exception {
        String unit = random(150, 3);
        String mutated = unit.substring(0, 70) + (unit.charAt(70) == 'A' ? 'C' : 'A') + unit.substring(71);
        String genome = random(200, 4) + unit + unit + mutated + unit + random(200, 5);
        Files.writeString(dir.resolve("s.fa"), ">s\n" + genome + "\n");
        Cli.Result r = Cli.stria(dir, "show", "--region", "s:190-210", "s.fa");
        assertThat(r.exit()).as(r.err()).isZero();
        assertThat(r.out().lines()).allSatisfy(l -> assertThat(l.length()).isLessThanOrEqualTo(100));
        assertThat(r.out().lines().filter(l -> l.trim().startsWith("consensus")).count()).isGreaterThan(1);
        // in every block, a copy's label is the genome position of its first letter there
        int checked = 0;
        for (String l : r.out().lines().toList()) {
            java.util.regex.Matcher m = java.util.regex.Pattern.compile("^ *([0-9,]+)  (.*)$").matcher(l);
            if (m.matches()) {
                int pos = Integer.parseInt(m.group(1).replace(",", ""));
                String drawn = m.group(2).replaceAll("[^A-Za-z]", "");
                assertThat(m.group(2)).as(l).isNotBlank();
                if (drawn.isEmpty()) {
                    continue; // only deletions in this block
                }
                assertThat(Character.toUpperCase(drawn.charAt(0))).as(l).isEqualTo(genome.charAt(pos - 1));
                assertThat(drawn.toUpperCase()).as(l).isEqualTo(genome.substring(pos - 1, pos - 1 + drawn.length()));
                checked++;
            }
        }
        assertThat(checked).isGreaterThanOrEqualTo(8);
        r = Cli.stria(dir, "show", "--region", "s:190-210", "--html", "v.html", "s.fa");
        assertThat(r.exit()).as(r.err()).isZero();
        String html = Files.readString(dir.resolve("v.html"));
        assertThat(html).contains("<section class=\"locus\">").contains("<span class=\"x\">")
                .contains("Research use only").doesNotContainIgnoringCase("<script");
    }
}
