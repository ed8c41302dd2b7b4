package stria.score;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import stria.io.Bases;
import stria.io.ContigBytes;
import stria.repeats.RunList;

/**
 * Turns exact runs into imperfect tandem-repeat loci.
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
 *
 * <h2>How a locus is found</h2>
 * Seeds are exact runs of short period ({@link #SEED_MAX_PERIOD} or less, at least
 * {@link #SEED_EXTRA} bases longer than one copy) and, for periods from {@link RecurrenceSeeds#MIN_PERIOD}
 * up, positions whose short word recurs at a steady distance ({@link RecurrenceSeeds}): at 85 % identity
 * long units have no exact runs at all. Seeds are taken in order of the end of their first copy, and a
 * seed already inside a locus of its period (or, for recurrence seeds, of a period its distance is
 * about a multiple of) adds nothing. Otherwise its first copy is the provisional motif and the locus is
 * extended both ways by aligning against the repeated motif ({@link WrapAligner}: wraparound dynamic
 * programming, Fischetti, Landau, Sellers &amp; Schmidt 1993, in an adaptive band with X-drop). The
 * copies other than the seed's then vote on the consensus: the majority letter at each phase, a phase
 * most copies lack is dropped and a base most copies insert is added, so a seed copy carrying an indel
 * does not fix the period; the result is reduced to its primitive root. A last alignment against the
 * consensus from the left end gives the right end and the counts, and up to {@link #VOTE_ROUNDS} more
 * rounds vote on that alignment while the score rises. Where the bases agree better at a neighbouring
 * distance or about as well at a near-divisor of the period, that period gets a candidate of its own;
 * units of {@link #NEIGHBOUR_MIN_PERIOD} bases or more with few copies also try the periods one off,
 * since a handful of copies votes unreliably on the length of a long unit. A candidate whose copies
 * change motif part way, as in (TGA)n(TGC)m, is split in two.
 * Seeds of one period separated by a few mismatches or a short indel end up in one candidate because
 * the extension runs through them.
 *
 * <h2>One locus, one period</h2>
 * Candidates that share bases compete ({@link Competition}). Each has a strength, its alignment score less one point per
 * motif base: the charge for the motif keeps a long consensus from winning by memorising the errors of
 * a short repeat. Among candidates linked by overlap, the set that overlaps at most at its edges and has
 * the largest total strength wins (weighted interval scheduling), so two neighbours that explain their
 * parts well beat one longer unit that mixes them. Winners are taken strongest first (ties: shorter
 * period, earlier start); every other candidate keeps its longest stretch not covered by one taken
 * before, realigned, if that still passes the filters; this is how a compound repeat such as
 * (CA)n(GA)m comes out as two adjacent loci. Filters apply before the competition, so a locus that
 * would not be reported never suppresses one that would.
 *
 * <h2>Why windows do not change the result</h2>
 * Every seed reaches {@link #reach} bases beyond its ends, and extension never leaves the union of
 * overlapping reaches that holds its seed. A position no reach crosses is quiet: nothing on one side can
 * affect the other. A call finds the nearest quiet point at or left of {@code from} and at or right of
 * {@code to}, far enough inside {@code [lo, hi)} that every seed near them is known exactly, and solves
 * everything between them exactly as a whole-contig call would; without such points it throws.
 */
public final class LocusCaller {
    /** Exact runs of longer period add nothing: recurrence seeds find those repeats too. */
    public static final int SEED_MAX_PERIOD = 12;
    /** Bases beyond one copy an exact run needs to seed: 6 keeps random DNA to a few seeds per kb. */
    public static final int SEED_EXTRA = 6;

    private final ScoreSettings settings;
    private final WrapAligner aligner = new WrapAligner();
    // the left end of a candidate is found while the right end's path is still wanted
    private final WrapAligner leftAligner = new WrapAligner();
    private final RecurrenceSeeds recurrence = new RecurrenceSeeds();

    public LocusCaller(ScoreSettings settings) {
        this.settings = settings;
    }

    /**
     * Whether an exact run takes part in scoring; the pipeline keeps only these in memory. Only short
     * periods: longer repeats are seeded from the sequence itself, so a few seeds per kilobase of random
     * sequence remain.
     */
    public boolean isSeed(int start, int end, int period) {
        return period <= SEED_MAX_PERIOD && period <= settings.maxPeriod() && end - start - period >= SEED_EXTRA;
    }

