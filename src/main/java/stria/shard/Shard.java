package stria.shard;

import java.util.List;
import stria.io.Region;

/**
 * One shard of a split run: the stretches of contigs it owns, in genome order. A shard with no pieces is
 * valid; its result has a header and no loci.
 */
public record Shard(ShardId id, List<Region> pieces) {
    public Shard {
        pieces = List.copyOf(pieces);
    }

    public long bases() {
        long b = 0;
        for (Region p : pieces) {
            b += p.length();
        }
        return b;
    }

    /** Whether a locus starting at {@code position} of {@code contig} belongs to this shard. */
    public boolean owns(String contig, int position) {
        for (Region p : pieces) {
            if (p.contig().equals(contig) && position >= p.start() && position < p.end()) {
                return true;
            }
        }
        return false;
    }
}
