package stria.pipeline;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Semaphore;
import java.util.concurrent.ThreadFactory;
import java.util.concurrent.atomic.AtomicInteger;
import stria.StriaException;
import stria.io.ContigBytes;
import stria.out.LocusSink;
import stria.score.NeedMoreContextException;

/**
 * The scan as a library call: the units of a {@link ScanPlan} scanned in order, their loci handed, in order,
 * to a {@link LocusSink}.
 *
 * <p>Threads: a reader thread reads each unit's stretch (a whole contig, or the context around a region
 * or shard piece, entered mid-record) front to back into a {@link ContigStore} and starts its windows on a
 * fixed pool as soon as their bases are in ({@link WindowRunner}); the calling thread stitches the windows of
 * each unit in order and turns the runs into loci ({@link ScanMode}: exact runs, or imperfect loci scored in
 * chunks, again on the pool), writing them as they come. At most {@code 2 threads + 4} windows are in flight
 * and a contig longer than {@link #IN_MEMORY_MAX} (or one window) is kept in a temporary file, not in memory,
 * so memory depends on window length and thread count, not on contig length (the exact runs a unit keeps as
 * seeds, a few per kilobase, are the one part that grows with it).
 *
 * <p>A unit that is not a whole contig keeps only a context around it ({@link Geometry#context}); when a run
 * or a locus may reach beyond it ({@link NeedMoreContextException}, the one signal for it), the margin grows,
 * the context is read anew and the unit computed again.
 *
 * <p>Every decision that shapes the output depends only on the sequence, never on which thread or window did
 * the work, so the bytes written are the same for any thread count and window length.
 */
public final class GenomeScan {
    /**
     * Longest stretch held in an array rather than a temporary file (or one window, when longer): an
     * assembly of many small contigs then never touches the disk.
     */
    static final int IN_MEMORY_MAX = 4_000_000;

    private final ScanSettings settings;
    private final ScanMode mode;
    private final Progress progress;
    private final long initialMargin;
    private final int inMemoryMax;
    private final int block;

    public GenomeScan(ScanSettings settings, Progress progress) {
        this(settings, progress, Geometry.initialMargin(settings.filters().maxPeriod()), ImperfectMode.SCORE_CHUNK,
                Math.max(IN_MEMORY_MAX, settings.window()), Geometry.COMPOSITION_BLOCK);
    }

    /**
     * With the context first computed around a unit that is not a whole contig, the length of scoring
     * chunks, the longest contig held in memory and the length of composition blocks (tests force all four
     * small).
     */
    GenomeScan(ScanSettings settings, Progress progress, long initialMargin, int scoreChunk, int inMemoryMax,
               int block) {
        this.settings = settings;
        this.mode = ScanMode.of(settings, scoreChunk);
        this.progress = progress;
        this.initialMargin = initialMargin;
        this.inMemoryMax = inMemoryMax;
        this.block = block;
    }

    /** Scans every unit of {@code plan}; {@link LocusSink#finish} is called once all are done. */
    public void run(ScanPlan plan, LocusSink out) {
        run(plan.units(), out);
    }

    /** What the reader thread hands the calling thread. */
    private sealed interface Queued {
    }

    /** A unit whose stretch is being read and whose windows are being computed. */
    private record Unit(ScanUnit unit, ContigStore store, WindowRunner.Windows windows) implements Queued {
    }

    private record Failed(Throwable error) implements Queued {
    }

    private record End() implements Queued {
    }

