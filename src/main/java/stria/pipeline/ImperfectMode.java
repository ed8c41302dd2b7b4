package stria.pipeline;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;
import java.util.function.LongConsumer;
import stria.out.LocusSink;
import stria.repeats.RunList;
import stria.score.Background;
import stria.score.Locus;
import stria.score.LocusCaller;
import stria.score.NeedMoreContextException;
import stria.score.ScoreSettings;
import stria.score.ScoreWorkspace;
import stria.score.SharedComponents;

/**
 * Imperfect loci: the unit keeps the scorer's seed runs and hands them to {@link LocusCaller} in independent
 * chunks on the pool; the caller's contract (any cut gives the same loci) makes the chunks invisible.
 */
final class ImperfectMode implements ScanMode {
    /**
     * Length of the stretches scored as separate tasks; any value gives the same output. 1 Mi against 2 Mi:
     * about 2 % more CPU, and less of a task's working data outlives young collections, so peak RSS on the
     * 256 Mb scale genome fell from 255 to 230 MB (bench/scale.sh genomes; 256 Ki cost 12 % more CPU).
     */
    static final int SCORE_CHUNK = 1 << 20;

    private final LocusCaller caller;
    private final int chunk;

    ImperfectMode(ScoreSettings filters, int chunk) {
        this.caller = new LocusCaller(filters);
        this.chunk = chunk;
    }

    @Override
    public boolean keep(int s, int e, int p) {
        return caller.isSeed(s, e, p);
    }

    @Override
    public int enginePeriod() {
        return caller.seedPeriod();
    }

    @Override
    public int readPad() {
        return caller.readPad();
    }

    @Override
    public double findShare() {
        // finding runs is about half the work of a stretch, scoring it the other half
        return 0.5;
    }

    @Override
    public Pass pass(ScanUnit unit, ContigStore seq, WindowPlan plan, LocusSink out) {
        RunList seeds = new RunList();
        String name = unit.contig().name();
        return new Pass() {
            @Override
            public void run(int s, int e, int p) {
                if (caller.isSeed(s, e, p)) {
                    seeds.add(s, e, p);
                }
            }

            @Override
            public void finish(ExecutorService pool, LongConsumer solved) throws InterruptedException {
                // every block the scorer reads is in by now: the windows have read the whole stretch
                Background background = seq.background();
                // a locus longer than a chunk is solved once, not once per chunk it touches
                SharedComponents shared = new SharedComponents();
                List<Future<List<Locus>>> parts = new ArrayList<>();
                for (long a = unit.from(); a < unit.to(); a += chunk) {
                    int from = (int) a;
                    int to = (int) Math.min(unit.to(), a + chunk);
                    parts.add(pool.submit(() -> caller.call(new ScoreWorkspace(), seq, background, seeds, plan.lo(),
                            plan.hi(), from, to, shared)));
                }
                // a whole contig has all the context there is: its chunks are written as they are ready;
                // a part is written only once every chunk had context enough
                boolean stream = unit.wholeContig();
                List<Locus> all = new ArrayList<>();
                boolean more = false;
                for (int i = 0; i < parts.size(); i++) {
                    List<Locus> loci;
                    try {
                        loci = parts.get(i).get();
                        parts.set(i, null);
                    } catch (ExecutionException e) {
                        if (e.getCause() instanceof NeedMoreContextException && !stream) {
                            // every chunk is waited for: none may still read the context when it is dropped
                            more = true;
                            continue;
                        }
                        throw GenomeScan.unchecked(e.getCause());
                    }
                    if (stream) {
                        for (Locus l : loci) {
                            out.locus(name, l);
                        }
                        long from = unit.from() + (long) i * chunk;
                        solved.accept(Math.min(unit.to(), from + chunk) - from);
                    } else {
                        all.addAll(loci);
                    }
                }
                more |= !stream && ScanMode.reachLeavesContext(all, out.reach(), plan, unit.contig().length());
                if (more) {
                    throw new NeedMoreContextException("a locus of " + unit.region() + " may reach past the context");
                }
                if (!stream) {
                    for (Locus l : all) {
                        out.locus(name, l);
                    }
                    solved.accept(unit.to() - unit.from());
                }
            }
        };
    }
}
