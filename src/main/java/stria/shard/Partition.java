package stria.shard;

import java.util.ArrayList;
import java.util.List;
import stria.io.ContigInfo;
import stria.io.Region;

/**
 * Splits a genome into shards of nearly equal size, so that a job array of {@code n} tasks finishes at
 * about the same time.
 *
 * <p>The genome is read as one line of bases: all contigs of all inputs in order. A shard is one stretch
 * of that line, so shards follow one another in genome order and the results of shards 1..n concatenated
 * are sorted. Cuts fall only at contig ends or, inside a contig, at multiples of {@code grain} from its
 * start; between two neighbouring cut points lies at most {@code u = max over contigs of min(length,
 * grain)} bases.
 *
 * <p>Cuts are chosen so that every shard size lies in one window {@code [m, m + w]}: with {@code w = u}
 * such a choice always exists (the set of cut points reachable after k shards is then every cut point
 * between a least and a greatest one, both found greedily, so whether a given {@code m} is feasible
 * takes a check of two numbers), and the largest feasible {@code m} is found by bisection. Within the freedom that
 * window leaves, each cut goes to a contig end when one is in reach, so contigs stay whole where balance
 * allows, and otherwise to the cut point nearest to the ideal {@code k * total / n}. Everything is
 * integer arithmetic on the lengths alone, so every task of an array computes the same partition.
 */
public final class Partition {
    private final long[] starts; // genome offset of each contig, then the total
    private final long total;
    private final int grain;

    private Partition(List<ContigInfo> contigs, int grain) {
        this.grain = grain;
        starts = new long[contigs.size() + 1];
        for (int i = 0; i < contigs.size(); i++) {
            starts[i + 1] = starts[i] + contigs.get(i).length();
        }
        total = starts[contigs.size()];
    }

    /**
     * Partitions {@code contigs} (in genome order) into {@code n} shards.
     *
     * @param grain contigs are cut only at multiples of this many bases from their start
     */
    public static List<Shard> of(List<ContigInfo> contigs, int n, int grain) {
        if (n < 1) {
            throw new IllegalArgumentException("number of shards must be at least 1, not " + n);
        }
        if (grain < 1) {
            throw new IllegalArgumentException("grain must be at least 1, not " + grain);
        }
        Partition p = new Partition(contigs, grain);
        long[] cuts = p.cuts(contigs, n);
        List<Shard> shards = new ArrayList<>(n);
        for (int k = 1; k <= n; k++) {
            shards.add(new Shard(new ShardId(k, n), p.pieces(contigs, cuts[k - 1], cuts[k])));
        }
        return shards;
    }

    /** Genome offsets where shards begin and end: cuts[0] = 0, cuts[n] = total. */
    private long[] cuts(List<ContigInfo> contigs, int n) {
        long[] c = new long[n + 1];
        c[n] = total;
        if (total == 0) {
            return c;
        }
        long u = 0;
        for (ContigInfo s : contigs) {
            u = Math.max(u, Math.min(s.length(), grain));
        }
        long[] lo = new long[n + 1];
        long[] hi = new long[n + 1];
        // w = u always suffices (see the class comment); widening is a guard, not an expected path
        for (long w = u; ; w = Math.min(total, 2 * w)) {
            long m = largestFeasibleMinimum(n, lo);
            if (reachesEnd(m, w, n, hi)) {
                reachable(m, n, lo);
                for (int k = n - 1; k >= 1; k--) {
                    long a = Math.max(lo[k], c[k + 1] - m - w);
                    long b = Math.min(hi[k], c[k + 1] - m);
                    c[k] = choose(a, b, idealCut(k, n));
                }
                return c;
            }
            if (w >= total) {
                throw new IllegalStateException("no partition of " + total + " bases into " + n);
            }
        }
    }

    private long idealCut(int k, int n) {
        return Math.floorDiv(Math.multiplyExact(total, k) + n / 2, n);
    }

    /** Largest m such that n shards of at least m bases each fit, cutting at the earliest point each time. */
    private long largestFeasibleMinimum(int n, long[] scratch) {
        long ok = 0;
        long bad = total + 1;
        while (bad - ok > 1) {
            long mid = ok + (bad - ok) / 2;
            if (reachable(mid, n, scratch)) {
                ok = mid;
            } else {
                bad = mid;
            }
        }
        return ok;
    }

    /** Fills lo[k] with the earliest cut after k shards of at least m bases; false if n do not fit. */
    private boolean reachable(long m, int n, long[] lo) {
        lo[0] = 0;
        for (int k = 1; k <= n; k++) {
            long x = lo[k - 1] + m;
            if (x > total) {
                return false;
            }
            lo[k] = firstCutAtOrAfter(x);
        }
        return true;
    }

    /** Fills hi[k] with the latest cut after k shards of at most m + w bases; whether that reaches the end. */
    private boolean reachesEnd(long m, long w, int n, long[] hi) {
        hi[0] = 0;
        for (int k = 1; k <= n; k++) {
            hi[k] = lastCutAtOrBefore(Math.min(total, hi[k - 1] + m + w));
        }
        return hi[n] == total;
    }

    /** A cut in [a, b]: a contig end if any (nearest to x), else the cut point nearest to x. */
    private long choose(long a, long b, long x) {
        long cx = Math.max(a, Math.min(b, x));
        int i = lastStartAtOrBefore(cx);
        long best = -1;
        if (starts[i] >= a) {
            best = starts[i];
        }
        int j = i;
        while (j < starts.length && starts[j] < cx) {
            j++;
        }
        if (j < starts.length && starts[j] <= b && (best < 0 || starts[j] - x < x - best)) {
            best = starts[j];
        }
        if (best >= 0) {
            return best;
        }
        long before = lastCutAtOrBefore(cx);
        long after = firstCutAtOrAfter(cx);
        boolean beforeOk = before >= a;
        boolean afterOk = after <= b;
        if (beforeOk && afterOk) {
            return after - x < x - before ? after : before;
        }
        return beforeOk ? before : after;
    }

    /** Largest i with starts[i] <= x (x within the genome). */
    private int lastStartAtOrBefore(long x) {
        int lo = 0;
        int hi = starts.length - 1;
        while (lo < hi) {
            int mid = (lo + hi + 1) >>> 1;
            if (starts[mid] <= x) {
                lo = mid;
            } else {
                hi = mid - 1;
            }
        }
        return lo;
    }

    private long firstCutAtOrAfter(long x) {
        if (x >= total) {
            return total;
        }
        int i = lastStartAtOrBefore(x); // contig i holds base x, so it is not empty
        long off = x - starts[i];
        long up = (off + grain - 1) / grain * grain;
        return starts[i] + up < starts[i + 1] ? starts[i] + up : starts[i + 1];
    }

    private long lastCutAtOrBefore(long x) {
        if (x >= total) {
            return total;
        }
        int i = lastStartAtOrBefore(x);
        long off = x - starts[i];
        return starts[i] + off / grain * grain;
    }

    /** The contig pieces of genome stretch [from, to). */
    private List<Region> pieces(List<ContigInfo> contigs, long from, long to) {
        List<Region> out = new ArrayList<>();
        if (from >= to) {
            return out;
        }
        for (int i = lastStartAtOrBefore(from); i < contigs.size() && starts[i] < to; i++) {
            long s = Math.max(from, starts[i]);
            long e = Math.min(to, starts[i + 1]);
            if (s < e) {
                out.add(new Region(contigs.get(i).name(), (int) (s - starts[i]), (int) (e - starts[i])));
            }
        }
        return out;
    }
}
