package stria.score;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * One array, one locus: joins the pieces the competition left of one satellite array. A long array of
 * diverged units often comes out of extension in pieces: a burst of errors a few units long drives the
 * running score below the X-drop and the next seed starts a piece of its own, with the same unit; and on
 * real arrays most pieces abut exactly, at an indel between two units (a jump of phase; 13 bases at the
 * first break of the chr20 array in the README) longer than the aligner's band ({@link WrapAligner#HALF}
 * letters either way) can follow.
 *
 * <p>The rule, in two passes over the winners of period {@link #MIN_PERIOD} or more, in order of position.
 * <em>Across bursts</em> (the phase runs on over the break): a piece and the pieces after it of a period
 * within {@link #PERIOD_TOLERANCE}, each starting no more than {@link #GAP_UNITS} units after the one
 * before, are aligned again from the first piece's start with the X-drop widened to cross
 * {@link #GAP_UNITS} units; the result replaces the pieces it reaches the end of when it passes the
 * filters, keeps half their summed score and is at most {@link #PURITY_LOSS} less pure than its least pure
 * piece. <em>Piece by piece</em> (what is left, in particular where the phase jumps at the break by
 * more than the band): the pieces form a chain while each next piece, of a period within
 * {@link #PERIOD_TOLERANCE} of the chain's unit or of a {@link #multiple} of it (a block of a few units
 * that a seed found whole), starts no more than {@link #GAP_UNITS} units after the chain ends (no locus
 * of another period longer than that between them) and is of the same unit as the piece before: the
 * motif of one (of the shorter unit, when the periods differ) explains the other, aligned from each of
 * its pieces' starts at the phase that fits best and on from where that stops ({@link #RESTARTS} times),
 * at most {@link #UNIT_LOSS} less purely than its own (unrelated
 * units of one length align at a purity of 0.3 to 0.5, an inverted piece, whose + strand motif is the
 * reverse complement, not at all; the pieces of one real array differ by 1 to 8 %), and the copies beside
 * the break show no fixed difference ({@link #fixedDifference}: a unit changed in one base, as in
 * (CA)n(GA)m, is two units). The chain is aligned as one locus against one motif
 * ({@link CandidateBuilder#settlePieces}): each piece from its own start at its best phase, the bases
 * between them charged as the cheapest columns between the two phases, the copies of all pieces voting
 * on the consensus, with the motif of the best piece at the chain's unit. The joined locus replaces the pieces (and any locus of another period between them)
 * when it reaches the last piece's end, passes the filters, keeps at least the first piece's and half of
 * the pieces' summed score, and is at most {@link #UNIT_LOSS} less pure than the pieces together; a
 * refused chain is tried again on its first half, quarter, ..., two pieces, and a joined locus is chained
 * again, since it may now reach the next piece; the pass repeats until nothing joins, so that a piece
 * refused beside a short neighbour is compared again with the whole array next to it. So an array is split only where it is really interrupted:
 * by more than {@link #GAP_UNITS} units of unrelated sequence, or where its unit changes (another period,
 * another unit of the same length, a fixed difference, or the other strand).
 *
 * <p>A chain stays inside one component of seed reaches ({@link QuietPoints}), so the result for a stretch
 * of contig is the same however the contig is cut into windows.
 */
final class ArrayJoin {
    /** Shortest period joined: satellite and minisatellite units, not microsatellites (compound repeats). */
    static final int MIN_PERIOD = 50;
    /** Unrelated bases, in units, that still lie inside one array. */
    static final int GAP_UNITS = 3;
    /** Periods of one array's pieces differ by at most this fraction. */
    static final double PERIOD_TOLERANCE = 0.05;

    /** Purity a locus joined across bursts may lose against its least pure piece (the break costs some). */
    static final double PURITY_LOSS = 0.03;
    /** Copies next to a break whose letters are compared ({@link #fixedDifference}). */
    static final int FIXED_UNITS = 20;
    /** A letter shared by this many of the copies on one side, and another on the other, is a unit change. */
    static final double FIXED_SHARE = 0.75;
    static final int FIXED_COPIES = 3;
    /** Purity a piece may lose against the motif of its neighbour, or the pieces against the joined motif. */
    static final double UNIT_LOSS = 0.10;
    /** Times the alignment of a piece against its neighbour's motif goes on from where it stopped. */
    static final int RESTARTS = 4;

    private ArrayJoin() {
    }

    /** The winners (sorted by position) with the pieces of each array joined. */
    static List<Candidate> join(CandidateBuilder builder, LocusFilter filter, QuietPoints quiet,
                                List<Candidate> won) {
        return joinPieceByPiece(builder, filter, quiet, joinAcrossBursts(builder, filter, quiet, won));
    }

    /**
     * The first pass: pieces whose phase runs on across the break (a burst of errors stopped the
     * extension), realigned from the first piece with the X-drop widened.
     */
    private static List<Candidate> joinAcrossBursts(CandidateBuilder builder, LocusFilter filter, QuietPoints quiet,
                                List<Candidate> won) {
        List<Candidate> out = new ArrayList<>(won.size());
        int i = 0;
        while (i < won.size()) {
            Candidate a = won.get(i);
            int next = i + 1;
            if (a.period >= MIN_PERIOD) {
                int last = chainEnd(quiet, won, i);
                if (last > i) {
                    int c = quiet.componentAt(a.start);
                    int stop = last + 1 < won.size() ? Math.min(quiet.end(c), won.get(last + 1).start) : quiet.end(c);
                    Candidate m = builder.settle(a.start, a.motif, a.phaseA, stop - a.start, dropScale(a.period));
                    int reached = m == null ? i : reached(won, i, last, m);
                    if (reached > i) {
                        // the locus must not end inside a piece it did not absorb
                        if (reached < won.size() - 1 && won.get(reached + 1).start < m.end) {
                            m = builder.settle(a.start, a.motif, a.phaseA, won.get(reached + 1).start - a.start,
                                    dropScale(a.period));
                            reached = m == null ? i : reached(won, i, reached, m);
                        }
                    }
                    if (reached > i && acceptedAcrossBurst(filter, won, i, reached, m)) {
                        a = m;
                        next = reached + 1;
                    }
                }
            }
            out.add(a);
            i = next;
        }
        return out;
    }

    /** Index of the last piece of the chain that starts at {@code i}; {@code i} when there is none. */
    private static int chainEnd(QuietPoints quiet, List<Candidate> won, int i) {
        Candidate a = won.get(i);
        int c = quiet.componentAt(a.start);
        int gap = GAP_UNITS * a.period;
        int end = a.end;
        int last = i;
        for (int j = i + 1; j < won.size(); j++) {
            Candidate w = won.get(j);
            if (w.start > end + gap || quiet.componentAt(w.start) != c) {
                break;
            }
            if (Math.abs(w.period - a.period) <= PERIOD_TOLERANCE * a.period) {
                last = j;
                end = Math.max(end, w.end);
            } else if (w.length() > gap) {
                break;
            }
        }
        return last;
    }

    /** The last index in {@code (i, last]} whose piece ends no later than half a unit past {@code m}. */
    private static int reached(List<Candidate> won, int i, int last, Candidate m) {
        int r = i;
        for (int j = i + 1; j <= last; j++) {
            if (won.get(j).end <= m.end + m.period / 2) {
                r = j;
            }
        }
        // a joined locus must reach past at least one piece of the array's period
        for (int j = r; j > i; j--) {
            if (Math.abs(won.get(j).period - won.get(i).period) <= PERIOD_TOLERANCE * won.get(i).period) {
                return r;
            }
        }
        return i;
    }

    private static boolean acceptedAcrossBurst(LocusFilter filter, List<Candidate> won, int i, int reached,
                                               Candidate m) {
        long sum = 0;
        double purity = 1;
        for (int j = i; j <= reached; j++) {
            sum += won.get(j).score;
            if (Math.abs(won.get(j).period - won.get(i).period) <= PERIOD_TOLERANCE * won.get(i).period) {
                purity = Math.min(purity, won.get(j).purity());
            }
        }
        return filter.accepts(m) && m.score >= won.get(i).score && 2L * m.score >= sum
                && m.purity() >= purity - PURITY_LOSS;
    }

    /**
     * The second pass: pieces each realigned from its own start, all against one motif, so that a jump of
     * phase at a break costs only its indels.
     */
    private static List<Candidate> joinPieceByPiece(CandidateBuilder builder, LocusFilter filter, QuietPoints quiet,
                                                   List<Candidate> won) {
        // the pieces a joined locus was aligned from: a later join realigns each from its own start
        List<int[]> starts = new ArrayList<>(won.size());
        for (Candidate k : won) {
            starts.add(new int[] {k.start});
        }
        List<Candidate> work = new ArrayList<>(won);
        // passes until nothing joins: a piece refused beside a short neighbour is tried again once that
        // neighbour has grown, so that the copies beside the break are the array's, not a few of a piece's
        boolean changed = true;
        while (changed) {
            changed = false;
            int i = 0;
            while (i < work.size()) {
                if (work.get(i).period >= MIN_PERIOD && joinAt(builder, filter, quiet, work, starts, i)) {
                    changed = true;
                } else {
                    i++;
                }
            }
        }
        return work;
    }

    /**
     * Joins the chain of pieces that starts at {@code i}, or its first half, quarter, ..., two pieces, into
     * one locus in place; whether it did.
     */
    private static boolean joinAt(CandidateBuilder builder, LocusFilter filter, QuietPoints quiet,
                                  List<Candidate> work, List<int[]> starts, int i) {
        Candidate a = work.get(i);
        int[] chain = chain(builder, quiet, work, starts, i);
        for (int n = chain.length; n > 1; n = n > 2 ? Math.max(2, n / 2) : 1) {
            int[] pieces = Arrays.copyOf(chain, n);
            int last = pieces[n - 1];
            int c = quiet.componentAt(a.start);
            int stop = last + 1 < work.size() ? Math.min(quiet.end(c), work.get(last + 1).start) : quiet.end(c);
            int[] from = startsOf(starts, pieces);
            // the first alignment uses the motif of the piece that scores best among those at the chain's
            // unit (its shortest period): a short first piece's motif may explain the others worse than
            // theirs explain it
            int unit = a.period;
            for (int j : pieces) {
                unit = Math.min(unit, work.get(j).period);
            }
            Candidate best = null;
            for (int j : pieces) {
                Candidate w = work.get(j);
                if (multiple(unit, w.period) == 1 && (best == null || w.score > best.score)) {
                    best = w;
                }
            }
            int phase = best == a ? a.phaseA : builder.bestPhase(a.model, a.start, best.motif, a.length(),
                    CandidateBuilder.xdrop(best.period), 0);
            Candidate m = builder.settlePieces(from, stop, best.motif, phase, dropScale(best.period));
            if (m != null && accepted(filter, work, i, last, pieces, m)) {
                // the joined locus may now reach the next piece: it is chained again
                work.subList(i + 1, last + 1).clear();
                work.set(i, m);
                starts.subList(i + 1, last + 1).clear();
                starts.set(i, from);
                return true;
            }
        }
        return false;
    }

    private static int[] startsOf(List<int[]> starts, int[] pieces) {
        int n = 0;
        for (int j : pieces) {
            n += starts.get(j).length;
        }
        int[] out = new int[n];
        n = 0;
        for (int j : pieces) {
            int[] s = starts.get(j);
            System.arraycopy(s, 0, out, n, s.length);
            n += s.length;
        }
        return out;
    }

    /** The X-drop multiple that lets an alignment cross {@link #GAP_UNITS} units of unrelated bases. */
    static int dropScale(int period) {
        return Math.max(1, GAP_UNITS * period / 45);
    }

    /**
     * Indices of the pieces of the array whose first piece is {@code i}: {@code i} and each next winner of
     * a period within {@link #PERIOD_TOLERANCE} that starts no more than {@link #GAP_UNITS} units after the
     * piece before ends, with no longer locus of another period between them, in the same component of
     * seed reaches, and explained by the motif of the piece before at most {@link #UNIT_LOSS} less purely
     * than by its own.
     */
    private static int[] chain(CandidateBuilder builder, QuietPoints quiet, List<Candidate> won, List<int[]> starts,
                               int i) {
        Candidate a = won.get(i);
        int c = quiet.componentAt(a.start);
        int gap = GAP_UNITS * a.period;
        int[] pieces = new int[8];
        int n = 0;
        pieces[n++] = i;
        Candidate u = a;
        int[] su = starts.get(i);
        // the starts of every piece of the chain so far: the copies before a break are the chain's
        int[] cs = su;
        int end = a.end;
        // the chain's unit: its shortest period; every piece is at it or at a multiple of it
        int unit = a.period;
        for (int j = i + 1; j < won.size(); j++) {
            Candidate w = won.get(j);
            if (w.start > end + gap || quiet.componentAt(w.start) != c) {
                break;
            }
            // at a multiple, every piece stays at MIN_PERIOD or more: the shorter unit is the chain's
            if (multiple(unit, w.period) == 1 || multiple(unit, w.period) > 1 && w.period >= MIN_PERIOD
                    && multiple(u.period, w.period) > 0) {
                if (!sameUnit(builder, u, su, a.start, cs, w, starts.get(j))) {
                    break;
                }
                if (n == pieces.length) {
                    pieces = Arrays.copyOf(pieces, 2 * n);
                }
                pieces[n++] = j;
                u = w;
                su = starts.get(j);
                cs = concat(cs, su);
                end = Math.max(end, w.end);
                unit = Math.min(unit, w.period);
            } else if (w.length() > gap) {
                break;
            }
        }
        return Arrays.copyOf(pieces, n);
    }

    /**
     * Whether {@code w} continues {@code u}'s array: the motif of one explains the other over its length at
     * most {@link #UNIT_LOSS} less purely than its own, and the copies beside the break show no
     * {@link #fixedDifference}.
     */
    private static boolean sameUnit(CandidateBuilder builder, Candidate u, int[] su, int left, int[] cs, Candidate w,
                                    int[] sw) {
        if (multiple(u.period, w.period) == 1) {
            if (explained(builder, u, w, sw) != null) {
                return !fixedDifference(builder, u.motif, u, left, cs, w, sw);
            }
            return explained(builder, w, u, su) != null && !fixedDifference(builder, w.motif, u, left, cs, w, sw);
        }
        // a piece at a multiple of the unit (a block of a few units that a seed found whole): the shorter
        // unit must explain it
        if (u.period < w.period) {
            return explained(builder, u, w, sw) != null && !fixedDifference(builder, u.motif, u, left, cs, w, sw);
        }
        return explained(builder, w, u, su) != null && !fixedDifference(builder, w.motif, u, left, cs, w, sw);
    }

    /**
     * m when the longer of two periods is within {@link #PERIOD_TOLERANCE} of m times the shorter (m = 1 to
     * {@link NestedUnits#MAX_UNITS}), else 0.
     */
    static int multiple(int p, int q) {
        int lo = Math.min(p, q);
        int hi = Math.max(p, q);
        int m = Math.round(hi / (float) lo);
        return m >= 1 && m <= NestedUnits.MAX_UNITS && Math.abs(hi - m * lo) <= PERIOD_TOLERANCE * m * lo ? m : 0;
    }

    private static int[] concat(int[] a, int[] b) {
        int[] out = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, out, a.length, b.length);
        return out;
    }

    /** {@code from} and the starts of {@code s} in {@code (from, to)}: where the pieces of a locus begin. */
    private static int[] within(int[] s, int from, int to) {
        int[] out = new int[s.length + 1];
        int n = 0;
        out[n++] = from;
        for (int x : s) {
            if (x > from && x < to) {
                out[n++] = x;
            }
        }
        return Arrays.copyOf(out, n);
    }

    /**
     * Whether the copies on the two sides of the break between {@code u} and {@code w}, both aligned against
     * {@code motif} (up to {@link #FIXED_UNITS} units each way: on {@code u}'s side those of the chain from
     * {@code left}, each piece from its start in {@code su}), differ at some phase as two units do, not as
     * the copies of one array: at least
     * {@link #FIXED_COPIES} copies on each side, {@link #FIXED_SHARE} of those of {@code u} with one letter
     * and that share of those of {@code w} with another. A unit changed in one base, as in (CA)n(GA)m, so
     * stays two loci; the copies of one diverged array vary at the phases where two pieces' consensuses
     * differ.
     */
    private static boolean fixedDifference(CandidateBuilder builder, byte[] motif, Candidate u, int left, int[] su,
                                           Candidate w, int[] sw) {
        int p = motif.length;
        int from = Math.max(left, u.end - FIXED_UNITS * p);
        int xd = CandidateBuilder.xdrop(p);
        int hint = motif == u.motif && from >= u.start ? u.phases.at(from - u.start) : 0;
        int phaseU = builder.bestPhase(u.model, from, motif, u.end - from, xd, hint);
        if (builder.alignPieces(within(su, from, u.end), u.end, motif, phaseU, 1) == null) {
            return false;
        }
        int[] a = builder.votes(p);
        int to = Math.min(w.end, w.start + FIXED_UNITS * p);
        int phaseW = builder.bestPhase(w.model, w.start, motif, to - w.start, xd, 0);
        if (builder.alignPieces(within(sw, w.start, to), to, motif, phaseW, 1) == null) {
            return false;
        }
        int[] b = builder.votes(p);
        for (int ph = 0; ph < p; ph++) {
            int o = VoteTally.SLOTS * ph;
            int x = majority(a, o);
            int y = majority(b, o);
            if (x != y && fixed(a, o, x) && fixed(b, o, y)) {
                return true;
            }
        }
        return false;
    }

    private static int majority(int[] v, int o) {
        int best = 0;
        for (int c = 1; c < 4; c++) {
            if (v[o + c] > v[o + best]) {
                best = c;
            }
        }
        return best;
    }

    /** Whether letter {@code x} holds {@link #FIXED_SHARE} of at least {@link #FIXED_COPIES} copies at the phase. */
    private static boolean fixed(int[] v, int o, int x) {
        int n = v[o] + v[o + 1] + v[o + 2] + v[o + 3] + v[o + VoteTally.DELETED];
        return n >= FIXED_COPIES && v[o + x] >= FIXED_SHARE * n;
    }

    /** {@code w} aligned against {@code u}'s motif, when that is at most {@link #UNIT_LOSS} less pure; else null. */
    private static Candidate explained(CandidateBuilder builder, Candidate u, Candidate w, int[] sw) {
        int phase = builder.bestPhase(w.model, w.start, u.motif, w.length(), CandidateBuilder.xdrop(u.period), 0);
        int[] from = within(sw, w.start, w.end);
        Candidate k = builder.alignPieces(from, w.end, u.motif, phase, dropScale(u.period));
        // where the alignment stops short (a jump of phase inside w that w's own motif, of another length,
        // took in its stride), it goes on from there as from the start of another piece
        for (int r = 0; r < RESTARTS && k != null && k.end < w.end - w.period / 2
                && k.end >= from[from.length - 1] + u.period; r++) {
            from = Arrays.copyOf(from, from.length + 1);
            from[from.length - 1] = k.end;
            k = builder.alignPieces(from, w.end, u.motif, phase, dropScale(u.period));
        }
        return k != null && k.end >= w.end - w.period / 2 && k.purity() >= w.purity() - UNIT_LOSS ? k : null;
    }

    private static boolean accepted(LocusFilter filter, List<Candidate> won, int i, int last, int[] pieces,
                                    Candidate m) {
        long sum = 0;
        for (int j = i; j <= last; j++) {
            sum += won.get(j).score;
        }
        long matched = 0;
        long columns = 0;
        for (int j : pieces) {
            Candidate w = won.get(j);
            matched += w.matches;
            columns += w.matches + w.mismatches + w.insertions + w.deletions;
        }
        double purity = matched / (double) columns;
        return filter.accepts(m) && m.end >= won.get(last).end - m.period / 2 && m.score >= won.get(i).score
                && 2L * m.score >= sum && m.purity() >= purity - UNIT_LOSS;
    }
}
