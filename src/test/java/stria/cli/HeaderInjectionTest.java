package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.StringLength;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.out.ResultHeader;
import stria.testutil.InProcess;
import stria.testutil.SmallGenome;

/**
 * File names are chosen by users and a shell allows a line feed or a tab in them: written raw into the
 * {@code #command} line, such a name would end the header line and start a data line of its own (a forged
 * locus in every BED tool downstream). Header values are escaped; the escape reads back to the name.
 */
class HeaderInjectionTest {
    @TempDir
    Path dir;

    static final String FORGED = "ctg1\t5\t50\tA\t1000\t.\t1\t45\tA";

    @Test
    void aLineFeedInAnInputNameDoesNotMakeADataLine() throws IOException {
        Path genome = SmallGenome.write(dir.resolve("x\n" + FORGED + "\n.fa"), 5);
        Path bed = dir.resolve("out.bed");
        InProcess.Result r = InProcess.stria("scan", "--bed", bed.toString(), genome.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        List<String> lines = Files.readAllLines(bed);
        assertThat(lines).doesNotContain(FORGED).noneMatch(l -> l.equals(".fa"));
        List<String> header = lines.stream().filter(l -> l.startsWith("#")).toList();
        assertThat(header).allMatch(l -> l.indexOf('\t') < 0);
        assertThat(ResultHeader.parse(header).command()).contains(genome.toString());
        // data lines are loci of the genome's own contigs, with the nine BED columns stria writes
        assertThat(lines.stream().filter(l -> !l.startsWith("#")))
                .isNotEmpty().allMatch(l -> l.matches("ctg[12]\t\\d+\t\\d+\t[ACGT]+\t\\d+\t\\.\t\\d+\t[\\d.]+\t[ACGT]+"));

        // merge writes its own command line, shard names included
        Path s1 = dir.resolve("a\n" + FORGED + "\n1.tsv");
        Path s2 = dir.resolve("a\n" + FORGED + "\n2.tsv");
        for (Path s : List.of(s1, s2)) {
            InProcess.Result sr = InProcess.stria("scan", "--shard", (s == s1 ? "1" : "2") + "/2", "--tsv",
                    s.toString(), genome.toString());
            assertThat(sr.exit()).as(sr.err()).isZero();
        }
        Path merged = dir.resolve("m.tsv");
        InProcess.Result m = InProcess.stria("merge", "--tsv", merged.toString(), s1.toString(), s2.toString());
        assertThat(m.exit()).as(m.err()).isZero();
        assertThat(Files.readAllLines(merged)).doesNotContain(FORGED).noneMatch(l -> l.equals("1.tsv"));
    }

    @Property(tries = 300)
    void escapedHeaderValuesAreOneLineWithoutTabsAndReadBack(@ForAll @StringLength(max = 40) String value) {
        String line = ResultHeader.escape(value);
        assertThat(line).doesNotContain("\n", "\r", "\t");
        assertThat(line.chars()).noneMatch(c -> c < 0x20 || c == 0x7f);
        assertThat(ResultHeader.unescape(line)).isEqualTo(value);
    }
}
