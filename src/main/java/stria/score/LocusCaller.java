package stria.score;

import java.util.ArrayList;
import java.util.List;
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
 * long units have no exact runs at all ({@link Seeds}). Seeds are taken in order of the end of their
 * first copy, and a seed already inside a locus of its period (or, for recurrence seeds, of a period its
 * distance is about a multiple of) adds nothing ({@link SeedCoverage}). Otherwise its first copy is the provisional motif and the locus is
 * extended both ways by aligning against the repeated motif ({@link WrapAligner}: wraparound dynamic
 * programming, Fischetti, Landau, Sellers &amp; Schmidt 1993, in an adaptive band with X-drop). A seed
 * whose extension reaches less than {@link #REJECT_SHARE} of the copies a locus needs is dropped there
 * (the bases after its first copy are aligned first, so a long unit that does not recur costs little),
 * and what it reached counts as explained for its period. The
 * copies other than the seed's then vote on the consensus ({@link VoteTally}, {@link Consensus}): the majority letter at each phase, a phase
 * most copies lack is dropped and a base most copies insert is added, so a seed copy carrying an indel
 * does not fix the period; the result is reduced to its primitive root. A last alignment against the
 * consensus from the left end gives the right end and the counts, and up to
 * {@link CandidateBuilder#VOTE_ROUNDS} more rounds vote on that alignment while the score rises
 * ({@link CandidateBuilder}). Every alignment scores its columns as log-odds in bits
 * ({@link ScoringModel}) against the background of the block that holds its first base ({@link Background}). Where the bases agree better at a neighbouring
 * distance or about as well at a near-divisor of the period, that period gets a candidate of its own;
 * units of {@link PeriodAlternatives#NEIGHBOUR_MIN_PERIOD} bases or more with few copies also try the periods one off,
 * since a handful of copies votes unreliably on the length of a long unit. A candidate whose copies
 * change motif part way, as in (TGA)n(TGC)m, is split in two ({@link CompoundSplit}).
 * Seeds of one period separated by a few mismatches or a short indel end up in one candidate because
 * the extension runs through them.
 *
 * <h2>One locus, one period</h2>
 * Candidates that share bases compete ({@link Competition}). Each has a strength, its log-odds score
 * less a charge per motif base ({@link Competition#MOTIF_CHARGE}): the charge for the motif keeps a long consensus from winning by memorising the errors of
 * a short repeat. Among candidates linked by overlap, the set that overlaps at most at its edges and has
 * the largest total strength wins (weighted interval scheduling), so two neighbours that explain their
 * parts well beat one longer unit that mixes them. Winners are taken strongest first (ties: shorter
 * period, earlier start); every other candidate keeps its longest stretch not covered by one taken
 * before, realigned, if that still passes the filters; this is how a compound repeat such as
 * (CA)n(GA)m comes out as two adjacent loci. Filters ({@link LocusFilter}) apply before the competition, so a locus that
 * would not be reported never suppresses one that would.
 *
 * <h2>Why windows do not change the result</h2>
 * Every seed reaches {@link QuietPoints#reach} bases beyond its ends, and extension never leaves the union of
 * overlapping reaches that holds its seed. A position no reach crosses is quiet: nothing on one side can
 * affect the other ({@link QuietPoints}). A call finds the nearest quiet point at or left of {@code from} and at or right of
 * {@code to}, far enough inside {@code [lo, hi)} that every seed near them is known exactly, and solves
 * everything between them exactly as a whole-contig call would; without such points it throws.
 *
 * <h2>State</h2>
 * The caller holds only its settings and is safe to share between threads; every call works in a
 * {@link ScoreWorkspace} (aligners, vote counts, the recurrence word table), its own or one the caller
 * of this class keeps per thread.
 */
public final class LocusCaller {
    /** Exact runs of longer period add nothing: recurrence seeds find those repeats too. */
    public static final int SEED_MAX_PERIOD = 12;
    /** Bases beyond one copy an exact run needs to seed: 6 keeps random DNA to a few seeds per kb. */
    public static final int SEED_EXTRA = 6;
    /**
     * Share of the copies a locus needs ({@code --min-copies}) that the first extension of a seed must
     * reach, or the seed is dropped before its consensus is voted on and realigned. In human DNA most
     * seeds of long period are the recurrence of a word between two nearby copies of one interspersed
     * element: one copy and a part, never two.
     */
    static final double REJECT_SHARE = 0.75;

    /** Sides of a stretch without a quiet point far enough inside, in {@link ScoreWorkspace#unsolvedSides}. */
    static final int LEFT = 1;
    static final int RIGHT = 2;

    /**
     * The pad around {@code [from, to)} that the last call needed, where the next one starts: in DNA dense in
     * interspersed repeats quiet points are far apart, and every stretch too short is a recurrence scan
     * wasted. Only the work depends on it, never the loci, so threads may race on it.
     */
    private volatile long padHint;

    private final ScoreSettings settings;
    private final LocusFilter filter;
    private final CompoundSplit split;

    public LocusCaller(ScoreSettings settings) {
        this.settings = settings;
        this.filter = new LocusFilter(settings);
        this.split = new CompoundSplit(filter, settings.minLength());
        this.padHint = 4L * minimumContext();
    }

    /**
     * Whether an exact run takes part in scoring; the pipeline keeps only these in memory. Only short
     * periods: longer repeats are seeded from the sequence itself, so a few seeds per kilobase of random
     * sequence remain.
     */
    public boolean isSeed(int start, int end, int period) {
        return Seeds.isExact(start, end, period, settings.maxPeriod());
    }

    /** The longest period of the runs {@link #isSeed} accepts: the engine need not look further. */
    public int seedPeriod() {
        return Math.min(SEED_MAX_PERIOD, settings.maxPeriod());
    }

    /** Bases beyond {@code [from, to)} a call may need on each side in the best case (no repeat nearby). */
    public int minimumContext() {
        return margin() + QuietPoints.reach(settings.maxPeriod()) + RecurrenceSeeds.K + 1;
    }

    /** Bases inside {@code [lo, hi)} whose seeds are not known exactly: those of a word reaching past an end. */
    private int margin() {
        return RecurrenceSeeds.context(settings.maxPeriod()) + 2 * SEED_MAX_PERIOD + SEED_EXTRA + 8;
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

    /**
     * The loci on the uniform background. Safe to call from several threads at once: each call works in a
     * workspace of its own.
     */
    public List<Locus> call(byte[] seq, int length, RunList seeds, int lo, int hi, int from, int to) {
        return call(ContigBytes.of(seq, length), seeds, lo, hi, from, to);
    }

    /**
     * As {@link #call(byte[], int, RunList, int, int, int, int)}, for a contig that is not held in an array:
     * only the stretch being solved, plus {@link #readPad} on each side, is copied out.
     */
    public List<Locus> call(ContigBytes seq, RunList seeds, int lo, int hi, int from, int to) {
        return call(new ScoreWorkspace(), seq, Background.uniform(), seeds, lo, hi, from, to);
    }

    /**
     * As {@link #call(ContigBytes, RunList, int, int, int, int)}, scored against the contig's
     * {@code background} (which must know every block the call reads), in a workspace the caller keeps per
     * thread.
     */
    public List<Locus> call(ScoreWorkspace ws, ContigBytes seq, Background background, RunList seeds, int lo, int hi,
                            int from, int to) {
        return call(ws, seq, background, seeds, lo, hi, from, to, null);
    }

    /**
     * As {@link #call(ScoreWorkspace, ContigBytes, Background, RunList, int, int, int, int)}, with the
     * components of seed reaches that reach past {@code [from, to)} solved once for all the calls that
     * share {@code shared} (null: each call solves alone). The calls sharing it must have the same
     * {@code seq}, {@code background}, {@code seeds}, {@code lo} and {@code hi}; the loci are the same
     * either way, but a locus longer than the stretches is solved once instead of once per stretch.
     */
    public List<Locus> call(ScoreWorkspace ws, ContigBytes seq, Background background, RunList seeds, int lo, int hi,
                            int from, int to, SharedComponents shared) {
        if (from >= to) {
            return List.of();
        }
        // work on a stretch around [from, to) first and widen it only when it holds no quiet point, and only
        // on the side that lacks one: a pipeline that scores a long contig in pieces then does not rescan
        // the whole contig per piece, nor a side that was fine
        long padLeft = padHint;
        long padRight = padLeft;
        byte[] whole = seq.array();
        while (true) {
            List<Locus> known = shared == null ? null : shared.covering(from, to);
            if (known != null) {
                return known;
            }
            int a = (int) Math.max(lo, from - padLeft);
            int b = (int) Math.min(hi, to + padRight);
            List<Locus> r = whole != null ? solve(ws, whole, seq.length(), background, seeds, a, b, from, to, 0, shared)
                    : solveSlice(ws, seq, background, seeds, a, b, from, to, shared);
            if (r != null) {
                padHint = Math.max(4L * minimumContext(), Math.max(padLeft, padRight));
                return r;
            }
            if (a == lo && b == hi) {
                throw new NeedMoreContextException("no quiet point within the known runs around [" + from + ", "
                        + to + ") given [" + lo + ", " + hi + ")");
            }
            if ((ws.unsolvedSides & LEFT) != 0 || b == hi) {
                padLeft *= 4;
            }
            if ((ws.unsolvedSides & RIGHT) != 0 || a == lo) {
                padRight *= 4;
            }
        }
    }

    /** {@link #solve} on a copy of {@code [lo - readPad, hi + readPad)}, in contig coordinates. */
    private List<Locus> solveSlice(ScoreWorkspace ws, ContigBytes seq, Background background, RunList seeds, int lo,
                                   int hi, int from, int to, SharedComponents shared) {
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
        List<Locus> r = solve(ws, slice, length - base, background.shifted(base), local, lo - base, hi - base,
                from - base, to - base, base, shared);
        if (r == null || base == 0) {
            return r;
        }
        List<Locus> out = new ArrayList<>(r.size());
        for (Locus l : r) {
            out.add(l.shifted(base));
        }
        return out;
    }

    /**
     * The loci of [from, to) computed from what is known in [lo, hi), or null if that cannot be decided;
     * {@code seq} starts at contig position {@code origin}.
     */
    private List<Locus> solve(ScoreWorkspace ws, byte[] seq, int length, Background background, RunList runs, int lo,
                              int hi, int from, int to, int origin, SharedComponents shared) {
        RunList seeds = Seeds.known(ws.recurrence, seq, length, runs, lo, hi, settings.maxPeriod());
        QuietPoints quiet = QuietPoints.of(seeds, length);
        // a quiet point must lie far enough inside [lo, hi) that every seed near it is known exactly
        int rmax = QuietPoints.reach(settings.maxPeriod()) + RecurrenceSeeds.K + 1;
        int q1 = quiet.atOrBefore(from);
        int q2 = quiet.atOrAfter(to);
        ws.unsolvedSides = (q1 < (lo == 0 ? 0 : lo + margin() + rmax) ? LEFT : 0)
                | (q2 > (hi >= length ? length : hi - margin() - rmax) ? RIGHT : 0);
        if (ws.unsolvedSides != 0) {
            return null;
        }
        CandidateBuilder builder = new CandidateBuilder(seq, background, ws, settings.minCopies() * REJECT_SHARE);
        if (shared == null) {
            return loci(builder, seeds, quiet, q1, q2, from, to);
        }
        // a component reaching past [from, to) is solved once for every call that meets it; quiet points
        // separate components, so the stretch between them is solved on its own
        int cl = q1 < from ? quiet.componentAt(from) : -1;
        int cr = q2 > to ? quiet.componentAt(to) : -1;
        List<Locus> out = new ArrayList<>();
        int m1 = q1;
        int m2 = q2;
        if (cl >= 0) {
            out.addAll(component(shared, builder, seeds, quiet, cl, from, to, origin));
            m1 = quiet.end(cl);
        }
        if (cr >= 0 && cr != cl) {
            m2 = quiet.start(cr);
        }
        if (m1 < m2) {
            out.addAll(loci(builder, seeds, quiet, m1, m2, from, to));
        }
        if (cr >= 0 && cr != cl) {
            out.addAll(component(shared, builder, seeds, quiet, cr, from, to, origin));
        }
        return out;
    }

    /** The loci of component {@code c} that start in {@code [from, to)}, solved once through {@code shared}. */
    private List<Locus> component(SharedComponents shared, CandidateBuilder builder, RunList seeds, QuietPoints quiet,
                                  int c, int from, int to, int origin) {
        int cs = quiet.start(c);
        int ce = quiet.end(c);
        List<Locus> all = shared.solve(cs + origin, ce + origin, () -> {
            List<Locus> loci = loci(builder, seeds, quiet, cs, ce, cs, ce);
            List<Locus> shifted = new ArrayList<>(loci.size());
            for (Locus l : loci) {
                shifted.add(origin == 0 ? l : l.shifted(origin));
            }
            return shifted;
        });
        return SharedComponents.startingIn(all, from + origin, to + origin, origin);
    }

    /** The loci starting in {@code [from, to)} of the seeds between the quiet points {@code q1} and {@code q2}. */
    private List<Locus> loci(CandidateBuilder builder, RunList seeds, QuietPoints quiet, int q1, int q2, int from,
                             int to) {
        List<Candidate> cands = candidates(builder, seeds, quiet, q1, q2);
        List<Candidate> won = Competition.resolve(cands, (k, g0, g1) -> trimmed(builder, k, g0, g1));
        won = ArrayJoin.join(builder, filter, quiet, won);
        List<Locus> out = new ArrayList<>();
        byte[] seq = builder.seq();
        for (int i = 0; i < won.size(); i++) {
            Candidate k = won.get(i);
            if (k.start >= from && k.start < to) {
                // a locus' nested structure is looked for within its component: the same whichever stretch
                // around it a call solves
                int stop = quiet.end(quiet.componentAt(k.start));
                if (i + 1 < won.size()) {
                    stop = Math.min(stop, won.get(i + 1).start);
                }
                out.add(NestedUnits.of(builder, filter, settings.maxPeriod(), k, stop - k.start).toLocus(seq, filter.calibration()));
            }
        }
        return out;
    }

    /** The candidates that pass the filter, from the seeds inside {@code [q1, q2)}. */
    private List<Candidate> candidates(CandidateBuilder builder, RunList seeds, QuietPoints quiet, int q1, int q2) {
        List<Candidate> out = new ArrayList<>();
        SeedCoverage coverage = new SeedCoverage(settings.maxPeriod());
        for (long key : Seeds.byFirstCopyEnd(seeds)) {
            int i = (int) key;
            int s = seeds.start(i);
            int e = seeds.end(i);
            int p = seeds.period(i);
            if (s < q1 || e > q2 || coverage.explains(s, e, p)) {
                continue;
            }
            int c = quiet.componentAt(s);
            Candidate k = builder.build(s, p, quiet.start(c), quiet.end(c));
            if (k == null && builder.reachEnd > builder.reachStart) {
                coverage.add(builder.reachStart, builder.reachEnd, p, p);
            }
            if (k != null) {
                coverage.add(k, p);
                if (filter.accepts(k)) {
                    addWithAlternatives(builder, k, quiet.start(c), quiet.end(c), coverage, out);
                }
            }
        }
        return out;
    }

    /** Adds a candidate (split when compound) and the candidates of its {@link PeriodAlternatives}. */
    private void addWithAlternatives(CandidateBuilder builder, Candidate k, int cs, int ce, SeedCoverage coverage,
                                     List<Candidate> out) {
        split.add(builder, k, ce, out);
        for (int q : PeriodAlternatives.of(builder.seq(), k)) {
            Candidate alt = builder.build(k.start, q, cs, ce);
            if (alt != null) {
                coverage.add(alt, alt.period);
                if (filter.accepts(alt)) {
                    split.add(builder, alt, ce, out);
                }
            }
        }
    }

    /**
     * The longest stretch of a losing candidate that no winner covers, realigned and voted on again; null
     * when it is too short or no longer passes the filter.
     */
    private Candidate trimmed(CandidateBuilder builder, Candidate k, int g0, int g1) {
        if (g1 - g0 < Math.max(settings.minLength(), k.period + SEED_EXTRA)) {
            return null;
        }
        // the stretch votes on its own consensus: the loser's was shaped by the copies it lost
        Candidate r = builder.settle(g0, k.motif, k.phases.at(g0 - k.start), g1 - g0);
        return r != null && filter.accepts(r) ? r : null;
    }
}