    /** Bases beyond a seed of period p that its locus may reach, and the gap two seeds may be joined across. */
    static int reach(int p) {
        return 32 + 2 * p;
    }

    /** Score drop that ends an extension: a long unit may carry a burst of errors and still continue. */
    static int xdrop(int p) {
        return 30 + Math.min(p, 60);
    }

    /** Bases beyond {@code [from, to)} a call may need on each side in the best case (no repeat nearby). */
    public int minimumContext() {
        return margin() + reach(settings.maxPeriod()) + RecurrenceSeeds.K + 1;
    }

    private int margin() {
        return RecurrenceSeeds.context(settings.maxPeriod()) + 2 * SEED_MAX_PERIOD + SEED_EXTRA + 8;
    }

    /** Safe to call from several threads at once: each call works in buffers of its own. */
    public List<Locus> call(byte[] seq, int length, RunList seeds, int lo, int hi, int from, int to) {
        return call(ContigBytes.of(seq, length), seeds, lo, hi, from, to);
    }

    /**
     * As {@link #call(byte[], int, RunList, int, int, int, int)}, for a contig that is not held in an array:
     * only the stretch being solved, plus {@link #readPad} on each side, is copied out.
     */
    public List<Locus> call(ContigBytes seq, RunList seeds, int lo, int hi, int from, int to) {
        if (from >= to) {
            return List.of();
        }
        return new LocusCaller(settings).callAlone(seq, seeds, lo, hi, from, to);
    }

    private List<Locus> callAlone(ContigBytes seq, RunList seeds, int lo, int hi, int from, int to) {
        // work on a stretch around [from, to) first and widen it only when it holds no quiet point: a
        // pipeline that scores a long contig in pieces then does not rescan the whole contig per piece
        long pad = 4L * minimumContext();
        byte[] whole = seq.array();
        while (true) {
            int a = (int) Math.max(lo, from - pad);
            int b = (int) Math.min(hi, to + pad);
            List<Locus> r = whole != null ? solve(whole, seq.length(), seeds, a, b, from, to)
                    : solveSlice(seq, seeds, a, b, from, to);
            if (r != null) {
                return r;
            }
            if (a == lo && b == hi) {
                throw new NeedMoreContextException("no quiet point within the known runs around [" + from + ", "
                        + to + ") given [" + lo + ", " + hi + ")");
            }
            pad *= 4;
        }
    }

    /**
     * Bases beyond {@code [lo, hi)} that solving may read: the recurrence check looks half its window past
     * a word on either side, and a seed's reach may start before {@code lo}. A copy of the contig that
     * starts this far before {@code lo} also keeps every position-dependent bound inside
     * {@link RecurrenceSeeds#find} and the reach computation where it would be for the whole contig, which
     * is why solving a copy gives the same loci, shifted.
     */
    public int readPad() {
        return RecurrenceSeeds.WINDOW + RecurrenceSeeds.K + 64 + 2 * settings.maxPeriod() + 32;
    }

    /** {@link #solve} on a copy of {@code [lo - readPad, hi + readPad)}, in contig coordinates. */
    private List<Locus> solveSlice(ContigBytes seq, RunList seeds, int lo, int hi, int from, int to) {
        int length = seq.length();
        int base = Math.max(0, lo - readPad());
        int end = (int) Math.min(length, (long) hi + readPad());
        byte[] slice = new byte[end - base];
        seq.copy(base, end, slice, 0);
        RunList local = new RunList(64);
        for (int i = 0; i < seeds.size(); i++) {
            int s = seeds.start(i);
            int e = seeds.end(i);
            if (e > lo && s < hi) {
                local.add(s - base, e - base, seeds.period(i));
            }
        }
        List<Locus> r = solve(slice, length - base, local, lo - base, hi - base, from - base, to - base);
        if (r == null || base == 0) {
            return r;
        }
        List<Locus> out = new ArrayList<>(r.size());
        for (Locus l : r) {
            out.add(l.shifted(base));
        }
        return out;
    }

