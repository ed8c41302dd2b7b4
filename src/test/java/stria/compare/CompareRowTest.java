package stria.compare;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;
import stria.score.Locus;

class CompareRowTest {
    private static final Locus CA = new Locus(100, 130, 2, "CA", "AC", 15, 0.9667, 1, 0, 0, 46.6, 1e-6, 1.0);

    private static String row(ComparedLocus r) {
        StringBuilder sb = new StringBuilder();
        CompareRow.tsv(sb, r);
        return sb.toString();
    }

    @Test
    void theColumnsChecksRelyOnComeFirstWithTheirNames() {
        assertThat(List.of(CompareRow.HEADER.split("\t")).subList(0, 11)).containsExactly("chrom", "start", "end",
                "period", "motif_class", "other_chrom", "other_start", "other_end", "other_strand", "length_change",
                "status");
    }

    @Test
    void everyStatusHasOneValueOrADotInEveryColumn() {
        int cols = CompareRow.HEADER.split("\t").length;
        ComparedLocus same = new ComparedLocus("c1", CA, Status.SAME, "b7", 90, 120, '+', 0.9667, null, null);
        ComparedLocus changed = new ComparedLocus("c1", CA, Status.CHANGED, "b2", 5000, 5036, '-', 0.972, null, null);
        ComparedLocus lost = new ComparedLocus("c1", CA, Status.LOST, "b2", 700, 700, '+', Double.NaN, null, null);
        ComparedLocus unplaced = ComparedLocus.unplaced("c1", CA, "left-anchor-not-unique-in-A");
        ComparedLocus fresh = ComparedLocus.newInB("b3", new Locus(10, 25, 3, "AGC", "AGC", 5, 1.0, 0, 0, 0, 25.5, 0.1, 1.58));
        assertThat(row(same)).isEqualTo("c1\t100\t130\t2\tAC\tb7\t90\t120\t+\t0\tsame\tCA\t30\t30\t15.00\t15.00\t0.967\t0.967\t.\n");
        assertThat(row(changed)).isEqualTo("c1\t100\t130\t2\tAC\tb2\t5000\t5036\t-\t6\tchanged\tCA\t30\t36\t15.00\t18.00\t0.967\t0.972\t.\n");
        assertThat(row(lost)).isEqualTo("c1\t100\t130\t2\tAC\tb2\t700\t700\t+\t-30\tlost\tCA\t30\t0\t15.00\t0.00\t0.967\t.\t.\n");
        assertThat(row(unplaced)).isEqualTo("c1\t100\t130\t2\tAC\t.\t.\t.\t.\t.\tunplaced\tCA\t30\t.\t15.00\t.\t0.967\t.\tleft-anchor-not-unique-in-A\n");
        assertThat(row(fresh)).isEqualTo(".\t.\t.\t3\tAGC\tb3\t10\t25\t+\t.\tnew\tAGC\t.\t15\t.\t5.00\t.\t1.000\t.\n");
        for (ComparedLocus r : List.of(same, changed, lost, unplaced, fresh)) {
            assertThat(row(r).split("\t", -1)).hasSize(cols);
        }
    }

    @Test
    void copiesRoundHalfUpFromTheExactFraction() {
        StringBuilder sb = new StringBuilder();
        CompareRow.copies(sb, 17, 8); // 2.125
        sb.append(' ');
        CompareRow.copies(sb, 1, 3); // 0.333...
        assertThat(sb).hasToString("2.13 0.33");
    }
}
