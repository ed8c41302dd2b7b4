package stria.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;

import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Scale;

import stria.io.ContigInfo;
import stria.testutil.ResultFixtures;

/**
 * The data behind the report's charts (bins, series, tables) against brute force on random results, with
 * no chart library involved: the classes are checked not to reference AWT or JFreeChart at all.
 */
class ChartDataProperties {
    /** Random results: a few contigs, loci of every class, scanned whole or in spans. */
    private record Results(ResultSet set, int[] lengths, List<int[]> loci) {
    }

    private static Results results(long seed) {
        Random rnd = new Random(seed);
        int n = 1 + rnd.nextInt(rnd.nextBoolean() ? 4 : 30);
        boolean regions = rnd.nextInt(4) == 0;
        List<ContigInfo> contigs = new ArrayList<>();
        List<long[]> scanned = new ArrayList<>();
        List<ContigLoci> loci = new ArrayList<>();
        List<String> motifClasses = new ArrayList<>();
        List<int[]> all = new ArrayList<>();
        int[] lengths = new int[n];
        for (int c = 0; c < n; c++) {
            int len = 1 + rnd.nextInt(rnd.nextBoolean() ? 3_000 : 40_000);
            lengths[c] = len;
            contigs.add(new ContigInfo("c" + c, len));
            if (regions) {
                // two disjoint spans, either may be empty
                int a = rnd.nextInt(len + 1), b = a + rnd.nextInt(len - a + 1), d = b + rnd.nextInt(len - b + 1);
                int e = d + rnd.nextInt(len - d + 1);
                List<Long> spans = new ArrayList<>();
                for (int[] s : new int[][] {{a, b}, {d, e}}) {
                    if (s[1] > s[0]) {
                        spans.add((long) s[0]);
                        spans.add((long) s[1]);
                    }
                }
                scanned.add(spans.stream().mapToLong(Long::longValue).toArray());
            } else {
                scanned.add(new long[] {0, len});
            }
            ContigLoci l = new ContigLoci();
            int count = rnd.nextInt(rnd.nextBoolean() ? 5 : 60);
            for (int k = 0; k < count; k++) {
                int start = rnd.nextInt(len);
                int end = Math.min(len, start + 1 + rnd.nextInt(rnd.nextBoolean() ? 40 : 3_000));
                int[] periods = {1, 2, 3, 6, 7, 10, 11, 20, 21, 99, 100, 150, 999, 1000, 1500};
                int period = rnd.nextInt(3) == 0 ? periods[rnd.nextInt(periods.length)] : 1 + rnd.nextInt(2000);
                int cls = rnd.nextInt(motifClasses.size() + 1);
                if (cls == motifClasses.size()) {
                    motifClasses.add(ResultFixtures.randomMotif(rnd, 1 + rnd.nextInt(rnd.nextBoolean() ? 6 : 40)));
                }
                float purity = rnd.nextInt(3) == 0 ? 1f : 0.5f + rnd.nextInt(501) / 1000f;
                l.add(start, end, period, cls, cls, purity);
            }
            l.sortAndDeduplicate();
            for (int i = 0; i < l.size(); i++) {
                all.add(new int[] {c, l.start(i), l.end(i), l.period(i), l.motifClass(i)});
            }
            loci.add(l);
        }
        ResultSet set = new ResultSet(List.of("r.tsv"), ResultFixtures.header(contigs, null, List.of()),
                List.of("scan"), List.of(), List.of(), regions, scanned, loci, motifClasses);
        return new Results(set, lengths, all);
    }

    // ---- period bins ----

    @Property(tries = 200)
    void periodBinsCountEveryLocusInTheBinOfItsPeriod(@ForAll long seed) {
        Results r = results(seed);
        PeriodHistogram h = PeriodHistogram.of(r.set());
        int last = 9;
        long[] loci = new long[PeriodHistogram.BINS.length];
        long[] bases = new long[PeriodHistogram.BINS.length];
        for (int[] l : r.loci()) {
            for (int b = 0; b < PeriodHistogram.BINS.length; b++) {
                if (PeriodHistogram.BINS[b][0] <= l[3] && l[3] <= PeriodHistogram.BINS[b][1]) {
                    loci[b]++;
                    bases[b] += l[2] - l[1];
                    last = Math.max(last, b);
                }
            }
        }
        assertThat(h.size()).isEqualTo(last + 1);
        for (int b = 0; b < h.size(); b++) {
            assertThat(h.loci()[b]).as("loci in bin %s", h.labels()[b]).isEqualTo(loci[b]);
            assertThat(h.bases()[b]).isEqualTo(bases[b]);
            assertThat(h.classes()[b]).isEqualTo(PeriodClass.of(PeriodHistogram.BINS[b][0]));
        }
    }

