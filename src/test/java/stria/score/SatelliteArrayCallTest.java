package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Satellite arrays through the caller, on planted arrays whose truth is known: a diverged array comes out
 * as one locus, an array interrupted by unrelated sequence in two, a higher-order array at its block with
 * the unit as subunit when the period limit allows, and at the unit without one when it does not.
 */
class SatelliteArrayCallTest {
    private static final int UNIT = 171;

    /** {@code copies} copies of {@code unit}, each base substituted with probability {@code sub}. */
    private static String array(String unit, int copies, double sub, Random r) {
        StringBuilder sb = new StringBuilder();
        for (int c = 0; c < copies; c++) {
            sb.append(mutate(unit, sub, r));
        }
        return sb.toString();
    }

    private static String mutate(String s, double sub, Random r) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < s.length(); i++) {
            char ch = s.charAt(i);
            double x = r.nextDouble();
            if (x < sub) {
                ch = "ACGT".charAt(("ACGT".indexOf(ch) + 1 + r.nextInt(3)) % 4);
            } else if (x < sub + 0.005) {
                continue; // an occasional deletion
            } else if (x < sub + 0.01) {
                sb.append("ACGT".charAt(r.nextInt(4)));
            }
            sb.append(ch);
        }
        return sb.toString();
    }

    private static String random(int n, Random r) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < n; i++) {
            sb.append("ACGT".charAt(r.nextInt(4)));
        }
        return sb.toString();
    }

    private static ScoreSettings settings(int maxPeriod) {
        return new ScoreSettings(1, maxPeriod, 2.0, 12, 0.7, 0);
    }

    /** Loci of period within 5 % of {@code p} (or a multiple up to 16) overlapping {@code [a, b)}. */
    private static List<Locus> pieces(List<Locus> loci, int a, int b) {
        return loci.stream().filter(l -> l.end() > a && l.start() < b && l.period() >= 0.95 * UNIT).toList();
    }

    @Test
    void aDivergedArrayIsOneLocus() {
        Random r = new Random(17);
        String unit = random(UNIT, r);
        // 18 % substitutions between copies: well below identity 0.85, above the purity floor
        String arr = array(unit, 240, 0.18, r);
        byte[] seq = LocusCallerTest.flanked(arr, 2000, 5);
        List<Locus> loci = LocusCallerTest.call(seq, settings(2000));
        List<Locus> p = pieces(loci, 2000, 2000 + arr.length());
        assertThat(p).hasSize(1);
        assertThat(p.get(0).length()).isGreaterThanOrEqualTo((int) (0.9 * arr.length()));
        assertThat(Math.abs(p.get(0).period() - UNIT)).isLessThanOrEqualTo(UNIT / 20);
        assertThat(p.get(0).subunits()).isZero();
    }

    @Test
    void aJumpOfPhaseBetweenTwoCopiesIsCrossed() {
        Random r = new Random(29);
        String unit = random(UNIT, r);
        // one copy lacks 40 bases: a jump of phase far wider than the aligner's band
        String left = array(unit, 60, 0.12, r);
        String right = mutate(unit.substring(40), 0.12, r) + array(unit, 60, 0.12, r);
        String arr = left + right;
        byte[] seq = LocusCallerTest.flanked(arr, 2000, 7);
        // the premise: one alignment with the unit, even with the widened X-drop, stops at the jump
        byte[] motif = new byte[UNIT];
        for (int i = 0; i < UNIT; i++) {
            motif[i] = stria.io.Bases.code((byte) unit.charAt(i));
        }
        WrapAligner one = new WrapAligner();
        one.extend(ScoringModel.uniform(), seq, 2000, 1, motif, UNIT, 0, arr.length(),
                CandidateBuilder.xdrop(UNIT) * ArrayJoin.dropScale(UNIT));
        assertThat(one.bestI()).isLessThan(left.length() + UNIT);

        List<Locus> p = pieces(LocusCallerTest.call(seq, settings(2000)), 2000, 2000 + arr.length());
        assertThat(p).hasSize(1);
        assertThat(p.get(0).length()).isGreaterThanOrEqualTo((int) (0.9 * arr.length()));
        assertThat(Math.abs(p.get(0).period() - UNIT)).isLessThanOrEqualTo(UNIT / 20);
    }

    @Test
    void aUnitChangedInOneBaseAfterAJumpStaysTwoLoci() {
        Random r = new Random(31);
        String unit = random(UNIT, r);
        char c = unit.charAt(90);
        String changed = unit.substring(0, 90) + "ACGT".charAt(("ACGT".indexOf(c) + 2) % 4) + unit.substring(91);
        // the first array ends inside a copy, the second starts a copy of its own unit: like (CA)n(GA)m
        String left = array(unit, 40, 0.04, r) + mutate(unit.substring(0, 80), 0.04, r);
        String right = array(changed, 40, 0.04, r);
        byte[] seq = LocusCallerTest.flanked(left + right, 2000, 8);
        List<Locus> p = pieces(LocusCallerTest.call(seq, settings(2000)), 2000, 2000 + left.length() + right.length());
        assertThat(p).hasSize(2);
        assertThat(Math.abs(p.get(0).end() - (2000 + left.length()))).isLessThan(UNIT);
    }

    @Test
    void multipleIsTheRatioOfTwoCommensuratePeriods() {
        assertThat(ArrayJoin.multiple(171, 171)).isEqualTo(1);
        assertThat(ArrayJoin.multiple(172, 168)).isEqualTo(1);
        assertThat(ArrayJoin.multiple(172, 344)).isEqualTo(2);
        assertThat(ArrayJoin.multiple(344, 172)).isEqualTo(2);
        assertThat(ArrayJoin.multiple(171, 1040)).isEqualTo(6);
        // 260 is 1.5 units: no multiple; 3 x 171 = 513 is 33 bases (over 5 %) from 480
        assertThat(ArrayJoin.multiple(171, 260)).isZero();
        assertThat(ArrayJoin.multiple(171, 480)).isZero();
        assertThat(ArrayJoin.multiple(50, 1000)).isZero();
    }

    @Test
    void anInvertedHalfStaysTwoLoci() {
        Random r = new Random(37);
        String unit = random(UNIT, r);
        String left = array(unit, 60, 0.12, r);
        String right = reverseComplement(array(unit, 60, 0.12, r));
        byte[] seq = LocusCallerTest.flanked(left + right, 2000, 9);
        List<Locus> p = pieces(LocusCallerTest.call(seq, settings(2000)), 2000, 2000 + left.length() + right.length());
        assertThat(p).hasSize(2);
        assertThat(Math.abs(p.get(0).end() - (2000 + left.length()))).isLessThan(UNIT);
    }

    private static String reverseComplement(String s) {
        StringBuilder sb = new StringBuilder(s.length());
        for (int i = s.length() - 1; i >= 0; i--) {
            sb.append("TGCA".charAt("ACGT".indexOf(s.charAt(i))));
        }
        return sb.toString();
    }

    @Test
    void anInterruptionOfUnrelatedSequenceSplitsTheArray() {
        Random r = new Random(23);
        String unit = random(UNIT, r);
        String left = array(unit, 120, 0.12, r);
        String right = array(unit, 120, 0.12, r);
        String arr = left + random(4000, r) + right;
        byte[] seq = LocusCallerTest.flanked(arr, 2000, 6);
        List<Locus> loci = LocusCallerTest.call(seq, settings(2000));
        List<Locus> p = pieces(loci, 2000, 2000 + arr.length());
        assertThat(p).hasSize(2);
        int gapStart = 2000 + left.length();
        int gapEnd = gapStart + 4000;
        assertThat(p.get(0).end()).isLessThan(gapStart + UNIT);
        assertThat(p.get(1).start()).isGreaterThan(gapEnd - UNIT);
    }

    @Test
    void aHigherOrderArrayIsFoundAtItsBlockWithTheUnitAsSubunit() {
        Random r = new Random(29);
        String unit = random(UNIT, r);
        // a block of 4 units 20 % apart, repeated with 1.5 % difference between blocks
        String block = mutate(unit, 0.2, r) + mutate(unit, 0.2, r) + mutate(unit, 0.2, r) + mutate(unit, 0.2, r);
        String arr = array(block, 60, 0.015, r);
        byte[] seq = LocusCallerTest.flanked(arr, 2000, 7);
        List<Locus> loci = LocusCallerTest.call(seq, settings(2000));
        List<Locus> p = pieces(loci, 2000, 2000 + arr.length());
        assertThat(p).hasSize(1);
        Locus l = p.get(0);
        assertThat(l.length()).isGreaterThanOrEqualTo((int) (0.9 * arr.length()));
        assertThat(Math.abs(l.period() - block.length())).isLessThanOrEqualTo(block.length() / 20);
        assertThat(Math.abs(l.subunitPeriod() - UNIT)).isLessThanOrEqualTo(UNIT / 20);
        assertThat(l.subunits()).isEqualTo(4);

        // a period limit below the block: one locus at the unit, no nested structure
        List<Locus> unitLevel = pieces(LocusCallerTest.call(seq, settings(500)), 2000, 2000 + arr.length());
        assertThat(unitLevel).hasSize(1);
        assertThat(unitLevel.get(0).length()).isGreaterThanOrEqualTo((int) (0.9 * arr.length()));
        assertThat(Math.abs(unitLevel.get(0).period() - UNIT)).isLessThanOrEqualTo(UNIT / 20);
        assertThat(unitLevel.get(0).subunits()).isZero();
    }

    @Test
    void aBlockLongerThanItsUnitsSayIsFoundAtItsOwnLength() {
        Random r = new Random(37);
        String unit = random(UNIT, r);
        // 10 units about 25 % apart, each followed by 1 or 2 inserted bases: the block is about 15 bases
        // longer than ten times the units' consensus (more than the aligner's band); its copies differ by 1.5 %
        StringBuilder b = new StringBuilder();
        for (int u = 0; u < 10; u++) {
            b.append(mutate(unit, 0.12, r)).append(random(1 + u % 2, r));
        }
        String block = b.toString();
        String arr = array(block, 30, 0.015, r);
        byte[] seq = LocusCallerTest.flanked(arr, 2000, 11);
        List<Locus> p = pieces(LocusCallerTest.call(seq, settings(10_000)), 2000, 2000 + arr.length());
        assertThat(p).hasSize(1);
        Locus l = p.get(0);
        assertThat(l.length()).isGreaterThanOrEqualTo((int) (0.9 * arr.length()));
        assertThat(Math.abs(l.period() - block.length())).isLessThanOrEqualTo(3);
        assertThat(l.subunits()).isEqualTo(10);
        assertThat(Math.abs(l.subunitPeriod() - UNIT)).isLessThanOrEqualTo(UNIT / 20);
    }

    @Test
    void shiftIsHowFarTheCopiesLieFromTheDistanceAsked() {
        Random r = new Random(41);
        String block = random(900, r);
        StringBuilder sb = new StringBuilder();
        for (int c = 0; c < 20; c++) {
            // copies that differ by substitutions only lie exactly 900 apart
            for (int i = 0; i < block.length(); i++) {
                char ch = block.charAt(i);
                sb.append(r.nextDouble() < 0.03 ? "ACGT".charAt(("ACGT".indexOf(ch) + 1 + r.nextInt(3)) % 4) : ch);
            }
        }
        byte[] seq = sb.toString().getBytes();
        assertThat(NestedUnits.shift(seq, 0, seq.length, 891)).isEqualTo(9);
        assertThat(NestedUnits.shift(seq, 0, seq.length, 900)).isZero();
        assertThat(NestedUnits.shift(seq, 0, seq.length, 909)).isEqualTo(-9);
        // random bases line up nowhere
        byte[] noise = random(20_000, r).getBytes();
        assertThat(NestedUnits.shift(noise, 0, noise.length, 900)).isZero();
    }

    @Test
    void agreementIsAboutTheCopyIdentity() {
        Random r = new Random(31);
        String unit = random(200, r);
        byte[] same = array(unit, 50, 0.05, r).getBytes();
        byte[] noise = random(10_000, r).getBytes();
        // copies about 0.9 alike by substitution; an indel inside a window costs the rest of that window
        assertThat(NestedUnits.agreement(same, 0, same.length, 200)).isBetween(0.75, 0.95);
        // random bases: a quarter agree, a little more at the best of a few offsets
        assertThat(NestedUnits.agreement(noise, 0, noise.length, 200)).isBetween(0.25, 0.5);
    }
}
