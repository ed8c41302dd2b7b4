package stria.pipeline;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.Semaphore;
import java.util.concurrent.ThreadFactory;
import java.util.concurrent.atomic.AtomicInteger;
import stria.StriaException;
import stria.io.ContigBytes;
import stria.io.ContigInfo;
import stria.repeats.RunList;
import stria.score.ExactLocus;
import stria.score.Locus;
import stria.score.LocusCaller;
import stria.score.NeedMoreContextException;
import stria.score.ScoreSettings;

/**
 * Scans a list of units (whole contigs, regions or shard pieces) in order and hands their loci, in order, to
 * an {@link Output}.
 *
 * <p>Threads: a reader thread reads each unit's stretch (a whole contig, or the context around a region
 * or shard piece, entered mid-record) front to back into a {@link ContigStore} and queues its windows on a
 * fixed pool as soon as their bases are in; the calling thread stitches the windows of each
 * unit in order and scores them in chunks, again on the pool, writing each chunk's loci as it comes. At
 * most {@code 2 threads + 4} windows are in flight and a contig longer than {@link #IN_MEMORY_MAX} (or one
 * window) is kept in a temporary file, not in memory, so memory depends on window length and thread
 * count, not on contig length (the exact runs a unit keeps as seeds, a few per kilobase, are the one part
 * that grows with it).
 * Every decision that shapes the output depends only on the sequence, never on which thread or window did
 * the work, so the bytes written are the same for any thread count and window length.
 */
public final class GenomeScan {
    /** Receives the results, unit by unit, in order. */
    public interface Output {
        /**
         * {@code seq} holds the bases of the unit and some context around it: the whole contig when the unit
         * is one. It is readable until {@link #endUnit} returns.
         */
        void beginUnit(ScanUnit unit, ContigBytes seq);

        void locus(ScanUnit unit, Locus locus);

        void endUnit(ScanUnit unit, ContigBytes seq);
    }

    /**
     * Length of the stretches scored as separate tasks; any value gives the same output. 1 Mi against 2 Mi:
     * about 2 % more CPU, and less of a task's working data outlives young collections, so peak RSS on the
     * 256 Mb scale genome fell from 255 to 230 MB (bench/scale.sh genomes; 256 Ki cost 12 % more CPU).
     */
    static final int SCORE_CHUNK = 1 << 20;
    /**
     * Longest stretch held in an array rather than a temporary file (or one window, when longer): an
     * assembly of many small contigs then never touches the disk.
     */
    static final int IN_MEMORY_MAX = 4_000_000;

    private final ScanSettings settings;
    private final ScoreSettings filters;
    private final LocusCaller caller;
    private final Progress progress;
    private final long initialMargin;
    private final int scoreChunk;
    private final int inMemoryMax;

    public GenomeScan(ScanSettings settings, Progress progress) {
        this(settings, progress, 65_536 + 8L * settings.filters().maxPeriod(), SCORE_CHUNK,
                Math.max(IN_MEMORY_MAX, settings.window()));
    }

    /**
     * With the context first computed around a unit that is not a whole contig, the length of scoring
     * chunks and the longest contig held in memory (tests force all three small).
     */
    GenomeScan(ScanSettings settings, Progress progress, long initialMargin, int scoreChunk, int inMemoryMax) {
        this.initialMargin = initialMargin;
        this.scoreChunk = scoreChunk;
        this.inMemoryMax = inMemoryMax;
        this.settings = settings;
        this.filters = settings.filters();
        this.caller = new LocusCaller(filters);
        this.progress = progress;
    }

    /** Total bases that will be reported on, for progress. */
    public static long totalBases(List<ScanUnit> units) {
        long t = 0;
        for (ScanUnit u : units) {
            t += u.to() - u.from();
        }
        return t;
    }

    private static final class Work {
        final ScanUnit unit;
        final ContigStore seq;
        final WindowPlan plan;
        final CompletableFuture<WindowRuns>[] windows;
        final Throwable error;

        @SuppressWarnings("unchecked")
        Work(ScanUnit unit, ContigStore seq, WindowPlan plan) {
            this.unit = unit;
            this.seq = seq;
            this.plan = plan;
            this.windows = new CompletableFuture[plan.count()];
            for (int k = 0; k < windows.length; k++) {
                windows[k] = new CompletableFuture<>();
            }
            this.error = null;
        }

        Work(Throwable error) {
            this.unit = null;
            this.seq = null;
            this.plan = null;
            this.windows = null;
            this.error = error;
        }
    }

    private static final Work END = new Work(null);