    /** The loci of [from, to) computed from what is known in [lo, hi), or null if that cannot be decided. */
    private List<Locus> solve(byte[] seq, int length, RunList seeds, int lo, int hi, int from, int to) {
        int maxP = settings.maxPeriod();
        // all seeds known in [lo, hi): exact ones from the pipeline, recurrence ones from the sequence
        RunList all = new RunList(256);
        for (int i = 0; i < seeds.size(); i++) {
            int s = seeds.start(i);
            int e = seeds.end(i);
            if (e > lo && s < hi && isSeed(s, e, seeds.period(i))) {
                all.add(s, e, seeds.period(i));
            }
        }
        recurrence.find(seq, length, lo, hi, maxP, all);
        all = sorted(all);
        int n = all.size();

        // union of reaches: components separated by quiet points
        long[] reachKey = new long[n];
        for (int i = 0; i < n; i++) {
            int r = reach(all.period(i));
            long a = Math.max(0, all.start(i) - r);
            long b = Math.min(length, (long) all.end(i) + r);
            reachKey[i] = (a << 32) | b;
        }
        Arrays.sort(reachKey);
        int[] compStart = new int[n];
        int[] compEnd = new int[n];
        int comps = 0;
        for (int i = 0; i < n; i++) {
            int a = (int) (reachKey[i] >>> 32);
            int b = (int) reachKey[i];
            if (comps > 0 && a < compEnd[comps - 1]) {
                compEnd[comps - 1] = Math.max(compEnd[comps - 1], b);
            } else {
                compStart[comps] = a;
                compEnd[comps] = b;
                comps++;
            }
        }

        int rmax = reach(maxP) + RecurrenceSeeds.K + 1;
        int minQ1 = lo == 0 ? 0 : lo + margin() + rmax;
        int maxQ2 = hi >= length ? length : hi - margin() - rmax;
        int q1 = from;
        int c = componentAt(compStart, compEnd, comps, from);
        if (c >= 0 && compStart[c] < from) {
            q1 = compStart[c];
        }
        int q2 = to;
        c = componentAt(compStart, compEnd, comps, to);
        if (c >= 0 && compStart[c] < to) {
            q2 = Math.max(to, compEnd[c]);
        }
        if (q1 < minQ1 || q2 > maxQ2) {
            return null;
        }

        List<Candidate> cands = new ArrayList<>();
        List<Candidate> active = new ArrayList<>();
        int[] covS = new int[maxP + 3];
        int[] covE = new int[maxP + 3];
        Arrays.fill(covE, Integer.MIN_VALUE);
        // seeds in order of the end of their first copy: in a repeat, recurrence at the unit's distance
        // shows up before recurrence at two or three units, so the right period is tried first
        long[] order = new long[n];
        for (int i = 0; i < n; i++) {
            order[i] = ((long) (all.start(i) + all.period(i)) << 32) | i;
        }
        Arrays.sort(order);
        for (int oi = 0; oi < n; oi++) {
            int i = (int) order[oi];
            int s = all.start(i);
            int e = all.end(i);
            int p = all.period(i);
            if (s < q1 || e > q2) {
                continue;
            }
            if (active.size() > 64) {
                // every later seed starts at or after its key minus the largest period
                int horizon = s + p - maxP;
                active.removeIf(k -> k.end <= horizon);
            }
            if (covered(covS, covE, s, e, p, maxP) || coveredByMultiple(active, s, e, p)) {
                continue;
            }
            int ci = componentAt(compStart, compEnd, comps, s);
            Candidate cand = candidate(seq, s, p, compStart[ci], compEnd[ci]);
            if (cand == null) {
                continue;
            }
            mark(covS, covE, p, cand);
            mark(covS, covE, cand.period, cand);
            if (p >= RecurrenceSeeds.MIN_PERIOD) {
                active.add(cand);
            }
            if (!passes(cand)) {
                continue;
            }
            addSplit(seq, cand, compEnd[ci], cands);
            // a seed copy carrying an indel, or a distance spanning several units, gives a period a little
            // off or a multiple; the period the locus' bases agree with best gets its own candidate
            int q = otherPeriod(seq, cand.start, cand.end, cand.period);
            int len = cand.end - cand.start;
            boolean fewCopies = cand.period >= NEIGHBOUR_MIN_PERIOD && len < NEIGHBOUR_MAX_COPIES * cand.period;
            for (int t = 0; t < 3; t++) {
                // few copies of a long unit vote unreliably on its length: the neighbouring periods compete too
                int qq = t == 0 ? q : fewCopies ? cand.period + (t == 1 ? -1 : 1) : -1;
                if (qq <= 0 || t > 0 && qq == q) {
                    continue;
                }
                Candidate alt = candidate(seq, cand.start, qq, compStart[ci], compEnd[ci]);
                if (alt != null) {
                    mark(covS, covE, alt.period, alt);
                    if (alt.period >= RecurrenceSeeds.MIN_PERIOD) {
                        active.add(alt);
                    }
                    if (passes(alt)) {
                        addSplit(seq, alt, compEnd[ci], cands);
                    }
                }
            }
        }
        List<Candidate> won = Competition.resolve(cands, (k, g0, g1) -> trimmed(seq, k, g0, g1));
        List<Locus> out = new ArrayList<>();
        for (Candidate k : won) {
            if (k.start >= from && k.start < to) {
                out.add(k.toLocus(seq));
            }
        }
        return out;
    }

