package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import stria.repeats.RunList;
import stria.sim.NaiveRuns;

/** Loci built by hand: substitutions, indels, compound repeats, competing periods. */
class LocusCallerTest {
    private static final ScoreSettings SETTINGS = new ScoreSettings(1, 2000, 2.0, 12, 0.6, 20);

    /** Random flanks with a fixed seed, around the given middle. */
    static byte[] flanked(String middle, int flank, long seed) {
        Random r = new Random(seed);
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < flank; i++) {
            sb.append("ACGT".charAt(r.nextInt(4)));
        }
        sb.append(middle);
        for (int i = 0; i < flank; i++) {
            sb.append("ACGT".charAt(r.nextInt(4)));
        }
        return sb.toString().getBytes(StandardCharsets.US_ASCII);
    }

    static List<Locus> call(byte[] seq, ScoreSettings st) {
        LocusCaller c = new LocusCaller(st);
        RunList runs = NaiveRuns.find(seq, seq.length, LocusCaller.SEED_MAX_PERIOD);
        RunList seeds = new RunList();
        for (int i = 0; i < runs.size(); i++) {
            if (c.isSeed(runs.start(i), runs.end(i), runs.period(i))) {
                seeds.add(runs.start(i), runs.end(i), runs.period(i));
            }
        }
        return c.call(seq, seq.length, seeds, 0, seq.length, 0, seq.length);
    }

    /** The loci overlapping [s, e). */
    static List<Locus> within(List<Locus> loci, int s, int e) {
        return loci.stream().filter(l -> l.start() < e && l.end() > s).toList();
    }

    static String repeat(String unit, int n) {
        return unit.repeat(n);
    }

    @Test
    void substitutionsAreCountedAndDoNotBreakTheLocus() {
        char[] m = repeat("CAG", 20).toCharArray();
        // three substitutions well inside
        m[10] = 'T';
        m[25] = 'A';
        m[40] = 'C';
        byte[] seq = flanked(new String(m), 200, 1);
        List<Locus> got = within(call(seq, SETTINGS), 200, 260);
        assertThat(got).hasSize(1);
        Locus l = got.get(0);
        assertThat(l.period()).isEqualTo(3);
        assertThat(l.motifClass()).isEqualTo(MotifClass.of("CAG"));
        assertThat(l.mismatches()).isEqualTo(3);
        assertThat(l.insertions()).isZero();
        assertThat(l.deletions()).isZero();
        // random flanks may continue the motif for a few bases by chance
        assertThat(Math.abs(l.start() - 200)).isLessThanOrEqualTo(3);
        assertThat(Math.abs(l.end() - 260)).isLessThanOrEqualTo(3);
        assertThat(l.purity()).isCloseTo(1 - 3.0 / l.length(), org.assertj.core.data.Offset.offset(1e-9));
    }

    @Test
    void anInsertionAndADeletionAreBridged() {
        String unit = "GATTACA";
        // one extra base in copy 4, one missing base in copy 9
        String s = repeat(unit, 3) + "GATTTACA" + repeat(unit, 4) + "GATACA" + repeat(unit, 3);
        byte[] seq = flanked(s, 300, 2);
        List<Locus> got = within(call(seq, SETTINGS), 300, 300 + s.length());
        assertThat(got).hasSize(1);
        Locus l = got.get(0);
        assertThat(l.period()).isEqualTo(7);
        assertThat(l.motifClass()).isEqualTo(MotifClass.of(unit));
        assertThat(l.insertions()).isEqualTo(1);
        assertThat(l.deletions()).isEqualTo(1);
        assertThat(l.mismatches()).isZero();
        assertThat(l.length()).isGreaterThanOrEqualTo(s.length() - 4);
    }

    @Test
    void aCompoundRepeatComesOutAsTwoAdjacentLoci() {
        String s = repeat("CA", 15) + repeat("GA", 15);
        byte[] seq = flanked(s, 200, 3);
        List<Locus> got = within(call(seq, SETTINGS), 200, 260);
        assertThat(got).hasSize(2);
        assertThat(got.get(0).period()).isEqualTo(2);
        assertThat(got.get(1).period()).isEqualTo(2);
        assertThat(got.get(0).motifClass()).isEqualTo(MotifClass.of("CA"));
        assertThat(got.get(1).motifClass()).isEqualTo(MotifClass.of("GA"));
        assertThat(got.get(0).end()).isLessThanOrEqualTo(got.get(1).start());
        assertThat(Math.abs(got.get(0).end() - 230)).isLessThanOrEqualTo(2);
        assertThat(got.get(1).start() - got.get(0).end()).isLessThanOrEqualTo(2);
    }

    @Test
    void aChangeOfMotifWithinOnePeriodSplitsTheLocus() {
        // two letters of three still match across the change, so one alignment runs through it
        String s = repeat("TGA", 12) + repeat("TGC", 14);
        byte[] seq = flanked(s, 200, 13);
        List<Locus> got = within(call(seq, SETTINGS), 200, 200 + s.length());
        assertThat(got).hasSize(2);
        assertThat(got).extracting(Locus::motifClass).containsExactly(MotifClass.of("TGA"), MotifClass.of("TGC"));
        assertThat(got).extracting(Locus::purity).containsOnly(1.0);
        assertThat(Math.abs(got.get(0).end() - 236)).isLessThanOrEqualTo(3);
        assertThat(got.get(1).start()).isEqualTo(got.get(0).end());
    }

    @Test
    void variationSpreadOverALocusDoesNotSplitIt() {
        Random r = new Random(14);
        char[] m = repeat("ACCTG", 30).toCharArray();
        for (int k = 0; k < 15; k++) {
            int i = 5 + r.nextInt(m.length - 10);
            m[i] = "ACGT".charAt(("ACGT".indexOf(m[i]) + 1 + r.nextInt(3)) % 4);
        }
        byte[] seq = flanked(new String(m), 200, 15);
        List<Locus> got = within(call(seq, SETTINGS), 200, 350);
        assertThat(got).hasSize(1);
        assertThat(got.get(0).period()).isEqualTo(5);
    }

    @Test
    void aDinucleotideIsNotAlsoReportedAtMultiplesOfItsPeriod() {
        char[] m = repeat("AT", 30).toCharArray();
        m[17] = 'C';
        m[38] = 'G';
        byte[] seq = flanked(new String(m), 200, 4);
        List<Locus> got = within(call(seq, SETTINGS), 200, 260);
        assertThat(got).hasSize(1);
        assertThat(got.get(0).period()).isEqualTo(2);
        assertThat(got.get(0).motifClass()).isEqualTo("AT");
    }

    @Test
    void aLongerUnitWinsWhereItExplainsTheBasesClearlyBetter() {
        // ACAG repeated: inside it "AC" and "AG" alternate, so a period-2 reading half disagrees
        String s = repeat("ACAG", 20);
        byte[] seq = flanked(s, 200, 5);
        List<Locus> got = within(call(seq, SETTINGS), 200, 280);
        assertThat(got).hasSize(1);
        assertThat(got.get(0).period()).isEqualTo(4);
        assertThat(got.get(0).purity()).isEqualTo(1.0);
    }

    @Test
    void aLongUnitAtEightyEightPercentIsFoundWithItsPeriod() {
        Random r = new Random(6);
        char[] unit = new char[45];
        for (int i = 0; i < unit.length; i++) {
            unit[i] = "ACGT".charAt(r.nextInt(4));
        }
        StringBuilder sb = new StringBuilder();
        for (int c = 0; c < 6; c++) {
            char[] copy = unit.clone();
            // about 12 % substitutions per copy, never in the first and last copy's edges
            for (int k = 0; k < 5; k++) {
                int i = 3 + r.nextInt(unit.length - 6);
                copy[i] = "ACGT".charAt((("ACGT".indexOf(copy[i])) + 1 + r.nextInt(3)) % 4);
            }
            sb.append(copy);
        }
        String s = sb.toString();
        byte[] seq = flanked(s, 400, 7);
        List<Locus> got = within(call(seq, SETTINGS), 400, 400 + s.length());
        assertThat(got).isNotEmpty();
        Locus best = got.stream().max((a, b) -> Integer.compare(a.length(), b.length())).orElseThrow();
        assertThat(best.period()).isEqualTo(45);
        assertThat(best.length()).isGreaterThan(s.length() * 9 / 10);
        assertThat(best.purity()).isBetween(0.8, 0.95);
    }

    @Test
    void aSatelliteArrayIsOneLocus() {
        Random r = new Random(8);
        char[] unit = new char[171];
        for (int i = 0; i < unit.length; i++) {
            unit[i] = "ACGT".charAt(r.nextInt(4));
        }
        StringBuilder sb = new StringBuilder();
        for (int c = 0; c < 60; c++) {
            char[] copy = unit.clone();
            for (int k = 0; k < 6; k++) {
                int i = 2 + r.nextInt(unit.length - 4);
                copy[i] = "ACGT".charAt((("ACGT".indexOf(copy[i])) + 1 + r.nextInt(3)) % 4);
            }
            sb.append(copy);
        }
        String s = sb.toString();
        byte[] seq = flanked(s, 500, 9);
        List<Locus> got = within(call(seq, SETTINGS), 500, 500 + s.length());
        assertThat(got).hasSize(1);
        assertThat(got.get(0).period()).isEqualTo(171);
        assertThat(got.get(0).motif()).isEqualTo(rotationOf(new String(unit), got.get(0).motif()));
        assertThat(got.get(0).length()).isGreaterThan(s.length() - 10);
    }

    /** The rotation of unit equal to motif, or unit itself when there is none (so the assertion fails). */
    private static String rotationOf(String unit, String motif) {
        for (int i = 0; i < unit.length(); i++) {
            String rot = unit.substring(i) + unit.substring(0, i);
            if (rot.equals(motif)) {
                return rot;
            }
        }
        return unit;
    }

    @Test
    void nBreaksALocus() {
        String s = repeat("TG", 15) + "N" + repeat("TG", 15);
        byte[] seq = flanked(s, 100, 10);
        List<Locus> got = within(call(seq, SETTINGS), 100, 100 + s.length());
        assertThat(got).hasSize(2);
        assertThat(got.get(0).end()).isLessThanOrEqualTo(130);
        assertThat(got.get(1).start()).isGreaterThanOrEqualTo(131);
    }

    @Test
    void lowerCaseIsTheSameSequence() {
        String s = repeat("AAC", 12);
        byte[] upper = flanked(s, 100, 11);
        byte[] lower = new String(upper, StandardCharsets.US_ASCII).toLowerCase().getBytes(StandardCharsets.US_ASCII);
        assertThat(call(lower, SETTINGS)).isEqualTo(call(upper, SETTINGS));
    }

    @Test
    void filtersApply() {
        String s = repeat("A", 14) + "CGTACGATCGAT" + repeat("CATG", 10);
        byte[] seq = flanked(s, 100, 12);
        List<Locus> all = within(call(seq, SETTINGS), 100, 100 + s.length());
        assertThat(all).extracting(Locus::period).contains(1, 4);
        ScoreSettings noHomopolymers = new ScoreSettings(2, 2000, 2.0, 12, 0.6, 20);
        assertThat(within(call(seq, noHomopolymers), 100, 100 + s.length())).extracting(Locus::period)
                .doesNotContain(1).contains(4);
        ScoreSettings longOnly = new ScoreSettings(1, 2000, 2.0, 30, 0.6, 20);
        assertThat(within(call(seq, longOnly), 100, 100 + s.length())).extracting(Locus::period).containsExactly(4);
    }

    @Test
    void entropyOfALocusIsThatOfItsBases() {
        assertThat(Candidate.entropy("AAAA".getBytes(StandardCharsets.US_ASCII), 0, 4)).isZero();
        assertThat(Candidate.entropy("ACGT".getBytes(StandardCharsets.US_ASCII), 0, 4)).isEqualTo(2.0);
        assertThat(Candidate.entropy("acAC".getBytes(StandardCharsets.US_ASCII), 0, 4)).isEqualTo(1.0);
    }
}
