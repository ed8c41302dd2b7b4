package stria.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.io.ContigInfo;
import stria.io.Region;
import stria.testutil.ResultFixtures;

class SummaryTest {

    /** Bases in repeats and per class, against marking every covered base in a boolean array. */
    @Property(tries = 200)
    void basesInRepeatsAreTheUnionOfLoci(@ForAll long seed, @ForAll @IntRange(min = 0, max = 60) int n) {
        Random r = new Random(seed);
        int len = 1 + r.nextInt(3000);
        ContigLoci l = new ContigLoci();
        boolean[] any = new boolean[len];
        boolean[][] byClass = new boolean[PeriodClass.values().length][len];
        long[] classLoci = new long[PeriodClass.values().length];
        int[] periods = {1, 2, 3, 6, 7, 50, 99, 100, 171};
        for (int i = 0; i < n; i++) {
            int s = r.nextInt(len);
            int e = s + 1 + r.nextInt(Math.min(len - s, 1 + r.nextInt(400)));
            int p = periods[r.nextInt(periods.length)];
            l.add(s, e, p, i, 0, 0.9f);
            int c = PeriodClass.of(p).ordinal();
            classLoci[c]++;
            for (int x = s; x < e; x++) {
                any[x] = true;
                byClass[c][x] = true;
            }
        }
        l.sortAndDeduplicate();
        Summary.Row row = Summary.contigRow("c", len, l);
        assertThat(row.repeatBases()).isEqualTo(count(any));
        for (PeriodClass pc : PeriodClass.values()) {
            assertThat(row.classBases()[pc.ordinal()]).as(pc.label()).isEqualTo(count(byClass[pc.ordinal()]));
            assertThat(row.classLoci()[pc.ordinal()]).isEqualTo(classLoci[pc.ordinal()]);
        }
        assertThat(row.loci()).isEqualTo(n);
    }

    private static long count(boolean[] b) {
        long t = 0;
        for (boolean x : b) {
            t += x ? 1 : 0;
        }
        return t;
    }

    @Test
    void periodClassBoundaries() {
        assertThat(PeriodClass.of(1)).isEqualTo(PeriodClass.HOMOPOLYMER);
        assertThat(PeriodClass.of(2)).isEqualTo(PeriodClass.MICRO);
        assertThat(PeriodClass.of(6)).isEqualTo(PeriodClass.MICRO);
        assertThat(PeriodClass.of(7)).isEqualTo(PeriodClass.MINI);
        assertThat(PeriodClass.of(99)).isEqualTo(PeriodClass.MINI);
        assertThat(PeriodClass.of(100)).isEqualTo(PeriodClass.SATELLITE);
        assertThat(PeriodClass.SATELLITE.range()).isEqualTo(">=100");
        assertThat(PeriodClass.MICRO.key()).isEqualTo("p2_6");
    }

    @Test
    void genomeRowSumsContigsAndSharesUseBasesScanned(@TempDir Path dir) throws Exception {
        var h = ResultFixtures.header(List.of(new ContigInfo("a", 1000), new ContigInfo("b", 500)),
                null, List.of());
        List<String> rows = new ArrayList<>();
        rows.add(ResultFixtures.row("a", 10, 30, "AC", 1.0));
        rows.add(ResultFixtures.row("a", 20, 40, "A", 0.9)); // overlaps the first: 30 bases, not 40
        rows.add(ResultFixtures.row("b", 100, 350, "ACGTACGTAAACCCGGGTTTACGTACGTAAACCCGGGTTTACGTACGTAAACCCGGGTTTACGTACGTAAACCCGGGTTTACGTACGTAAACCCGGGTTTAC", 0.95));
        ResultSet r = ResultReader.read(List.of(ResultFixtures.write(dir.resolve("x.tsv"), h, rows).toString()));
        Summary s = Summary.of(r);
        assertThat(s.contigs().get(0).repeatBases()).isEqualTo(30);
        assertThat(s.contigs().get(1).repeatBases()).isEqualTo(250);
        assertThat(s.genome().scanned()).isEqualTo(1500);
        assertThat(s.genome().repeatBases()).isEqualTo(280);
        assertThat(s.genome().loci()).isEqualTo(3);
        assertThat(s.genome().share()).isEqualTo(280 / 1500.0);
        assertThat(s.genome().classBases()[PeriodClass.SATELLITE.ordinal()]).isEqualTo(250);
        assertThat(s.genome().classBases()[PeriodClass.MICRO.ordinal()]).isEqualTo(20);
        assertThat(s.genome().classBases()[PeriodClass.HOMOPOLYMER.ordinal()]).isEqualTo(20);
    }

    @Test
    void regionsSetTheBasesScanned(@TempDir Path dir) throws Exception {
        var contigs = List.of(new ContigInfo("a", 1000), new ContigInfo("b", 500));
        // two files, overlapping regions on a, none on b: a counts the union 0-300, b is not scanned
        var h1 = ResultFixtures.header(contigs, null, List.of(new Region("a", 0, 200)));
        var h2 = ResultFixtures.header(contigs, null, List.of(new Region("a", 100, 300)));
        Path f1 = ResultFixtures.write(dir.resolve("1.tsv"), h1, List.of(ResultFixtures.row("a", 10, 30, "AC", 1.0)));
        Path f2 = ResultFixtures.write(dir.resolve("2.tsv"), h2, List.of(ResultFixtures.row("a", 250, 262, "AG", 1.0)));
        ResultSet r = ResultReader.read(List.of(f1.toString(), f2.toString()));
        Summary s = Summary.of(r);
        assertThat(r.regionLimited()).isTrue();
        assertThat(s.contigs().get(0).scanned()).isEqualTo(300);
        assertThat(s.contigs().get(1).scanned()).isZero();
        assertThat(s.genome().scanned()).isEqualTo(300);
        assertThat(s.genome().repeatBases()).isEqualTo(32);
    }
}