    /**
     * The seeds sorted by start, end, period. Seeds sharing a start are few, so a sort of packed
     * (start, index) keys followed by insertion sort within equal starts does the job with the primitive
     * sort this class already runs, instead of a general comparison sort.
     */
    private static RunList sorted(RunList all) {
        int n = all.size();
        long[] key = new long[n];
        for (int i = 0; i < n; i++) {
            key[i] = ((long) all.start(i) << 32) | i;
        }
        Arrays.sort(key);
        int[] idx = new int[n];
        for (int i = 0; i < n; i++) {
            idx[i] = (int) key[i];
        }
        for (int g = 0; g < n; ) {
            int s = all.start(idx[g]);
            int h = g + 1;
            while (h < n && all.start(idx[h]) == s) {
                h++;
            }
            for (int i = g + 1; i < h; i++) {
                int v = idx[i];
                int ve = all.end(v);
                int vp = all.period(v);
                int j = i - 1;
                while (j >= g && (all.end(idx[j]) > ve || all.end(idx[j]) == ve && all.period(idx[j]) > vp)) {
                    idx[j + 1] = idx[j];
                    j--;
                }
                idx[j + 1] = v;
            }
            g = h;
        }
        RunList out = new RunList(Math.max(n, 1));
        for (int i = 0; i < n; i++) {
            int k = idx[i];
            out.add(all.start(k), all.end(k), all.period(k));
        }
        return out;
    }

    /** Index of the component whose half-open interior holds x, or -1. */
    private static int componentAt(int[] cs, int[] ce, int comps, int x) {
        int l = 0;
        int h = comps - 1;
        int found = -1;
        while (l <= h) {
            int m = (l + h) >>> 1;
            if (cs[m] <= x) {
                found = m;
                l = m + 1;
            } else {
                h = m - 1;
            }
        }
        return found >= 0 && x < ce[found] ? found : -1;
    }

    private static boolean covered(int[] covS, int[] covE, int s, int e, int p, int maxP) {
        // recurrence distances wobble by a base or two around the period where copies carry indels
        int tol = p >= RecurrenceSeeds.MIN_PERIOD ? 2 : 0;
        for (int q = Math.max(1, p - tol); q <= Math.min(maxP, p + tol); q++) {
            int ov = Math.min(e, covE[q]) - Math.max(s, covS[q]);
            if (2 * ov >= e - s) {
                return true;
            }
        }
        return false;
    }

    /**
     * Whether a recurrence seed lies in a locus whose period its distance is a multiple of: in a
     * satellite, words also recur two or three units apart wherever a unit between carries errors.
     */
    private static boolean coveredByMultiple(List<Candidate> active, int s, int e, int d) {
        if (d < RecurrenceSeeds.MIN_PERIOD) {
            return false;
        }
        for (Candidate k : active) {
            if (k.end <= s) {
                continue;
            }
            int ov = Math.min(e, k.end) - Math.max(s, k.start);
            if (2 * ov < e - s) {
                continue;
            }
            int m = Math.max(1, Math.round(d / (float) k.period));
            // copies drift apart by their indels: allow 4 % of the distance
            if (Math.abs(d - m * k.period) <= 2 + d / 25) {
                return true;
            }
        }
        return false;
    }

