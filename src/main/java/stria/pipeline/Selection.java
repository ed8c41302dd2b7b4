package stria.pipeline;

import java.util.List;
import stria.io.Region;
import stria.shard.ShardId;

/** What part of a genome a scan reports: all of it, some regions, or one shard of a split run. */
public sealed interface Selection {
    /** Every contig, whole. */
    record WholeGenome() implements Selection {
    }

    /** The loci that start in these regions (0-based, end exclusive), reported whole. */
    record Regions(List<Region> regions) implements Selection {
        public Regions {
            regions = List.copyOf(regions);
        }
    }

    /** The pieces that shard {@code id} owns in the partition of the genome on {@code grain}. */
    record OneShard(ShardId id, int grain) implements Selection {
    }

    static Selection wholeGenome() {
        return new WholeGenome();
    }

    static Selection regions(List<Region> regions) {
        return new Regions(regions);
    }

    /** A shard of the partition on the default grain ({@link Geometry#SHARD_GRAIN}). */
    static Selection shard(ShardId id) {
        return new OneShard(id, Geometry.SHARD_GRAIN);
    }
}
