package stria.pipeline;

import java.util.List;
import stria.score.ScoreSettings;

/**
 * Everything a scan needs, parsed once by the command line and passed down unchanged.
 *
 * @param exact      report exact runs instead of imperfect loci
 * @param filters    period range, copies, length, purity and score filters
 * @param threads    worker threads
 * @param window     window length in bases (windows overlap by {@link #overlap()})
 * @param regions    region strings as typed (1-based inclusive); empty means whole genomes
 * @param shardK     this shard (1-based), or 0 for an unsplit run
 * @param shardN     number of shards, or 0
 * @param grain      shard cut granularity in bases
 */
public record ScanSettings(boolean exact, ScoreSettings filters, int threads, int window, List<String> regions,
                           int shardK, int shardN, int grain) {

    /** Bases shared by neighbouring windows: enough that every run is seen whole, or stitched, exactly once. */
    public int overlap() {
        return 2 * filters.maxPeriod() + 2;
    }

    /** Smallest window that still leaves an owned stretch between overlaps. */
    public static int minWindow(int maxPeriod) {
        return 4 * maxPeriod + 8;
    }

    /** The words of the {@code #settings} header line: every option that changes data lines. */
    public String describe() {
        ScoreSettings f = filters;
        StringBuilder sb = new StringBuilder();
        sb.append("mode=").append(exact ? "exact" : "imperfect");
        sb.append(" min-period=").append(f.minPeriod());
        sb.append(" max-period=").append(f.maxPeriod());
        sb.append(" min-copies=").append(stripZeros(f.minCopies()));
        sb.append(" min-length=").append(f.minLength());
        if (!exact) {
            sb.append(" min-purity=").append(stripZeros(f.minPurity()));
            sb.append(" min-score=").append(f.minScore());
        }
        return sb.toString();
    }

    static String stripZeros(double v) {
        return java.math.BigDecimal.valueOf(v).stripTrailingZeros().toPlainString();
    }
}
