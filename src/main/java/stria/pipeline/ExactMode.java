package stria.pipeline;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.function.LongConsumer;
import stria.out.LocusSink;
import stria.repeats.RunList;
import stria.score.Background;
import stria.score.Calibration;
import stria.score.ExactLocus;
import stria.score.Locus;
import stria.score.NeedMoreContextException;
import stria.score.ScoreSettings;
import stria.score.ScoringModel;

/**
 * Exact runs as loci: each stitched run that passes the filters, motif and composition from its first copy,
 * scored against the background of its composition block.
 */
final class ExactMode implements ScanMode {
    private final ScoreSettings filters;
    private final Calibration calibration;

    ExactMode(ScoreSettings filters) {
        this.filters = filters;
        this.calibration = Calibration.shipped().forPeriods(filters.minPeriod(), filters.maxPeriod());
    }

    @Override
    public boolean keep(int s, int e, int p) {
        return passes(s, e, p);
    }

    private boolean passes(int s, int e, int p) {
        int len = e - s;
        return p >= filters.minPeriod() && p <= filters.maxPeriod() && len >= filters.minLength()
                && len >= filters.minCopies() * p - 1e-9;
    }

    @Override
    public int enginePeriod() {
        return filters.maxPeriod();
    }

    @Override
    public int readPad() {
        return 0;
    }

    @Override
    public double findShare() {
        return 1;
    }

    @Override
    public Pass pass(ScanUnit unit, ContigStore seq, WindowPlan plan, LocusSink out) {
        String name = unit.contig().name();
        if (unit.wholeContig()) {
            // the stitched runs are the loci, in order: written as they come, once the composition block of
            // their first base is read whole
            RunList pending = new RunList();
            int len = unit.contig().length();
            return new Pass() {
                private int head;
                private int block = -1;
                private ScoringModel model;

                @Override
                public void run(int s, int e, int p) {
                    if (passes(s, e, p)) {
                        pending.add(s, e, p);
                        flush(false);
                    }
                }

                private void flush(boolean all) {
                    while (head < pending.size()) {
                        int s = pending.start(head);
                        int k = Background.blockOf(s, len, seq.block);
                        if (k != block) {
                            ScoringModel m = seq.blockModel(k);
                            if (m == null) {
                                if (all) {
                                    throw new IllegalStateException("block " + k + " of " + name + " not read");
                                }
                                return;
                            }
                            block = k;
                            model = m;
                        }
                        out.locus(name, ExactLocus.of(seq, s, pending.end(head), pending.period(head), model,
                                calibration));
                        head++;
                    }
                    pending.clear();
                    head = 0;
                }

                @Override
                public void finish(ExecutorService pool, LongConsumer solved) {
                    flush(true);
                }
            };
        }
        RunList kept = new RunList();
        return new Pass() {
            @Override
            public void run(int s, int e, int p) {
                if (s >= unit.from() && s < unit.to()) {
                    kept.add(s, e, p);
                }
            }

            @Override
            public void finish(ExecutorService pool, LongConsumer solved) {
                int len = unit.contig().length();
                Background background = seq.background();
                List<Locus> loci = new ArrayList<>();
                for (int i = 0; i < kept.size(); i++) {
                    int s = kept.start(i), e = kept.end(i), p = kept.period(i);
                    if ((e == plan.hi() && plan.hi() < len) || (s == plan.lo() && plan.lo() > 0)) {
                        throw new NeedMoreContextException("run at " + s + " may continue past the context");
                    }
                    if (passes(s, e, p)) {
                        loci.add(ExactLocus.of(seq, s, e, p, background.at(s), calibration));
                    }
                }
                if (ScanMode.reachLeavesContext(loci, out.reach(), plan, len)) {
                    throw new NeedMoreContextException("the flanks of a locus of " + unit.region()
                            + " reach past the context");
                }
                for (Locus l : loci) {
                    out.locus(name, l);
                }
            }
        };
    }
}
