package stria.sim;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;
import stria.pipeline.ScanOptions;
import stria.pipeline.ScanSettings;

/**
 * The planted-truth benchmark at CI size: a simulated genome with known repeats, scanned with the default
 * filters through the real pipeline (windows of 100 kb, stitched, two threads, scored in chunks), must meet
 * the targets the full benchmark (bench/planted.sh) reports against.
 */
class PlantedTruthTest {
    @Test
    void defaultSettingsMeetTheTargetsOnAPlantedGenome() {
        GenomeSimulator.Genome g = GenomeSimulator.generate("--seed", "5", "--size", "3000000", "--contigs", "3",
                "--satellites", "1", "--satellite-length", "80000", "--gaps", "6", "--lower", "12");
        ScanSettings settings = new ScanOptions(ScanSettings.Mode.IMPERFECT).threads(2).window(100_000L).settings();
        List<TruthScorer.Call> calls = TruthScorer.scanInProcess(g, settings);
        TruthScorer.Result r = TruthScorer.score(g.truth(), calls);
        System.out.print(r.summary());
        assertThat(r.plantedEligible()).isGreaterThan(250);
        assertThat(r.recall()).isGreaterThanOrEqualTo(0.95);
        assertThat(r.precision()).isGreaterThanOrEqualTo(0.90);
        assertThat(r.boundaryError()).isLessThanOrEqualTo(0.05);
        assertThat(r.purityError()).isLessThanOrEqualTo(0.03);
    }

    @Test
    void scoringCountsMissesAndFalseCalls() {
        GenomeSimulator.Planted a = new GenomeSimulator.Planted("c", 100, 200, 4, "ACGT", 25, 0.95, "x");
        GenomeSimulator.Planted b = new GenomeSimulator.Planted("c", 500, 560, 2, "CA", 30, 0.90, "x");
        GenomeSimulator.Planted tooPoor = new GenomeSimulator.Planted("c", 900, 960, 3, "CAG", 20, 0.80, "x");
        List<TruthScorer.Call> calls = List.of(
                new TruthScorer.Call("c", 102, 198, 4, 0.97), // found, boundary error 4 / 100
                new TruthScorer.Call("c", 500, 540, 4, 0.90), // wrong period: b is missed
                new TruthScorer.Call("c", 2000, 2040, 1, 1.0)); // long and overlapping nothing
        TruthScorer.Result r = TruthScorer.score(List.of(a, b, tooPoor), calls);
        assertThat(r.plantedEligible()).isEqualTo(2);
        assertThat(r.found()).isEqualTo(1);
        assertThat(r.reportedLong()).isEqualTo(3);
        assertThat(r.reportedLongTrue()).isEqualTo(2);
        assertThat(r.boundaryError()).isEqualTo(0.04);
        assertThat(r.purityError()).isCloseTo(0.02, org.assertj.core.data.Offset.offset(1e-12));
    }
}
