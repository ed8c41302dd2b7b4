package stria.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static stria.io.FastaFiles.bytes;
import static stria.io.FastaFiles.format;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Random;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import stria.StriaException;
import stria.testutil.Cli;

/**
 * Index files made by the tools people use (samtools faidx, bgzip -i) are read as matching, and regions
 * cut the same bases as samtools faidx cuts for the same region text.
 */
@Tag("tools")
class IndexInteropTest {
    @TempDir
    Path dir;

    private List<FastaFiles.Rec> genome() {
        Random rnd = new Random(21);
        List<FastaFiles.Rec> recs = new ArrayList<>();
        for (int i = 0; i < 6; i++) {
            recs.add(new FastaFiles.Rec("seq" + i, i % 2 == 0 ? "some words" : "",
                    FastaFiles.letters(rnd, i == 3 ? 0 : i == 1 ? 900_000 : 1 + rnd.nextInt(20_000))));
        }
        return recs;
    }

    private static Map<String, String> readBackwards(Path p, List<String> warnings) {
        Map<String, String> got = new java.util.TreeMap<>();
        try (GenomeReader r = GenomeReader.open(p.toString(), warnings::add)) {
            List<ContigInfo> order = new ArrayList<>(r.contigs());
            Collections.reverse(order);
            for (ContigInfo c : order) {
                got.put(c.name(), new String(r.sequence(c), StandardCharsets.ISO_8859_1));
            }
        }
        return got;
    }

    @Test
    void samtoolsAndBgzipIndexesAreAccepted() throws Exception {
        Cli.needTool("samtools");
        Cli.needTool("bgzip");
        List<FastaFiles.Rec> recs = genome();
        Map<String, String> want = new java.util.TreeMap<>(FastaFiles.expected(recs));
        for (String eol : List.of("\n", "\r\n")) {
            Path plain = FastaFiles.write(dir.resolve("g.fa"), bytes(format(recs, 60, eol, true)));
            Files.deleteIfExists(dir.resolve("g.fa.fai"));
            Cli.tool(dir, "samtools", "faidx", "g.fa");
            List<String> warnings = new ArrayList<>();
            assertThat(readBackwards(plain, warnings)).isEqualTo(want);
            assertThat(warnings).containsExactly(plain + ": skipped 1 record with no sequence (seq3)");

            Path bgz = dir.resolve("g.fa.gz");
            Files.deleteIfExists(bgz);
            Files.deleteIfExists(dir.resolve("g.fa.gz.fai"));
            Files.deleteIfExists(dir.resolve("g.fa.gz.gzi"));
            Cli.tool(dir, "bgzip", "-i", "-k", "g.fa");
            Cli.tool(dir, "samtools", "faidx", "g.fa.gz");
            assertThat(readBackwards(bgz, new ArrayList<>())).isEqualTo(want);
        }
        // the same indexes after the file changed under them
        FastaFiles.write(dir.resolve("g.fa"), bytes(format(recs, 61, "\n", true)));
        assertThatThrownBy(() -> GenomeReader.open(dir.resolve("g.fa").toString(), w -> { }))
                .isInstanceOf(StriaException.class).hasMessageContaining("g.fa.fai does not match");
        Files.delete(dir.resolve("g.fa.gz"));
        Cli.tool(dir, "bgzip", "-k", "-l", "1", "g.fa");
        assertThatThrownBy(() -> GenomeReader.open(dir.resolve("g.fa.gz").toString(), w -> { }))
                .isInstanceOf(StriaException.class).hasMessageContaining("does not match");
    }

    @Test
    void regionsCutWhatSamtoolsCuts() throws Exception {
        Cli.needTool("samtools");
        List<FastaFiles.Rec> recs = genome();
        Path p = FastaFiles.write(dir.resolve("r.fa"), bytes(format(recs, 70, "\n", true)));
        Cli.tool(dir, "samtools", "faidx", "r.fa");
        List<String> regions = List.of("seq0", "seq1:1-1", "seq1:1,001-2,000", "seq1:899000-", "seq2:5",
                "seq4:10-20", "seq5");
        try (GenomeReader r = GenomeReader.open(p.toString(), w -> { })) {
            for (String text : regions) {
                Region g = Region.parse(text, r.contigs());
                ContigInfo c = r.contigs().stream().filter(x -> x.name().equals(g.contig())).findFirst().orElseThrow();
                String ours = new String(r.sequence(c), g.start(), g.length(), StandardCharsets.ISO_8859_1);
                String theirs = Cli.tool(dir, "samtools", "faidx", "r.fa", text);
                String bases = String.join("", theirs.substring(theirs.indexOf('\n') + 1).split("\n"));
                assertThat(ours).as(text).isEqualTo(bases);
            }
        }
    }
}
