package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/** The filters: each bound inclusive, and the copy-number test exact for copy numbers typed in decimal. */
class LocusFilterTest {
    private static final LocusFilter F = new LocusFilter(new ScoreSettings(2, 50, 2.5, 12, 0.7, 3.0));
    private static final int U = ScoringModel.UNIFORM_CLASS;

    @Test
    void everyBoundIsInclusive() {
        assertThat(F.acceptsRun(2, 12)).isTrue();
        assertThat(F.acceptsRun(1, 12)).isFalse(); // period below the least
        assertThat(F.acceptsRun(50, 125)).isTrue();
        assertThat(F.acceptsRun(51, 200)).isFalse(); // period above the largest
        assertThat(F.acceptsRun(4, 11)).isFalse(); // shorter than the least length
        assertThat(F.acceptsRun(6, 15)).isTrue(); // exactly 2.5 copies
        assertThat(F.acceptsRun(6, 14)).isFalse();
        // 3 bits are 30 units
        assertThat(F.accepts(6, 15, 0.7, 30, U)).isTrue();
        assertThat(F.accepts(6, 15, 0.699, 30, U)).isFalse();
        assertThat(F.accepts(6, 15, 0.7, 29, U)).isFalse();
        assertThat(F.accepts(6, 14, 1.0, 100, U)).isFalse();
    }

    @Test
    void aCandidateIsJudgedByItsAlignment() {
        // 20 bases of period 4: 16 matches of 20 columns is purity 0.8
        Candidate k = new Candidate(100, new byte[4], 0, 31, ScoringModel.uniform(), new VoteTally.PathCounts(16, 2, 1, 1), PhaseMap.steady(4, 20, 0));
        assertThat(F.accepts(k)).isTrue();
        Candidate weak = new Candidate(100, new byte[4], 0, 31, ScoringModel.uniform(), new VoteTally.PathCounts(13, 5, 1, 1), PhaseMap.steady(4, 20, 0));
        assertThat(F.accepts(weak)).isFalse();
    }

    /** A table with one period class of GC class 4 and nothing elsewhere. */
    static Calibration oneClass(double k, double lambda) {
        List<String> rows = new ArrayList<>();
        rows.add(Calibration.HEADER);
        for (int g = 0; g < ScoringModel.GC_CLASSES; g++) {
            for (int c = 0; c < Calibration.PERIOD_CLASSES; c++) {
                boolean on = g == 4 && c == Calibration.periodClass(2);
                rows.add(String.format(Locale.ROOT, "%.2f\t%s\t%s\t%s\t0\t0", ScoringModel.gcOfClass(g),
                        Calibration.className(c), on ? k : 0, on ? lambda : 1));
            }
        }
        return Calibration.parse(rows);
    }

    @Test
    void theEvalueBoundIsTheLowestScoreOfThatEvalue() {
        // E(S) = 100 x 2^(-S / 2) <= 1 needs S >= 2 log2(100) = 13.2877 bits: 13.3 bits (133 units) gives
        // 100 x 2^-6.65 = 0.996, 13.2 bits gives 100 x 2^-6.6 = 1.031
        Calibration t = oneClass(100, 0.5);
        assertThat(t.evalue(4, 133)).isCloseTo(0.996, org.assertj.core.data.Offset.offset(0.001));
        assertThat(t.evalue(4, 132)).isCloseTo(1.031, org.assertj.core.data.Offset.offset(0.001));
        LocusFilter f = new LocusFilter(new ScoreSettings(1, 50, 2, 12, 0.7, 0, 1.0), t);
        assertThat(f.minUnits(4)).isEqualTo(133);
        assertThat(f.accepts(2, 40, 0.9, 133, 4)).isTrue();
        assertThat(f.accepts(2, 40, 0.9, 132, 4)).isFalse();
        // no loci by chance in the other classes: every score passes
        assertThat(f.minUnits(5)).isZero();
        // the bound in bits binds where it is higher
        LocusFilter both = new LocusFilter(new ScoreSettings(1, 50, 2, 12, 0.7, 20.0, 1.0), t);
        assertThat(both.minUnits(4)).isEqualTo(200);
        // a period range without the class sums nothing
        LocusFilter longOnly = new LocusFilter(new ScoreSettings(3, 50, 2, 12, 0.7, 0, 1.0), t);
        assertThat(longOnly.minUnits(4)).isZero();
        assertThat(longOnly.calibration().evalue(4, 0)).isZero();
        // and none at all: everything passes
        assertThat(new LocusFilter(new ScoreSettings(1, 50, 2, 12, 0.7, 0), t).minUnits(4)).isZero();
    }

    @Test
    void theShippedTableHasEveryClassAndFallsWithTheScore() {
        Calibration t = Calibration.shipped();
        for (int g = 0; g < ScoringModel.GC_CLASSES; g++) {
            double prev = Double.POSITIVE_INFINITY;
            for (int units = 0; units <= 1000; units += 10) {
                double e = t.evalue(g, units);
                assertThat(e).isLessThanOrEqualTo(prev).isNotNegative();
                prev = e;
            }
        }
    }

    /** Against exact decimal arithmetic: 1.1 x 10 is 11.000000000000002 in doubles, yet 11 bases are 1.1 copies. */
    @Property(tries = 2000)
    void copyNumberTestIsExactForDecimalSettings(@ForAll @IntRange(min = 100, max = 1000) int hundredths,
                                                 @ForAll @IntRange(min = 1, max = 2000) int period,
                                                 @ForAll @IntRange(min = 0, max = 30) int extra) {
        BigDecimal minCopies = BigDecimal.valueOf(hundredths, 2);
        LocusFilter f = new LocusFilter(new ScoreSettings(1, 2000, minCopies.doubleValue(), 1, 0, 0));
        int needed = minCopies.multiply(BigDecimal.valueOf(period)).setScale(0, java.math.RoundingMode.CEILING)
                .intValueExact();
        int length = Math.max(1, needed - 15 + extra);
        assertThat(f.acceptsRun(period, length)).isEqualTo(length >= needed);
    }
}
