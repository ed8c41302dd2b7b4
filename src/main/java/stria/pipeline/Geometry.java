package stria.pipeline;

/**
 * How a scan cuts a genome, in one place: windows and their overlap, the context read around a stretch that
 * is not a whole contig, the grain of shard cuts and the composition blocks. Everything here but the
 * composition blocks changes speed and memory, never the output.
 */
public final class Geometry {
    /**
     * Default window: 256,000 bases, or 64 max-periods when that is more (window overlap stays under 4 %), up
     * to 4,000,000. Chosen by bench/window.sh (README): smaller windows keep the engine's arrays in cache;
     * below 64 max-periods the overlap costs more than that gains.
     */
    public static final int DEFAULT_WINDOW = 256_000;
    public static final int DEFAULT_WINDOW_PERIODS = 64;
    public static final int DEFAULT_WINDOW_MAX = 4_000_000;
    /** Largest window accepted. */
    public static final int MAX_WINDOW = 1_000_000_000;
    /** Cuts of a split run inside a contig fall on multiples of this many bases. */
    public static final int SHARD_GRAIN = 1_000_000;
    /**
     * Composition blocks: the background of the log-odds score is the composition of the block of this many
     * bases (from each contig's first base; a last piece under half a block joins the one before) that holds
     * a locus' first base. Blocks are fixed by the contig alone, so no cut changes the output; a region or
     * shard piece is read out to whole blocks.
     */
    public static final int COMPOSITION_BLOCK = 1_000_000;
    /** Each time the context around a stretch turns out too short, its margin grows by this factor. */
    static final int MARGIN_GROWTH = 4;

    private Geometry() {
    }

    /** Bases shared by neighbouring windows: enough that every run is seen whole, or stitched, exactly once. */
    public static int overlap(int maxPeriod) {
        return 2 * maxPeriod + 2;
    }

    /**
     * How far before the end of a window the next window's stretch of owned run starts begins (see
     * {@link WindowPlan}).
     */
    static int ownershipLead(int maxPeriod) {
        return 2 * maxPeriod;
    }

    /** Smallest window that still leaves an owned stretch between overlaps. */
    public static int minWindow(int maxPeriod) {
        return 4 * maxPeriod + 8;
    }

    /** The window used when none is asked for. */
    public static int defaultWindow(int maxPeriod) {
        return (int) Math.max(minWindow(maxPeriod), Math.min(DEFAULT_WINDOW_MAX,
                Math.max(DEFAULT_WINDOW, (long) DEFAULT_WINDOW_PERIODS * maxPeriod)));
    }

    /** Margin of the context first read around a stretch that is not a whole contig. */
    static long initialMargin(int maxPeriod) {
        return 65_536 + 8L * maxPeriod;
    }

    /**
     * The context {@code [lo, hi)} around {@code [from, to)} of a contig of {@code length} bases. Runs that
     * start within {@code 2 maxPeriod} of the end of the known stretch may be too short there to be seen at
     * all, so the margin never goes below that.
     */
    static Range context(int length, int from, int to, long margin, int maxPeriod) {
        long m = Math.max(margin, 2L * maxPeriod + 2);
        return new Range((int) Math.max(0, from - m), (int) Math.min(length, to + m));
    }
}
