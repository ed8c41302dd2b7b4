package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/**
 * The run-length map of phases against the plain array it replaces: phases drawn as an alignment makes
 * them (one step on per base, with the phase repeated at an insertion and skipped at a deletion), added
 * from the last base to the first as a path is walked, read back at random offsets and in order.
 */
class PhaseMapProperties {
    @Property(tries = 500)
    void mapReadsBackEveryPhase(@ForAll long seed, @ForAll @IntRange(min = 1, max = 300) int p,
                                @ForAll @IntRange(min = 0, max = 3000) int length,
                                @ForAll @IntRange(min = 0, max = 40) int indelPercent) {
        Random r = new Random(seed);
        int[] phase = new int[length];
        int ph = r.nextInt(p);
        int steps = 0;
        for (int i = 0; i < length; i++) {
            phase[i] = ph;
            int e = r.nextInt(100);
            int step = e < indelPercent / 2 ? 0 : e < indelPercent ? 2 + r.nextInt(3) : 1;
            steps += step == 1 ? 0 : 1;
            ph = (ph + step) % p;
        }
        PhaseMap.Builder b = new PhaseMap.Builder(p);
        for (int i = length - 1; i >= 0; i--) {
            b.add(i, phase[i]);
        }
        PhaseMap map = b.build(length);
        assertThat(map.length()).isEqualTo(length);
        // a run per change of step, at most (a step of p + 1 is a step of one)
        assertThat(map.runs()).isLessThanOrEqualTo(Math.min(length, steps + 1));
        PhaseMap.Cursor c = map.cursor();
        for (int i = 0; i < length; i++) {
            assertThat(c.next()).isEqualTo(phase[i]);
        }
        for (int t = 0; t < 50 && length > 0; t++) {
            int x = r.nextInt(length);
            assertThat(map.at(x)).isEqualTo(phase[x]);
        }
    }
}
