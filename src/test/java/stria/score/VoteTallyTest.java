package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

/**
 * The vote tally and the consensus on alignments made by hand: a few copies of CAG with one substitution,
 * insertion or deletion at a known place, aligned rightwards and leftwards; both directions must put each
 * vote on the same phase.
 */
class VoteTallyTest {
    private static final byte[] CAG = {1, 0, 2};
    private static final int S = VoteTally.SLOTS;

    private static byte[] ascii(String s) {
        return s.getBytes(StandardCharsets.US_ASCII);
    }

    /** Tally of {@code text} aligned rightwards from its first base against CAG from phase 0. */
    private static int[] rightwards(String text, int skip, int[] phaseAt, VoteTally.PathCounts[] counts) {
        byte[] seq = ascii(text);
        WrapAligner a = new WrapAligner();
        a.extend(ScoringModel.uniform(), seq, 0, 1, CAG, 3, 0, seq.length, 860);
        assertThat(a.bestI()).isEqualTo(seq.length);
        VoteTally t = new VoteTally();
        t.clear(3);
        PhaseMap.Builder phases = phaseAt == null ? null : new PhaseMap.Builder(3);
        VoteTally.PathCounts c = t.addPath(a, seq, 0, 1, CAG, 0, skip, phases);
        if (phases != null) {
            PhaseMap map = phases.build(seq.length);
            PhaseMap.Cursor cursor = map.cursor();
            for (int i = 0; i < seq.length; i++) {
                phaseAt[i] = map.at(i);
                assertThat(cursor.next()).isEqualTo(phaseAt[i]);
            }
        }
        if (counts != null) {
            counts[0] = c;
        }
        return java.util.Arrays.copyOf(t.counts(), 3 * S);
    }

    /** Tally of {@code text} aligned leftwards from its last base against CAG from phase 2 (its G). */
    private static int[] leftwards(String text) {
        byte[] seq = ascii(text);
        WrapAligner a = new WrapAligner();
        a.extend(ScoringModel.uniform(), seq, seq.length - 1, -1, CAG, 3, 2, seq.length, 860);
        assertThat(a.bestI()).isEqualTo(seq.length);
        VoteTally t = new VoteTally();
        t.clear(3);
        t.addPath(a, seq, seq.length - 1, -1, CAG, 2, 0, null);
        return java.util.Arrays.copyOf(t.counts(), 3 * S);
    }

    @Test
    void substitutionVotesAtItsPhase() {
        int[] c = rightwards("CAGCAGCTGCAG", 0, null, null);
        assertThat(c[S * 0 + 1]).isEqualTo(4); // C at phase 0
        assertThat(c[S * 1 + 0]).isEqualTo(3); // A at phase 1, and one T
        assertThat(c[S * 1 + 3]).isEqualTo(1);
        assertThat(c[S * 2 + 2]).isEqualTo(4);
        assertThat(c).isEqualTo(leftwards("CAGCAGCTGCAG"));
    }

    @Test
    void insertionVotesOnceBeforeTheLetterItPrecedes() {
        // TT between the A and the G of the third copy: one copy inserting two bases before phase 2
        VoteTally.PathCounts[] counts = new VoteTally.PathCounts[1];
        // (copies enough after it that the alignment pays for the insertion)
        String text = "CAGCAGCATTGCAGCAGCAG";
        int[] phaseAt = new int[text.length()];
        int[] c = rightwards(text, 0, phaseAt, counts);
        assertThat(c[S * 2 + VoteTally.INSERTED]).isEqualTo(1);
        assertThat(c[S * 2 + VoteTally.INSERTED_BASES]).isEqualTo(2);
        assertThat(c[S * 2 + 2]).isEqualTo(6);
        assertThat(phaseAt).containsExactly(0, 1, 2, 0, 1, 2, 0, 1, 2, 2, 2, 0, 1, 2, 0, 1, 2, 0, 1, 2);
        assertThat(counts[0]).isEqualTo(new VoteTally.PathCounts(18, 0, 2, 0));
        assertThat(c).isEqualTo(leftwards(text));
    }

    @Test
    void deletionVotesAtTheMissingPhase() {
        VoteTally.PathCounts[] counts = new VoteTally.PathCounts[1];
        int[] c = rightwards("CAGCAGCGCAGCAG", 0, null, counts);
        assertThat(c[S * 1 + VoteTally.DELETED]).isEqualTo(1);
        assertThat(c[S * 1 + 0]).isEqualTo(4);
        assertThat(counts[0]).isEqualTo(new VoteTally.PathCounts(14, 0, 0, 1));
        assertThat(c).isEqualTo(leftwards("CAGCAGCGCAGCAG"));
    }

