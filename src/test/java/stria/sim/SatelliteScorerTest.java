package stria.sim;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import stria.sim.SatelliteArrays.TruthRow;
import stria.sim.SatelliteScorer.Call;
import stria.sim.SatelliteScorer.Outcome;
import stria.sim.SatelliteScorer.Result;

/** The satellite scorer on hand-made truth and calls, each case worked out by hand beside it. */
class SatelliteScorerTest {
    /** Plain array of 200 bp units, 10,000-60,000. */
    private static final TruthRow PLAIN = row("p", 1, 1, 10000, 60000, 200, 1, 200, -1, -1);
    /** Higher-order array: 10 units of 170 bp, block 1,700 bp, 100,000-200,000. */
    private static final TruthRow HOR = row("h", 1, 1, 100000, 200000, 170, 10, 1700, -1, -1);
    /** An array interrupted at 300,000-304,000: two expected loci. */
    private static final TruthRow LEFT = row("i", 1, 2, 250000, 300000, 180, 1, 180, 300000, 304000);
    private static final TruthRow RIGHT = row("i", 2, 2, 304000, 340000, 180, 1, 180, 300000, 304000);

    private static TruthRow row(String id, int piece, int pieces, int start, int end, int unit, int k, int block,
                                int gs, int ge) {
        return new TruthRow(id, piece, pieces, "c1", start, end, unit, k, block, k == 1 ? Double.NaN : 0.2,
                k == 1 ? 0.15 : 0.01, gs, ge);
    }

    private static Call call(int start, int end, int period) {
        return new Call("c1", start, end, period, 0, 0);
    }

    private static Outcome only(List<TruthRow> rows, List<Call> calls, TruthRow which) {
        for (Outcome o : SatelliteScorer.score(rows, calls, true).outcomes()) {
            if (o.row().equals(which)) {
                return o;
            }
        }
        throw new AssertionError("no outcome for " + which);
    }

    @Test
    void oneLocusOfTheUnitCoversAPlainArray() {
        // 10,100-59,900 is 49,800 of 50,000 bases: 0.996
        Outcome o = only(List.of(PLAIN), List.of(call(10100, 59900, 201)), PLAIN);
        assertThat(o.covered()).isTrue();
        assertThat(o.atMostTwo()).isTrue();
        assertThat(o.bestCover()).isCloseTo(0.996, Offset.offset(1e-12));
        assertThat(SatelliteScorer.periodKind(PLAIN, 201)).isEqualTo("unit");
    }

    @Test
    void piecesAreLociOfTheUnitOrBlockOrAMultipleWithinFivePercent() {
        // 5 % of 200 is 10: 190 and 210 are the unit, 189 is not; a multiple within 10 too: 400 +- 10
        assertThat(SatelliteScorer.isPiece(PLAIN, 190)).isTrue();
        assertThat(SatelliteScorer.isPiece(PLAIN, 210)).isTrue();
        assertThat(SatelliteScorer.isPiece(PLAIN, 189)).isFalse();
        assertThat(SatelliteScorer.isPiece(PLAIN, 410)).isTrue();
        assertThat(SatelliteScorer.isPiece(PLAIN, 411)).isFalse();
        assertThat(SatelliteScorer.isPiece(PLAIN, 2110)).isFalse();
        assertThat(SatelliteScorer.isPiece(PLAIN, 100)).isFalse();
        // HOR: 1,700 +- 85 is the block; 1,786 is 10.5 units and 84 from 11 units, more than 8.5
        assertThat(SatelliteScorer.isPiece(HOR, 1786)).isFalse();
        assertThat(SatelliteScorer.isPiece(HOR, 1785)).isTrue();
        assertThat(SatelliteScorer.isPiece(HOR, 1100)).isFalse();
        assertThat(SatelliteScorer.isPiece(HOR, 1028)).isTrue();
        assertThat(SatelliteScorer.periodKind(HOR, 1650)).isEqualTo("block");
        assertThat(SatelliteScorer.periodKind(HOR, 340)).isEqualTo("2x_unit");
        assertThat(SatelliteScorer.periodKind(HOR, 3400)).isEqualTo("2x_block");
        assertThat(SatelliteScorer.periodKind(HOR, 171)).isEqualTo("unit");
        assertThat(SatelliteScorer.periodKind(HOR, 100)).isEqualTo("other");
    }

    @Test
    void fragmentedArrayIsNeitherCoveredNorInTwoPieces() {
        List<Call> calls = List.of(
                call(100000, 140000, 170), // 40 % of the array
                call(140000, 141000, 35), // another period: not a piece
                call(141000, 180000, 171), // 39 %
                call(180000, 200000, 1700)); // 20 %, at the block
        Outcome o = only(List.of(HOR), calls, HOR);
        assertThat(o.pieces()).hasSize(3);
        assertThat(o.others()).extracting(Call::period).containsExactly(35);
        assertThat(o.covered()).isFalse();
        assertThat(o.atMostTwo()).isFalse();
        assertThat(o.bestCover()).isCloseTo(0.40, Offset.offset(1e-12));
        assertThat(o.unionCover()).isCloseTo(0.99, Offset.offset(1e-12));
    }

