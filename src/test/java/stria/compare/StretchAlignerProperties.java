package stria.compare;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/**
 * The stretch aligner against a brute force that shares none of its machinery: every way of cutting the
 * text into one piece per template segment, each piece aligned on its own (a linear segment end to end
 * by plain global alignment, a loop against every prefix of its motif unrolled from the entry phase).
 */
class StretchAlignerProperties {
    private static final int MATCH = StretchAligner.MATCH;
    private static final int MISMATCH = StretchAligner.MISMATCH;
    private static final int GAP = StretchAligner.GAP;

    /** A segment: linear bases, or a loop over a motif from a phase. */
    record Seg(byte[] bases, byte[] motif, int phase, boolean target) {
        static Seg linear(byte[] b) {
            return new Seg(b, null, 0, false);
        }
    }

    @Property(tries = 400)
    void bestScoreAndTheTargetsCutAreOptimal(@ForAll long seed, @ForAll @IntRange(min = 1, max = 4) int period,
                                             @ForAll boolean neighbour) {
        Random r = new Random(seed);
        List<Seg> segs = new ArrayList<>();
        if (neighbour) {
            segs.add(Seg.linear(random(r, r.nextInt(4))));
            segs.add(new Seg(null, random(r, 1 + r.nextInt(3)), 0, false));
        }
        segs.add(Seg.linear(random(r, r.nextInt(6))));
        byte[] motif = random(r, period);
        segs.add(new Seg(null, motif, r.nextInt(period), true));
        segs.add(Seg.linear(random(r, r.nextInt(6))));
        byte[] text = text(r, segs, neighbour ? 12 : 14);
        check(segs, text);
    }

    /** Identical bases on both sides: the repeat is found exactly where A has it. */
    @Property(tries = 300)
    void theTemplatesOwnBasesGiveItsOwnCut(@ForAll long seed, @ForAll @IntRange(min = 1, max = 6) int period,
                                           @ForAll @IntRange(min = 2, max = 12) int copies) {
        Random r = new Random(seed);
        byte[] left = random(r, 1 + r.nextInt(40));
        byte[] right = random(r, 1 + r.nextInt(40));
        byte[] motif = random(r, period);
        if (stria.score.MotifClass.primitiveRoot(motif) != period) {
            return;
        }
        byte[] rep = new byte[period * copies + r.nextInt(period)];
        for (int i = 0; i < rep.length; i++) {
            rep[i] = motif[i % period];
        }
        byte[] text = Pairs.concat(left, rep, right);
        // the flanks must not continue the repeat, or its extent is a matter of taste
        if (left[left.length - 1] == motif[period - 1] || right[0] == motif[rep.length % period]) {
            return;
        }
        StretchAligner al = new StretchAligner();
        al.reset();
        al.linear(left, 0, left.length);
        al.loop(motif, 0, true);
        al.linear(right, 0, right.length);
        assertThat(al.align(text, text.length, 1L << 40)).isTrue();
        assertThat(al.repeatStart()).isEqualTo(left.length);
        assertThat(al.repeatEnd()).isEqualTo(left.length + rep.length);
        assertThat(al.purity()).isEqualTo(1.0);
        assertThat(al.score()).isEqualTo(MATCH * text.length);
    }

    /** Extra copies of a neighbour go to the neighbour's loop, not the target's. */
    @Example
    void copiesOfANeighbourStayWithTheNeighbour() {
        byte[] ca = codes("CACACACACACA");
        byte[] ga = codes("GAGAGAGAGAGA");
        byte[] flank = codes("TTGCTTCGTCATTG");
        StretchAligner al = new StretchAligner();
        al.reset();
        al.linear(flank, 0, flank.length);
        al.loop(codes("CA"), 0, false);
        al.loop(codes("GA"), 0, true);
        al.linear(flank, 0, flank.length);
        byte[] text = Pairs.concat(flank, ca, codes("CACA"), ga, flank);
        assertThat(al.align(text, text.length, 1L << 30)).isTrue();
        assertThat(al.repeatEnd() - al.repeatStart()).isEqualTo(ga.length);
        assertThat(al.repeatStart()).isEqualTo(flank.length + ca.length + 4);
    }

    @Example
    void aRepeatReplacedByOtherBasesIsEmptyOrImpure() {
        byte[] flank = codes("TTGCTTCGTCATTG");
        StretchAligner al = new StretchAligner();
        al.reset();
        al.linear(flank, 0, flank.length);
        al.loop(codes("CAG"), 0, true);
        al.linear(flank, 0, flank.length);
        byte[] text = Pairs.concat(flank, flank);
        assertThat(al.align(text, text.length, 1L << 30)).isTrue();
        assertThat(al.repeatStart()).isEqualTo(al.repeatEnd()).isEqualTo(flank.length);
        assertThat(al.score()).isEqualTo(MATCH * text.length);
    }

    @Example
    void tooManyCellsAreRefused() {
        StretchAligner al = new StretchAligner();
        al.reset();
        al.loop(codes("CAG"), 0, true);
        byte[] text = codes("CAGCAGCAG");
        assertThat(al.align(text, text.length, 10)).isFalse();
    }

