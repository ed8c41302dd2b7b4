package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import stria.bench.Calibrate;

/**
 * The shipped evalues against what they promise: in random i.i.d. sequence, the number of loci with
 * evalue at most E is about E per Mb. 40 Mb at 41 % GC and at 60 % GC, drawn from seeds other than the
 * calibration's, must give 40 and 400 loci at evalue 1 and 10, each within a factor 1.5.
 */
@Tag("slow")
class CalibrationTest {
    private static final int MB = 40;

    @Test
    void randomSequenceAt41PercentGc() {
        check(0.41, 0x41_41_41L);
    }

    @Test
    void randomSequenceAt60PercentGc() {
        check(0.60, 0x60_60_60L);
    }

    private static void check(double gc, long seed) {
        assertThat(seed).isNotEqualTo(Calibrate.SEED);
        List<Locus> loci = Calibrate.scan(gc, MB, 2, seed);
        long at1 = loci.stream().filter(l -> l.evalue() <= 1).count();
        long at10 = loci.stream().filter(l -> l.evalue() <= 10).count();
        System.out.printf("GC %.2f, %d Mb: %d loci in all, %d at evalue <= 1, %d at evalue <= 10%n", gc, MB,
                loci.size(), at1, at10);
        assertThat((double) at1).isBetween(MB / 1.5, MB * 1.5);
        assertThat((double) at10).isBetween(10 * MB / 1.5, 10 * MB * 1.5);
    }
}
