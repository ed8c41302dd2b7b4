package stria.score;

import java.util.Arrays;
import stria.io.Bases;

/**
 * Builds candidates on one sequence with the buffers of one {@link ScoreWorkspace}: the seed's first copy
 * is the provisional motif, the locus is extended both ways by aligning against the repeated motif
 * ({@link WrapAligner}), the copies other than the seed's vote on the consensus ({@link VoteTally},
 * {@link Consensus}), and a last alignment from the left end gives the right end and the counts, voted on
 * again while the score rises ({@link #settle}).
 */
final class CandidateBuilder {
    /** Copies that vote on the provisional consensus: plenty to outvote errors, bounded work in satellites. */
    static final int VOTE_COPIES = 24;
    /** Rounds of voting on the locus' own alignment; each must raise the score to be kept. */
    static final int VOTE_ROUNDS = 3;

    private final byte[] seq;
    private final Background background;
    private final WrapAligner right;
    private final WrapAligner left;
    private final VoteTally tally;
    private final double rejectCopies;
    /**
     * Where the first extension of the last {@link #build} reached when it rejected the seed for falling
     * short of {@code rejectCopies} copies; an empty stretch after any other outcome.
     */
    int reachStart;
    int reachEnd;

    /**
     * @param background   the composition at every position of {@code seq}
     * @param rejectCopies copies the first extension of a seed must reach for the seed to be built on
     */
    CandidateBuilder(byte[] seq, Background background, ScoreWorkspace ws, double rejectCopies) {
        this.rejectCopies = rejectCopies;
        this.seq = seq;
        this.background = background;
        this.right = ws.right;
        this.left = ws.left;
        this.tally = ws.tally;
    }

    byte[] seq() {
        return seq;
    }

    /**
     * Score drop that ends an extension, in score units: 26 bits, and 0.87 bits more per base of the unit up
     * to 60, since a long unit may carry a burst of errors and still continue (about 15 uniform matches, and
     * one more per unit base up to 60).
     */
    static int xdrop(int p) {
        return ScoringModel.PER_BIT * 26 + ScoringModel.PER_BIT * 87 * Math.min(p, 60) / 100;
    }

    /**
     * The candidate seeded by period {@code p} at {@code s}, extended no further than {@code [cs, ce)} (the
     * seed's component of reaches), or null when its first copy holds a letter other than ACGT, the
     * extension is no longer than a copy and {@link LocusCaller#SEED_EXTRA} bases or shorter than
     * {@code rejectCopies} copies ({@link #reachStart} and {@link #reachEnd} then say how far it reached), or
     * no consensus is left.
     */
    Candidate build(int s, int p, int cs, int ce) {
        reachStart = s;
        reachEnd = s;
        byte[] m0 = new byte[p];
        for (int k = 0; k < p; k++) {
            int code = Bases.code(seq[s + k]);
            if (code < 0 || code > 3) {
                return null;
            }
            m0[k] = (byte) code;
        }
        int xd = xdrop(p);
        // the model of the seed's own block: a position decides it, never the cut that holds it
        ScoringModel model = background.at(s);
        // the provisional consensus is voted on the first copies only; the final one on the whole locus.
        // Both ends are found before any vote is counted: most candidates fail the length test and their
        // paths are never walked
        left.extend(model, seq, s - 1, -1, m0, p, p - 1, s - cs, xd);
        int leftLen = left.bestI();
        // the seed copy aligns with itself: the right end is found by aligning the bases after it against
        // the motif from its first letter, which for a long unit that does not recur is a fraction of the work
        int rightCap = Math.max(0, Math.min(ce - s, VOTE_COPIES * p + 64) - p);
        right.extend(model, seq, s + p, 1, m0, p, 0, rightCap, xd);
        int reach = leftLen + p + right.bestI();
        if (reach < p + LocusCaller.SEED_EXTRA) {
            return null;
        }
        if (reach < rejectCopies * p) {
            return rejected(s - leftLen, s + p + right.bestI());
        }
        tally.clear(p);
        // the seed copy, which the motif was read from, does not vote (nor is it on the right path)
        tally.addPath(right, seq, s + p, 1, m0, 0, 0, null);
        tally.addPath(left, seq, s - 1, -1, m0, p - 1, 0, null);
        int a = s - leftLen;
        int phaseA = leftLen == 0 ? 0 : Math.floorMod(p - left.bestJ(), p);
        Consensus c = Consensus.of(tally.counts(), m0, phaseA);
        return c == null ? null : settle(a, c.motif(), c.phase(), ce - a);
    }

    private Candidate rejected(int start, int end) {
        reachStart = start;
        reachEnd = end;
        return null;
    }

    /**
     * {@link #align} followed by up to {@link #VOTE_ROUNDS} rounds of the candidate's own copies voting on
     * its consensus, each kept only when realigning with it raises the score; null when nothing aligns.
     */
    Candidate settle(int a, byte[] motif, int phaseA, int cap) {
        return settle(a, motif, phaseA, cap, 1);
    }

    /**
     * As {@link #settle(int, byte[], int, int)}, with the X-drop multiplied by {@code dropScale}: an
     * extension that must run through a burst of errors, as across the break between two pieces of one
     * satellite array ({@link ArrayJoin}).
     */
    Candidate settle(int a, byte[] motif, int phaseA, int cap, int dropScale) {
        Candidate k = align(a, motif, phaseA, cap, dropScale);
        for (int round = 0; k != null && round < VOTE_ROUNDS; round++) {
            // the tally holds the votes of k's alignment: align filled it last
            Consensus next = Consensus.of(tally.counts(), k.motif, k.phaseA);
            if (next == null || Arrays.equals(next.motif(), k.motif)) {
                break;
            }
            Candidate r = align(k.start, next.motif(), next.phase(), cap, dropScale);
            if (r == null || r.score <= k.score) {
                break;
            }
            k = r;
        }
        return k;
    }

    /**
     * The alignment against {@code motif} repeated from phase {@code phaseA} at the fixed left end
     * {@code a}, over at most {@code cap} bases: gives the right end, the counts and the phase of every
     * base, and leaves its votes in the workspace's tally. Scored with the model of the block holding
     * {@code a}. Null when not one base aligns.
     */
    Candidate align(int a, byte[] motif, int phaseA, int cap) {
        return align(a, motif, phaseA, cap, 1);
    }

    private Candidate align(int a, byte[] motif, int phaseA, int cap, int dropScale) {
        int p = motif.length;
        ScoringModel model = background.at(a);
        right.extend(model, seq, a, 1, motif, p, phaseA, cap, xdrop(p) * dropScale);
        int len = right.bestI();
        if (len == 0) {
            return null;
        }
        PhaseMap.Builder phases = new PhaseMap.Builder(p);
        tally.clear(p);
        VoteTally.PathCounts counts = tally.addPath(right, seq, a, 1, motif, phaseA, 0, phases);
        return new Candidate(a, motif, phaseA, right.bestScore(), model, counts, phases.build(len));
    }
}
