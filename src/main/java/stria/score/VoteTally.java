package stria.score;

import java.util.Arrays;
import stria.io.Bases;

/**
 * The votes of aligned copies on a consensus, per phase of the motif: how many bases of each letter were
 * aligned there, how many copies lack it, how many copies insert just before it and how many bases they
 * insert. Filled from alignment paths ({@link #addPath}) and read by {@link Consensus}. Part of a
 * {@link ScoreWorkspace}: the buffer grows with the period and is reused.
 */
final class VoteTally {
    /** Slots per phase: A, C, G, T, then the three below. */
    static final int SLOTS = 7;
    static final int DELETED = 4;
    static final int INSERTED = 5;
    static final int INSERTED_BASES = 6;

    private int[] counts = new int[64];

    /** The figures of one alignment path: columns by kind. */
    record PathCounts(int matches, int mismatches, int insertions, int deletions) {
    }

    /** Empties the tally for a motif of {@code p} phases. */
    void clear(int p) {
        if (counts.length < SLOTS * p) {
            counts = new int[SLOTS * p];
        } else {
            Arrays.fill(counts, 0, SLOTS * p, 0);
        }
    }

    /** The counts, {@link #SLOTS} per phase; valid for the phases of the last {@link #clear}. */
    int[] counts() {
        return counts;
    }

    /**
     * Adds the votes of the best path of {@code path}'s last extend, which read text base {@code i} (from 1)
     * at {@code seq[pos0 + dir * (i - 1)]} and template letter {@code j} (from 1) as
     * {@code motif[mod(phase + dir * (j - 1), p)]}. Columns within the first {@code skip} text bases or
     * template letters do not vote (the copy a motif was read from would outvote a few others on its own
     * errors). An insertion of several bases is one vote for its boundary. When {@code phases} is not
     * null it receives the phase of every text base (at offset {@code i - 1}, an inserted base taking the
     * phase it precedes).
     */
    PathCounts addPath(WrapAligner path, byte[] seq, int pos0, int dir, byte[] motif, int phase, int skip,
                       PhaseMap.Builder phases) {
        int p = motif.length;
        int[] cnt = counts;
        int matches = 0;
        int mismatches = 0;
        int insertions = 0;
        int deletions = 0;
        int lastIns = -1;
        // the path runs from the far end inwards and j falls by at most one per column, so the phase of
        // letter j is stepped instead of divided out
        int prevJ = path.bestJ();
        int ph = Math.floorMod(phase + dir * (prevJ - 1), p);
        path.beginPath();
        for (int op = path.nextColumn(); op >= 0; op = path.nextColumn()) {
            int i = path.colI;
            int j = path.colJ;
            if (j != prevJ) {
                ph = dir > 0 ? (ph == 0 ? p - 1 : ph - 1) : (ph == p - 1 ? 0 : ph + 1);
                prevJ = j;
            }
            if (i <= skip && op != WrapAligner.DEL || j <= skip && op == WrapAligner.DEL) {
                lastIns = -1;
                continue;
            }
            if (op == WrapAligner.DIAG) {
                int x = Bases.code(seq[pos0 + dir * (i - 1)]);
                cnt[SLOTS * ph + x]++;
                if (phases != null) {
                    phases.add(i - 1, ph);
                }
                if (motif[ph] == x) {
                    matches++;
                } else {
                    mismatches++;
                }
            } else if (op == WrapAligner.INS) {
                // the base sits before the next letter in contig order: j + 1 reading rightwards, j leftwards
                int at = dir < 0 ? ph : ph == p - 1 ? 0 : ph + 1;
                if (phases != null) {
                    phases.add(i - 1, at);
                }
                insertions++;
                cnt[SLOTS * at + INSERTED_BASES]++;
                if (lastIns != j) {
                    cnt[SLOTS * at + INSERTED]++;
                }
            } else {
                deletions++;
                cnt[SLOTS * ph + DELETED]++;
            }
            lastIns = op == WrapAligner.INS ? j : -1;
        }
        return new PathCounts(matches, mismatches, insertions, deletions);
    }
}
