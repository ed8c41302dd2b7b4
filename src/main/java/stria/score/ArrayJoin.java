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

    /** Purity a piece may lose when aligned against the motif of the piece before: one unit family. */
    static final double UNIT_LOSS = 0.10;

    private ArrayJoin() {
    }

    /** The winners (sorted by position) with the pieces of each array joined. */
    static List<Candidate> join(CandidateBuilder builder, LocusFilter filter, QuietPoints quiet,
                                List<Candidate> won) {
        List<Candidate> out = new ArrayList<>(won.size());
        // the pieces a joined locus was aligned from: a later join realigns each from its own start
        List<int[]> starts = new ArrayList<>(won.size());
        for (Candidate k : won) {
            starts.add(new int[] {k.start});
        }
        List<Candidate> work = new ArrayList<>(won);
        int i = 0;
        while (i < work.size()) {
            Candidate a = work.get(i);
            if (a.period >= MIN_PERIOD) {
                int[] chain = chain(builder, quiet, work, i);
                // a chain refused whole is tried again on its first half, quarter, ..., two pieces
                boolean joined = false;
                for (int n = chain.length; n > 1 && !joined; n = n > 2 ? Math.max(2, n / 2) : 1) {
                    int[] pieces = java.util.Arrays.copyOf(chain, n);
                    int last = pieces[n - 1];
                    int c = quiet.componentAt(a.start);
                    int stop = last + 1 < work.size() ? Math.min(quiet.end(c), work.get(last + 1).start)
                            : quiet.end(c);
                    int[] from = startsOf(starts, pieces);
                    // the first alignment uses the motif of the piece that scores best: a short first
                    // piece's motif may explain the others worse than theirs explain it
                    Candidate best = a;
                    for (int j : pieces) {
                        if (work.get(j).score > best.score) {
                            best = work.get(j);
                        }
                    }
                    int phase = best == a ? a.phaseA : builder.bestPhase(a.model, a.start, best.motif,
                            a.length(), CandidateBuilder.xdrop(best.period), 0);
                    Candidate m = builder.settlePieces(from, stop, best.motif, phase, dropScale(a.period));
                    if (m != null && accepted(filter, work, i, last, pieces, m)) {
                        // the joined locus may now reach the next piece: it is chained again
                        work.subList(i + 1, last + 1).clear();
                        work.set(i, m);
                        starts.subList(i + 1, last + 1).clear();
                        starts.set(i, from);
                        joined = true;
                    }
                }
                if (joined) {
                    continue;
                }
            }
            out.add(a);
            i++;
        }
        return out;
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
    private static int[] chain(CandidateBuilder builder, QuietPoints quiet, List<Candidate> won, int i) {
        Candidate a = won.get(i);
        int c = quiet.componentAt(a.start);
        int gap = GAP_UNITS * a.period;
        int[] pieces = new int[8];
        int n = 0;
        pieces[n++] = i;
        Candidate u = a;
        int end = a.end;
        for (int j = i + 1; j < won.size(); j++) {
            Candidate w = won.get(j);
            if (w.start > end + gap || quiet.componentAt(w.start) != c) {
                break;
            }
            if (Math.abs(w.period - a.period) <= PERIOD_TOLERANCE * a.period) {
                if (!sameUnit(builder, u, w)) {
                    break;
                }
                if (n == pieces.length) {
                    pieces = java.util.Arrays.copyOf(pieces, 2 * n);
                }
                pieces[n++] = j;
                u = w;
                end = Math.max(end, w.end);
            } else if (w.length() > gap) {
                break;
            }
        }
        return java.util.Arrays.copyOf(pieces, n);
    }

    /**
     * Whether {@code u} and {@code w} are of one unit: the motif of one explains the other over its length
     * at most {@link #UNIT_LOSS} less purely than its own.
     */
    private static boolean sameUnit(CandidateBuilder builder, Candidate u, Candidate w) {
        return explains(builder, u, w) || explains(builder, w, u);
    }

    /** Whether {@code u}'s motif explains {@code w} over its length at most {@link #UNIT_LOSS} less purely. */
    private static boolean explains(CandidateBuilder builder, Candidate u, Candidate w) {
        int phase = builder.bestPhase(w.model, w.start, u.motif, w.length(), CandidateBuilder.xdrop(u.period), 0);
        Candidate k = builder.alignPieces(new int[] {w.start}, w.end, u.motif, phase, dropScale(u.period));
        return k != null && k.end >= w.end - w.period / 2 && k.purity() >= w.purity() - UNIT_LOSS;
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
