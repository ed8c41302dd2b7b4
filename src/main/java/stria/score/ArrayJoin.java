package stria.score;

import java.util.ArrayList;
import java.util.List;

/**
 * One array, one locus: joins the pieces the competition left of one satellite array. A long array of
 * diverged units often comes out of extension in pieces: a burst of errors a few units long drives the
 * running score below the X-drop and the next seed starts a piece of its own, with the same unit.
 *
 * <p>The rule. Winners of period {@link #MIN_PERIOD} or more are taken in order of position. A piece
 * and the pieces after it form a chain while each next piece of a period within {@link #PERIOD_TOLERANCE}
 * of the first piece's starts no more than {@link #GAP_UNITS} units after the chain ends, and no locus of
 * another period longer than that lies between them. The chain's first piece is then aligned again from
 * its start against its consensus, with an X-drop wide enough to cross {@link #GAP_UNITS} units of
 * unrelated bases, and its copies vote on the consensus again. The realigned locus replaces every piece
 * (and every locus of another period between them) that it reaches the end of, when it reaches at least the
 * second piece, passes the filters, keeps at least half of the pieces' summed score, and is at most
 * {@link #PURITY_LOSS} less pure than its least pure piece (two arrays of nearly the same unit at different
 * identities, one after the other, stay apart: one consensus explains them worse than each its own). So an array is
 * split only where it is really interrupted: by more than {@link #GAP_UNITS} units of unrelated sequence,
 * or where its unit changes (a piece of another period, or of the same length but unrelated bases, which
 * stops the alignment).
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

    /** A joined locus may be this much less pure than its least pure piece (the break itself costs some). */
    static final double PURITY_LOSS = 0.03;

    private ArrayJoin() {
    }

    /** The winners (sorted by position) with the pieces of each array joined. */
    static List<Candidate> join(CandidateBuilder builder, LocusFilter filter, QuietPoints quiet,
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
                    if (reached > i && accepted(filter, won, i, reached, m)) {
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

    /** The X-drop multiple that lets an alignment cross {@link #GAP_UNITS} units of unrelated bases. */
    static int dropScale(int period) {
        return Math.max(1, GAP_UNITS * period / 45);
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

    private static boolean accepted(LocusFilter filter, List<Candidate> won, int i, int reached, Candidate m) {
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
}