    private static void mark(int[] covS, int[] covE, int p, Candidate k) {
        if (p < covE.length && k.end > covE[p]) {
            covS[p] = k.start;
            covE[p] = k.end;
        }
    }

    private boolean passes(Candidate k) {
        ScoreSettings st = settings;
        int len = k.end - k.start;
        return k.period >= st.minPeriod() && k.period <= st.maxPeriod() && len >= st.minLength()
                && len >= st.minCopies() * k.period && k.purity() >= st.minPurity() && k.score >= st.minScore();
    }

    // ---------------------------------------------------------------- one candidate

    // per phase: counts of A, C, G, T aligned there, deletions of it, copies inserting just before it and
    // the bases they insert
    private int[] counts = new int[64];
    private static final int SLOTS = 7;
    private static final int DELETED = 4;
    private static final int INSERTED = 5;
    private static final int INSERTED_BASES = 6;
    /** Copies that vote on the provisional consensus: plenty to outvote errors, bounded work in satellites. */
    private static final int VOTE_COPIES = 24;
    /** Rounds of voting on the locus' own alignment; each must raise the score to be kept. */
    static final int VOTE_ROUNDS = 3;

    private int[] clearCounts(int p) {
        if (counts.length < SLOTS * p) {
            counts = new int[SLOTS * p];
        } else {
            Arrays.fill(counts, 0, SLOTS * p, 0);
        }
        return counts;
    }

    private Candidate candidate(byte[] seq, int s, int p, int cs, int ce) {
        byte[] m0 = new byte[p];
        for (int k = 0; k < p; k++) {
            int code = Bases.code(seq[s + k]);
            if (code < 0 || code > 3) {
                return null;
            }
            m0[k] = (byte) code;
        }
        int xd = xdrop(p);
        // the provisional consensus is voted on the first copies only; the final one on the whole locus.
        // Both ends are found before any vote is counted: most candidates fail the length test and their
        // paths are never walked
        aligner.extend(seq, s, 1, m0, p, 0, Math.min(ce - s, VOTE_COPIES * p + 64), xd);
        int right = aligner.bestI();
        leftAligner.extend(seq, s - 1, -1, m0, p, p - 1, s - cs, xd);
        int left = leftAligner.bestI();
        int leftJ = leftAligner.bestJ();
        if (left + right < p + SEED_EXTRA) {
            return null;
        }
        int[] cnt = clearCounts(p);
        // an insertion of several bases is one vote for its boundary; the seed copy, which the motif was
        // read from, does not vote: with few copies it would outvote the others on its own errors
        aligner.beginPath();
        int lastIns = -1;
        // j falls by at most one per column: phases are stepped down, not divided out
        int prevJ = aligner.bestJ();
        int phIns = prevJ % p;
        for (int op = aligner.nextColumn(); op >= 0; op = aligner.nextColumn()) {
            int i = aligner.colI;
            int j = aligner.colJ;
            if (j != prevJ) {
                phIns = phIns == 0 ? p - 1 : phIns - 1;
                prevJ = j;
            }
            if (i <= p && op != WrapAligner.DEL || j <= p && op == WrapAligner.DEL) {
                lastIns = -1;
                continue;
            }
            int phDiag = phIns == 0 ? p - 1 : phIns - 1;
            if (op == WrapAligner.DIAG) {
                cnt[SLOTS * phDiag + Bases.code(seq[s + i - 1])]++;
            } else if (op == WrapAligner.DEL) {
                cnt[SLOTS * phDiag + DELETED]++;
            } else {
                cnt[SLOTS * phIns + INSERTED_BASES]++;
                if (lastIns != j) {
                    cnt[SLOTS * phIns + INSERTED]++;
                }
            }
            lastIns = op == WrapAligner.INS ? j : -1;
        }
        leftAligner.beginPath();
        lastIns = -1;
        // (p - j) mod p rises by one, wrapping, each time j falls by one
        prevJ = leftAligner.bestJ();
        int phLeft = Math.floorMod(p - prevJ, p);
        for (int op = leftAligner.nextColumn(); op >= 0; op = leftAligner.nextColumn()) {
            int i = leftAligner.colI;
            int j = leftAligner.colJ;
            if (j != prevJ) {
                phLeft = phLeft == p - 1 ? 0 : phLeft + 1;
                prevJ = j;
            }
            int slot = SLOTS * phLeft;
            if (op == WrapAligner.DIAG) {
                cnt[slot + Bases.code(seq[s - i])]++;
            } else if (op == WrapAligner.DEL) {
                cnt[slot + DELETED]++;
            } else {
                cnt[slot + INSERTED_BASES]++;
                if (lastIns != j) {
                    cnt[slot + INSERTED]++;
                }
            }
            lastIns = op == WrapAligner.INS ? j : -1;
        }
        int a = s - left;
        int phaseA = left == 0 ? 0 : Math.floorMod(p - leftJ, p);
        int[] phaseMap = new int[1];
        byte[] m = consensus(cnt, m0, phaseA, phaseMap);
        if (m == null) {
            return null;
        }
        return vote(seq, align(seq, a, m, m.length, phaseMap[0], ce - a), ce - a);
    }

