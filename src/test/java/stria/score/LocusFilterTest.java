package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/** The filters: each bound inclusive, and the copy-number test exact for copy numbers typed in decimal. */
class LocusFilterTest {
    private static final LocusFilter F = new LocusFilter(new ScoreSettings(2, 50, 2.5, 12, 0.7, 30));

    @Test
    void everyBoundIsInclusive() {
        assertThat(F.acceptsRun(2, 12)).isTrue();
        assertThat(F.acceptsRun(1, 12)).isFalse(); // period below the least
        assertThat(F.acceptsRun(50, 125)).isTrue();
        assertThat(F.acceptsRun(51, 200)).isFalse(); // period above the largest
        assertThat(F.acceptsRun(4, 11)).isFalse(); // shorter than the least length
        assertThat(F.acceptsRun(6, 15)).isTrue(); // exactly 2.5 copies
        assertThat(F.acceptsRun(6, 14)).isFalse();
        assertThat(F.accepts(6, 15, 0.7, 30)).isTrue();
        assertThat(F.accepts(6, 15, 0.699, 30)).isFalse();
        assertThat(F.accepts(6, 15, 0.7, 29)).isFalse();
        assertThat(F.accepts(6, 14, 1.0, 100)).isFalse();
    }

    @Test
    void aCandidateIsJudgedByItsAlignment() {
        // 20 bases of period 4: 16 matches of 20 columns is purity 0.8
        Candidate k = new Candidate(100, new byte[4], 0, 31, new VoteTally.PathCounts(16, 2, 1, 1), new int[20]);
        assertThat(F.accepts(k)).isTrue();
        Candidate weak = new Candidate(100, new byte[4], 0, 31, new VoteTally.PathCounts(13, 5, 1, 1), new int[20]);
        assertThat(F.accepts(weak)).isFalse();
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
