package stria.compare;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import stria.score.Locus;

/**
 * The engine on a small invented pair: pure repeats planted every 2.5 kb in random sequence, and B made
 * from A by hand, one kind of change at a time, so each expected row is known exactly.
 */
class ComparisonTest {
    private static final String[] MOTIFS = {"A", "CA", "CAG", "AATG", "GGTCA", "ACCTTGA", "TTAGGGCATCCAGTTACGATCGAGT"};
    private static final int[] LENGTHS = {15, 24, 30, 28, 30, 28, 75};

    /** Contig 0 of 40 kb and contig 1 of 30 kb, a locus every 2.5 kb from 1,500 on. */
    private final List<String> names = List.of("chrA", "chrB");
    private final List<byte[]> a = new ArrayList<>();
    private final List<List<Locus>> loci = new ArrayList<>();

    ComparisonTest() {
        Random r = new Random(20261202L);
        int[] sizes = {40_000, 30_000};
        int k = 0;
        for (int size : sizes) {
            byte[] s = Pairs.random(r, size);
            List<Locus> ls = new ArrayList<>();
            for (int at = 1500; at + 200 < size; at += 2500, k++) {
                String mo = MOTIFS[k % MOTIFS.length];
                int len = LENGTHS[k % LENGTHS.length];
                System.arraycopy(Pairs.repeat(mo, len), 0, s, at, len);
                // a flank base that continued the motif would move the locus' true ends
                s[at - 1] = Pairs.differentFrom(mo.charAt(mo.length() - 1), s[at - 1]);
                s[at + len] = Pairs.differentFrom(mo.charAt(len % mo.length()), s[at + len]);
                ls.add(Pairs.locus(at, at + len, mo));
            }
            a.add(s);
            loci.add(ls);
        }
    }

    private List<ComparedLocus> run(List<String> bNames, List<byte[]> b) {
        return Pairs.compare(Pairs.settings(), names, a, loci, bNames, b).results(2);
    }

    private Locus at(int contig, int i) {
        return loci.get(contig).get(i);
    }

    private int index(int contig, int i) {
        return contig == 0 ? i : loci.get(0).size() + i;
    }

    @Test
    void theSameGenomeTwiceIsTheSameEverywhere() {
        List<ComparedLocus> rows = run(names, a);
        assertThat(rows).hasSize(loci.get(0).size() + loci.get(1).size());
        for (ComparedLocus row : rows) {
            assertThat(row.status()).isEqualTo(Status.SAME);
            assertThat(row.otherChrom()).isEqualTo(row.chrom());
            assertThat(row.otherStart()).isEqualTo(row.locus().start());
            assertThat(row.otherEnd()).isEqualTo(row.locus().end());
            assertThat(row.otherStrand()).isEqualTo('+');
            assertThat(row.lengthChange()).isZero();
            assertThat(row.otherPurity()).isEqualTo(row.locus().purity());
        }
    }

    @Test
    void renamedReorderedAndReverseComplementedContigsArePlacedByTheirBases() {
        byte[] rc = Pairs.reverseComplement(a.get(1));
        List<ComparedLocus> rows = run(List.of("scaffold_1", "scaffold_2"), List.of(rc, a.get(0)));
        int n = a.get(1).length;
        for (ComparedLocus row : rows) {
            assertThat(row.status()).isEqualTo(Status.SAME);
            if (row.chrom().equals("chrA")) {
                assertThat(row.otherChrom()).isEqualTo("scaffold_2");
                assertThat(row.otherStrand()).isEqualTo('+');
                assertThat(row.otherStart()).isEqualTo(row.locus().start());
            } else {
                assertThat(row.otherChrom()).isEqualTo("scaffold_1");
                assertThat(row.otherStrand()).isEqualTo('-');
                assertThat(row.otherStart()).isEqualTo(n - row.locus().end());
                assertThat(row.otherEnd()).isEqualTo(n - row.locus().start());
                assertThat(Pairs.text(rc, row.otherStart(), row.otherEnd()))
                        .isEqualTo(Pairs.text(Pairs.reverseComplement(Arrays.copyOfRange(a.get(1),
                                row.locus().start(), row.locus().end())), 0, row.locus().length()));
            }
        }
    }

    @Test
    void wholeCopiesGainedAndLostAreMeasuredOnEitherStrand() {
        // contig 0: locus 3 (AATG x 7) gains 3 copies, locus 5 (ACCTTGA x 4) loses 2; contig 1 the same
        // edits on locus 1 and 2, then reverse-complemented
        byte[] b0 = edit(a.get(0), at(0, 3), +3, at(0, 5), -2);
        byte[] b1 = Pairs.reverseComplement(edit(a.get(1), at(1, 1), +2, at(1, 2), -3));
        List<ComparedLocus> rows = run(List.of("h2.1", "h2.2"), List.of(b0, b1));
        for (int i = 0; i < rows.size(); i++) {
            ComparedLocus row = rows.get(i);
            int want = i == index(0, 3) ? 12 : i == index(0, 5) ? -14 : i == index(1, 1) ? 8 : i == index(1, 2) ? -15 : 0;
            assertThat(row.lengthChange()).as("row %d %s", i, row).isEqualTo(want);
            assertThat(row.status()).isEqualTo(want == 0 ? Status.SAME : Status.CHANGED);
            byte[] b = row.otherChrom().equals("h2.1") ? b0 : b1;
            // B's repeat, read on A's strand, is A's motif repeated
            String rep = Pairs.text(b, row.otherStart(), row.otherEnd());
            if (row.otherStrand() == '-') {
                rep = Pairs.text(Pairs.reverseComplement(rep.getBytes(java.nio.charset.StandardCharsets.US_ASCII)),
                        0, rep.length());
            }
            assertThat(rep).isEqualTo(Pairs.text(Pairs.repeat(row.locus().motif(), rep.length()), 0, rep.length()));
        }
    }