    /**
     * Up to {@link #VOTE_ROUNDS} rounds of a candidate's own copies voting on its consensus, each kept only
     * when realigning with it raises the score. {@code k} must be the last candidate {@link #align}ed (its
     * counts are read), or null.
     */
    private Candidate vote(byte[] seq, Candidate k, int cap) {
        int[] phaseMap = new int[1];
        for (int round = 0; k != null && round < VOTE_ROUNDS; round++) {
            byte[] next = consensus(counts, k.motif, k.phaseA, phaseMap);
            if (next == null || Arrays.equals(next, k.motif)) {
                break;
            }
            Candidate r = align(seq, k.start, next, next.length, phaseMap[0], cap);
            if (r == null || r.score <= k.score) {
                break;
            }
            k = r;
        }
        return k;
    }

    /**
     * Majority consensus with gaps as votes: a phase most copies lack is dropped, and where most copies
     * insert, as many bases as they insert on average are added (placeholder letters, replaced by the
     * next vote). Reduced to its primitive root. {@code phaseMap[0]} receives the new phase of
     * {@code phase}. Null when nothing is left.
     */
    private static byte[] consensus(int[] cnt, byte[] base, int phase, int[] phaseMap) {
        int p = base.length;
        byte[] m = new byte[p + 8];
        int n = 0;
        int mapped = 0;
        for (int ph = 0; ph < p; ph++) {
            int o = SLOTS * ph;
            int through = cnt[o] + cnt[o + 1] + cnt[o + 2] + cnt[o + 3] + cnt[o + DELETED];
            if (ph == phase) {
                mapped = n;
            }
            if (through > 0 && 2 * cnt[o + INSERTED] > through) {
                int extra = Math.max(1, Math.round(cnt[o + INSERTED_BASES] / (float) cnt[o + INSERTED]));
                for (int x = 0; x < extra; x++) {
                    if (n == m.length) {
                        m = Arrays.copyOf(m, 2 * m.length);
                    }
                    m[n++] = base[ph];
                }
            }
            int best = base[ph];
            int bc = cnt[o + best];
            for (int b = 0; b < 4; b++) {
                if (cnt[o + b] > bc) {
                    bc = cnt[o + b];
                    best = b;
                }
            }
            if (cnt[o + DELETED] > bc) {
                continue;
            }
            if (n == m.length) {
                m = Arrays.copyOf(m, 2 * m.length);
            }
            m[n++] = (byte) best;
        }
        if (n == 0) {
            return null;
        }
        m = Arrays.copyOf(m, n);
        mapped = Math.min(mapped, n - 1);
        int root = MotifClass.primitiveRoot(m);
        if (root < n) {
            m = Arrays.copyOf(m, root);
            mapped %= root;
        }
        phaseMap[0] = mapped;
        return m;
    }

