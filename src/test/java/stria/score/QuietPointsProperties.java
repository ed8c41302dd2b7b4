package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import stria.repeats.RunList;

/**
 * Quiet points against their definition: a position no seed's reach (clipped to the sequence) has strictly
 * inside it. The nearest ones around any position, and the component of every seed, by direct search.
 */
class QuietPointsProperties {

    private static boolean quiet(RunList seeds, int length, int x) {
        for (int i = 0; i < seeds.size(); i++) {
            int r = QuietPoints.reach(seeds.period(i));
            int a = Math.max(0, seeds.start(i) - r);
            int b = Math.min(length, seeds.end(i) + r);
            if (a < x && x < b) {
                return false;
            }
        }
        return true;
    }

    @Property(tries = 300)
    void nearestQuietPointsByDirectSearch(@ForAll long seed, @ForAll @IntRange(min = 0, max = 30) int n,
                                          @ForAll @IntRange(min = 50, max = 3000) int length) {
        Random r = new Random(seed);
        RunList seeds = new RunList();
        for (int i = 0; i < n; i++) {
            int p = 1 + r.nextInt(r.nextBoolean() ? 12 : 200);
            int s = r.nextInt(length);
            seeds.add(s, Math.min(length, s + p + 1 + r.nextInt(40)), p);
        }
        QuietPoints q = QuietPoints.of(Seeds.sorted(seeds), length);
        for (int x = 0; x <= length; x++) {
            int before = x;
            while (!quiet(seeds, length, before)) {
                before--;
            }
            int after = x;
            while (!quiet(seeds, length, after)) {
                after++;
            }
            assertThat(q.atOrBefore(x)).as("at or before %d", x).isEqualTo(before);
            assertThat(q.atOrAfter(x)).as("at or after %d", x).isEqualTo(after);
        }
        for (int i = 0; i < seeds.size(); i++) {
            int c = q.componentAt(seeds.start(i));
            assertThat(c).isNotNegative();
            assertThat(q.start(c)).isLessThanOrEqualTo(seeds.start(i));
            assertThat(q.end(c)).isGreaterThanOrEqualTo(seeds.end(i));
        }
    }
}