    @Test
    void aRepeatDeletedOrCutBelowTwoCopiesIsLost() {
        Locus gone = at(0, 2); // CAG x 10, deleted whole
        Locus cut = at(0, 4); // GGTCA x 6, 5 copies removed
        byte[] b = Pairs.concat(Arrays.copyOfRange(a.get(0), 0, gone.start()),
                Arrays.copyOfRange(a.get(0), gone.end(), cut.start() + 5),
                Arrays.copyOfRange(a.get(0), cut.end(), a.get(0).length));
        List<ComparedLocus> rows = run(names, List.of(b, a.get(1)));
        ComparedLocus g = rows.get(index(0, 2));
        assertThat(g.status()).isEqualTo(Status.LOST);
        assertThat(g.otherStart()).isEqualTo(g.otherEnd()).isEqualTo(gone.start());
        assertThat(g.lengthChange()).isEqualTo(-30);
        assertThat(g.otherPurity()).isNaN();
        ComparedLocus c = rows.get(index(0, 4));
        assertThat(c.status()).isEqualTo(Status.LOST);
        assertThat(c.lengthChange()).isEqualTo(-25);
        assertThat(rows.get(index(0, 3)).status()).isEqualTo(Status.SAME);
        assertThat(rows.get(index(0, 3)).otherStart()).isEqualTo(at(0, 3).start() - 30);
    }

    @Test
    void aSplitContigKeepsEveryLocusButTheOneAtTheCutAndAJoinShiftsThem() {
        Locus atCut = at(0, 6);
        int cut = atCut.start() + 30;
        byte[] left = Arrays.copyOfRange(a.get(0), 0, cut);
        byte[] right = Arrays.copyOfRange(a.get(0), cut, a.get(0).length);
        byte[] joined = Pairs.concat(right, "NNNNNNNNNN".getBytes(java.nio.charset.StandardCharsets.US_ASCII),
                a.get(1));
        List<ComparedLocus> rows = run(List.of("p1", "p2+chrB"), List.of(left, joined));
        for (int i = 0; i < rows.size(); i++) {
            ComparedLocus row = rows.get(i);
            if (i == index(0, 6)) {
                assertThat(row.status()).isEqualTo(Status.UNPLACED);
                assertThat(row.note()).isEqualTo("anchors-disagree");
                continue;
            }
            assertThat(row.status()).as(row.toString()).isEqualTo(Status.SAME);
            int shift = row.chrom().equals("chrB") ? right.length + 10 : row.locus().start() < cut ? 0 : -cut;
            assertThat(row.otherChrom()).isEqualTo(row.chrom().equals("chrA") && row.locus().start() < cut ? "p1" : "p2+chrB");
            assertThat(row.otherStart()).isEqualTo(row.locus().start() + shift);
        }
    }

    @Test
    void anchorsMustBeUniqueInAAndInBAndPresentInB() {
        // A: locus 2's left flank copied over the middle of the gap after locus 8, so its words are twice in A
        List<byte[]> a2 = List.of(a.get(0).clone(), a.get(1));
        Locus dupA = at(0, 2);
        System.arraycopy(a2.get(0), dupA.start() - 260, a2.get(0), at(0, 8).end() + 600, 260);
        // B: locus 4's right flank twice in B (pasted into contig 1), locus 6's right flank replaced
        Locus dupB = at(0, 4);
        Locus gone = at(0, 6);
        byte[] b0 = a2.get(0).clone();
        Random r = new Random(7);
        System.arraycopy(Pairs.random(r, 260), 0, b0, gone.end(), 260);
        byte[] b1 = a.get(1).clone();
        System.arraycopy(b0, dupB.end(), b1, 500, 260);
        List<ComparedLocus> rows = Pairs.compare(Pairs.settings(), names, a2, loci, names, List.of(b0, b1)).results(1);
        assertThat(rows.get(index(0, 2)).status()).isEqualTo(Status.UNPLACED);
        assertThat(rows.get(index(0, 2)).note()).isEqualTo("left-anchor-not-unique-in-A");
        assertThat(rows.get(index(0, 4)).note()).isEqualTo("right-anchor-not-unique-in-B");
        assertThat(rows.get(index(0, 6)).note()).isEqualTo("right-anchor-missing-in-B");
        long placed = rows.stream().filter(ComparedLocus::placed).count();
        assertThat(placed).isEqualTo(rows.size() - 3);
    }

