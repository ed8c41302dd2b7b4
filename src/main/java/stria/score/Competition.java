package stria.score;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * One locus, one period: decides between candidates that share bases. Each candidate has a strength,
 * its log-odds score less a charge per motif base. Among candidates linked by overlap, the set that
 * overlaps at most at its edges and has the largest total strength wins (weighted interval scheduling);
 * winners are taken strongest first (ties: shorter period, earlier start); every other candidate keeps
 * its longest stretch not covered by one taken before, if the caller's trimmer still accepts it.
 * Clusters are independent, so the outcome for a stretch of contig depends only on the candidates in it.
 */
final class Competition {
    private Competition() {
    }

    /** Realigns a candidate on a stretch of it, or returns null when that stretch is not a locus. */
    interface Trimmer {
        Candidate trim(Candidate k, int from, int to);
    }

    /** Order by start, end, period. */
    static int byPosition(Candidate a, Candidate b) {
        int c = Integer.compare(a.start, b.start);
        if (c == 0) {
            c = Integer.compare(a.end, b.end);
        }
        return c != 0 ? c : Integer.compare(a.period, b.period);
    }

    /**
     * Charge per motif base, in score units (tenths of a bit): about half a uniform match, the former one
     * point in a match's two. On bench/planted.sh (max evalue 5) 9 and 12 gave the same calls, 6 lost four
     * planted loci (recall 0.9798 against 0.9823).
     */
    static final int MOTIF_CHARGE = 9;

    /**
     * Strength in a competition: the alignment score less {@link #MOTIF_CHARGE} per motif base. A long
     * consensus can absorb the errors of a short repeat copy by copy (a 30-base "unit" of an imperfect CAAT
     * repeat agrees a little better than CAAT itself); charging for the motif makes the shorter period win
     * unless the longer one explains the bases clearly better.
     */
    static int strength(int score, int period) {
        return score - MOTIF_CHARGE * period;
    }

    /** Order strongest first; ties: shorter period, then by position. */
    static int byStrength(Candidate a, Candidate b) {
        int c = Integer.compare(strength(b.score, b.period), strength(a.score, a.period));
        if (c == 0) {
            c = Integer.compare(a.period, b.period);
        }
        return c != 0 ? c : byPosition(a, b);
    }

    /**
     * Sorts in place and stably, by {@link #byStrength} or else {@link #byPosition}: the order a library
     * sort gives with the same comparison. Written out because the library's object sort is one method
     * shared by every comparator in the process; each new comparator it meets makes the JIT compile it
     * again (a fifth of all optimising-compiler time on a human chromosome).
     */
    static void sort(List<Candidate> list, boolean strongestFirst) {
        Candidate[] base = list.toArray(new Candidate[0]);
        int[] order = order(base, strongestFirst);
        for (int i = 0; i < order.length; i++) {
            list.set(i, base[order[i]]);
        }
    }

    /** Indices of {@code base} in the stable order of {@link #sort}. */
    private static int[] order(Candidate[] base, boolean strongestFirst) {
        int n = base.length;
        int[] idx = new int[n];
        for (int i = 0; i < n; i++) {
            idx[i] = i;
        }
        mergeSort(base, idx, new int[n], 0, n, strongestFirst);
        return idx;
    }

    private static int compare(Candidate a, Candidate b, boolean strongestFirst) {
        return strongestFirst ? byStrength(a, b) : byPosition(a, b);
    }

    private static void mergeSort(Candidate[] base, int[] a, int[] tmp, int from, int to, boolean s) {
        if (to - from <= 8) {
            for (int i = from + 1; i < to; i++) {
                int x = a[i];
                int j = i;
                while (j > from && compare(base[a[j - 1]], base[x], s) > 0) {
                    a[j] = a[j - 1];
                    j--;
                }
                a[j] = x;
            }
            return;
        }
        int mid = (from + to) >>> 1;
        mergeSort(base, a, tmp, from, mid, s);
        mergeSort(base, a, tmp, mid, to, s);
        if (compare(base[a[mid - 1]], base[a[mid]], s) <= 0) {
            return;
        }
        System.arraycopy(a, from, tmp, from, to - from);
        int i = from;
        int j = mid;
        int k = from;
        while (i < mid && j < to) {
            a[k++] = compare(base[tmp[j]], base[tmp[i]], s) < 0 ? tmp[j++] : tmp[i++];
        }
        while (i < mid) {
            a[k++] = tmp[i++];
        }
        while (j < to) {
            a[k++] = tmp[j++];
        }
    }

    /** The winners among {@code cands} (sorted in place by position), sorted by start, end, period. */
    static List<Candidate> resolve(List<Candidate> cands, Trimmer trimmer) {
        sort(cands, false);
        List<Candidate> won = new ArrayList<>();
        int i = 0;
        while (i < cands.size()) {
            // a cluster: candidates linked by overlap
            int j = i + 1;
            int end = cands.get(i).end;
            while (j < cands.size() && cands.get(j).start < end) {
                end = Math.max(end, cands.get(j).end);
                j++;
            }
            won.addAll(resolveCluster(cands.subList(i, j), trimmer));
            i = j;
        }
        return won;
    }