    private static void check(List<Seg> segs, byte[] text) {
        StretchAligner al = new StretchAligner();
        al.reset();
        int targetIndex = -1;
        for (int k = 0; k < segs.size(); k++) {
            Seg s = segs.get(k);
            if (s.bases() != null) {
                al.linear(s.bases(), 0, s.bases().length);
            } else {
                al.loop(s.motif(), s.phase(), s.target());
                if (s.target()) {
                    targetIndex = k;
                }
            }
        }
        int n = text.length;
        assertThat(al.align(text, n, 1L << 40)).isTrue();
        // before[k][x]: best score of segments 0..k-1 over text[0, x); after[k][x]: of segments k.. over text[x, n)
        int ns = segs.size();
        long[][] before = new long[ns + 1][n + 1];
        long[][] after = new long[ns + 1][n + 1];
        for (long[] row : before) {
            java.util.Arrays.fill(row, Long.MIN_VALUE / 4);
        }
        for (long[] row : after) {
            java.util.Arrays.fill(row, Long.MIN_VALUE / 4);
        }
        before[0][0] = 0;
        after[ns][n] = 0;
        for (int k = 0; k < ns; k++) {
            for (int y = 0; y <= n; y++) {
                for (int x = y; x <= n; x++) {
                    before[k + 1][x] = Math.max(before[k + 1][x], before[k][y] + piece(segs.get(k), text, y, x));
                }
            }
        }
        for (int k = ns - 1; k >= 0; k--) {
            for (int x = n; x >= 0; x--) {
                for (int y = x; y <= n; y++) {
                    after[k][x] = Math.max(after[k][x], after[k + 1][y] + piece(segs.get(k), text, x, y));
                }
            }
        }
        long best = before[ns][n];
        assertThat((long) al.score()).isEqualTo(best);
        int b0 = al.repeatStart();
        int b1 = al.repeatEnd();
        assertThat(b0).isBetween(0, n);
        assertThat(b1).isBetween(b0, n);
        long loop = piece(segs.get(targetIndex), text, b0, b1);
        assertThat(before[targetIndex][b0] + loop + after[targetIndex + 1][b1]).isEqualTo(best);
        int m = al.matches();
        int x = al.mismatches();
        int i = al.insertions();
        int d = al.deletions();
        assertThat(m + x + i).isEqualTo(b1 - b0);
        assertThat((long) MATCH * m + (long) MISMATCH * x + (long) GAP * (i + d)).isEqualTo(loop);
    }

    /** Best score of text[a, b) against one segment on its own. */
    private static long piece(Seg s, byte[] text, int a, int b) {
        if (s.bases() != null) {
            return global(s.bases(), s.bases().length, text, a, b);
        }
        int p = s.motif().length;
        int maxJ = (b - a + 1) * p + (b - a);
        byte[] unrolled = new byte[maxJ];
        for (int j = 0; j < maxJ; j++) {
            unrolled[j] = s.motif()[(s.phase() + j) % p];
        }
        long best = Long.MIN_VALUE;
        for (int j = 0; j <= maxJ; j++) {
            best = Math.max(best, global(unrolled, j, text, a, b));
        }
        return best;
    }

    /** Needleman-Wunsch of tmpl[0, tl) against text[a, b), linear gap cost. */
    private static long global(byte[] tmpl, int tl, byte[] text, int a, int b) {
        int n = b - a;
        long[][] h = new long[n + 1][tl + 1];
        for (int i = 0; i <= n; i++) {
            for (int j = 0; j <= tl; j++) {
                if (i == 0 && j == 0) {
                    continue;
                }
                long v = Long.MIN_VALUE / 4;
                if (i > 0 && j > 0) {
                    v = h[i - 1][j - 1] + (text[a + i - 1] == tmpl[j - 1] ? MATCH : MISMATCH);
                }
                if (i > 0) {
                    v = Math.max(v, h[i - 1][j] + GAP);
                }
                if (j > 0) {
                    v = Math.max(v, h[i][j - 1] + GAP);
                }
                h[i][j] = v;
            }
        }
        return h[n][tl];
    }

    /** A text like the template: each segment realised, then a few random edits (an N among them). */
    private static byte[] text(Random r, List<Seg> segs, int max) {
        List<Byte> t = new ArrayList<>();
        for (Seg s : segs) {
            if (s.bases() != null) {
                for (byte x : s.bases()) {
                    t.add(x);
                }
            } else {
                int len = r.nextInt(2 * s.motif().length + 4);
                for (int j = 0; j < len; j++) {
                    t.add(s.motif()[(s.phase() + j) % s.motif().length]);
                }
            }
        }
        int edits = r.nextInt(4);
        for (int e = 0; e < edits; e++) {
            int at = t.isEmpty() ? 0 : r.nextInt(t.size() + 1);
            switch (r.nextInt(4)) {
                case 0 -> t.add(at, (byte) r.nextInt(4));
                case 1 -> {
                    if (at < t.size()) {
                        t.remove(at);
                    }
                }
                case 2 -> {
                    if (at < t.size()) {
                        t.set(at, (byte) r.nextInt(4));
                    }
                }
                default -> {
                    if (at < t.size()) {
                        t.set(at, (byte) 4);
                    }
                }
            }
        }
        while (t.size() > max) {
            t.remove(t.size() - 1);
        }
        byte[] out = new byte[t.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = t.get(i);
        }
        return out;
    }

    static byte[] random(Random r, int n) {
        byte[] b = new byte[n];
        for (int i = 0; i < n; i++) {
            b[i] = (byte) r.nextInt(4);
        }
        return b;
    }

    static byte[] codes(String s) {
        byte[] b = new byte[s.length()];
        for (int i = 0; i < b.length; i++) {
            b[i] = (byte) "ACGT".indexOf(s.charAt(i));
        }
        return b;
    }
}
