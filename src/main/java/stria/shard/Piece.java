package stria.shard;

/** A stretch of one contig owned by a shard, 0-based, end exclusive. */
public record Piece(String contig, int start, int end) {
    public Piece {
        if (start < 0 || end <= start) {
            throw new IllegalArgumentException("empty or negative piece " + contig + " " + start + " " + end);
        }
    }

    public int length() {
        return end - start;
    }

    /** As people type regions: 1-based, inclusive. */
    public String toRegionString() {
        return contig + ":" + (start + 1) + "-" + end;
    }
}