    private static List<Candidate> resolveCluster(List<Candidate> cluster, Trimmer trimmer) {
        List<Candidate> taken = new ArrayList<>();
        Candidate last = null;
        for (Candidate k : order(cluster)) {
            if (last != null && last.start == k.start && last.end == k.end && last.period == k.period) {
                continue;
            }
            last = k;
            Candidate kept = free(k, taken, trimmer);
            if (kept != null) {
                taken.add(kept);
            }
        }
        sort(taken, false);
        return taken;
    }

    /** The order candidates are taken in: the {@link #tiling}, then the rest, each strongest first. */
    private static List<Candidate> order(List<Candidate> cluster) {
        List<Candidate> order = new ArrayList<>();
        boolean[] tiled = new boolean[cluster.size()];
        for (int t : tiling(cluster)) {
            tiled[t] = true;
            order.add(cluster.get(t));
        }
        sort(order, true);
        List<Candidate> rest = new ArrayList<>();
        for (int t = 0; t < cluster.size(); t++) {
            if (!tiled[t]) {
                rest.add(cluster.get(t));
            }
        }
        sort(rest, true);
        order.addAll(rest);
        return order;
    }

    /**
     * Indices in {@code cluster} of the set of candidates, overlapping at most at their edges
     * ({@link #core}), with the largest total {@link #weight} (weighted interval scheduling). A locus that
     * one longer period covers in one piece can still lose to two neighbours that explain its parts
     * better, as with (GGAA)n(GCAA)m against a 12-base unit mixing both.
     */
    static int[] tiling(List<Candidate> cluster) {
        int n = cluster.size();
        int[] es = new int[n];
        int[] ee = new int[n];
        for (int i = 0; i < n; i++) {
            Candidate k = cluster.get(i);
            es[i] = k.start + edgeTolerance(k);
            ee[i] = k.end - edgeTolerance(k);
        }
        // by core end, ties strongest first (then by index): a candidate's rank in a stable strength order
        // breaks the ties, so one primitive sort of (end, rank) keys gives that order
        int[] strong = order(cluster.toArray(new Candidate[0]), true);
        long[] keys = new long[n];
        for (int r = 0; r < n; r++) {
            keys[strong[r]] = r;
        }
        for (int i = 0; i < n; i++) {
            keys[i] |= (long) ee[i] << 32;
        }
        Arrays.sort(keys);
        int[] byEnd = new int[n];
        for (int r = 0; r < n; r++) {
            byEnd[r] = strong[(int) keys[r]];
        }
        long[] best = new long[n + 1];
        boolean[] use = new boolean[n + 1];
        int[] prev = new int[n + 1];
        int used = 0;
        for (int r = 1; r <= n; r++) {
            int i = byEnd[r - 1];
            // last candidate in end order that ends at or before this one starts
            int lo = 0;
            int hi = r - 1;
            while (lo < hi) {
                int mid = (lo + hi + 1) >>> 1;
                if (ee[byEnd[mid - 1]] <= es[i]) {
                    lo = mid;
                } else {
                    hi = mid - 1;
                }
            }
            long with = best[lo] + weight(cluster.get(i));
            if (with > best[r - 1]) {
                best[r] = with;
                use[r] = true;
                prev[r] = lo;
            } else {
                best[r] = best[r - 1];
                prev[r] = r - 1;
            }
        }
        int[] chosen = new int[n];
        for (int r = n; r > 0; r = prev[r]) {
            if (use[r]) {
                chosen[used++] = byEnd[r - 1];
            }
        }
        return Arrays.copyOf(chosen, used);
    }

    /** What a candidate adds to a tiling: its strength, and at least 1, so that every locus counts. */
    static long weight(Candidate k) {
        return Math.max(1, strength(k.score, k.period));
    }

    /**
     * Bases at each end of a candidate that may overlap a neighbour in the tiling: extensions of neighbours
     * often claim a base or two of each other. Two candidates fit one tiling when their stretches without
     * these bases do not overlap.
     */
    static int edgeTolerance(Candidate k) {
        return Math.min(EDGE_TOLERANCE, k.length() / 8);
    }

    /** Bases at each end of a locus that may overlap a neighbour in the tiling. */
    private static final int EDGE_TOLERANCE = 3;

    /** The candidate itself if it overlaps nothing taken, else its longest free stretch realigned, or null. */
    private static Candidate free(Candidate k, List<Candidate> taken, Trimmer trimmer) {
        boolean clash = false;
        for (Candidate t : taken) {
            if (t.start < k.end && k.start < t.end) {
                clash = true;
                break;
            }
        }
        if (!clash) {
            return k;
        }
        // longest stretch of [k.start, k.end) outside every taken locus; leftmost on ties
        int bestA = 0;
        int bestB = 0;
        int x = k.start;
        while (x < k.end) {
            int blockEnd = -1;
            for (Candidate t : taken) {
                if (t.start <= x && x < t.end) {
                    blockEnd = Math.max(blockEnd, t.end);
                }
            }
            if (blockEnd >= 0) {
                x = blockEnd;
                continue;
            }
            int y = k.end;
            for (Candidate t : taken) {
                if (t.start > x && t.start < y) {
                    y = t.start;
                }
            }
            if (y - x > bestB - bestA) {
                bestA = x;
                bestB = y;
            }
            x = y;
        }
        return bestB > bestA ? trimmer.trim(k, bestA, bestB) : null;
    }
}
