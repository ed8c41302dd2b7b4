package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/** What every result satisfies, on short odd inputs: repeats, N, lower case, tiny contigs. */
class LocusInvariantProperties {
    private static final ScoreSettings SETTINGS = new ScoreSettings(1, 50, 2.0, 8, 0.6, 12);

    /** Pieces of random DNA, short repeats with errors, runs of N, some in lower case. */
    private static byte[] mixed(long seed, int pieces) {
        Random r = new Random(seed);
        StringBuilder sb = new StringBuilder();
        for (int k = 0; k < pieces; k++) {
            int kind = r.nextInt(4);
            if (kind == 0) {
                sb.append("N".repeat(1 + r.nextInt(5)));
            } else if (kind == 1) {
                for (int i = r.nextInt(40); i > 0; i--) {
                    sb.append("ACGT".charAt(r.nextInt(4)));
                }
            } else {
                char[] unit = new char[1 + r.nextInt(kind == 2 ? 6 : 40)];
                for (int i = 0; i < unit.length; i++) {
                    unit[i] = "ACGT".charAt(r.nextInt(4));
                }
                int n = unit.length * (2 + r.nextInt(8));
                StringBuilder rep = new StringBuilder();
                for (int i = 0; i < n; i++) {
                    int e = r.nextInt(20);
                    if (e == 0) {
                        continue;
                    }
                    rep.append(e == 1 ? "ACGT".charAt(r.nextInt(4)) : unit[i % unit.length]);
                }
                String s = rep.toString();
                sb.append(r.nextBoolean() ? s : s.toLowerCase());
            }
        }
        return sb.toString().getBytes(StandardCharsets.US_ASCII);
    }

    @Property(tries = 300)
    void lociAreSortedDisjointInsideTheContigAndPassTheFilters(@ForAll long seed,
                                                               @ForAll @IntRange(min = 0, max = 30) int pieces) {
        byte[] seq = mixed(seed, pieces);
        List<Locus> loci = LocusCallerTest.call(seq, SETTINGS);
        int prevEnd = 0;
        for (Locus l : loci) {
            assertThat(l.start()).isGreaterThanOrEqualTo(prevEnd);
            assertThat(l.end()).isLessThanOrEqualTo(seq.length).isGreaterThan(l.start());
            prevEnd = l.end();
            assertThat(l.period()).isBetween(SETTINGS.minPeriod(), SETTINGS.maxPeriod());
            assertThat(l.length()).isGreaterThanOrEqualTo(SETTINGS.minLength());
            assertThat(l.copies()).isGreaterThanOrEqualTo(SETTINGS.minCopies());
            assertThat(l.purity()).isBetween(SETTINGS.minPurity(), 1.0);
            assertThat(l.score()).isGreaterThanOrEqualTo(SETTINGS.minScore());
            assertThat(l.motif()).hasSize(l.period()).matches("[ACGT]+");
            assertThat(l.motifClass()).isEqualTo(MotifClass.of(l.motif()));
            assertThat(l.entropy()).isBetween(0.0, 2.0);
            // no locus spans a letter that breaks repeats
            for (int x = l.start(); x < l.end(); x++) {
                assertThat("ACGTacgt".indexOf(seq[x])).isGreaterThanOrEqualTo(0);
            }
            // the alignment accounts for every base: matched, substituted or inserted
            int columns = l.length() + l.deletions();
            long matches = Math.round(l.purity() * columns);
            assertThat(matches + l.mismatches() + l.insertions()).isEqualTo(l.length());
        }
    }
}