    void run(List<ScanUnit> units, LocusSink out) {
        int threads = settings.threads();
        AtomicInteger n = new AtomicInteger();
        ThreadFactory tf = r -> {
            Thread t = new Thread(r, "stria-worker-" + n.incrementAndGet());
            t.setDaemon(true);
            return t;
        };
        ExecutorService pool = Executors.newFixedThreadPool(threads, tf);
        Semaphore permits = new Semaphore(2 * threads + 4);
        BlockingQueue<Queued> queue = new ArrayBlockingQueue<>(2 * threads + 4);
        Stores stores = new Stores();
        WindowRunner runner = new WindowRunner(pool, mode.enginePeriod(), mode::keep);
        Thread reader = new Thread(() -> produce(units, runner, permits, queue, stores), "stria-reader");
        reader.setDaemon(true);
        reader.start();
        try {
            while (true) {
                Queued q = queue.take();
                if (q instanceof End) {
                    break;
                }
                if (q instanceof Failed f) {
                    throw unchecked(f.error());
                }
                Unit u = (Unit) q;
                consume(u, runner, pool, out, stores);
                stores.close(u.store());
            }
            out.finish();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new StriaException("interrupted");
        } finally {
            reader.interrupt();
            pool.shutdownNow();
            try {
                reader.join(10_000);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            stores.closeAll();
        }
    }

    /**
     * The stores open at any time (one per unit in flight), closed by the consumer after each unit and all
     * together when the scan ends, however it ends.
     */
    private final class Stores {
        private final List<ContigStore> open = new ArrayList<>();
        private boolean closed;

        /**
         * A store of the stretch a unit's runs and loci may read: the whole contig, or the context plus the
         * mode's read pad on each side, widened to whole composition blocks so that every position read
         * has the background a whole-contig scan gives it.
         */
        ContigStore open(ScanUnit u, Range context) {
            int pad = u.wholeContig() ? 0 : mode.readPad();
            int length = u.contig().length();
            int origin = Math.max(0, context.lo() - pad);
            int end = (int) Math.min(length, (long) context.hi() + pad);
            if (end > origin) {
                origin = ContigStore.blockStartAt(origin, length, block);
                end = ContigStore.blockEndAt(end - 1, length, block);
            }
            ContigStore st = ContigStore.open(u.contig(), origin, end, u.source().stream(u.contig(), origin),
                    inMemoryMax, block);
            synchronized (this) {
                if (!closed) {
                    open.add(st);
                    return st;
                }
            }
            st.close();
            throw new StriaException("interrupted");
        }

        synchronized void close(ContigStore st) {
            st.close();
            open.remove(st);
        }

        synchronized void closeAll() {
            closed = true;
            for (ContigStore st : open) {
                st.close();
            }
            open.clear();
        }
    }

    private void produce(List<ScanUnit> units, WindowRunner runner, Semaphore permits, BlockingQueue<Queued> queue,
                         Stores stores) {
        WindowRunner.Windows current = null;
        try {
            for (ScanUnit u : units) {
                Range context = u.wholeContig() ? new Range(0, u.contig().length()) : context(u, initialMargin);
                ContigStore store = stores.open(u, context);
                if (!u.wholeContig()) {
                    // the scorer reads a little beyond the windows' stretch
                    store.fill(store.end);
                }
                current = runner.windows(plan(context), permits);
                queue.put(new Unit(u, store, current));
                runner.start(store, current);
            }
            queue.put(new End());
        } catch (InterruptedException e) {
            // the consumer stopped; nothing more to do
        } catch (Throwable t) {
            // whatever the consumer waits for (a window of this unit or of one before), it hears of it now
            runner.abort(t);
            try {
                if (current != null) {
                    // bases that cannot be read fail the windows still waiting for them
                    current.fail(t);
                }
            } catch (Throwable again) {
                t.addSuppressed(again);
            }
            try {
                queue.put(new Failed(t));
            } catch (InterruptedException ignored) {
                // consumer gone
            }
        }
    }

    private Range context(ScanUnit u, long margin) {
        return Geometry.context(u.contig().length(), u.from(), u.to(), margin, settings.filters().maxPeriod());
    }

    private WindowPlan plan(Range context) {
        return new WindowPlan(context.lo(), context.hi(), settings.window(), settings.filters().maxPeriod());
    }

    private void consume(Unit w, WindowRunner runner, ExecutorService pool, LocusSink out, Stores stores)
            throws InterruptedException {
        ScanUnit u = w.unit();
        // the sinks read the bases through this view, which follows the context when it is widened
        Current view = new Current(w.store());
        out.begin(u.region(), view);
        WindowPlan plan = w.windows().plan;
        ScanMode.Pass pass = mode.pass(u, w.store(), plan, out);
        w.windows().stitch(pass, k -> found(u, plan, k));
        ContigStore store = w.store();
        long margin = initialMargin;
        while (true) {
            try {
                pass.finish(pool, this::solved);
                break;
            } catch (NeedMoreContextException e) {
                if (u.wholeContig()) {
                    throw e;
                }
            }
            // the context was too short to decide: widen it, read it and compute again
            margin *= Geometry.MARGIN_GROWTH;
            Range context = context(u, margin);
            if (store != w.store()) {
                stores.close(store);
            }
            store = stores.open(u, context);
            store.fill(store.end);
            view.store = store;
            WindowPlan wider = plan(context);
            pass = mode.pass(u, store, wider, out);
            WindowRunner.Windows again = runner.windows(wider, null);
            runner.start(store, again);
            again.stitch(pass, k -> { });
        }
        out.end(u.region(), view);
        if (store != w.store()) {
            stores.close(store);
        }
    }

    /** The bases of the context a unit's loci are delivered from: the first, or the last widened one. */
    private static final class Current implements ContigBytes {
        volatile ContigStore store;

        Current(ContigStore store) {
            this.store = store;
        }

        @Override
        public int length() {
            return store.length();
        }

        @Override
        public void copy(int from, int to, byte[] dst, int off) {
            store.copy(from, to, dst, off);
        }

        @Override
        public byte[] array() {
            return store.array();
        }
    }

    /** Progress, in one place: window {@code k} of the first pass over a unit has been stitched. */
    private void found(ScanUnit u, WindowPlan plan, int k) {
        long a = Math.max(plan.ownedFrom(k), u.from());
        long b = Math.min(plan.ownedTo(k), u.to());
        if (b > a) {
            progress.add(Math.round((b - a) * mode.findShare()));
        }
    }

    /** Progress: the loci of {@code bases} bases have been delivered. */
    private void solved(long bases) {
        progress.add(Math.round(bases * (1 - mode.findShare())));
    }

    /** A failure of a task, rethrown as it was when it is unchecked. */
    static RuntimeException unchecked(Throwable t) {
        if (t instanceof RuntimeException r) {
            return r;
        }
        if (t instanceof Error err) {
            throw err;
        }
        return new IllegalStateException(t);
    }
}
