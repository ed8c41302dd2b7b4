package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Random;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/**
 * Consensus, purity and counts against a direct computation. With substitutions only and an alignment
 * without gaps, base x of a locus sits at phase (x - start) mod period, so the consensus is the majority
 * letter of each phase and purity is the share of bases equal to it.
 */
class ConsensusProperties {
    private static final ScoreSettings SETTINGS = new ScoreSettings(1, 200, 2.0, 12, 0.5, 10);

    @Property(tries = 300)
    void consensusAndPurityMatchADirectCount(@ForAll long seed, @ForAll @IntRange(min = 1, max = 9) int period,
                                             @ForAll @IntRange(min = 6, max = 30) int copies,
                                             @ForAll @IntRange(min = 0, max = 12) int errorsPercent) {
        check(seed, period, copies, errorsPercent);
    }

    /**
     * A stretch of a flank (TCCATATCCATA) lost most of a candidate to a (TA)n locus beside it: what is left
     * must vote on its own consensus, not keep the one the lost copies shaped (TCTATA, two mismatches).
     */
    @Example
    void aTrimmedLocusHasItsOwnConsensus() {
        check(1048733739L, 2, 8, 0);
    }

    /**
     * One (CCCACAC)n array, starting at a flank A one base early, split in two by {@link CompoundSplit}
     * (the whole candidate's alignment took a gap, so its phases shift part way): the left side's motif was
     * counted on the whole candidate's phases, which the side realigned alone does not have, and was never
     * voted on again, so it said ACCCACA where the side's own phase 0 holds C 8 times and A twice.
     */
    @Example
    void aLeadingFlankBaseDoesNotKeepAMinorityMotif() {
        check(9186364920792210195L, 7, 24, 10);
    }

    private static void check(long seed, int period, int copies, int errorsPercent) {
        Random r = new Random(seed);
        char[] unit = new char[period];
        for (int i = 0; i < period; i++) {
            unit[i] = "ACGT".charAt(r.nextInt(4));
        }
        StringBuilder mid = new StringBuilder();
        for (int i = 0; i < period * copies; i++) {
            char c = unit[i % period];
            if (r.nextInt(100) < errorsPercent) {
                c = "ACGT".charAt(("ACGT".indexOf(c) + 1 + r.nextInt(3)) % 4);
            }
            mid.append(c);
        }
        byte[] seq = LocusCallerTest.flanked(mid.toString(), 150, seed ^ 0x5DEECE66DL);
        List<Locus> loci = LocusCallerTest.call(seq, SETTINGS);
        for (Locus l : loci) {
            if (l.insertions() != 0 || l.deletions() != 0) {
                continue;
            }
            int p = l.period();
            int[][] counts = new int[p][4];
            for (int x = l.start(); x < l.end(); x++) {
                counts[(x - l.start()) % p]["ACGT".indexOf(Character.toUpperCase((char) seq[x]))]++;
            }
            int agree = 0;
            for (int ph = 0; ph < p; ph++) {
                int reported = "ACGT".indexOf(l.motif().charAt(ph));
                int max = 0;
                for (int b = 0; b < 4; b++) {
                    max = Math.max(max, counts[ph][b]);
                }
                // the reported letter is a majority letter of its phase (ties may go either way)
                assertThat(counts[ph][reported]).as("phase %d of %s", ph, l).isEqualTo(max);
                agree += counts[ph][reported];
            }
            assertThat(l.mismatches()).isEqualTo(l.length() - agree);
            assertThat(l.purity()).isEqualTo(agree / (double) l.length());
            assertThat(l.copies()).isEqualTo(l.length() / (double) p);
            assertThat(l.motifClass()).isEqualTo(MotifClass.of(l.motif()));
            // no indels: every column a match or a substitution, scored on the uniform background of the call
            ScoringModel m = ScoringModel.uniform();
            assertThat(l.score()).isEqualTo(ScoringModel.bits(m.match(0) * agree + m.substitution(0) * (l.length() - agree)));
            int[] comp = new int[4];
            for (int x = l.start(); x < l.end(); x++) {
                comp["ACGT".indexOf(Character.toUpperCase((char) seq[x]))]++;
            }
            double h = 0;
            for (int c : comp) {
                if (c > 0) {
                    double f = c / (double) l.length();
                    h -= f * Math.log(f) / Math.log(2);
                }
            }
            assertThat(l.entropy()).isCloseTo(h, org.assertj.core.data.Offset.offset(1e-12));
        }
        String s = new String(seq, StandardCharsets.US_ASCII);
        assertThat(s).isNotEmpty();
    }
}