    @Test
    void substitutionsInTheNearestAnchorsAndAnIndelBesideTheLocusLeaveItTheSame() {
        Comparison probe = Pairs.compare(Pairs.settings(), names, a, loci, names, a);
        int g = index(0, 1);
        int m = probe.m;
        int l0 = probe.anchorPos[g * 2 * m];
        int l1 = probe.anchorPos[g * 2 * m + 1];
        int r0 = probe.anchorPos[g * 2 * m + m];
        assertThat(l0).isPositive();
        assertThat(l1).isPositive();
        byte[] b0 = a.get(0).clone();
        b0[l0 + 10] = Pairs.differentFrom((char) b0[l0 + 10], b0[l0 + 10]);
        b0[l1 + 20] = Pairs.differentFrom((char) b0[l1 + 20], b0[l1 + 20]);
        b0[r0 + 5] = Pairs.differentFrom((char) b0[r0 + 5], b0[r0 + 5]);
        // two bases gone from inside the killed nearest right anchor: between the next anchor and the locus
        b0 = Pairs.concat(Arrays.copyOfRange(b0, 0, r0 + 12), Arrays.copyOfRange(b0, r0 + 14, b0.length));
        List<ComparedLocus> rows = run(names, List.of(b0, a.get(1)));
        ComparedLocus row = rows.get(g);
        assertThat(row.status()).isEqualTo(Status.SAME);
        assertThat(row.otherStart()).isEqualTo(row.locus().start());
        assertThat(rows.get(g + 1).otherStart()).isEqualTo(rows.get(g + 1).locus().start() - 2);
    }

    @Test
    void anNInBsRepeatIsASubstitutionThere() {
        Locus l = at(0, 3);
        byte[] b0 = a.get(0).clone();
        b0[l.start() + 9] = 'N';
        b0[l.end() + 3] = 'n';
        ComparedLocus row = run(names, List.of(b0, a.get(1))).get(index(0, 3));
        assertThat(row.status()).isEqualTo(Status.SAME);
        assertThat(row.otherStart()).isEqualTo(l.start());
        assertThat(row.otherPurity()).isLessThan(row.locus().purity());
    }

    @Test
    void lociOfBWithoutACounterpartAreNew() {
        Locus l3 = at(0, 3);
        byte[] ins = Pairs.repeat("TC", 40);
        int at = l3.end() + 1200;
        byte[] b0 = Pairs.concat(Arrays.copyOfRange(a.get(0), 0, at), ins, Arrays.copyOfRange(a.get(0), at,
                a.get(0).length));
        Comparison cmp = Pairs.compare(Pairs.settings(), names, a, loci, names, List.of(b0, a.get(1)));
        cmp.results(1);
        List<Locus> bLoci = new ArrayList<>();
        for (Locus l : loci.get(0)) {
            bLoci.add(l.start() < at ? l : l.shifted(ins.length));
        }
        Locus fresh = Pairs.locus(at, at + ins.length, "TC");
        bLoci.add(fresh);
        // a locus of B that is only part of a counterpart is not new either
        bLoci.add(Pairs.locus(l3.start() + 4, l3.end(), "AATG"));
        bLoci.sort((x, y) -> Integer.compare(x.start(), y.start()));
        List<ComparedLocus> news = cmp.newLoci("chrA", bLoci);
        assertThat(news).hasSize(1);
        assertThat(news.get(0).otherLocus()).isEqualTo(fresh);
        assertThat(news.get(0).status()).isEqualTo(Status.NEW);
        assertThat(news.get(0).chrom()).isNull();
    }

    @Test
    void threadCountsGiveTheSameRows() {
        byte[] b0 = edit(a.get(0), at(0, 3), +3, at(0, 5), -2);
        Comparison one = Pairs.compare(Pairs.settings(), names, a, loci, names, List.of(b0, a.get(1)));
        Comparison four = Pairs.compare(Pairs.settings(), names, a, loci, names, List.of(b0, a.get(1)));
        assertThat(four.results(4)).isEqualTo(one.results(1));
    }

    /** A copy of {@code s} with whole copies added (d > 0) or removed in the middle of two loci. */
    private static byte[] edit(byte[] s, Locus x, int dx, Locus y, int dy) {
        byte[] out = s;
        // the later locus first, so the earlier one's coordinates still hold
        Locus[] ls = x.start() > y.start() ? new Locus[] {x, y} : new Locus[] {y, x};
        int[] ds = x.start() > y.start() ? new int[] {dx, dy} : new int[] {dy, dx};
        for (int k = 0; k < 2; k++) {
            Locus l = ls[k];
            int p = l.period();
            int mid = l.start() + p * (l.length() / p / 2);
            if (ds[k] > 0) {
                out = Pairs.concat(Arrays.copyOfRange(out, 0, mid), Pairs.repeat(l.motif(), ds[k] * p),
                        Arrays.copyOfRange(out, mid, out.length));
            } else {
                out = Pairs.concat(Arrays.copyOfRange(out, 0, mid), Arrays.copyOfRange(out, mid - ds[k] * p, out.length));
            }
        }
        return out;
    }
}
