package stria.sim;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.zip.GZIPInputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class GenomeSimulatorTest {
    private static final String[] SMALL = {"--seed", "3", "--size", "400000", "--contigs", "3",
        "--satellites", "1", "--satellite-length", "20000", "--gaps", "3", "--lower", "4"};

    @Test
    void sameSeedSameGenomeOtherSeedOtherGenome() {
        GenomeSimulator.Genome a = GenomeSimulator.generate(SMALL);
        GenomeSimulator.Genome b = GenomeSimulator.generate(SMALL);
        assertThat(a.truth()).isEqualTo(b.truth());
        for (int i = 0; i < a.sequences().size(); i++) {
            assertThat(a.sequences().get(i)).isEqualTo(b.sequences().get(i));
        }
        String[] other = SMALL.clone();
        other[1] = "4";
        assertThat(GenomeSimulator.generate(other).sequences().get(0)).isNotEqualTo(a.sequences().get(0));
    }

    @Test
    void contigsHaveTheAskedSizesAndTheFirstHoldsTheMajorShare() {
        GenomeSimulator.Genome g = GenomeSimulator.generate(SMALL);
        long total = 0;
        for (byte[] s : g.sequences()) {
            total += s.length;
        }
        assertThat(total).isEqualTo(400000);
        assertThat(g.sequences().get(0).length).isEqualTo(300000);
        assertThat(g.names()).containsExactly("ctg01", "ctg02", "ctg03");
    }

    @Test
    void plantedLociAreWhereTheTableSaysWithIntactEdges() {
        GenomeSimulator.Genome g = GenomeSimulator.generate(SMALL);
        assertThat(g.truth()).hasSizeGreaterThan(30);
        assertThat(g.truth()).extracting(GenomeSimulator.Planted::kind).contains("homopolymer", "microsatellite",
                "minisatellite", "satellite", "compound");
        int prevEnd = 0;
        String prevContig = "";
        for (GenomeSimulator.Planted p : g.truth()) {
            byte[] seq = g.sequences().get(g.names().indexOf(p.contig()));
            if (!p.contig().equals(prevContig)) {
                prevEnd = 0;
                prevContig = p.contig();
            }
            assertThat(p.start()).isGreaterThanOrEqualTo(prevEnd);
            prevEnd = p.end();
            assertThat(p.identity()).isBetween(0.5, 1.0);
            assertThat(p.copies()).isEqualTo((p.end() - p.start()) / (double) p.period());
            // the first motif-length stretch is never mutated (a quarter of the locus at most)
            int guard = Math.min(p.period(), (int) Math.round(p.copies() * p.period()) / 4);
            String head = new String(seq, p.start(), guard).toUpperCase();
            assertThat(head).isEqualTo(p.motif().substring(0, guard));
        }
    }

    @Test
    void writesGzipFastaAndTheTruthTable(@TempDir Path dir) throws IOException {
        Path fa = dir.resolve("g.fa.gz");
        Path tsv = dir.resolve("t.tsv");
        String[] args = new String[SMALL.length + 4];
        System.arraycopy(SMALL, 0, args, 0, SMALL.length);
        args[SMALL.length] = "--out";
        args[SMALL.length + 1] = fa.toString();
        args[SMALL.length + 2] = "--truth";
        args[SMALL.length + 3] = tsv.toString();
        assertThat(new picocli.CommandLine(new GenomeSimulator()).execute(args)).isZero();
        String text;
        try (GZIPInputStream in = new GZIPInputStream(Files.newInputStream(fa))) {
            text = new String(in.readAllBytes(), java.nio.charset.StandardCharsets.US_ASCII);
        }
        assertThat(text).startsWith(">ctg01 ");
        assertThat(text).contains("\n>ctg02 ", "\n>ctg03 ");
        assertThat(text.chars().filter(c -> c == 'N').count()).isGreaterThan(0);
        assertThat(text.chars().filter(c -> c >= 'a' && c <= 'z').count()).isGreaterThan(0);
        java.util.List<String> rows = Files.readAllLines(tsv);
        assertThat(rows.get(0)).isEqualTo("contig\tstart\tend\tperiod\tmotif\tcopies\tidentity\tkind");
        assertThat(rows).hasSize(GenomeSimulator.generate(SMALL).truth().size() + 1);
        assertThat(TruthScorer.readTruth(tsv)).hasSize(rows.size() - 1);
    }
}
