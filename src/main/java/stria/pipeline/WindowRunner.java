package stria.pipeline;

import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ConcurrentLinkedDeque;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Semaphore;
import java.util.function.IntConsumer;

/**
 * Runs the engine on the windows of a stretch, on the pool, and hands their runs on in window order through
 * a {@link Stitcher}: the one way windows are computed, for the stretch first read (windows start as soon as
 * their bases are in, throttled by permits) and for a context read again wider.
 */
final class WindowRunner {
    private final ExecutorService pool;
    private final int maxPeriod;
    private final WindowRuns.Keep keep;
    /**
     * One engine workspace per task running at once: borrowed for a window, then given back on top, so the
     * next window takes the one last used, whose buffers are likeliest still in cache.
     */
    private final ConcurrentLinkedDeque<WindowRuns.Workspace> workspaces = new ConcurrentLinkedDeque<>();
    /**
     * Fails once, when the scan cannot go on (the reader failed): every wait for a window also waits on it,
     * so no window left uncompleted by a failure can hold the scan.
     */
    private final CompletableFuture<Void> aborted = new CompletableFuture<>();

    WindowRunner(ExecutorService pool, int maxPeriod, WindowRuns.Keep keep) {
        this.pool = pool;
        this.maxPeriod = maxPeriod;
        this.keep = keep;
    }

    /** Ends every wait for a window, now and later, with {@code cause}. */
    void abort(Throwable cause) {
        aborted.completeExceptionally(cause);
    }

    /** The windows of {@code plan}, not started yet. */
    Windows windows(WindowPlan plan, Semaphore permits) {
        return new Windows(plan, permits, aborted);
    }

    /**
     * Starts every window of {@code w} over {@code store}, each once its bases are read (this thread reads
     * them) and, when {@code w} is throttled, once it has a permit.
     */
    void start(ContigStore store, Windows w) throws InterruptedException {
        for (int k = 0; k < w.runs.length; k++) {
            if (w.permits != null) {
                w.permits.acquire();
            }
            int ws = w.plan.start(k);
            int we = w.plan.end(k);
            store.fill(we);
            CompletableFuture<WindowRuns> f = w.runs[k];
            pool.execute(() -> {
                WindowRuns.Workspace space = workspaces.pollFirst();
                try {
                    f.complete(WindowRuns.compute(store, ws, we, maxPeriod, keep,
                            space != null ? space : (space = new WindowRuns.Workspace())));
                } catch (Throwable t) {
                    f.completeExceptionally(t);
                } finally {
                    if (space != null) {
                        workspaces.offerFirst(space);
                    }
                }
            });
        }
    }

    /** The windows of one stretch and their results to come. */
    static final class Windows {
        final WindowPlan plan;
        private final Semaphore permits;
        private final CompletableFuture<WindowRuns>[] runs;
        private final CompletableFuture<Void> aborted;

        @SuppressWarnings("unchecked")
        private Windows(WindowPlan plan, Semaphore permits, CompletableFuture<Void> aborted) {
            this.plan = plan;
            this.permits = permits;
            this.aborted = aborted;
            this.runs = new CompletableFuture[plan.count()];
            for (int k = 0; k < runs.length; k++) {
                runs[k] = new CompletableFuture<>();
            }
        }

        /**
         * Waits for the windows in order and stitches their runs into {@code sink}, giving back each window's
         * permit as it is taken; {@code done} hears of each window stitched.
         */
        void stitch(Stitcher.Sink sink, IntConsumer done) throws InterruptedException {
            Stitcher st = new Stitcher(plan, sink);
            for (int k = 0; k < runs.length; k++) {
                WindowRuns r;
                try {
                    CompletableFuture.anyOf(runs[k], aborted).get();
                    r = runs[k].get();
                } catch (ExecutionException e) {
                    throw GenomeScan.unchecked(e.getCause());
                }
                runs[k] = null;
                if (permits != null) {
                    permits.release();
                }
                st.accept(k, r);
                done.accept(k);
            }
            st.finish();
        }

        /** Fails the windows not computed yet, so that whoever waits for them stops at the first, in order. */
        void fail(Throwable t) {
            for (CompletableFuture<WindowRuns> f : runs) {
                if (f != null) {
                    f.completeExceptionally(t);
                }
            }
        }
    }
}