    /**
     * Final alignment from a fixed left end: gives the right end, the counts and the phase of every base,
     * and leaves the votes of the alignment in {@link #counts}.
     */
    private Candidate align(byte[] seq, int a, byte[] motif, int p, int phaseA, int cap) {
        aligner.extend(seq, a, 1, motif, p, phaseA, cap, xdrop(p));
        int len = aligner.bestI();
        if (len == 0) {
            return null;
        }
        Candidate k = new Candidate();
        k.start = a;
        k.end = a + len;
        k.period = p;
        k.motif = motif;
        k.phaseA = phaseA;
        k.score = aligner.bestScore();
        int[] phaseAt = new int[len];
        k.phaseAt = phaseAt;
        int[] cnt = clearCounts(p);
        aligner.beginPath();
        int matches = 0;
        int mismatches = 0;
        int insertions = 0;
        int deletions = 0;
        int lastIns = -1;
        // the path runs from the far end inwards and j falls by at most one per column, so the phases are
        // stepped down instead of divided out: phIns is (phaseA + j) % p, phDiag is (phaseA + j - 1) % p
        int prevJ = aligner.bestJ();
        int phIns = (phaseA + prevJ) % p;
        for (int op = aligner.nextColumn(); op >= 0; op = aligner.nextColumn()) {
            int i = aligner.colI;
            int j = aligner.colJ;
            if (j != prevJ) {
                phIns = phIns == 0 ? p - 1 : phIns - 1;
                prevJ = j;
            }
            int phDiag = phIns == 0 ? p - 1 : phIns - 1;
            if (op == WrapAligner.DIAG) {
                int ph = phDiag;
                phaseAt[i - 1] = ph;
                int x = Bases.code(seq[a + i - 1]);
                cnt[SLOTS * ph + x]++;
                if (motif[ph] == x) {
                    matches++;
                } else {
                    mismatches++;
                }
            } else if (op == WrapAligner.INS) {
                int ph = phIns;
                phaseAt[i - 1] = ph;
                insertions++;
                cnt[SLOTS * ph + INSERTED_BASES]++;
                if (lastIns != j) {
                    cnt[SLOTS * ph + INSERTED]++;
                }
            } else {
                deletions++;
                cnt[SLOTS * phDiag + DELETED]++;
            }
            lastIns = op == WrapAligner.INS ? j : -1;
        }
        k.matches = matches;
        k.mismatches = mismatches;
        k.insertions = insertions;
        k.deletions = deletions;
        return k;
    }

    private static final int AGREEMENT_SAMPLE = 600;

    /**
     * Adds the candidate, or the two loci it is made of when its copies change motif part way, as in
     * (TGA)n(TGC)m: the alignment runs on through such a change (two letters of three still match), so
     * the split is found afterwards. The split point is where separate majority consensuses for the two
     * sides agree with the most bases; it is taken when that gains at least {@link #SPLIT_GAIN} of the
     * locus' bases (and {@link #SPLIT_MIN_GAIN} bases) over one consensus and each side keeps two copies.
     */
    private void addSplit(byte[] seq, Candidate k, int ce, List<Candidate> out) {
        int p = k.period;
        int len = k.end - k.start;
        if (len < 4 * p || len < 2 * settings.minLength() || k.purity() > 0.97) {
            out.add(k);
            return;
        }
        int[] left = new int[4 * p];
        int[] right = new int[4 * p];
        int[] code = new int[len];
        for (int i = 0; i < len; i++) {
            code[i] = Bases.code(seq[k.start + i]);
            right[4 * k.phaseAt[i] + code[i]]++;
        }
        int single = 0;
        for (int ph = 0; ph < p; ph++) {
            single += max4(right, ph);
        }
        int sum = single; // sum over phases of the left and right majorities
        int best = single;
        int bestAt = -1;
        int minSide = Math.max(2 * p, settings.minLength());
        for (int i = 0; i < len - minSide; i++) {
            int ph = k.phaseAt[i];
            int before = max4(left, ph) + max4(right, ph);
            left[4 * ph + code[i]]++;
            right[4 * ph + code[i]]--;
            sum += max4(left, ph) + max4(right, ph) - before;
            if (i + 1 >= minSide && sum > best) {
                best = sum;
                bestAt = i + 1;
            }
        }
        if (bestAt < 0 || best - single < Math.max(SPLIT_MIN_GAIN, SPLIT_GAIN * len)) {
            out.add(k);
            return;
        }
        // the two consensuses, counted again on each side of the chosen point
        byte[] ml = new byte[p];
        byte[] mr = new byte[p];
        Arrays.fill(left, 0);
        Arrays.fill(right, 0);
        for (int i = 0; i < len; i++) {
            (i < bestAt ? left : right)[4 * k.phaseAt[i] + code[i]]++;
        }
        for (int ph = 0; ph < p; ph++) {
            ml[ph] = (byte) argmax4(left, ph, k.motif[ph]);
            mr[ph] = (byte) argmax4(right, ph, k.motif[ph]);
        }
        if (MotifClass.primitiveRoot(ml) < p || MotifClass.primitiveRoot(mr) < p) {
            out.add(k);
            return;
        }
        int x = k.start + bestAt;
        Candidate l = align(seq, k.start, ml, p, k.phaseA, bestAt);
        Candidate r = align(seq, x, mr, p, k.phaseAt[bestAt], ce - x);
        if (l == null || r == null || !passes(l) || !passes(r)) {
            out.add(k);
            return;
        }
        out.add(l);
        out.add(r);
    }