    @Example
    void periodBinsCoverEveryPeriodOnceWithinOneClass() {
        long next = 1;
        for (int[] b : PeriodHistogram.BINS) {
            assertThat((long) b[0]).isEqualTo(next);
            assertThat(PeriodClass.of(b[0])).as("bin %d-%d in one class", b[0], b[1])
                    .isEqualTo(PeriodClass.of(b[1]));
            next = b[1] + 1L;
        }
        assertThat(next).isEqualTo(Integer.MAX_VALUE + 1L);
        assertThat(PeriodHistogram.label(new int[] {7, 7})).isEqualTo("7");
        assertThat(PeriodHistogram.label(new int[] {11, 20})).isEqualTo("11\u201320");
        assertThat(PeriodHistogram.label(new int[] {1000, Integer.MAX_VALUE})).isEqualTo("\u22651000");
    }

    // ---- motif classes ----

    @Property(tries = 200)
    void motifRankingIsTheMostFrequentClassesInOrder(@ForAll long seed) {
        Results r = results(seed);
        List<String> names = r.set().motifClasses();
        long[] loci = new long[names.size()];
        long[] bases = new long[names.size()];
        for (int[] l : r.loci()) {
            loci[l[4]]++;
            bases[l[4]] += l[2] - l[1];
        }
        List<Integer> want = new ArrayList<>();
        for (int i = 0; i < names.size(); i++) {
            want.add(i);
        }
        want.sort(Comparator.<Integer>comparingLong(i -> -loci[i]).thenComparingLong(i -> -bases[i])
                .thenComparing(names::get));
        MotifRanking m = MotifRanking.of(r.set());
        assertThat(m.size()).isEqualTo(Math.min(MotifRanking.MAX, names.size()));
        Set<String> seen = new HashSet<>();
        for (int k = 0; k < m.size(); k++) {
            String motif = names.get(want.get(k));
            assertThat(m.loci()[k]).isEqualTo(loci[want.get(k)]);
            assertThat(m.classes()[k]).isEqualTo(PeriodClass.of(motif.length()));
            String label = m.labels()[k].strip();
            assertThat(label).isEqualTo(motif.length() <= 14 ? motif
                    : motif.substring(0, 10) + "\u2026 (" + motif.length() + " bp)");
            assertThat(seen.add(m.labels()[k])).as("labels are unique").isTrue();
        }
    }

    // ---- contigs ----

    @Property(tries = 200)
    void drawnContigsAreTheLongestScannedOnes(@ForAll long seed) {
        Results r = results(seed);
        List<Integer> drawn = DrawnContigs.of(r.set());
        List<Integer> scanned = new ArrayList<>();
        for (int c = 0; c < r.lengths().length; c++) {
            if (r.set().scannedBases(c) > 0) {
                scanned.add(c);
            }
        }
        assertThat(DrawnContigs.scanned(r.set())).isEqualTo(scanned.size());
        assertThat(drawn).hasSize(Math.min(DrawnContigs.MAX, scanned.size())).doesNotHaveDuplicates();
        assertThat(scanned).containsAll(drawn);
        long shortestDrawn = drawn.stream().mapToLong(r.set()::scannedBases).min().orElse(Long.MAX_VALUE);
        for (int c : scanned) {
            if (!drawn.contains(c)) {
                assertThat(r.set().scannedBases(c)).isLessThanOrEqualTo(shortestDrawn);
            }
        }
        for (int k = 1; k < drawn.size(); k++) {
            assertThat(r.set().scannedBases(drawn.get(k))).isLessThanOrEqualTo(r.set().scannedBases(drawn.get(k - 1)));
        }
    }

