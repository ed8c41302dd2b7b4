package stria.out;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.math.RoundingMode;
import org.junit.jupiter.api.Test;
import stria.score.Locus;

/**
 * The numbers of a result line against {@link BigDecimal}'s decimal rounding: copies are rounded half up from
 * the exact fraction length / period; purity and entropy, which reach the formatter as doubles, are rounded
 * half up wherever the double is not within rounding noise of a midpoint.
 */
class LocusFormatTest {
    private static Locus locus(int start, int end, int period, double purity) {
        return new Locus(start, end, period, "A".repeat(period), "A".repeat(period), (end - start) / (double) period,
                purity, 0, 0, 0, 0, 0, 0.0);
    }

    private static String column(String line, int index) {
        return line.split("\t")[index];
    }

    @Test
    void copiesAreTheExactFractionRoundedHalfUp() {
        for (int period = 1; period <= 40; period++) {
            for (int length = 0; length <= 1200; length++) {
                StringBuilder sb = new StringBuilder();
                LocusFormat.tsv(sb, "c", locus(10, 10 + length, period, 1.0));
                String want = new BigDecimal(length).divide(new BigDecimal(period), 2, RoundingMode.HALF_UP)
                        .toPlainString();
                assertThat(column(sb.toString(), 6)).as("%d / %d", length, period).isEqualTo(want);
            }
        }
        StringBuilder sb = new StringBuilder();
        LocusFormat.bed(sb, "c", locus(0, 2_000_000_001, 3, 1.0));
        assertThat(column(sb.toString(), 7)).isEqualTo("666666667.00");
    }

    @Test
    void fractionsOfWholeNumbersAreRoundedHalfUpAwayFromMidpoints() {
        for (int columns = 1; columns <= 450; columns++) {
            for (int agree = 0; agree <= columns; agree++) {
                double v = agree / (double) columns;
                BigDecimal exact = new BigDecimal(agree).divide(new BigDecimal(columns), 12, RoundingMode.HALF_UP);
                StringBuilder sb = new StringBuilder();
                LocusFormat.fixed(sb, v, 3);
                BigDecimal got = new BigDecimal(sb.toString());
                BigDecimal want = exact.setScale(3, RoundingMode.HALF_UP);
                BigDecimal midpointDistance = exact.movePointRight(3).remainder(BigDecimal.ONE)
                        .subtract(new BigDecimal("0.5")).abs();
                if (midpointDistance.compareTo(new BigDecimal("1e-9")) > 0) {
                    assertThat(got).as("%d / %d", agree, columns).isEqualTo(want);
                } else {
                    // a midpoint such as 201/400 = 0.5025: the double lies a hair to one side of it
                    assertThat(got.subtract(exact).abs()).as("%d / %d", agree, columns)
                            .isLessThanOrEqualTo(new BigDecimal("0.0005"));
                }
            }
        }
    }

    @Test
    void fixedWritesEveryDecimalAndTheSign() {
        StringBuilder sb = new StringBuilder();
        LocusFormat.fixed(sb, 0, 3);
        sb.append(' ');
        LocusFormat.fixed(sb, 2, 3);
        sb.append(' ');
        LocusFormat.fixed(sb, 0.0625, 3);
        sb.append(' ');
        LocusFormat.fixed(sb, 1.0049, 2);
        sb.append(' ');
        LocusFormat.fixed(sb, -0.25, 2);
        assertThat(sb.toString()).isEqualTo("0.000 2.000 0.063 1.00 -0.25");
    }

    @Test
    void bedScoreIsPurityInThousandths() {
        StringBuilder sb = new StringBuilder();
        LocusFormat.bed(sb, "chr1", locus(100, 130, 2, 0.8765));
        assertThat(sb.toString()).isEqualTo("chr1\t100\t130\tAA\t877\t.\t2\t15.00\tAA\n");
    }

    /** The evalue against java.util.Formatter's {@code %.1e}, exact zero as 0; repeated values from the cache. */
    @Test
    void evalueIsScientificWithOneDecimal() {
        java.util.Random r = new java.util.Random(16);
        for (int i = 0; i < 20_000; i++) {
            double v = Math.pow(10, -300 + 310 * r.nextDouble());
            for (int twice = 0; twice < 2; twice++) {
                StringBuilder sb = new StringBuilder();
                LocusFormat.evalue(sb, v);
                assertThat(sb.toString()).isEqualTo(String.format(java.util.Locale.ROOT, "%.1e", v));
            }
        }
        StringBuilder sb = new StringBuilder();
        LocusFormat.evalue(sb, 0);
        sb.append(' ');
        LocusFormat.evalue(sb, 3.25e-5);
        sb.append(' ');
        LocusFormat.evalue(sb, 12.0);
        assertThat(sb.toString()).isEqualTo("0 3.3e-05 1.2e+01");
    }

    @Test
    void tsvHasTheScoreInBitsAndTheEvalueAfterIt() {
        Locus l = new Locus(10, 40, 2, "CA", "AC", 15, 1.0, 0, 0, 0, 51.8, 2.13e-7, 1.0);
        StringBuilder sb = new StringBuilder();
        LocusFormat.tsv(sb, "c", l);
        // empty trailing columns (no nested structure) are kept
        String[] f = sb.toString().replace("\n", "").split("\t", -1);
        String[] names = LocusFormat.TSV_HEADER.split("\t");
        assertThat(f).hasSameSizeAs(names);
        assertThat(f[f.length - 2]).isEmpty();
        assertThat(f[f.length - 1]).isEmpty();
        int score = java.util.Arrays.asList(names).indexOf("score");
        assertThat(names[score + 1]).isEqualTo("evalue");
        assertThat(f[score]).isEqualTo("51.8");
        assertThat(f[score + 1]).isEqualTo("2.1e-07");
        // BED keeps round(1000 x purity)
        sb.setLength(0);
        LocusFormat.bed(sb, "c", l);
        assertThat(sb.toString().split("\t")[4]).isEqualTo("1000");
    }

    @Test
    void nestedUnitsFillTheirTwoColumns() {
        Locus l = new Locus(0, 6840, 684, "A".repeat(684), "A".repeat(684), 10, 0.98, 0, 0, 0, 9000.0, 0, 1.9,
                171, 4);
        StringBuilder sb = new StringBuilder();
        LocusFormat.tsv(sb, "c", l);
        String[] f = sb.toString().replace("\n", "").split("\t", -1);
        java.util.List<String> names = java.util.Arrays.asList(LocusFormat.TSV_HEADER.split("\t"));
        assertThat(f[names.indexOf("subunit_period")]).isEqualTo("171");
        assertThat(f[names.indexOf("subunits")]).isEqualTo("4");
    }
}
