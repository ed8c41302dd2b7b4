package stria.pipeline;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import stria.io.ContigBytes;
import stria.repeats.RunList;
import stria.sim.NaiveRuns;

/**
 * The stitcher alone, against brute force: the runs of each window, computed separately and joined, are the
 * runs of the whole stretch found by direct comparison ({@link NaiveRuns}), each once, whole, in sorted
 * order, whatever the window length. A window drops the complete runs its filter refuses; what it keeps for
 * stitching (runs touching its ends) may come out short of the filter, for the caller to judge, but is always
 * a true run of the stretch.
 */
class StitcherProperties {

    /** Runs of seq[lo, hi) with smallest period at most maxPeriod, by direct comparison, sorted. */
    static List<String> bruteForceRuns(byte[] seq, int lo, int hi, int maxPeriod, int minLength) {
        RunList runs = NaiveRuns.find(Arrays.copyOfRange(seq, lo, hi), hi - lo, maxPeriod);
        List<String> s = new ArrayList<>();
        for (int i = 0; i < runs.size(); i++) {
            if (runs.end(i) - runs.start(i) >= minLength) {
                s.add((runs.start(i) + lo) + "-" + (runs.end(i) + lo) + "/" + runs.period(i));
            }
        }
        return s;
    }

    private static List<String> stitched(byte[] seq, WindowPlan plan, int maxPeriod, int minLength) {
        ContigBytes bytes = ContigBytes.of(seq);
        List<String> got = new ArrayList<>();
        Stitcher st = new Stitcher(plan, (s, e, p) -> got.add(s + "-" + e + "/" + p));
        WindowRuns.Workspace ws = new WindowRuns.Workspace();
        for (int k = 0; k < plan.count(); k++) {
            st.accept(k, WindowRuns.compute(bytes, plan.start(k), plan.end(k), maxPeriod,
                    (s, e, p) -> e - s >= minLength, ws));
        }
        st.finish();
        return got;
    }

    private static List<String> longerThan(List<String> runs, int minLength) {
        List<String> out = new ArrayList<>();
        for (String r : runs) {
            String[] f = r.split("[-/]");
            if (Integer.parseInt(f[1]) - Integer.parseInt(f[0]) >= minLength) {
                out.add(r);
            }
        }
        return out;
    }

    @Property(tries = 60)
    void windowRunsJoinedAreTheRunsOfTheWholeStretch(@ForAll long seed,
                                                     @ForAll @IntRange(min = 1, max = 12) int maxPeriod,
                                                     @ForAll @IntRange(min = 0, max = 300) int extra,
                                                     @ForAll @IntRange(min = 0, max = 30) int minLength,
                                                     @ForAll @IntRange(min = 0, max = 500) int lo) {
        byte[] seq = WindowingProperties.genome(seed, 2500, maxPeriod);
        int hi = seq.length - lo / 3;
        WindowPlan plan = new WindowPlan(lo, hi, Geometry.minWindow(maxPeriod) + extra, maxPeriod);
        List<String> got = stitched(seq, plan, maxPeriod, minLength);
        // runs cut by the stretch's own ends are runs of the stretch: the brute force sees the same stretch
        List<String> all = bruteForceRuns(seq, lo, hi, maxPeriod, 0);
        assertThat(all).containsAll(got);
        assertThat(longerThan(got, minLength)).isEqualTo(bruteForceRuns(seq, lo, hi, maxPeriod, minLength));
        assertThat(got).isSortedAccordingTo(StitcherProperties::compareRuns).doesNotHaveDuplicates();
    }

    private static int compareRuns(String a, String b) {
        String[] x = a.split("[-/]");
        String[] y = b.split("[-/]");
        for (int i = 0; i < 3; i++) {
            int c = Integer.compare(Integer.parseInt(x[i]), Integer.parseInt(y[i]));
            if (c != 0) {
                return c;
            }
        }
        return 0;
    }

    @Example
    void aSatelliteLongerThanManyWindowsComesOutOnceWhole() {
        byte[] seq = WindowingProperties.genome(3, 20_000, 1);
        for (int i = 3_000; i < 17_000; i++) {
            seq[i] = (byte) "ACGTTGCA".charAt((i - 3_000) % 8);
        }
        seq[2_999] = 'N';
        seq[17_000] = 'N';
        WindowPlan plan = new WindowPlan(0, seq.length, Geometry.minWindow(8), 8);
        assertThat(plan.count()).isGreaterThan(100);
        List<String> got = longerThan(stitched(seq, plan, 8, 1000), 1000);
        assertThat(got).isEqualTo(bruteForceRuns(seq, 0, seq.length, 8, 1000)).containsExactly("3000-17000/8");
    }

    @Example
    void windowsMustComeInOrder() {
        byte[] seq = "ACGTACGTAC".repeat(30).getBytes();
        WindowPlan plan = new WindowPlan(0, seq.length, Geometry.minWindow(2), 2);
        Stitcher st = new Stitcher(plan, (s, e, p) -> { });
        WindowRuns w1 = WindowRuns.compute(ContigBytes.of(seq), plan.start(1), plan.end(1), 2, (s, e, p) -> true,
                new WindowRuns.Workspace());
        assertThatThrownBy(() -> st.accept(1, w1)).isInstanceOf(IllegalStateException.class);
        assertThatThrownBy(st::finish).isInstanceOf(IllegalStateException.class);
    }
}