    /** Share of a locus' bases a split must gain, and the fewest bases, so chance variation never splits. */
    private static final double SPLIT_GAIN = 0.08;
    private static final int SPLIT_MIN_GAIN = 6;

    private static int max4(int[] c, int ph) {
        int o = 4 * ph;
        return Math.max(Math.max(c[o], c[o + 1]), Math.max(c[o + 2], c[o + 3]));
    }

    private static int argmax4(int[] c, int ph, int prefer) {
        int o = 4 * ph;
        int best = prefer;
        for (int b = 0; b < 4; b++) {
            if (c[o + b] > c[o + best]) {
                best = b;
            }
        }
        return best;
    }

    /** Units this long or longer with fewer than this many copies also try the periods one off. */
    private static final int NEIGHBOUR_MIN_PERIOD = 20;
    private static final int NEIGHBOUR_MAX_COPIES = 10;

    /** Fraction of positions x in [a, b - q) whose base equals the base q later. */
    private static double agreement(byte[] seq, int a, int b, int q) {
        // a sample of the locus says as much as all of it about which period fits
        b = Math.min(b, a + AGREEMENT_SAMPLE + q);
        int n = b - a - q;
        if (n <= 0) {
            return 0;
        }
        int hit = 0;
        for (int x = a; x < b - q; x++) {
            // zero exactly when the codes are equal and in 0..3; counted without branches
            int c = Bases.code(seq[x]);
            int v = (c ^ Bases.code(seq[x + q])) | (c & ~3);
            hit += 1 - ((v | -v) >>> 31);
        }
        return hit / (double) n;
    }

    /**
     * A period other than p that the bases of [a, b) support at least as well: the best of p - 3 .. p + 3
     * when it beats p, else the shortest near-divisor of p that agrees nearly as well; -1 if none.
     */
    private static int otherPeriod(byte[] seq, int a, int b, int p) {
        if (p < 4 || b - a < 2 * p) {
            return -1;
        }
        double base = agreement(seq, a, b, p);
        int best = -1;
        double bestAgree = base;
        for (int q = Math.max(1, p - 3); q <= p + 3; q++) {
            if (q != p && b - a >= 2 * q) {
                double g = agreement(seq, a, b, q);
                if (g > bestAgree + 0.02) {
                    bestAgree = g;
                    best = q;
                }
            }
        }
        if (best > 0) {
            return best;
        }
        for (int m = Math.min(p / 2, 12); m >= 2; m--) {
            // shortest first: the largest divisor count gives the shortest unit
            int c = Math.round(p / (float) m);
            for (int q = Math.max(1, c - 2); q <= c + 2 && q < p; q++) {
                double g = agreement(seq, a, b, q);
                if (g >= base - 0.05 && g >= 0.5) {
                    return q;
                }
            }
        }
        return -1;
    }

    /**
     * The longest stretch of a losing candidate that no winner covers, realigned and voted on again; null
     * when it is too short or no longer passes the filters.
     */
    private Candidate trimmed(byte[] seq, Candidate k, int g0, int g1) {
        if (g1 - g0 < Math.max(settings.minLength(), k.period + SEED_EXTRA)) {
            return null;
        }
        // the stretch votes on its own consensus: the loser's was shaped by the copies it lost
        Candidate r = vote(seq, align(seq, g0, k.motif, k.period, k.phaseAt[g0 - k.start], g1 - g0), g1 - g0);
        return r != null && passes(r) ? r : null;
    }

    static double entropy(byte[] seq, int start, int end) {
        return Candidate.entropy(seq, start, end);
    }
}
