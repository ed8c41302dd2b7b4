package stria.pipeline;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/**
 * The window plan against its documented rule: windows cover the stretch, neighbours share
 * {@code 2 maxPeriod + 2} bases, the owned stretches partition it in order, each owned stretch lies strictly
 * inside its window (but the first), and the next window sees at least {@code 2 maxPeriod} bases of every run
 * that reaches a window's end from its owned stretch.
 */
class WindowPlanProperties {

    @Property(tries = 500)
    void windowsCoverTheStretchAndOwnershipPartitionsIt(@ForAll @IntRange(min = 0, max = 5000) int lo,
                                                        @ForAll @IntRange(min = 0, max = 200_000) int length,
                                                        @ForAll @IntRange(min = 1, max = 2000) int maxPeriod,
                                                        @ForAll @IntRange(min = 0, max = 30_000) int extra) {
        int window = Geometry.minWindow(maxPeriod) + extra;
        WindowPlan plan = new WindowPlan(lo, lo + length, window, maxPeriod);
        int overlap = Geometry.overlap(maxPeriod);
        assertThat(plan.start(0)).isEqualTo(lo);
        assertThat(plan.end(plan.count() - 1)).isEqualTo(lo + length);
        assertThat(plan.ownedFrom(0)).isEqualTo(lo);
        assertThat(plan.ownedTo(plan.count() - 1)).isEqualTo(lo + length);
        for (int k = 0; k < plan.count(); k++) {
            assertThat(plan.end(k) - plan.start(k)).as("window %d", k).isLessThanOrEqualTo(window)
                    .isGreaterThanOrEqualTo(length == 0 ? 0 : 1);
            assertThat(plan.isLast(k)).isEqualTo(k == plan.count() - 1);
            assertThat(plan.ownedFrom(k)).isLessThanOrEqualTo(plan.ownedTo(k));
            if (k > 0) {
                assertThat(plan.start(k)).isEqualTo(plan.end(k - 1) - overlap);
                assertThat(plan.ownedFrom(k)).isEqualTo(plan.ownedTo(k - 1));
                // a run owned here starts strictly inside the window, so the window sees its true start
                assertThat(plan.ownedFrom(k)).isGreaterThan(plan.start(k));
            }
            if (!plan.isLast(k)) {
                // a run that reaches this window's end from its owned stretch is seen by the next window
                // over at least 2 maxPeriod bases: enough to show the same period there
                assertThat(plan.end(k) - plan.start(k + 1)).isGreaterThanOrEqualTo(2 * maxPeriod);
                assertThat(plan.ownedTo(k)).isGreaterThan(plan.start(k + 1));
                assertThat(plan.end(k) - plan.ownedTo(k)).isEqualTo(2 * maxPeriod);
            }
        }
        // as few windows as cover the stretch: one fewer would not reach its end
        if (plan.count() > 1) {
            long reach = lo + (long) (plan.count() - 2) * (window - overlap) + window;
            assertThat(reach).isLessThan(lo + length);
        }
    }

    @Example
    void aWindowBelowTheSmallestIsRefused() {
        assertThatThrownBy(() -> new WindowPlan(0, 1000, Geometry.minWindow(10) - 1, 10))
                .isInstanceOf(IllegalArgumentException.class);
        assertThat(new WindowPlan(0, 1000, Geometry.minWindow(10), 10).count()).isPositive();
    }

    @Example
    void theDefaultWindowFollowsTheLargestPeriod() {
        assertThat(Geometry.defaultWindow(1)).isEqualTo(256_000);
        assertThat(Geometry.defaultWindow(4096)).isEqualTo(64 * 4096);
        assertThat(Geometry.defaultWindow(62_500)).isEqualTo(4_000_000);
        assertThat(Geometry.defaultWindow(1_000_000)).isEqualTo(Geometry.minWindow(1_000_000));
    }
}
