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
    /**
     * A left extension longer than this (and than the copies that vote) that leaves its seed outside the
     * candidate is not repeated by the seeds after it: the candidate is built from the seed on instead.
     */
    static final int LONG_LEFT = 10_000;
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
        Candidate k = c == null ? null : settle(a, c.motif(), c.phase(), ce - a);
        if (k != null && k.end < s + p && leftLen > Math.max(VOTE_COPIES * p, LONG_LEFT)) {
            // the copies before the seed, more than ever vote, made a unit that stops short of the seed itself:
            // a seed just past a change inside a satellite array, whose left extension ran back over the
            // whole piece before. The candidate is built from the seed on, so that it holds its seed
            // and the seeds after it are explained, instead of each running back over that piece again
            // (which made the time grow with the square of the array's length)
            return settle(s, m0, 0, ce - s);
        }
        return k;
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
     * One alignment over the pieces of one array, against one motif: piece {@code j} is aligned from its own
     * start {@code starts[j]} (ascending; the first at {@code phase0}, every other at {@link #bestPhase}), no
     * further than the next piece's start (the last no further than {@code stop}), with the X-drop multiplied
     * by {@code dropScale}. What the aligner cannot follow between two pieces, a jump of phase (an indel
     * longer than its band) and the bases between the end of one piece's alignment and the next start, is
     * charged as the cheapest columns that take the template from the one phase to the other: the gap's g
     * bases against D template letters, with D the template advance nearest to g, as min(g, D)
     * substitutions and |g - D| insertions or deletions. Leaves the votes of every piece in the tally.
     * Null when a piece aligns no base or a gap holds a letter other than ACGT.
     */
    Candidate alignPieces(int[] starts, int stop, byte[] motif, int phase0, int dropScale) {
        int p = motif.length;
        int a = starts[0];
        ScoringModel model = background.at(a);
        int xd = xdrop(p) * dropScale;
        // per piece, where its alignment starts and its phases; per gap before a piece, the phase and template
        // advance it is drawn with
        int[] segStart = new int[starts.length];
        PhaseMap[] segPhases = new PhaseMap[starts.length];
        int[] gapPhase = new int[starts.length];
        int[] gapAdvance = new int[starts.length];
        tally.clear(p);
        long score = 0;
        int matches = 0;
        int mismatches = 0;
        int insertions = 0;
        int deletions = 0;
        int end = a;
        int expected = phase0;
        for (int j = 0; j < starts.length; j++) {
            int s = starts[j];
            int cap = (j + 1 < starts.length ? starts[j + 1] : stop) - s;
            int phase = j == 0 ? phase0 : bestPhase(model, s, motif, cap, xd, expected);
            if (j > 0) {
                int g = s - end;
                // the template advance over the gap, nearest to g: a phase that goes back by e letters
                // (D = -e) repeats e letters, charged as e inserted bases
                int d = Math.floorMod(phase - expected, p);
                int big = d + p * Math.max(-1, Math.round((g - d) / (float) p));
                int sub = Math.max(0, Math.min(g, big));
                for (int x = end; x < s; x++) {
                    int b = Bases.code(seq[x]);
                    if (b < 0 || b > 3) {
                        return null;
                    }
                    score += x - end < sub ? model.substitution(b) : model.insertion();
                }
                gapPhase[j] = expected;
                gapAdvance[j] = Math.max(0, big);
                int ins = g - sub + Math.max(0, -big);
                int del = Math.max(0, big - sub);
                mismatches += sub;
                insertions += ins;
                deletions += del;
                score += (long) Math.max(0, -big) * model.insertion() + (long) del * model.deletion();
            }
            right.extend(model, seq, s, 1, motif, p, phase, cap, xd);
            int len = right.bestI();
            if (len == 0) {
                return null;
            }
            PhaseMap.Builder at = new PhaseMap.Builder(p);
            VoteTally.PathCounts c = tally.addPath(right, seq, s, 1, motif, phase, 0, at);
            segStart[j] = s;
            segPhases[j] = at.build(len);
            score += right.bestScore();
            matches += c.matches();
            mismatches += c.mismatches();
            insertions += c.insertions();
            deletions += c.deletions();
            end = s + len;
            expected = Math.floorMod(phase + right.bestJ(), p);
        }
        // the map is built from the last base back: each piece's phases, and across each gap the phase
        // stepped on evenly by the template advance charged for it
        PhaseMap.Builder phases = new PhaseMap.Builder(p);
        for (int j = starts.length - 1; j >= 0; j--) {
            int s = segStart[j];
            PhaseMap m = segPhases[j];
            for (int y = s + m.length() - 1; y >= s; y--) {
                phases.add(y - a, m.at(y - s));
            }
            if (j > 0) {
                int g0 = segStart[j - 1] + segPhases[j - 1].length();
                int g = s - g0;
                for (int y = s - 1; y >= g0; y--) {
                    phases.add(y - a, (int) Math.floorMod(gapPhase[j] + (long) (y - g0) * gapAdvance[j] / Math.max(1, g), p));
                }
            }
        }
        return new Candidate(a, motif, phase0, (int) Math.min(Integer.MAX_VALUE, score), model,
                new VoteTally.PathCounts(matches, mismatches, insertions, deletions), phases.build(end - a));
    }

    /**
     * {@link #alignPieces} followed by up to {@link #VOTE_ROUNDS} rounds of voting on the consensus of all
     * pieces, each kept only when it raises the score.
     */
    Candidate settlePieces(int[] starts, int stop, byte[] motif, int phase0, int dropScale) {
        Candidate k = alignPieces(starts, stop, motif, phase0, dropScale);
        for (int round = 0; k != null && round < VOTE_ROUNDS; round++) {
            Consensus next = Consensus.of(tally.counts(), k.motif, k.phaseA);
            if (next == null || Arrays.equals(next.motif(), k.motif)) {
                break;
            }
            Candidate r = alignPieces(starts, stop, next.motif(), next.phase(), dropScale);
            if (r == null || r.score <= k.score) {
                break;
            }
            k = r;
        }
        return k;
    }

    /** A copy of the votes the last alignment left in the tally, {@link VoteTally#SLOTS} per phase of {@code p}. */
    int[] votes(int p) {
        return Arrays.copyOf(tally.counts(), VoteTally.SLOTS * p);
    }

    /** Phases kept from the first, short trial of every phase for the longer second one. */
    static final int PHASE_TRIALS = 4;

    /**
     * The phase of {@code motif} at which the bases from {@code s} align best: every phase is tried over
     * the first unit and a half, and the {@link #PHASE_TRIALS} best over up to 8 units (at most
     * {@code cap} bases), since diverged units may favour a wrong phase over one unit, and a wrong phase
     * dies at the first indel longer than the band; ties go to the phase nearest {@code expected}.
     */
    int bestPhase(ScoringModel model, int s, byte[] motif, int cap, int xd, int expected) {
        int p = motif.length;
        int n = Math.min(cap, p + p / 2);
        int[] top = new int[PHASE_TRIALS];
        int[] topScore = new int[PHASE_TRIALS];
        Arrays.fill(topScore, Integer.MIN_VALUE);
        for (int t = 0; t < p; t++) {
            // from the expected phase outwards, alternately ahead and behind
            int phase = Math.floorMod(expected + ((t & 1) == 0 ? t / 2 : -(t + 1) / 2), p);
            right.extend(model, seq, s, 1, motif, p, phase, n, xd);
            int sc = right.bestScore();
            for (int r = 0; r < PHASE_TRIALS; r++) {
                if (sc > topScore[r]) {
                    System.arraycopy(top, r, top, r + 1, PHASE_TRIALS - r - 1);
                    System.arraycopy(topScore, r, topScore, r + 1, PHASE_TRIALS - r - 1);
                    top[r] = phase;
                    topScore[r] = sc;
                    break;
                }
            }
        }
        int m = Math.min(cap, 8 * p);
        int best = top[0];
        int bestScore = Integer.MIN_VALUE;
        for (int r = 0; r < PHASE_TRIALS && r < p; r++) {
            right.extend(model, seq, s, 1, motif, p, top[r], m, xd);
            if (right.bestScore() > bestScore) {
                bestScore = right.bestScore();
                best = top[r];
            }
        }
        return best;
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
