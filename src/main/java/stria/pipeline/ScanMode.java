package stria.pipeline;

import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.function.LongConsumer;
import stria.out.LocusSink;
import stria.score.Locus;
import stria.score.NeedMoreContextException;

/**
 * What differs between the two modes of a scan: which runs a window keeps, and how the stitched runs of a
 * unit become its loci. {@link GenomeScan} does the rest alike for both.
 */
sealed interface ScanMode permits ExactMode, ImperfectMode {
    /** @param scoreChunk length of the stretches scored as separate tasks (imperfect mode) */
    static ScanMode of(ScanSettings settings, int scoreChunk) {
        return settings.exact() ? new ExactMode(settings.filters())
                : new ImperfectMode(settings.filters(), scoreChunk);
    }

    /** Whether a window keeps a complete run (runs touching a window end are always kept, for stitching). */
    boolean keep(int start, int end, int period);

    /**
     * The longest period the engine looks for: runs of longer period are never used by this mode, and the
     * engine skips the deeper LCP intervals when it need not report them.
     */
    int enginePeriod();

    /** Bases read beyond the context of a unit that is not a whole contig, on each side. */
    int readPad();

    /** The share of a unit's progress that finding its runs earns; turning them into loci earns the rest. */
    double findShare();

    /**
     * One pass over the runs of a unit's context {@code plan} (read into {@code seq}, which also knows the
     * composition of the blocks read), loci to {@code out}.
     */
    Pass pass(ScanUnit unit, ContigStore seq, WindowPlan plan, LocusSink out);

    /**
     * Whether the sink's {@link LocusSink#reach reach} beside one of {@code loci} leaves the context
     * {@code plan} of a unit that is not a whole contig (where the contig does not end first); the context must
     * then be widened like for a locus that may reach beyond it.
     */
    static boolean reachLeavesContext(List<Locus> loci, int reach, WindowPlan plan, int contigLength) {
        if (reach == 0) {
            return false;
        }
        for (Locus l : loci) {
            if ((plan.lo() > 0 && l.start() - reach < plan.lo())
                    || (plan.hi() < contigLength && (long) l.end() + reach > plan.hi())) {
                return true;
            }
        }
        return false;
    }

    /** Receives the stitched runs of the context, then delivers the unit's loci. */
    interface Pass extends Stitcher.Sink {
        /**
         * Delivers the loci of the unit to the sink, using the pool when it helps; {@code solved} hears of
         * bases whose loci are delivered.
         *
         * @throws NeedMoreContextException when a locus may reach beyond the context; nothing is delivered
         *                                   then (it cannot happen for a whole contig)
         */
        void finish(ExecutorService pool, LongConsumer solved) throws InterruptedException;
    }
}
