package stria.score;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;

/**
 * Components of seed reaches ({@link QuietPoints}) that reach beyond the stretch of one
 * {@link LocusCaller#call} call, solved once for all the calls of one pass that meet them. A pipeline that
 * scores a contig in chunks would otherwise solve a locus longer than a chunk once per chunk it touches:
 * time quadratic in its length. Any call may meet a component first; it solves it while the others wait
 * for the result, and a call whose whole stretch lies in a component already met takes its loci without
 * looking at the sequence. The result is the same as if every call solved alone (the caller's contract
 * makes a component's loci independent of the call).
 *
 * <p>Safe for concurrent calls. A call waits only for a component before which it has nothing of its own
 * left to solve (components are taken left to right), so calls never wait for each other in a circle.
 * Coordinates are the contig's, 0-based, end exclusive. One instance per pass over a stretch of contig.
 */
public final class SharedComponents {
    private final List<Entry> entries = new ArrayList<>();

    private record Entry(int start, int end, CompletableFuture<List<Locus>> loci) {
    }

    /** A solver of one component: its loci, in contig coordinates, sorted by start, end, period. */
    interface Solver {
        List<Locus> solve();
    }

    /**
     * The loci of the component {@code [start, end)}: solved by {@code solver} when no call met it before,
     * else as that call solved it (waiting for it when needed).
     */
    List<Locus> solve(int start, int end, Solver solver) {
        CompletableFuture<List<Locus>> met = null;
        CompletableFuture<List<Locus>> f = new CompletableFuture<>();
        synchronized (entries) {
            for (Entry e : entries) {
                if (e.start == start && e.end == end) {
                    met = e.loci;
                    break;
                }
            }
            if (met == null) {
                entries.add(new Entry(start, end, f));
            }
        }
        // waited for outside the lock: the call solving it may need the lock for its next component
        if (met != null) {
            return join(met);
        }
        try {
            List<Locus> loci = List.copyOf(solver.solve());
            f.complete(loci);
            return loci;
        } catch (RuntimeException | Error e) {
            f.completeExceptionally(e);
            throw e;
        }
    }

    /**
     * The loci of a component met before that holds all of {@code [from, to)}, with start in it; null when
     * there is none.
     */
    List<Locus> covering(int from, int to) {
        CompletableFuture<List<Locus>> f = null;
        synchronized (entries) {
            for (Entry e : entries) {
                if (e.start <= from && to <= e.end) {
                    f = e.loci;
                    break;
                }
            }
        }
        return f == null ? null : startingIn(join(f), from, to, 0);
    }

    /** The loci of {@code all} that start in {@code [from, to)}, shifted by {@code -origin}. */
    static List<Locus> startingIn(List<Locus> all, int from, int to, int origin) {
        List<Locus> out = new ArrayList<>();
        for (Locus l : all) {
            if (l.start() >= from && l.start() < to) {
                out.add(origin == 0 ? l : l.shifted(-origin));
            }
        }
        return out;
    }

    private static List<Locus> join(CompletableFuture<List<Locus>> f) {
        try {
            return f.join();
        } catch (CompletionException e) {
            Throwable c = e.getCause();
            if (c instanceof RuntimeException r) {
                throw r;
            }
            if (c instanceof Error r) {
                throw r;
            }
            throw e;
        }
    }
}
