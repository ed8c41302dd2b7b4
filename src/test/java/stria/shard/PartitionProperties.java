package stria.shard;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import stria.io.ContigInfo;
import stria.io.Region;

class PartitionProperties {

    @Provide
    Arbitrary<List<ContigInfo>> genomes() {
        Arbitrary<Integer> length = Arbitraries.oneOf(
                Arbitraries.integers().between(0, 50),
                Arbitraries.integers().between(1, 3_000),
                Arbitraries.integers().between(10_000, 200_000));
        return length.list().ofMinSize(0).ofMaxSize(15).map(ls -> {
            List<ContigInfo> out = new ArrayList<>();
            for (int i = 0; i < ls.size(); i++) {
                out.add(new ContigInfo("ctg" + i, ls.get(i)));
            }
            return out;
        });
    }

    @Property
    void everyBaseBelongsToExactlyOneShardInGenomeOrder(@ForAll("genomes") List<ContigInfo> genome,
                                                         @ForAll @IntRange(min = 1, max = 60) int n,
                                                         @ForAll @IntRange(min = 1, max = 20_000) int grain) {
        List<Shard> shards = Partition.of(genome, n, grain);

        assertThat(shards).hasSize(n);
        // walking the pieces of shards 1..n in order must retrace the genome base by base
        int contig = nextNonEmpty(genome, 0);
        int pos = 0;
        for (int k = 0; k < n; k++) {
            Shard s = shards.get(k);
            assertThat(s.id().k()).isEqualTo(k + 1);
            assertThat(s.id().n()).isEqualTo(n);
            for (Region p : s.pieces()) {
                assertThat(contig).as("piece past the genome end").isLessThan(genome.size());
                assertThat(p.contig()).isEqualTo(genome.get(contig).name());
                assertThat(p.start()).isEqualTo(pos);
                pos = p.end();
                if (pos == genome.get(contig).length()) {
                    contig = nextNonEmpty(genome, contig + 1);
                    pos = 0;
                }
            }
        }
        assertThat(contig).as("bases left over").isEqualTo(genome.size());
    }

    @Property
    void cutsInsideAContigFallOnTheGrain(@ForAll("genomes") List<ContigInfo> genome,
                                          @ForAll @IntRange(min = 1, max = 60) int n,
                                          @ForAll @IntRange(min = 1, max = 20_000) int grain) {
        for (Shard s : Partition.of(genome, n, grain)) {
            for (Region p : s.pieces()) {
                int length = lengthOf(genome, p.contig());
                if (p.start() != 0) {
                    assertThat(p.start() % grain).isZero();
                }
                if (p.end() != length) {
                    assertThat(p.end() % grain).isZero();
                }
            }
        }
    }

    @Property
    void shardSizesDifferByAtMostOneGrainOrOneWholeContig(@ForAll("genomes") List<ContigInfo> genome,
                                                          @ForAll @IntRange(min = 1, max = 60) int n,
                                                          @ForAll @IntRange(min = 1, max = 20_000) int grain) {
        List<Shard> shards = Partition.of(genome, n, grain);
        long max = Long.MIN_VALUE;
        long min = Long.MAX_VALUE;
        for (Shard s : shards) {
            max = Math.max(max, s.bases());
            min = Math.min(min, s.bases());
        }
        int largestUncut = 0;
        int step = 0; // the largest distance between neighbouring permitted cuts
        for (ContigInfo c : genome) {
            if (isWhole(shards, c)) {
                largestUncut = Math.max(largestUncut, c.length());
            }
            step = Math.max(step, Math.min(c.length(), grain));
        }
        assertThat(max - min).isLessThanOrEqualTo(Math.max(grain, largestUncut));
        assertThat(max - min).isLessThanOrEqualTo(step);
    }

    @Property
    void theSameInputGivesTheSamePartition(@ForAll("genomes") List<ContigInfo> genome,
                                           @ForAll @IntRange(min = 1, max = 60) int n,
                                           @ForAll @IntRange(min = 1, max = 20_000) int grain) {
        assertThat(Partition.of(List.copyOf(genome), n, grain)).isEqualTo(Partition.of(genome, n, grain));
    }

    @Property
    void aContigIsCutOnlyWhereNoContigEndWouldDo(@ForAll @IntRange(min = 1, max = 8) int contigs,
                                                 @ForAll @IntRange(min = 1, max = 8) int n) {
        // equal contigs divide evenly among a divisor number of shards without a single cut
        List<ContigInfo> genome = new ArrayList<>();
        for (int i = 0; i < contigs * n; i++) {
            genome.add(new ContigInfo("chr" + i, 5_000_000));
        }
        for (Shard s : Partition.of(genome, n, 1_000_000)) {
            assertThat(s.pieces()).hasSize(contigs)
                    .allSatisfy(p -> assertThat(p.length()).isEqualTo(5_000_000));
        }
    }

    private static boolean isWhole(List<Shard> shards, ContigInfo c) {
        for (Shard s : shards) {
            for (Region p : s.pieces()) {
                if (p.contig().equals(c.name())) {
                    return p.length() == c.length();
                }
            }
        }
        return true; // empty contigs are never cut
    }

    private static int nextNonEmpty(List<ContigInfo> genome, int from) {
        int i = from;
        while (i < genome.size() && genome.get(i).length() == 0) {
            i++;
        }
        return i;
    }

    private static int lengthOf(List<ContigInfo> genome, String name) {
        for (ContigInfo c : genome) {
            if (c.name().equals(name)) {
                return c.length();
            }
        }
        throw new AssertionError(name);
    }
}
