package stria.score;

import java.util.List;
import stria.repeats.RunList;

/**
 * Turns exact runs into imperfect tandem-repeat loci. Placeholder: the scorer is being written.
 *
 * <p>Contract the pipeline relies on (windows, threads and shards all depend on it):
 * <ul>
 *   <li>{@code seq} is the whole contig as read (ASCII, any case; letters other than ACGT break repeats).
 *   <li>{@code seeds} holds the exact runs that {@link #isSeed} accepts and that intersect
 *       {@code [lo, hi)}, sorted by start, end, period. Runs are only known inside {@code [lo, hi)}: a run
 *       that starts at {@code lo} (unless {@code lo == 0}) or ends at {@code hi} (unless
 *       {@code hi == seq length}) may have been clipped there.
 *   <li>The result is the list of loci whose start lies in {@code [from, to)}, sorted by start, end,
 *       period, and it is exactly the restriction to {@code [from, to)} of the result for the whole
 *       contig with complete knowledge ({@code lo = from = 0}, {@code hi = to = length}). When the known
 *       runs do not suffice to guarantee that, it throws {@link NeedMoreContextException}.
 * </ul>
 */
public final class LocusCaller {
    private final ScoreSettings settings;

    public LocusCaller(ScoreSettings settings) {
        this.settings = settings;
    }

    public ScoreSettings settings() {
        return settings;
    }

    /** Whether an exact run takes part in scoring; the pipeline keeps only these in memory. */
    public boolean isSeed(int start, int end, int period) {
        return true;
    }

    public List<Locus> call(byte[] seq, int length, RunList seeds, int lo, int hi, int from, int to) {
        throw new UnsupportedOperationException("scorer not written yet");
    }
}
