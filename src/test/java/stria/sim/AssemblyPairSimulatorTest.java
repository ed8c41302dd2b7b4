package stria.sim;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.io.ContigInfo;
import stria.io.GenomeReader;

class AssemblyPairSimulatorTest {
    private static final GenomeSimulator.Genome A = GenomeSimulator.generate("--seed", "4", "--size", "600000",
            "--contigs", "4", "--gaps", "0", "--satellites", "0");

    @Test
    void bIsAPlusTheTabledChangesInTheStatedLayout() {
        AssemblyPairSimulator.Pair p = AssemblyPairSimulator.make(A, AssemblyPairSimulator.Options.defaults(9));
        long aBases = 0;
        for (byte[] s : A.sequences()) {
            aBases += s.length;
        }
        long bBases = 0;
        long ns = 0;
        for (byte[] s : p.sequences()) {
            bBases += s.length;
            for (byte b : s) {
                ns += b == 'N' ? 1 : 0;
            }
        }
        long change = 0;
        int planted = 0;
        for (AssemblyPairSimulator.Change c : p.changes()) {
            change += c.lengthChange();
            if (c.period() > 0) {
                planted++;
                assertThat(Math.abs(c.lengthChange()) % c.period()).isZero();
                assertThat(Math.abs(c.lengthChange()) / c.period()).isBetween(1, 8);
                assertThat(c.editAt()).isBetween(c.start() + c.period(), c.end() - c.period());
            }
        }
        // four contigs: the first split, the second reverse-complemented, the last two joined across 100 N
        assertThat(p.names()).hasSize(4).doesNotContainAnyElementsOf(A.names());
        assertThat(ns).isEqualTo(100);
        assertThat(bBases - ns).isEqualTo(aBases + change);
        assertThat(planted).isGreaterThanOrEqualTo(60);
        assertThat(p.substitutions()).isBetween((int) (aBases * 0.0007), (int) (aBases * 0.0013));
        int minus = 0;
        int split = 0;
        for (AssemblyPairSimulator.Layout l : p.layout()) {
            for (AssemblyPairSimulator.Piece x : l.pieces()) {
                minus += x.strand() == '-' ? 1 : 0;
                split += x.chrom().equals(A.names().get(0)) ? 1 : 0;
            }
        }
        assertThat(minus).isEqualTo(1);
        assertThat(split).isEqualTo(2);
    }

    @Test
    void writesAFastaTheReaderTakesAndATruthTable(@TempDir Path dir) throws IOException {
        AssemblyPairSimulator.Pair p = AssemblyPairSimulator.make(A, AssemblyPairSimulator.Options.defaults(9));
        Path fa = dir.resolve("b.fa");
        Path truth = dir.resolve("b.truth.tsv");
        AssemblyPairSimulator.write(p, fa, truth);
        try (GenomeReader r = GenomeReader.open(fa.toString(), w -> { })) {
            List<ContigInfo> cs = r.contigs();
            assertThat(cs).extracting(ContigInfo::name).containsExactlyElementsOf(p.names());
            for (int c = 0; c < cs.size(); c++) {
                assertThat(r.sequence(cs.get(c))).isEqualTo(p.sequences().get(c));
            }
        }
        List<String> lines = Files.readAllLines(truth, StandardCharsets.US_ASCII);
        assertThat(lines.get(0)).startsWith("#substitutions: ");
        assertThat(lines.stream().filter(x -> x.startsWith("#contig: "))).hasSize(4);
        int header = lines.indexOf("kind\tchrom\tstart\tend\tperiod\tmotif\tedit_at\tlength_change");
        assertThat(header).isEqualTo(5);
        assertThat(lines.size() - header - 1).isEqualTo(p.changes().size());
    }
}
