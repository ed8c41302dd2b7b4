package stria.shard;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import org.junit.jupiter.api.Test;
import stria.io.ContigInfo;
import stria.io.Region;

class PartitionTest {
    private static final int MB = 1_000_000;

    @Test
    void wholeContigsWhenTheyBalance() {
        List<ContigInfo> g = List.of(new ContigInfo("a", 3 * MB), new ContigInfo("b", 2 * MB),
                new ContigInfo("c", MB));
        List<Shard> s = Partition.of(g, 2, MB);
        assertThat(s.get(0).pieces()).containsExactly(new Region("a", 0, 3 * MB));
        assertThat(s.get(1).pieces()).containsExactly(new Region("b", 0, 2 * MB), new Region("c", 0, MB));
    }

    @Test
    void aLongContigIsCutOnTheGrain() {
        List<ContigInfo> g = List.of(new ContigInfo("chr1", 10 * MB + 17));
        List<Shard> s = Partition.of(g, 3, MB);
        assertThat(s).extracting(Shard::bases).allSatisfy(b -> assertThat(b).isBetween(3L * MB, 4L * MB + 17));
        assertThat(s.get(0).pieces().get(0).end() % MB).isZero();
        assertThat(s.get(2).pieces().get(0).end()).isEqualTo(10 * MB + 17);
    }

    @Test
    void moreShardsThanGrainsLeavesSomeEmpty() {
        List<ContigInfo> g = List.of(new ContigInfo("x", 2_500), new ContigInfo("y", 10));
        List<Shard> s = Partition.of(g, 7, 1_000);
        assertThat(s).hasSize(7);
        assertThat(s.stream().filter(x -> x.pieces().isEmpty()).count()).isEqualTo(3);
        assertThat(s.stream().mapToLong(Shard::bases).sum()).isEqualTo(2_510);
    }

    @Test
    void anEmptyGenomeGivesEmptyShards() {
        assertThat(Partition.of(List.of(), 3, MB)).extracting(Shard::pieces)
                .containsExactly(List.of(), List.of(), List.of());
    }

    @Test
    void ownershipFollowsTheRegions() {
        Shard s = new Shard(new ShardId(2, 3), List.of(new Region("chr1", 2 * MB, 5 * MB)));
        assertThat(s.owns("chr1", 2 * MB)).isTrue();
        assertThat(s.owns("chr1", 5 * MB - 1)).isTrue();
        assertThat(s.owns("chr1", 5 * MB)).isFalse();
        assertThat(s.owns("chr2", 3 * MB)).isFalse();
        assertThat(s.id()).hasToString("2/3");
    }

    @Test
    void rejectsNonsense() {
        assertThatThrownBy(() -> Partition.of(List.of(), 0, MB)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> Partition.of(List.of(), 2, 0)).isInstanceOf(IllegalArgumentException.class);
    }
}
