package stria.pipeline;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import stria.io.Bases;
import stria.io.ContigBytes;
import stria.io.Region;
import stria.out.LocusSink;
import stria.pipeline.ScanSettings.Mode;
import stria.repeats.RunFinder;
import stria.repeats.RunList;
import stria.score.Locus;
import stria.score.ScoreSettings;

/**
 * Windowed, threaded and split scans give exactly the runs of one unwindowed pass over the whole contig,
 * including arrays much longer than a window that must be stitched across many windows.
 */
class WindowingProperties {

    /**
     * Composition blocks of the scans here: short, so that a contig has several and the background changes
     * within a window, a chunk and a split piece.
     */
    static final int BLOCK = 2_500;

    /**
     * A contig with random background (its GC content changing every 1,500 bases, so that composition blocks
     * differ), planted exact and mutated arrays, some longer than several windows.
     */
    static byte[] genome(long seed, int length, int maxPeriod) {
        Random rnd = new Random(seed);
        byte[] s = new byte[length];
        String acgt = "ACGT";
        double gc = 0.5;
        for (int i = 0; i < length; i++) {
            if (i % 1500 == 0) {
                gc = 0.15 + 0.7 * rnd.nextDouble();
            }
            double x = rnd.nextDouble();
            s[i] = (byte) acgt.charAt(x < gc / 2 ? 1 : x < gc ? 2 : x < (1 + gc) / 2 ? 0 : 3);
        }
        int arrays = 3 + rnd.nextInt(12);
        for (int a = 0; a < arrays; a++) {
            int p = 1 + rnd.nextInt(maxPeriod);
            int len = p * (2 + rnd.nextInt(rnd.nextBoolean() ? 6 : 200));
            int at = rnd.nextInt(length);
            for (int i = at + p; i < Math.min(length, at + len); i++) {
                s[i] = rnd.nextInt(300) == 0 ? (byte) acgt.charAt(rnd.nextInt(4)) : s[i - p];
            }
        }
        for (int k = rnd.nextInt(4); k > 0; k--) {
            int at = rnd.nextInt(length);
            for (int i = at; i < Math.min(length, at + rnd.nextInt(30)); i++) {
                s[i] = 'N';
            }
        }
        if (rnd.nextBoolean()) {
            for (int i = 0; i < length / 10; i++) {
                s[i] = (byte) Character.toLowerCase(s[i]);
            }
        }
        return s;
    }

    static RunList oracle(byte[] seq, int maxPeriod) {
        byte[] codes = new byte[seq.length];
        Bases.encode(seq, 0, seq.length, codes);
        RunList r = new RunList();
        new RunFinder().find(codes, 0, seq.length, maxPeriod, r);
        r.sort();
        return r;
    }

    static List<String> scan(byte[] seq, ScanSettings s, List<Range> ranges) {
        return scan(seq, s, ranges, 1 << 20);
    }

    static List<String> scan(byte[] seq, ScanSettings s, List<Range> ranges, long margin) {
        return scan(seq, s, ranges, margin, ImperfectMode.SCORE_CHUNK, s.window(), false);
    }

    /**
     * @param inMemoryMax longest contig held in memory; longer ones go through a temporary file
     * @param full        whole loci (every field) instead of start-end/period
     */
    static List<String> scan(byte[] seq, ScanSettings s, List<Range> ranges, long margin, int scoreChunk,
                             int inMemoryMax, boolean full) {
        Genome genome = Genome.of(List.of("c"), List.of(seq));
        List<ScanUnit> units = new ArrayList<>();
        for (Range r : ranges) {
            units.add(genome.unit("c", r.lo(), r.hi()));
        }
        List<String> out = new ArrayList<>();
        new GenomeScan(s, Progress.none(), margin, scoreChunk, inMemoryMax, BLOCK).run(units, new LocusSink() {
            @Override
            public void locus(String contig, Locus l) {
                out.add(full ? l.toString() : l.start() + "-" + l.end() + "/" + l.period());
            }

            @Override
            public void end(Region stretch, ContigBytes q) {
                byte[] part = new byte[stretch.length()];
                q.copy(stretch.start(), stretch.end(), part, 0);
                assertThat(part).isEqualTo(java.util.Arrays.copyOfRange(seq, stretch.start(), stretch.end()));
            }
        });
        return out;
    }

    static ScanSettings exact(int maxPeriod, int window, int threads) {
        return new ScanSettings(Mode.EXACT, new ScoreSettings(1, maxPeriod, 0, 0, 0, 0), threads, window);
    }

    @Property(tries = 40)
    void windowsAndThreadsDoNotChangeRuns(@ForAll long seed, @ForAll @IntRange(min = 1, max = 40) int maxPeriod,
                                          @ForAll @IntRange(min = 0, max = 2000) int extra,
                                          @ForAll @IntRange(min = 1, max = 4) int threads) {
        byte[] seq = genome(seed, 3000 + extra * 3, maxPeriod);
        RunList truth = oracle(seq, maxPeriod);
        List<String> expected = new ArrayList<>();
        for (int i = 0; i < truth.size(); i++) {
            expected.add(truth.start(i) + "-" + truth.end(i) + "/" + truth.period(i));
        }
        int window = Geometry.minWindow(maxPeriod) + extra % 500;
        List<String> got = scan(seq, exact(maxPeriod, window, threads), List.of(new Range(0, seq.length)));
        assertThat(got).isEqualTo(expected);
    }