    @Test
    void twoPiecesCountAsAtMostTwoButCoverOnlyTogether() {
        List<Call> calls = List.of(call(10000, 40000, 200), call(40000, 60000, 199));
        Outcome o = only(List.of(PLAIN), calls, PLAIN);
        assertThat(o.atMostTwo()).isTrue();
        assertThat(o.atMostTwoCovering()).isTrue();
        assertThat(o.covered()).isFalse();
        // one piece over a fifth of the array: at most two pieces, but not covering together
        Outcome p = only(List.of(PLAIN), List.of(call(20000, 30000, 200)), PLAIN);
        assertThat(p.atMostTwo()).isTrue();
        assertThat(p.atMostTwoCovering()).isFalse();
        // nothing at all is not "at most two"
        assertThat(only(List.of(PLAIN), List.of(), PLAIN).atMostTwo()).isFalse();
    }

    @Test
    void structureNeedsTheBlockAsPeriodAndTheUnitAsSubunit() {
        assertThat(only(List.of(HOR), List.of(new Call("c1", 100000, 200000, 1702, 170, 10)), HOR).structured()).isTrue();
        // the subunit off by more than 5 %, absent, or the period at two blocks
        assertThat(only(List.of(HOR), List.of(new Call("c1", 100000, 200000, 1702, 85, 20)), HOR).structured()).isFalse();
        assertThat(only(List.of(HOR), List.of(new Call("c1", 100000, 200000, 1702, 0, 0)), HOR).structured()).isFalse();
        assertThat(only(List.of(HOR), List.of(new Call("c1", 100000, 200000, 3400, 170, 20)), HOR).structured()).isFalse();
        // right periods, but covering only 80 %
        assertThat(only(List.of(HOR), List.of(new Call("c1", 100000, 180000, 1700, 170, 10)), HOR).structured()).isFalse();
    }

    @Test
    void interruptedArrayIsTwoExpectedLociAndABridgingLocusIsCounted() {
        List<TruthRow> rows = List.of(LEFT, RIGHT);
        Result apart = SatelliteScorer.score(rows, List.of(call(250000, 300010, 180), call(303990, 340000, 181)), true);
        assertThat(apart.covered()).isEqualTo(2);
        assertThat(apart.interruptions()).isEqualTo(1);
        assertThat(apart.bridged()).isZero();
        Result bridged = SatelliteScorer.score(rows, List.of(call(250000, 340000, 180)), true);
        assertThat(bridged.covered()).isEqualTo(2);
        assertThat(bridged.bridged()).isEqualTo(1);
        // a locus reaching into the interruption from one side only does not bridge it
        Result into = SatelliteScorer.score(rows, List.of(call(250000, 303000, 180), call(304000, 340000, 180)), true);
        assertThat(into.bridged()).isZero();
    }

    @Test
    void summaryCountsEveryExpectedLocus(@TempDir Path dir) {
        List<TruthRow> rows = List.of(PLAIN, HOR, LEFT, RIGHT);
        List<Call> calls = new ArrayList<>(List.of(
                call(10000, 60000, 200), // PLAIN covered, 1 piece
                call(100000, 150000, 170), call(150000, 200000, 170), // HOR: 2 pieces, not covered
                call(250000, 340000, 180), // LEFT and RIGHT covered by one bridging locus
                new Call("c2", 10000, 60000, 200, 0, 0))); // another contig: ignored
        Result r = SatelliteScorer.score(rows, calls, false);
        assertThat(r.rows()).isEqualTo(4);
        assertThat(r.covered()).isEqualTo(3);
        assertThat(r.atMostTwo()).isEqualTo(4);
        assertThat(r.higherOrderRows()).isEqualTo(1);
        assertThat(r.structured()).isZero();
        assertThat(r.bridged()).isEqualTo(1);
        String s = r.summary();
        assertThat(s).contains("arrays        3 (4 expected loci; 1 interrupted arrays in two; 1 rows higher-order)")
                .contains("covered       0.7500  (3 of 4").contains("<= 2 pieces   1.0000  (4 of 4")
                .contains("no subunit_period column").contains("bridged       1 of 1")
                .contains("periods       of the largest piece: unit 4");
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        r.detail(new PrintStream(bytes, true, StandardCharsets.UTF_8));
        String[] lines = bytes.toString(StandardCharsets.UTF_8).split("\n");
        assertThat(lines).hasSize(5);
        assertThat(lines[2]).isEqualTo("h\t1/1\tc1\t100000\t200000\t170\t10\t1700\t2\t0.5000\t1.0000\t-\t0"
                + "\t170:100000-150000,170:150000-200000");
        assertThat(lines[3]).endsWith("\tyes\t0\t180:250000-340000");
    }

