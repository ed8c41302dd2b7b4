package stria.shard;

import java.util.List;

/**
 * Shard {@code k} of {@code n} (1-based, as job-array indexes are): the pieces it owns, in genome order.
 * A shard with no pieces is valid; its result has a header and no loci.
 */
public record Shard(int k, int n, List<Piece> pieces) {
    public Shard {
        if (n < 1 || k < 1 || k > n) {
            throw new IllegalArgumentException("shard " + k + "/" + n);
        }
        pieces = List.copyOf(pieces);
    }

    public long bases() {
        long b = 0;
        for (Piece p : pieces) {
            b += p.length();
        }
        return b;
    }

    /** Whether a locus starting at {@code position} of {@code contig} belongs to this shard. */
    public boolean owns(String contig, int position) {
        for (Piece p : pieces) {
            if (p.contig().equals(contig) && position >= p.start() && position < p.end()) {
                return true;
            }
        }
        return false;
    }

    /** The label written in result headers, {@code K/N}. */
    public String label() {
        return k + "/" + n;
    }
}
