package stria;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import stria.io.ContigInfo;
import stria.io.Region;

/** The one interval union (and the union of regions in genome order built on it) against a bitmap of bases. */
class IntervalsProperties {

    @Property(tries = 500)
    void theUnionCoversTheSameBasesSortedDisjointAndApart(@ForAll long seed,
                                                          @ForAll @IntRange(min = 0, max = 60) int n) {
        Random rnd = new Random(seed);
        int[] starts = new int[n];
        int[] ends = new int[n];
        for (int i = 0; i < n; i++) {
            starts[i] = rnd.nextInt(300);
            ends[i] = starts[i] + rnd.nextInt(rnd.nextBoolean() ? 5 : 60);
        }
        Integer[] order = new Integer[n];
        Arrays.setAll(order, i -> i);
        Arrays.sort(order, (a, b) -> Integer.compare(starts[a], starts[b]));
        int[] s = new int[n];
        int[] e = new int[n];
        boolean[] covered = new boolean[400];
        for (int i = 0; i < n; i++) {
            s[i] = starts[order[i]];
            e[i] = ends[order[i]];
            Arrays.fill(covered, s[i], e[i], true);
        }
        int m = Intervals.union(s, e, n);
        boolean[] got = new boolean[400];
        for (int i = 0; i < m; i++) {
            assertThat(s[i]).isLessThan(e[i]);
            if (i > 0) {
                // touching intervals are one: a gap of at least one base separates neighbours
                assertThat(s[i]).isGreaterThan(e[i - 1]);
            }
            Arrays.fill(got, s[i], e[i], true);
        }
        assertThat(got).isEqualTo(covered);
        long bases = 0;
        for (boolean b : covered) {
            bases += b ? 1 : 0;
        }
        assertThat(Intervals.covered(s, e, m)).isEqualTo(bases);
    }

    @Example
    void unsortedInputIsRefused() {
        assertThatThrownBy(() -> Intervals.union(new int[] {5, 1}, new int[] {9, 3}, 2))
                .isInstanceOf(IllegalArgumentException.class);
    }

    @Example
    void regionsComeOutInGenomeOrderMerged() {
        List<ContigInfo> genome = List.of(new ContigInfo("b", 100), new ContigInfo("a", 100));
        List<Region> regions = new ArrayList<>(List.of(new Region("a", 10, 20), new Region("b", 50, 60),
                new Region("a", 20, 30), new Region("b", 0, 5), new Region("b", 55, 70), new Region("a", 40, 40)));
        assertThat(Region.union(regions, genome)).containsExactly(new Region("b", 0, 5), new Region("b", 50, 70),
                new Region("a", 10, 30));
        assertThatThrownBy(() -> Region.union(List.of(new Region("z", 0, 1)), genome))
                .isInstanceOf(IllegalArgumentException.class);
    }
}