    @Test
    void readsTheTsvByColumnNameWithOrWithoutSubunitColumns(@TempDir Path dir) throws IOException {
        Path old = dir.resolve("old.tsv");
        Files.writeString(old, "#stria 0.1.0\n#settings: x\nchrom\tstart\tend\tperiod\tmotif\tpurity\n"
                + "c1\t10\t500\t200\tACGT\t0.9\n");
        SatelliteScorer.Calls a = SatelliteScorer.readCalls(old);
        assertThat(a.subunitColumns()).isFalse();
        assertThat(a.calls()).containsExactly(new Call("c1", 10, 500, 200, 0, 0));
        Path neu = dir.resolve("new.tsv");
        Files.writeString(neu, "#stria\nchrom\tstart\tend\tperiod\tmotif\tsubunit_period\tsubunits\tpurity\n"
                + "c1\t10\t5000\t1700\tACGT\t170\t10\t0.9\nc1\t6000\t7000\t200\tACGT\t\t\t0.9\n");
        SatelliteScorer.Calls b = SatelliteScorer.readCalls(neu);
        assertThat(b.subunitColumns()).isTrue();
        assertThat(b.calls()).containsExactly(new Call("c1", 10, 5000, 1700, 170, 10), new Call("c1", 6000, 7000, 200, 0, 0));
    }

    @Test
    void theRealCommandsTsvScores(@TempDir Path dir) throws IOException {
        // the contract with the scan's TSV: it parses, and each array is found (whole or in pieces)
        String[] common = {"--seed", "4", "--arrays", "1", "--contigs", "1", "--lengths", "30000", "--interrupted", "0",
            "--spacing", "5000"};
        for (String[] kind : new String[][] {{"--plain", "1", "--plain-between", "0.10"}, {"--plain", "0"}}) {
            List<String> args = new ArrayList<>(List.of(common));
            args.addAll(List.of(kind));
            args.addAll(List.of("--out", dir.resolve("g.fa").toString(), "--truth", dir.resolve("t.tsv").toString()));
            assertThat(new CommandLine(new SatelliteArrays()).execute(args.toArray(String[]::new))).isZero();
            stria.testutil.Cli.Result scan = stria.testutil.Cli.stria(dir, "scan", "-q", "--tsv", "calls.tsv", "g.fa");
            assertThat(scan.exit()).as(scan.err()).isZero();
            CommandLine cl = new CommandLine(new SatelliteScorer());
            PrintStream out = System.out;
            ByteArrayOutputStream bytes = new ByteArrayOutputStream();
            System.setOut(new PrintStream(bytes, true, StandardCharsets.UTF_8));
            try {
                assertThat(cl.execute("--truth", dir.resolve("t.tsv").toString(), "--calls",
                        dir.resolve("calls.tsv").toString(), "--detail")).isZero();
            } finally {
                System.setOut(out);
            }
            assertThat(bytes.toString(StandardCharsets.UTF_8)).contains("\narray\tpiece\t", "\narray01\t1/1\tsat01\t");
            SatelliteScorer.Calls calls = SatelliteScorer.readCalls(dir.resolve("calls.tsv"));
            Result r = SatelliteScorer.score(SatelliteArrays.readTruth(dir.resolve("t.tsv")), calls.calls(), false);
            assertThat(r.outcomes().get(0).unionCover()).as(String.join(" ", kind)).isGreaterThan(0.9);
        }
    }

    @Test
    void truthTableReadsBack(@TempDir Path dir) throws IOException {
        Path t = dir.resolve("t.tsv");
        SatelliteArrays.writeTruth(t, List.of(PLAIN, HOR, LEFT, RIGHT));
        assertThat(Files.readAllLines(t).get(3)).isEqualTo("i\t1/2\tc1\t250000\t300000\t50000\t180\t1\t180\t-\t0.1500\t300000-304000");
        assertThat(SatelliteArrays.readTruth(t)).containsExactly(PLAIN, HOR, LEFT, RIGHT);
    }

    @Test
    void unreadableInputIsOneLineAndExitOne(@TempDir Path dir) throws IOException {
        Path t = dir.resolve("t.tsv");
        SatelliteArrays.writeTruth(t, List.of(PLAIN));
        Path bad = dir.resolve("bad.tsv");
        Files.writeString(bad, "chrom\tstart\tend\tperiod\nc1\tten\t20\t2\n");
        CommandLine cl = new CommandLine(new SatelliteScorer());
        PrintStream err = System.err;
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        System.setErr(new PrintStream(bytes, true, StandardCharsets.UTF_8));
        try {
            assertThat(cl.execute("--truth", t.toString(), "--calls", bad.toString())).isEqualTo(1);
            assertThat(cl.execute("--truth", t.toString(), "--calls", dir.resolve("none.tsv").toString())).isEqualTo(1);
        } finally {
            System.setErr(err);
        }
        String[] lines = bytes.toString(StandardCharsets.UTF_8).split("\n");
        assertThat(lines).hasSize(2);
        assertThat(lines[0]).contains("bad.tsv line 2");
        cl.setErr(new PrintWriter(Writer.nullWriter()));
        assertThat(cl.execute("--truth", t.toString())).isEqualTo(2);
    }
}