    @Property(tries = 200)
    void contigSharesAreTheDrawnContigsTheOthersAndTheGenome(@ForAll long seed) {
        Results r = results(seed);
        Summary s = Summary.of(r.set());
        ContigShares cs = ContigShares.of(r.set(), s);
        List<Integer> drawn = DrawnContigs.of(r.set());
        int others = DrawnContigs.scanned(r.set()) - drawn.size();
        int entries = drawn.size() + (others > 0 ? 1 : 0);
        assertThat(cs.drawn()).isEqualTo(drawn.size());
        assertThat(cs.size()).isEqualTo(entries > 1 ? entries + 1 : entries);
        assertThat(new HashSet<>(cs.labels())).hasSize(cs.size());
        // the brute-force share of one class in a set of contigs: covered bases of that class over scanned bases
        for (PeriodClass pc : PeriodClass.values()) {
            for (int i = 0; i < drawn.size(); i++) {
                assertThat(cs.percent()[pc.ordinal()][i]).isCloseTo(share(r, List.of(drawn.get(i)), pc), within(1e-9));
            }
            if (others > 0) {
                List<Integer> rest = new ArrayList<>();
                for (int c = 0; c < r.lengths().length; c++) {
                    if (!drawn.contains(c) && r.set().scannedBases(c) > 0) {
                        rest.add(c);
                    }
                }
                assertThat(cs.labels().get(drawn.size())).isEqualTo("others (" + others + ")");
                assertThat(cs.percent()[pc.ordinal()][drawn.size()]).isCloseTo(share(r, rest, pc), within(1e-9));
            }
            if (cs.size() > entries) {
                List<Integer> every = new ArrayList<>();
                for (int c = 0; c < r.lengths().length; c++) {
                    every.add(c);
                }
                assertThat(cs.labels().get(entries)).isEqualTo("genome");
                assertThat(cs.percent()[pc.ordinal()][entries]).isCloseTo(share(r, every, pc), within(1e-9));
            }
        }
    }

    /** Percent of the bases scanned on {@code contigs} covered by loci of class {@code pc}, base by base. */
    private static double share(Results r, List<Integer> contigs, PeriodClass pc) {
        long covered = 0, scanned = 0;
        for (int c : contigs) {
            boolean[] in = new boolean[r.lengths()[c]];
            for (int[] l : r.loci()) {
                if (l[0] == c && PeriodClass.of(l[3]) == pc) {
                    for (int b = l[1]; b < l[2]; b++) {
                        in[b] = true;
                    }
                }
            }
            for (boolean b : in) {
                covered += b ? 1 : 0;
            }
            scanned += r.set().scannedBases(c);
        }
        return scanned == 0 ? 0 : 100.0 * covered / scanned;
    }

    // ---- density ----

    @Property(tries = 200)
    void densityBinsHoldTheShareOfTheirScannedBasesInLoci(@ForAll long seed) {
        Results r = results(seed);
        RepeatDensity d = RepeatDensity.of(r.set());
        List<Integer> drawn = DrawnContigs.of(r.set());
        long longest = 1;
        for (int c : drawn) {
            longest = Math.max(longest, r.lengths()[c]);
        }
        assertThat(d.bin()).isEqualTo(RepeatDensity.niceBin(longest / 300.0));
        List<Double> values = new ArrayList<>();
        for (int t = 0; t < drawn.size(); t++) {
            int c = drawn.get(t);
            int len = r.lengths()[c];
            boolean[] covered = new boolean[len];
            boolean[] scanned = new boolean[len];
            for (int[] l : r.loci()) {
                if (l[0] == c) {
                    for (int b = l[1]; b < l[2]; b++) {
                        covered[b] = true;
                    }
                }
            }
            long[] spans = r.set().scanned().get(c);
            for (int i = 0; i < spans.length; i += 2) {
                for (long b = spans[i]; b < spans[i + 1]; b++) {
                    scanned[(int) b] = true;
                }
            }
            double[] p = d.percent()[t];
            assertThat(p).hasSize((int) ((len + d.bin() - 1) / d.bin()));
            for (int b = 0; b < p.length; b++) {
                int cov = 0, scan = 0;
                for (long i = b * d.bin(); i < Math.min(len, (b + 1) * d.bin()); i++) {
                    cov += covered[(int) i] ? 1 : 0;
                    scan += scanned[(int) i] ? 1 : 0;
                }
                if (scan == 0) {
                    assertThat(p[b]).isNaN();
                } else {
                    // loci may reach past the scanned spans of a region; a bin is never more than full
                    assertThat(p[b]).isCloseTo(100.0 * Math.min(cov, scan) / scan, within(1e-9));
                    values.add(p[b]);
                }
            }
            RepeatDensity.Profile pr = d.profile(t);
            assertThat(pr.x()).hasSize(p.length + 1);
            assertThat(pr.x()[p.length] * unit(pr.unitName())).isCloseTo(len, within(1e-6 * len));
            for (int b = 0; b < p.length; b++) {
                assertThat(pr.x()[b] * unit(pr.unitName())).isCloseTo(b * d.bin(), within(1e-6 * len));
                assertThat(Double.compare(pr.percent()[b], p[b])).isZero();
                if (!Double.isNaN(p[b])) {
                    assertThat(pr.yMax()).isGreaterThanOrEqualTo(p[b]);
                }
            }
        }
        values.sort(null);
        double p99 = values.isEmpty() ? 1 : Math.max(1, values.get((int) Math.floor(0.99 * (values.size() - 1))));
        assertThat(d.scaleMax()).isEqualTo(Math.min(100, RepeatDensity.niceCeil(p99)));
        RepeatDensity.Cells cells = d.cells();
        assertThat(cells.percent()).hasSize(values.size());
        assertThat(cells.names()).hasSize(drawn.size());
    }

