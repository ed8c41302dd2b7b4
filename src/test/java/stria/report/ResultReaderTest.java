package stria.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.StriaException;
import stria.io.ContigInfo;
import stria.out.ResultHeader;
import stria.testutil.ResultFixtures;

class ResultReaderTest {
    @TempDir
    Path dir;

    private final List<ContigInfo> contigs = List.of(new ContigInfo("chr1", 10_000),
            new ContigInfo("chr2", 5_000));

    @Test
    void refusesFilesOfDifferentGenomesAndNamesThem() throws Exception {
        Path a = ResultFixtures.write(dir.resolve("a.tsv"), ResultFixtures.header(contigs, null, List.of()), List.of());
        var other = List.of(new ContigInfo("chr1", 10_000), new ContigInfo("chr2", 5_001));
        Path b = ResultFixtures.write(dir.resolve("b.tsv"), ResultFixtures.header(other, null, List.of()), List.of());
        assertThatThrownBy(() -> ResultReader.read(List.of(a.toString(), b.toString())))
                .isInstanceOf(StriaException.class)
                .hasMessageContaining(a.toString()).hasMessageContaining(b.toString())
                .hasMessageContaining("different genomes");
    }

    @Test
    void refusesFilesMadeWithDifferentSettings() throws Exception {
        Path a = ResultFixtures.write(dir.resolve("a.tsv"), ResultFixtures.header(contigs, null, List.of()), List.of());
        var h = new ResultHeader("0.1.0", "scan", ResultFixtures.SETTINGS.replace("min-purity=0.8", "min-purity=0.9"),
                contigs, null, List.of());
        Path b = ResultFixtures.write(dir.resolve("b.tsv"), h, List.of());
        assertThatThrownBy(() -> ResultReader.read(List.of(a.toString(), b.toString())))
                .isInstanceOf(StriaException.class).hasMessageContaining("different settings")
                .hasMessageContaining("b.tsv");
    }

    @Test
    void refusesAHeaderWhoseInputLineWasEdited() throws Exception {
        Path a = ResultFixtures.write(dir.resolve("a.tsv"), ResultFixtures.header(contigs, null, List.of()), List.of());
        String text = Files.readString(a).replace("#contig: chr2 5000", "#contig: chr2 5100");
        Files.writeString(a, text);
        assertThatThrownBy(() -> ResultReader.read(List.of(a.toString())))
                .isInstanceOf(StriaException.class).hasMessageContaining("#input");
    }

    @Test
    void refusesFilesThatAreNotResults() throws Exception {
        Path bed = dir.resolve("x.bed");
        List<String> lines = new ArrayList<>(ResultFixtures.header(contigs, null, List.of()).lines());
        lines.add("chr1\t10\t30\tAC\t1000\t.\t2\t10.00\tAC");
        Files.write(bed, lines);
        assertThatThrownBy(() -> ResultReader.read(List.of(bed.toString())))
                .isInstanceOf(StriaException.class).hasMessageContaining("x.bed line").hasMessageContaining("header row");
        Path plain = Files.writeString(dir.resolve("plain.tsv"), "chrom\tstart\n");
        assertThatThrownBy(() -> ResultReader.read(List.of(plain.toString())))
                .isInstanceOf(StriaException.class).hasMessageContaining("not a stria result");
        assertThatThrownBy(() -> ResultReader.read(List.of(dir.resolve("missing.tsv").toString())))
                .isInstanceOf(StriaException.class).hasMessageContaining("missing.tsv");
    }

    @Test
    void refusesRowsOutsideTheContigsAndNamesTheLine() throws Exception {
        var h = ResultFixtures.header(contigs, null, List.of());
        Path a = ResultFixtures.write(dir.resolve("a.tsv"), h, List.of(ResultFixtures.row("chr1", 10, 30, "AC", 1),
                ResultFixtures.row("chr3", 10, 30, "AC", 1)));
        int line = h.lines().size() + 3;
        assertThatThrownBy(() -> ResultReader.read(List.of(a.toString())))
                .isInstanceOf(StriaException.class).hasMessageContaining("a.tsv line " + line)
                .hasMessageContaining("chr3");
        Path b = ResultFixtures.write(dir.resolve("b.tsv"), h, List.of(ResultFixtures.row("chr2", 4990, 5010, "AC", 1)));
        assertThatThrownBy(() -> ResultReader.read(List.of(b.toString())))
                .isInstanceOf(StriaException.class).hasMessageContaining("does not fit");
    }

    @Test
    void shardsAreCombinedDuplicatesDroppedAndMissingShardsReported() throws Exception {
        Path s1 = ResultFixtures.write(dir.resolve("s1.tsv"), ResultFixtures.header(contigs, "1/3", List.of()),
                List.of(ResultFixtures.row("chr1", 10, 30, "AC", 1), ResultFixtures.row("chr2", 40, 60, "AG", 1)));
        Path s3 = ResultFixtures.write(dir.resolve("s3.tsv"), ResultFixtures.header(contigs, "3/3", List.of()),
                List.of(ResultFixtures.row("chr1", 5, 9, "A", 1), ResultFixtures.row("chr1", 10, 30, "AC", 1)));
        ResultSet r = ResultReader.read(List.of(s3.toString(), s1.toString()));
        assertThat(r.shards()).extracting(Object::toString).containsExactly("1/3", "3/3");
        assertThat(r.missingShards()).containsExactly(2);
        assertThat(r.loci().get(0).size()).isEqualTo(2);
        assertThat(r.loci().get(0).start(0)).isEqualTo(5);
        assertThat(r.loci().get(1).size()).isEqualTo(1);
    }

    @Test
    void readsGzipAndBgzfFiles() throws Exception {
        Path plain = ResultFixtures.write(dir.resolve("a.tsv"), ResultFixtures.header(contigs, null, List.of()),
                List.of(ResultFixtures.row("chr1", 10, 30, "AC", 1), ResultFixtures.row("chr2", 40, 60, "AG", 1)));
        Path gz = dir.resolve("a.tsv.gz");
        try (OutputStream o = new GZIPOutputStream(Files.newOutputStream(gz))) {
            o.write(Files.readAllBytes(plain));
        }
        Path bgz = dir.resolve("b.tsv.gz");
        try (OutputStream o = new htsjdk.samtools.util.BlockCompressedOutputStream(bgz.toFile())) {
            o.write(Files.readString(plain).getBytes(StandardCharsets.UTF_8));
        }
        for (Path p : List.of(gz, bgz)) {
            ResultSet r = ResultReader.read(List.of(p.toString()));
            assertThat(r.loci().get(0).size() + r.loci().get(1).size()).as(p.toString()).isEqualTo(2);
            assertThat(r.motifClasses()).containsExactly("AC", "AG");
        }
    }
}
