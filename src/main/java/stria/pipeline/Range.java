package stria.pipeline;

/** A stretch {@code [lo, hi)} of the contig being scanned, 0-based, end exclusive. */
record Range(int lo, int hi) {
    Range {
        if (lo < 0 || hi < lo) {
            throw new IllegalArgumentException("bad range [" + lo + ", " + hi + ")");
        }
    }

    int length() {
        return hi - lo;
    }
}