    private static double unit(String name) {
        return switch (name) {
            case "Mb" -> 1e6;
            case "kb" -> 1e3;
            default -> 1;
        };
    }

    /** The nice numbers, against every candidate listed out. */
    @Property(tries = 500)
    void niceNumbersAreTheSmallestCandidateAtOrAbove(@ForAll @DoubleRange(min = 0.001, max = 1e9) @Scale(4) double v) {
        long bin = RepeatDensity.niceBin(v);
        double ceil = RepeatDensity.niceCeil(v);
        long bestBin = Long.MAX_VALUE;
        double bestCeil = Double.MAX_VALUE;
        for (int e = -4; e <= 10; e++) {
            for (double m : new double[] {1, 2, 2.5, 5}) {
                double cand = m * Math.pow(10, e);
                if (cand >= v * (1 - 1e-12)) {
                    bestCeil = Math.min(bestCeil, cand);
                }
                if (m != 2.5 && e >= 0 && cand >= v && cand >= 10) {
                    bestBin = Math.min(bestBin, Math.round(cand));
                }
            }
        }
        assertThat(bin).isEqualTo(bestBin);
        assertThat(ceil).isCloseTo(bestCeil, within(bestCeil * 1e-12));
    }

    // ---- lengths and purity ----

    /** Consecutive lengths never skip a bin, which would leave an empty stripe in the chart. */
    @Property(tries = 300)
    void lengthBinsTakeEveryLengthInOrderWithoutGaps(@ForAll @IntRange(min = 1, max = 200_000) int min,
                                                     @ForAll @IntRange(min = 0, max = 2_000_000) int extra) {
        int max = (int) Math.min(Integer.MAX_VALUE, (long) min + extra);
        LengthBins lb = LengthBins.of(min, max);
        assertThat(Math.pow(10, lb.x0())).isLessThanOrEqualTo(min);
        assertThat(Math.pow(10, lb.x1())).isGreaterThanOrEqualTo(max);
        assertThat(lb.x1() - lb.x0()).isGreaterThanOrEqualTo(1);
        assertThat(lb.x0() + lb.count() * lb.dx()).isGreaterThanOrEqualTo(lb.x1() - 1e-9);
        assertThat(lb.count()).isBetween(1, 48);
        int step = Math.max(1, (max - min) / 5_000);
        int before = lb.bin(min);
        for (long len = min + 1L; len <= max; len += len - min < 2_000 ? 1 : step) {
            int b = lb.bin((int) len);
            assertThat(b - before).as("bins of %d and the length before", len).isBetween(0, len - min < 2_000 ? 1 : 49);
            double lo = Math.pow(10, lb.start(b));
            double hi = Math.pow(10, lb.start(b + 1));
            assertThat((double) len).isBetween(lo * (1 - 1e-12), b == lb.count() - 1 ? Double.MAX_VALUE : hi * (1 + 1e-12));
            before = b;
        }
    }

