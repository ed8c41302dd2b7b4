package stria.sim;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import stria.sim.SatelliteArrays.TruthRow;
import stria.sim.SatelliteScorer.Call;
import stria.sim.SatelliteScorer.Outcome;

/**
 * The scorer against a brute force that marks every base: random expected loci and random calls (long and
 * short, overlapping, on two contigs), and per expected locus the pieces, the best and the joint cover and
 * the bridging of an interruption counted base by base.
 */
class SatelliteScorerProperties {
    @Property(tries = 300)
    void coverAndPiecesAgreeWithMarkingEveryBase(@ForAll long seed, @ForAll @IntRange(min = 0, max = 40) int nCalls) {
        Random r = new Random(seed);
        int len = 20000;
        List<TruthRow> rows = new ArrayList<>();
        int at = r.nextInt(500);
        int id = 0;
        while (at < len - 2500) {
            int unit = 20 + r.nextInt(40);
            int k = r.nextBoolean() ? 1 : 2 + r.nextInt(4);
            int block = unit * k + r.nextInt(5) - 2;
            int a = at + 100 + r.nextInt(2000);
            int b = Math.min(len, a + 200 + r.nextInt(3000));
            String name = "a" + id++;
            if (r.nextInt(3) == 0 && b - a > 600) {
                int gs = a + (b - a) / 3;
                int ge = gs + 100 + r.nextInt(100);
                rows.add(row(name, 1, 2, a, gs, unit, k, block, gs, ge));
                rows.add(row(name, 2, 2, ge, Math.max(b, ge + 50), unit, k, block, gs, ge));
                b = Math.max(b, ge + 50);
            } else {
                rows.add(row(name, 1, 1, a, b, unit, k, block, -1, -1));
            }
            at = b;
        }
        List<Call> calls = new ArrayList<>();
        for (int i = 0; i < nCalls; i++) {
            int s = r.nextInt(len);
            int e = Math.min(len + 100, s + 1 + (r.nextInt(4) == 0 ? r.nextInt(8000) : r.nextInt(300)));
            TruthRow near = rows.isEmpty() ? null : rows.get(r.nextInt(rows.size()));
            int period = near == null || r.nextInt(4) == 0 ? 1 + r.nextInt(400)
                    : (r.nextBoolean() ? near.unit() * (1 + r.nextInt(3)) : near.blockLength()) + r.nextInt(7) - 3;
            calls.add(new Call(r.nextInt(5) == 0 ? "c2" : "c1", s, e, period, 0, 0));
        }
        List<Outcome> got = SatelliteScorer.score(rows, calls, false).outcomes();
        assertThat(got).hasSize(rows.size());
        for (Outcome o : got) {
            TruthRow t = o.row();
            boolean[] joint = new boolean[t.length()];
            int best = 0;
            int pieces = 0;
            int others = 0;
            boolean bridged = false;
            for (Call c : calls) {
                if (!c.contig().equals(t.contig()) || c.end() <= t.start() || c.start() >= t.end()) {
                    continue;
                }
                if (t.interrupted() && c.start() < t.gapStart() && c.end() > t.gapEnd()) {
                    bridged = true;
                }
                if (!SatelliteScorer.isPiece(t, c.period())) {
                    others++;
                    continue;
                }
                pieces++;
                int mine = 0;
                for (int x = Math.max(c.start(), t.start()); x < Math.min(c.end(), t.end()); x++) {
                    joint[x - t.start()] = true;
                    mine++;
                }
                best = Math.max(best, mine);
            }
            int covered = 0;
            for (boolean b : joint) {
                covered += b ? 1 : 0;
            }
            assertThat(o.pieces()).hasSize(pieces);
            assertThat(o.others()).hasSize(others);
            assertThat(o.bestCover()).isEqualTo(best / (double) t.length());
            assertThat(o.unionCover()).isEqualTo(covered / (double) t.length());
            assertThat(o.covered()).isEqualTo(best / (double) t.length() >= SatelliteScorer.COVER);
            assertThat(o.bridged()).isEqualTo(bridged);
        }
    }

    private static TruthRow row(String id, int piece, int pieces, int start, int end, int unit, int k, int block,
                                int gs, int ge) {
        return new TruthRow(id, piece, pieces, "c1", start, end, unit, k, block, k == 1 ? Double.NaN : 0.2, 0.1, gs, ge);
    }
}