    public void run(List<ScanUnit> units, Output out) {
        int threads = settings.threads();
        AtomicInteger n = new AtomicInteger();
        ThreadFactory tf = r -> {
            Thread t = new Thread(r, "stria-worker-" + n.incrementAndGet());
            t.setDaemon(true);
            return t;
        };
        ExecutorService pool = Executors.newFixedThreadPool(threads, tf);
        Semaphore permits = new Semaphore(2 * threads + 4);
        BlockingQueue<Work> queue = new ArrayBlockingQueue<>(2 * threads + 4);
        Stores stores = new Stores();
        Thread reader = new Thread(() -> produce(units, pool, permits, queue, stores), "stria-reader");
        reader.setDaemon(true);
        reader.start();
        try {
            while (true) {
                Work w = queue.take();
                if (w == END) {
                    break;
                }
                if (w.error != null) {
                    rethrow(w.error);
                }
                consume(w, pool, permits, out, stores);
                stores.close(w.seq);
            }
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
         * A store of the stretch a unit's runs and scoring may read: the whole contig, or the context
         * {@code [lo, hi)} plus the scorer's read pad on each side.
         */
        ContigStore open(ScanUnit u, int lo, int hi) {
            int pad = u.wholeContig() ? 0 : caller.readPad();
            int origin = Math.max(0, lo - pad);
            int end = (int) Math.min(u.contig().length(), (long) hi + pad);
            ContigStore st = ContigStore.open(u.contig(), origin, end, u.source().stream(u.contig(), origin),
                    inMemoryMax);
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

    private void produce(List<ScanUnit> units, ExecutorService pool, Semaphore permits, BlockingQueue<Work> queue,
                         Stores stores) {
        Work w = null;
        try {
            int maxPeriod = filters.maxPeriod();
            WindowRuns.Keep keep = this::keep;
            for (ScanUnit u : units) {
                int[] range = initialRange(u);
                ContigStore seq = stores.open(u, range[0], range[1]);
                if (!u.wholeContig()) {
                    // the scorer reads a little beyond the windows' stretch
                    seq.fill(seq.end);
                }
                w = new Work(u, seq, new WindowPlan(range[0], range[1], settings.window(), maxPeriod));
                queue.put(w);
                ContigStore s = seq;
                for (int k = 0; k < w.windows.length; k++) {
                    permits.acquire();
                    int ws = w.plan.start(k), we = w.plan.end(k);
                    s.fill(we);
                    CompletableFuture<WindowRuns> f = w.windows[k];
                    pool.execute(() -> {
                        try {
                            f.complete(WindowRuns.compute(s, ws, we, maxPeriod, keep));
                        } catch (Throwable t) {
                            f.completeExceptionally(t);
                        }
                    });
                }
            }
            queue.put(END);
        } catch (InterruptedException e) {
            // the consumer stopped; nothing more to do
        } catch (Throwable t) {
            if (w != null) {
                // bases that cannot be read fail the windows still waiting for them, so the consumer
                // stops at the first window it cannot have, in order
                for (CompletableFuture<WindowRuns> f : w.windows) {
                    f.completeExceptionally(t);
                }
            }
            try {
                queue.put(new Work(t));
            } catch (InterruptedException ignored) {
                // consumer gone
            }
        }
    }

    /** Context around a unit that is not a whole contig: runs are computed on [lo, hi). */
    private int[] initialRange(ScanUnit u) {
        if (u.wholeContig()) {
            return new int[] {0, u.contig().length()};
        }
        return widen(u, initialMargin);
    }

    /**
     * Runs that start within {@code 2 maxPeriod} of the end of the known stretch may be too short there to be
     * seen at all, so the margin never goes below that.
     */
    private int[] widen(ScanUnit u, long margin) {
        margin = Math.max(margin, 2L * filters.maxPeriod() + 2);
        long lo = Math.max(0, u.from() - margin);
        long hi = Math.min(u.contig().length(), u.to() + margin);
        return new int[] {(int) lo, (int) hi};
    }

    private void consume(Work w, ExecutorService pool, Semaphore permits, Output out, Stores stores)
            throws InterruptedException {
        ScanUnit u = w.unit;
        out.beginUnit(u, w.seq);
        WindowPlan plan = w.plan;
        boolean streamExact = settings.exact() && u.wholeContig();
        RunList kept = new RunList();
        Stitcher.Sink sink;
        if (streamExact) {
            sink = (s, e, p) -> {
                if (passes(s, e, p)) {
                    out.locus(u, ExactLocus.of(w.seq, s, e, p));
                }
            };
        } else {
            sink = collector(u, plan, kept);
        }
        Stitcher st = new Stitcher(plan, sink);
        for (int k = 0; k < plan.count(); k++) {
            WindowRuns r = get(w.windows[k]);
            w.windows[k] = null;
            permits.release();
            st.accept(k, r);
            long a = Math.max(plan.ownedFrom(k), u.from());
            long b = Math.min(plan.ownedTo(k), u.to());
            if (b > a) {
                // imperfect mode: finding runs is half the work of a stretch, scoring it the other half
                progress.add(settings.exact() ? b - a : (b - a) / 2);
            }
        }
        st.finish();
        if (!streamExact) {
            long margin = initialMargin;
            ContigStore seq = w.seq;
            while (true) {
                List<Locus> loci = settings.exact() ? exactFromRange(u, seq, plan, kept)
                        : score(u, seq, plan, kept, pool, out);
                if (loci != null) {
                    for (Locus l : loci) {
                        out.locus(u, l);
                    }
                    break;
                }
                // the stretch of known runs was too short to decide: widen it, read it and compute again
                margin *= 4;
                int[] range = widen(u, margin);
                if (seq != w.seq) {
                    stores.close(seq);
                }
                seq = stores.open(u, range[0], range[1]);
                seq.fill(seq.end);
                plan = new WindowPlan(range[0], range[1], settings.window(), filters.maxPeriod());
                kept = new RunList();
                runRange(seq, plan, collector(u, plan, kept), pool);
            }
            if (seq != w.seq) {
                stores.close(seq);
            }
        }
        out.endUnit(u, w.seq);
    }

    private Stitcher.Sink collector(ScanUnit u, WindowPlan plan, RunList kept) {
        if (settings.exact()) {
            return (s, e, p) -> {
                if (s >= u.from() && s < u.to()) {
                    kept.add(s, e, p);
                }
            };
        }
        return (s, e, p) -> {
            if (caller.isSeed(s, e, p)) {
                kept.add(s, e, p);
            }
        };
    }

    /** Exact runs of a stretch, or null when one of them may continue past the known stretch. */
    private List<Locus> exactFromRange(ScanUnit u, ContigBytes seq, WindowPlan plan, RunList runs) {
        int len = u.contig().length();
        List<Locus> loci = new ArrayList<>();
        for (int i = 0; i < runs.size(); i++) {
            int s = runs.start(i), e = runs.end(i), p = runs.period(i);
            if ((e == plan.hi() && plan.hi() < len) || (s == plan.lo() && plan.lo() > 0)) {
                return null;
            }
            if (passes(s, e, p)) {
                loci.add(ExactLocus.of(seq, s, e, p));
            }
        }
        return loci;
    }

    /**
     * Imperfect loci of a unit, scored in chunks on the pool. A whole contig never needs more context: its
     * loci go to {@code out} chunk by chunk as they are ready and the result is an empty list. A part of a
     * contig is answered whole, or null when more context is needed.
     */
    private List<Locus> score(ScanUnit u, ContigBytes seq, WindowPlan plan, RunList seeds, ExecutorService pool,
                              Output out) throws InterruptedException {
        boolean stream = u.wholeContig();
        List<Future<List<Locus>>> parts = new ArrayList<>();
        List<Integer> sizes = new ArrayList<>();
        for (long a = u.from(); a < u.to(); a += scoreChunk) {
            int from = (int) a;
            int to = (int) Math.min(u.to(), a + scoreChunk);
            parts.add(pool.submit(() -> caller.call(seq, seeds, plan.lo(), plan.hi(), from, to)));
            sizes.add(to - from);
        }
        List<Locus> all = new ArrayList<>();
        boolean more = false;
        for (int i = 0; i < parts.size(); i++) {
            List<Locus> loci = null;
            try {
                loci = parts.get(i).get();
                parts.set(i, null);
            } catch (ExecutionException e) {
                if (e.getCause() instanceof NeedMoreContextException && !stream) {
                    more = true;
                    continue;
                }
                rethrow(e.getCause());
            }
            if (stream) {
                for (Locus l : loci) {
                    out.locus(u, l);
                }
            } else {
                all.addAll(loci);
            }
            progress.add(sizes.get(i) - sizes.get(i) / 2);
        }
        return more ? null : all;
    }

    private void runRange(ContigBytes seq, WindowPlan plan, Stitcher.Sink sink, ExecutorService pool)
            throws InterruptedException {
        List<Future<WindowRuns>> fs = new ArrayList<>();
        int maxPeriod = filters.maxPeriod();
        WindowRuns.Keep keep = this::keep;
        for (int k = 0; k < plan.count(); k++) {
            int ws = plan.start(k), we = plan.end(k);
            fs.add(pool.submit(() -> WindowRuns.compute(seq, ws, we, maxPeriod, keep)));
        }
        Stitcher st = new Stitcher(plan, sink);
        for (int k = 0; k < fs.size(); k++) {
            try {
                st.accept(k, fs.get(k).get());
            } catch (ExecutionException e) {
                rethrow(e.getCause());
            }
        }
        st.finish();
    }

    /** The runs a window must keep besides those touching its ends: reported runs, or the scorer's seeds. */
    private boolean keep(int s, int e, int p) {
        return settings.exact() ? passes(s, e, p) : caller.isSeed(s, e, p);
    }

    private boolean passes(int s, int e, int p) {
        int len = e - s;
        return p >= filters.minPeriod() && p <= filters.maxPeriod() && len >= filters.minLength()
                && len >= filters.minCopies() * p - 1e-9;
    }

    private static WindowRuns get(CompletableFuture<WindowRuns> f) throws InterruptedException {
        try {
            return f.get();
        } catch (ExecutionException e) {
            rethrow(e.getCause());
            return null;
        }
    }

    private static void rethrow(Throwable t) {
        if (t instanceof RuntimeException r) {
            throw r;
        }
        if (t instanceof Error err) {
            throw err;
        }
        throw new IllegalStateException(t);
    }
}