    /**
     * Every locus is counted once, in the cell of its length bin and purity. Purities are floats read from
     * three decimals, so one on a cell boundary (0.83 is 0.82999998f) may fall on either side: such a locus
     * is allowed in both cells, every other one only in its own.
     */
    @Property(tries = 200)
    void lengthChartsCountEveryLocusOnce(@ForAll long seed) {
        Results r = results(seed);
        LengthBins lb = LengthBins.of(r.set());
        LengthHistogram h = LengthHistogram.of(r.set());
        LengthPurityGrid g = LengthPurityGrid.of(r.set());
        assertThat(h.bins()).isEqualTo(lb);
        assertThat(g.lengths()).isEqualTo(lb);
        int rows = g.rows();
        long[][] byClass = new long[PeriodClass.values().length][lb.count()];
        long[] columns = new long[lb.count()];
        long[][] surely = new long[lb.count()][rows];
        long[][] maybe = new long[lb.count()][rows];
        List<Float> purities = new ArrayList<>();
        double slack = 1e-5;
        for (ContigLoci l : r.set().loci()) {
            for (int k = 0; k < l.size(); k++) {
                int bx = lb.bin(l.end(k) - l.start(k));
                byClass[PeriodClass.of(l.period(k)).ordinal()][bx]++;
                columns[bx]++;
                double p = l.purity(k);
                purities.add(l.purity(k));
                for (int y = 0; y < rows; y++) {
                    double lo = g.y0() + y * g.dy();
                    double hi = y == rows - 1 ? Double.MAX_VALUE : lo + g.dy();
                    if (y == 0) {
                        lo = -Double.MAX_VALUE;
                    }
                    if (p >= lo + slack && p < hi - slack) {
                        surely[bx][y]++;
                    }
                    if (p >= lo - slack && p < hi + slack) {
                        maybe[bx][y]++;
                    }
                }
            }
        }
        assertThat(h.loci()).isDeepEqualTo(byClass);
        long most = 1;
        int filled = 0;
        for (int bx = 0; bx < lb.count(); bx++) {
            long sum = 0;
            for (int y = 0; y < rows; y++) {
                long n = g.counts()[bx][y];
                assertThat(n).as("cell %d %d", bx, y).isBetween(surely[bx][y], maybe[bx][y]);
                sum += n;
                most = Math.max(most, n);
                filled += n > 0 ? 1 : 0;
            }
            assertThat(sum).isEqualTo(columns[bx]);
        }
        float lowest = purities.stream().min(Float::compare).orElse(0.8f);
        // the same float rounding: 0.9f is 0.89999998, and 20 times it rounds to 18 exactly
        assertThat(g.y0()).isLessThanOrEqualTo(lowest + 1e-6).isGreaterThan(lowest - 0.05 - 1e-6);
        assertThat(g.y0() + rows * g.dy()).as("a row for purity 1").isGreaterThan(1);
        assertThat(g.most()).isEqualTo(most);
        assertThat(g.cells().log10Count()).hasSize(filled);
        assertThat(r.set().allExact()).isEqualTo(purities.stream().allMatch(p -> p == 1f));
    }

    /** Found by the property: the lowest purity 0.9 (as a float just below it) starts the grid at 0.9. */
    @Example
    void lowestPurityJustBelowACellEdge() {
        lengthChartsCountEveryLocusOnce(-350618892L);
    }

    // ---- no drawing library ----

    @Example
    void theDataClassesUseNoDrawingLibrary() throws IOException {
        List<Class<?>> data = List.of(DrawnContigs.class, PeriodHistogram.class, MotifRanking.class, ContigShares.class,
                RepeatDensity.class, RepeatDensity.Profile.class, RepeatDensity.Cells.class, LengthBins.class,
                LengthHistogram.class, LengthPurityGrid.class, LengthPurityGrid.Cells.class, Summary.class,
                ResultSet.class, ContigLoci.class, PeriodClass.class, Fmt.class);
        for (Class<?> c : data) {
            String name = c.getName().substring(c.getPackageName().length() + 1) + ".class";
            try (InputStream in = c.getResourceAsStream(name)) {
                assertThat(in).as(name).isNotNull();
                // class references sit in the constant pool as plain text
                String pool = new String(in.readAllBytes(), StandardCharsets.ISO_8859_1);
                assertThat(pool).as(name).doesNotContain("java/awt").doesNotContain("org/jfree")
                        .doesNotContain("ChartStyle").doesNotContain("Charts");
            }
        }
        // the check can fail: the drawing classes do reference both
        try (InputStream in = Charts.class.getResourceAsStream("Charts.class")) {
            String pool = new String(in.readAllBytes(), StandardCharsets.ISO_8859_1);
            assertThat(pool).contains("org/jfree").contains("java/awt");
        }
    }
}
