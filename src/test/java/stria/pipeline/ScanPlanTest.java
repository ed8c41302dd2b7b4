package stria.pipeline;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import org.junit.jupiter.api.Test;
import stria.io.Region;
import stria.out.ResultHeader;
import stria.shard.Partition;
import stria.shard.ShardId;

/** What a plan scans, and what the header of its result says, for each kind of selection. */
class ScanPlanTest {
    private final Genome genome = Genome.of(List.of("chrA", "chrB", "chrC"),
            List.of(new byte[3_000_000], new byte[500_000], new byte[1_200_000]));
    private final ScanSettings settings = new ScanOptions(ScanSettings.Mode.EXACT).threads(1).settings();

    private static List<Region> stretches(ScanPlan p) {
        return p.units().stream().map(ScanUnit::region).toList();
    }

    @Test
    void theWholeGenomeIsEveryContigWholeInOrder() {
        ScanPlan p = ScanPlan.of(genome, Selection.wholeGenome());
        assertThat(stretches(p)).containsExactly(new Region("chrA", 0, 3_000_000), new Region("chrB", 0, 500_000),
                new Region("chrC", 0, 1_200_000));
        assertThat(p.units()).allMatch(ScanUnit::wholeContig);
        assertThat(p.bases()).isEqualTo(4_700_000);
        ResultHeader h = p.header("0.1.0", "scan g.fa", settings);
        assertThat(h.shard()).isNull();
        assertThat(h.regions()).isEmpty();
        assertThat(h.contigs()).isEqualTo(genome.contigs());
        assertThat(h.settings()).isEqualTo("mode=exact min-period=1 max-period=2000 min-copies=2 min-length=12 score-model="
                + stria.score.ScoringModel.DESCRIPTION);
    }

    @Test
    void regionsAreMergedInGenomeOrderAndNamedInTheHeader() {
        ScanPlan p = ScanPlan.of(genome, Selection.regions(List.of(new Region("chrC", 100, 200),
                new Region("chrA", 5_000, 9_000), new Region("chrA", 1_000, 5_000), new Region("chrC", 150, 400))));
        List<Region> merged = List.of(new Region("chrA", 1_000, 9_000), new Region("chrC", 100, 400));
        assertThat(stretches(p)).isEqualTo(merged);
        assertThat(p.regions()).isEqualTo(merged);
        assertThat(p.header("0.1.0", "scan", settings).regions()).isEqualTo(merged);
        assertThat(p.bases()).isEqualTo(8_300);
    }

    @Test
    void aShardIsItsPiecesOfThePartitionOnTheGrain() {
        ShardId id = new ShardId(2, 3);
        ScanPlan p = ScanPlan.of(genome, Selection.shard(id));
        List<Region> pieces = Partition.of(genome.contigs(), 3, Geometry.SHARD_GRAIN).get(1).pieces();
        assertThat(stretches(p)).isEqualTo(pieces).isNotEmpty();
        assertThat(p.shard()).isEqualTo(id);
        assertThat(p.header("0.1.0", "scan", settings).shard()).isEqualTo("2/3");
        long all = 0;
        for (int k = 1; k <= 3; k++) {
            all += ScanPlan.of(genome, Selection.shard(new ShardId(k, 3))).bases();
        }
        assertThat(all).isEqualTo(4_700_000);
    }

    @Test
    void contigNamesAreUniqueInAGenome() {
        assertThatThrownBy(() -> Genome.of(List.of("x", "x"), List.of(new byte[1], new byte[2])))
                .isInstanceOf(IllegalArgumentException.class);
    }
}