    @Test
    void theSkippedCopyDoesNotVote() {
        int[] all = rightwards("CTGCAGCAGCAG", 0, null, null);
        int[] skipped = rightwards("CTGCAGCAGCAG", 3, null, null);
        assertThat(all[S * 1 + 3]).isEqualTo(1);
        assertThat(skipped[S * 1 + 3]).isZero();
        assertThat(skipped[S * 1 + 0]).isEqualTo(3);
        assertThat(skipped[S * 0 + 1]).isEqualTo(3);
    }

    /** Counts of one phase: A, C, G, T, deleted, inserting copies, inserted bases. */
    private static int[] tally(int[]... phases) {
        int[] c = new int[S * phases.length];
        for (int ph = 0; ph < phases.length; ph++) {
            System.arraycopy(phases[ph], 0, c, S * ph, S);
        }
        return c;
    }

    @Test
    void consensusTakesTheMajorityAndKeepsTheBaseOnTies() {
        int[] c = tally(new int[] {0, 5, 0, 0, 0, 0, 0}, new int[] {2, 0, 0, 3, 0, 0, 0},
                new int[] {0, 0, 2, 2, 0, 0, 0});
        Consensus k = Consensus.of(c, CAG, 2);
        assertThat(k.motif()).containsExactly(1, 3, 2); // CTG: T outvotes A, the tie at phase 2 keeps G
        assertThat(k.phase()).isEqualTo(2);
    }

    @Test
    void aPhaseMostCopiesLackIsDropped() {
        int[] c = tally(new int[] {0, 5, 0, 0, 0, 0, 0}, new int[] {1, 0, 0, 0, 4, 0, 0},
                new int[] {0, 0, 5, 0, 0, 0, 0});
        Consensus k = Consensus.of(c, CAG, 1);
        assertThat(k.motif()).containsExactly(1, 2); // CG
        assertThat(k.phase()).isEqualTo(1); // the dropped phase maps to the letter after it
    }

    @Test
    void basesMostCopiesInsertAreAddedBeforeTheirPhase() {
        // 4 of 5 copies insert before phase 2, 9 bases between them: round(9 / 4) = 2 placeholders
        int[] c = tally(new int[] {0, 5, 0, 0, 0, 0, 0}, new int[] {5, 0, 0, 0, 0, 0, 0},
                new int[] {0, 0, 5, 0, 0, 4, 9});
        Consensus k = Consensus.of(c, CAG, 2);
        assertThat(k.motif()).containsExactly(1, 0, 2, 2, 2);
        assertThat(k.phase()).isEqualTo(2);
        // an inserting minority changes nothing
        c[S * 2 + VoteTally.INSERTED] = 2;
        assertThat(Consensus.of(c, CAG, 2).motif()).containsExactly(1, 0, 2);
    }

    @Test
    void consensusIsReducedToItsPrimitiveRoot() {
        byte[] acac = {0, 1, 0, 1};
        int[] c = tally(new int[] {3, 0, 0, 0, 0, 0, 0}, new int[] {0, 3, 0, 0, 0, 0, 0},
                new int[] {3, 0, 0, 0, 0, 0, 0}, new int[] {0, 3, 0, 0, 0, 0, 0});
        Consensus k = Consensus.of(c, acac, 3);
        assertThat(k.motif()).containsExactly(0, 1);
        assertThat(k.phase()).isEqualTo(1);
    }

    @Test
    void nothingIsLeftWhenEveryPhaseIsDropped() {
        int[] c = tally(new int[] {0, 0, 0, 0, 3, 0, 0}, new int[] {0, 0, 0, 0, 3, 0, 0});
        assertThat(Consensus.of(c, new byte[] {0, 1}, 0)).isNull();
    }

    @Test
    void aRealAlignmentVotesTheInsertionIntoTheMotifInTwoRounds() {
        // every copy after the first carries an extra T before the second G: five matches (5 x 17 units) pay
        // for the insertion (-51) of each copy, on the uniform background
        byte[] seq = ascii("CAGGA" + "CAGTGA".repeat(6));
        byte[] cagga = {1, 0, 2, 2, 0};
        WrapAligner a = new WrapAligner();
        VoteTally t = new VoteTally();
        a.extend(ScoringModel.uniform(), seq, 0, 1, cagga, 5, 0, seq.length, 1720);
        t.clear(5);
        t.addPath(a, seq, 0, 1, cagga, 0, 5, null);
        // the inserted base first enters as a placeholder (the letter of the phase it precedes) ...
        byte[] first = Consensus.of(t.counts(), cagga, 0).motif();
        assertThat(first).containsExactly(1, 0, 2, 2, 2, 0);
        // ... which the vote over the alignment against the new motif replaces
        a.extend(ScoringModel.uniform(), seq, 0, 1, first, 6, 0, seq.length, 1720);
        t.clear(6);
        t.addPath(a, seq, 0, 1, first, 0, 0, null);
        assertThat(Consensus.of(t.counts(), first, 0).motif()).containsExactly(1, 0, 2, 3, 2, 0);
    }
}