    @Property(tries = 40)
    void filtersGiveTheFilteredRunsWhateverTheWindows(@ForAll long seed,
                                                      @ForAll @IntRange(min = 2, max = 40) int maxPeriod,
                                                      @ForAll @IntRange(min = 0, max = 60) int minLength,
                                                      @ForAll @IntRange(min = 2, max = 5) int minCopies,
                                                      @ForAll @IntRange(min = 1, max = 3) int threads) {
        byte[] seq = genome(seed, 6000, maxPeriod);
        RunList truth = oracle(seq, maxPeriod);
        List<String> expected = new ArrayList<>();
        for (int i = 0; i < truth.size(); i++) {
            int len = truth.end(i) - truth.start(i);
            if (len >= minLength && len >= minCopies * truth.period(i)) {
                expected.add(truth.start(i) + "-" + truth.end(i) + "/" + truth.period(i));
            }
        }
        ScanSettings s = new ScanSettings(Mode.EXACT, new ScoreSettings(1, maxPeriod, minCopies, minLength, 0, 0),
                threads, Geometry.minWindow(maxPeriod) + (int) Math.floorMod(seed, 300L));
        assertThat(scan(seq, s, List.of(new Range(0, seq.length)))).isEqualTo(expected);
    }

    @Property(tries = 40)
    void splitStretchesGiveTheSliceOfTheWholeScan(@ForAll long seed,
                                                  @ForAll @IntRange(min = 1, max = 30) int maxPeriod,
                                                  @ForAll @IntRange(min = 1, max = 6) int pieces,
                                                  @ForAll @IntRange(min = 1, max = 300) int margin) {
        byte[] seq = genome(seed, 5000, maxPeriod);
        ScanSettings s = exact(maxPeriod, Geometry.minWindow(maxPeriod) + 7, 2);
        List<String> whole = scan(seq, s, List.of(new Range(0, seq.length)));
        List<Range> ranges = cuts(seed, seq.length, pieces);
        assertThat(scan(seq, s, ranges, margin)).isEqualTo(whole);
    }

    /** An array of 40 copies with about one base in 25 substituted, so that every genome has imperfect loci. */
    static void plantImperfect(byte[] seq, long seed, int maxPeriod) {
        Random rnd = new Random(~seed);
        int p = 1 + rnd.nextInt(maxPeriod);
        int at = rnd.nextInt(seq.length - 40 * p);
        for (int i = 0; i < p; i++) {
            seq[at + i] = (byte) "ACGT".charAt(rnd.nextInt(4));
        }
        for (int i = at + p; i < at + 40 * p; i++) {
            seq[i] = rnd.nextInt(25) == 0 ? (byte) "ACGT".charAt(rnd.nextInt(4)) : seq[i - p];
        }
    }

    /** Up to {@code pieces} consecutive stretches covering {@code [0, length)}, cut at random. */
    static List<Range> cuts(long seed, int length, int pieces) {
        Random rnd = new Random(seed);
        List<Range> ranges = new ArrayList<>();
        int at = 0;
        for (int k = 1; k < pieces; k++) {
            int cut = at + rnd.nextInt(Math.max(1, length - at));
            if (cut > at) {
                ranges.add(new Range(at, cut));
                at = cut;
            }
        }
        ranges.add(new Range(at, length));
        return ranges;
    }

    static ScanSettings imperfect(int maxPeriod, int window, int threads) {
        return new ScanSettings(Mode.IMPERFECT, new ScoreSettings(1, maxPeriod, 2, 12, 0.7, 0, 10), threads, window);
    }

    /**
     * Imperfect loci do not depend on where the contig lives (array or temporary file), on the scoring chunk
     * length (chunks of a few hundred bases force the scorer to read a copy of its stretch and widen it
     * across chunk ends many times), on windows or on threads.
     */
    @Property(tries = 25)
    void imperfectLociDoNotDependOnStorageChunksWindowsOrThreads(
            @ForAll long seed, @ForAll @IntRange(min = 2, max = 60) int maxPeriod,
            @ForAll @IntRange(min = 64, max = 3000) int chunk, @ForAll @IntRange(min = 1, max = 3) int threads) {
        byte[] seq = genome(seed, 30_000, maxPeriod);
        plantImperfect(seq, seed, maxPeriod);
        List<Range> whole = List.of(new Range(0, seq.length));
        List<String> reference = scan(seq, imperfect(maxPeriod, 1 << 20, 1), whole, 1 << 20, 1 << 30, 1 << 30,
                true);
        int window = Geometry.minWindow(maxPeriod) + (int) Math.floorMod(seed, 2000L);
        List<String> got = scan(seq, imperfect(maxPeriod, window, threads), whole, 1 << 20, chunk, 0, true);
        assertThat(got).isNotEmpty().isEqualTo(reference);
    }

    /** Parts of a contig kept in a temporary file give the slice of the whole scan, imperfect loci included. */
    @Property(tries = 15)
    void imperfectPartsFromATemporaryFileGiveTheSliceOfTheWholeScan(
            @ForAll long seed, @ForAll @IntRange(min = 2, max = 40) int maxPeriod,
            @ForAll @IntRange(min = 1, max = 5) int pieces, @ForAll @IntRange(min = 1, max = 2000) int margin) {
        byte[] seq = genome(seed, 20_000, maxPeriod);
        ScanSettings s = imperfect(maxPeriod, Geometry.minWindow(maxPeriod) + 300, 2);
        List<String> whole = scan(seq, s, List.of(new Range(0, seq.length)), 1 << 20, 1 << 30, 1 << 30, true);
        List<Range> ranges = cuts(seed, seq.length, pieces);
        assertThat(scan(seq, s, ranges, margin, 500 + margin, 0, true)).isEqualTo(whole);
    }
}
