package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/**
 * The column scores against log-odds worked out by hand (Karlin &amp; Altschul 1990 log-odds; the columns of
 * the pair-HMM of Durbin, Eddy, Krogh &amp; Mitchison 1998), with S = 0.12, I = D = 0.03, so that an aligned
 * column has probability 1 - I - D = 0.94, a match 0.94 x 0.88 = 0.8272 and each substitution
 * 0.94 x 0.04 = 0.0376. Logarithms: log2(x) = ln(x) / ln(2), rounded to a tenth of a bit.
 */
class ScoringModelTest {
    private static final int A = 0, C = 1, G = 2, T = 3;

    @Test
    void uniformBackground() {
        ScoringModel m = ScoringModel.uniform();
        assertThat(m.gc()).isEqualTo(0.50);
        // match: log2(0.8272 / 0.25) = log2(3.3088) = 1.19658 / 0.693147 = 1.7263 bits -> 17 units
        // substitution: log2(0.0376 / 0.25) = log2(0.1504) = -1.89446 / 0.693147 = -2.7331 bits -> -27
        for (int b = 0; b < 4; b++) {
            assertThat(m.match(b)).isEqualTo(17);
            assertThat(m.substitution(b)).isEqualTo(-27);
        }
        // indels: log2(0.03) = -3.50656 / 0.693147 = -5.0589 bits -> -51 (an inserted base is drawn from the
        // background, so its q(b) cancels)
        assertThat(m.insertion()).isEqualTo(-51);
        assertThat(m.deletion()).isEqualTo(-51);
    }

    @Test
    void gcPoorBackgroundRewardsRareBasesMore() {
        // class 4 is GC 0.40: q(A) = q(T) = 0.30, q(C) = q(G) = 0.20
        ScoringModel m = ScoringModel.forClass(4);
        assertThat(m.gc()).isEqualTo(0.40);
        // A: log2(0.8272 / 0.30) = log2(2.75733) = 1.46327 -> 15; log2(0.0376 / 0.30) = log2(0.125333) = -2.99616 -> -30
        assertThat(m.match(A)).isEqualTo(15);
        assertThat(m.match(T)).isEqualTo(15);
        assertThat(m.substitution(A)).isEqualTo(-30);
        // C: log2(0.8272 / 0.20) = log2(4.136) = 2.04824 -> 20; log2(0.0376 / 0.20) = log2(0.188) = -2.41119 -> -24
        assertThat(m.match(C)).isEqualTo(20);
        assertThat(m.match(G)).isEqualTo(20);
        assertThat(m.substitution(G)).isEqualTo(-24);
        assertThat(m.insertion()).isEqualTo(-51);
    }

    @Test
    void extremeClass() {
        // class 0 is GC 0.20: q(C) = 0.10, q(A) = 0.40
        ScoringModel m = ScoringModel.forClass(0);
        // log2(8.272) = 3.04824 -> 30; log2(0.376) = -1.41119 -> -14
        assertThat(m.match(C)).isEqualTo(30);
        assertThat(m.substitution(C)).isEqualTo(-14);
        // log2(2.068) = 1.04824 -> 10; log2(0.094) = -3.41119 -> -34
        assertThat(m.match(A)).isEqualTo(10);
        assertThat(m.substitution(A)).isEqualTo(-34);
        assertThat(ScoringModel.forClass(12).gc()).isEqualTo(0.80);
    }

    @Test
    void expectedColumnOnBackgroundIsNegative() {
        // Karlin-Altschul need a negative expected score: a random base matches the letter x with
        // probability q(x)
        for (int c = 0; c < ScoringModel.GC_CLASSES; c++) {
            ScoringModel m = ScoringModel.forClass(c);
            double gc = m.gc();
            for (int x = 0; x < 4; x++) {
                double qx = ScoringModel.background(gc, x);
                double e = qx * m.match(x);
                for (int b = 0; b < 4; b++) {
                    if (b != x) {
                        e += ScoringModel.background(gc, b) * m.substitution(b);
                    }
                }
                assertThat(e).as("class %d letter %d", c, x).isNegative();
            }
        }
    }

    @Test
    void compositionClasses() {
        assertThat(ScoringModel.classOf(400, 999)).isEqualTo(ScoringModel.UNIFORM_CLASS); // too few bases
        assertThat(ScoringModel.classOf(410, 1000)).isEqualTo(4); // 0.41 -> 0.40
        assertThat(ScoringModel.classOf(425, 1000)).isEqualTo(5); // 0.425 rounds half up to 0.45
        assertThat(ScoringModel.classOf(424, 1000)).isEqualTo(4);
        assertThat(ScoringModel.classOf(600, 1000)).isEqualTo(8);
        assertThat(ScoringModel.classOf(50, 1000)).isEqualTo(0); // clamped at 0.20
        assertThat(ScoringModel.classOf(990, 1000)).isEqualTo(12); // clamped at 0.80
        assertThat(ScoringModel.DESCRIPTION).doesNotContain(" ");
    }
}
