package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/**
 * The competition between candidates: the tiling is a maximum-weight set of candidates whose cores (the
 * candidate without its edge tolerance) do not overlap, checked against every subset of small random
 * sets; the winners share no base, every loser overlaps a winner, and far-apart groups are decided alone.
 */
class CompetitionProperties {

    static Candidate candidate(int start, int length, int period, int score) {
        return new Candidate(start, new byte[period], 0, score, ScoringModel.uniform(), new VoteTally.PathCounts(length, 0, 0, 0),
                PhaseMap.steady(period, length, 0));
    }

    private static List<Candidate> randomSet(Random r, int n, int span) {
        List<Candidate> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            int len = 4 + r.nextInt(40);
            out.add(candidate(r.nextInt(span), len, 1 + r.nextInt(8), r.nextInt(90) - 10));
        }
        return out;
    }

    private static boolean coresOverlap(Candidate a, Candidate b) {
        int as = a.start + Competition.edgeTolerance(a);
        int ae = a.end - Competition.edgeTolerance(a);
        int bs = b.start + Competition.edgeTolerance(b);
        int be = b.end - Competition.edgeTolerance(b);
        return as < be && bs < ae;
    }

    /** The largest total weight of a set of candidates with pairwise disjoint cores, over all subsets. */
    private static long bruteForceBest(List<Candidate> c) {
        int n = c.size();
        long best = 0;
        subsets:
        for (int mask = 0; mask < 1 << n; mask++) {
            long w = 0;
            for (int i = 0; i < n; i++) {
                if ((mask >> i & 1) == 0) {
                    continue;
                }
                for (int j = i + 1; j < n; j++) {
                    if ((mask >> j & 1) != 0 && coresOverlap(c.get(i), c.get(j))) {
                        continue subsets;
                    }
                }
                w += Competition.weight(c.get(i));
            }
            best = Math.max(best, w);
        }
        return best;
    }

    @Property(tries = 500)
    void tilingIsAMaximumWeightSetOfDisjointCores(@ForAll long seed, @ForAll @IntRange(min = 1, max = 12) int n,
                                                  @ForAll @IntRange(min = 5, max = 120) int span) {
        Random r = new Random(seed);
        List<Candidate> c = randomSet(r, n, span);
        int[] chosen = Competition.tiling(c);
        long w = 0;
        for (int x = 0; x < chosen.length; x++) {
            for (int y = x + 1; y < chosen.length; y++) {
                assertThat(chosen[x]).isNotEqualTo(chosen[y]);
                assertThat(coresOverlap(c.get(chosen[x]), c.get(chosen[y]))).isFalse();
            }
            w += Competition.weight(c.get(chosen[x]));
        }
        assertThat(w).isEqualTo(bruteForceBest(c));
    }

    /**
     * The competition's own sort gives the order of the library's stable sort with the same comparison,
     * ties (equal candidates as distinct objects) kept in input order; sets small and large enough for both
     * the insertion and the merge paths.
     */
    @Property(tries = 300)
    void ownSortIsTheStableLibrarySort(@ForAll long seed, @ForAll @IntRange(min = 0, max = 70) int n,
                                       @ForAll boolean strongestFirst) {
        Random r = new Random(seed);
        List<Candidate> c = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            // narrow ranges: many equal keys
            c.add(candidate(r.nextInt(6), 4 + r.nextInt(4), 1 + r.nextInt(3), r.nextInt(5) * 9));
        }
        java.util.Comparator<Candidate> cmp = strongestFirst ? Competition::byStrength : Competition::byPosition;
        // the orders as the documented chains of keys
        java.util.Comparator<Candidate> chain = strongestFirst
                ? java.util.Comparator.<Candidate>comparingInt(k -> -Competition.strength(k.score, k.period))
                        .thenComparingInt(k -> k.period).thenComparingInt(k -> k.start).thenComparingInt(k -> k.end)
                : java.util.Comparator.<Candidate>comparingInt(k -> k.start).thenComparingInt(k -> k.end)
                        .thenComparingInt(k -> k.period);
        for (Candidate a : c) {
            for (Candidate b : c) {
                assertThat(Integer.signum(cmp.compare(a, b))).isEqualTo(Integer.signum(chain.compare(a, b)));
            }
        }
        List<Candidate> expected = new ArrayList<>(c);
        expected.sort(cmp);
        Competition.sort(c, strongestFirst);
        for (int i = 0; i < n; i++) {
            assertThat(c.get(i)).isSameAs(expected.get(i));
        }
    }

    /** Two neighbours that explain their parts beat one longer candidate covering both. */
    @Example
    void twoNeighboursBeatOneLongerUnit() {
        // strengths 58 against 36 + 36; the neighbours overlap by two bases, within their edge tolerance
        List<Candidate> c = List.of(candidate(0, 60, 12, 70), candidate(0, 32, 4, 40), candidate(30, 30, 4, 40));
        assertThat(Competition.tiling(c)).containsExactlyInAnyOrder(1, 2);
        // taken strongest first (ties: earlier start), the second keeps what the first leaves
        Competition.Trimmer trimmer = (k, a, b) -> candidate(a, b - a, k.period, k.score);
        List<Candidate> won = Competition.resolve(new ArrayList<>(c), trimmer);
        assertThat(won).extracting(k -> k.start, k -> k.end, k -> k.period)
                .containsExactly(org.assertj.core.groups.Tuple.tuple(0, 32, 4),
                        org.assertj.core.groups.Tuple.tuple(32, 60, 4));
    }

    @Property(tries = 300)
    void winnersShareNoBaseAndEveryLoserMeetsAWinner(@ForAll long seed, @ForAll @IntRange(min = 1, max = 14) int n,
                                                     @ForAll @IntRange(min = 5, max = 150) int span,
                                                     @ForAll boolean trims) {
        Random r = new Random(seed);
        List<Candidate> c = randomSet(r, n, span);
        List<Candidate> input = List.copyOf(c);
        Competition.Trimmer trimmer = trims
                ? (k, a, b) -> b - a >= 4 ? candidate(a, b - a, k.period, k.score * (b - a) / k.length()) : null
                : (k, a, b) -> null;
        List<Candidate> won = Competition.resolve(new ArrayList<>(c), trimmer);
        for (int x = 0; x < won.size(); x++) {
            Candidate w = won.get(x);
            assertThat(input.stream().anyMatch(k -> k.start <= w.start && w.end <= k.end)).isTrue();
            if (x > 0) {
                Candidate v = won.get(x - 1);
                assertThat(v.end).isLessThanOrEqualTo(w.start);
            }
        }
        for (Candidate k : input) {
            boolean isWinner = won.stream().anyMatch(w -> w == k);
            boolean meets = won.stream().anyMatch(w -> w.start < k.end && k.start < w.end);
            assertThat(isWinner || meets).isTrue();
        }
    }

    @Property(tries = 200)
    void farApartGroupsAreDecidedAlone(@ForAll long seed, @ForAll @IntRange(min = 1, max = 8) int n1,
                                       @ForAll @IntRange(min = 1, max = 8) int n2) {
        Random r = new Random(seed);
        List<Candidate> a = randomSet(r, n1, 80);
        List<Candidate> b = new ArrayList<>();
        for (Candidate k : randomSet(r, n2, 80)) {
            b.add(candidate(k.start + 1000, k.length(), k.period, k.score));
        }
        Competition.Trimmer none = (k, x, y) -> null;
        List<Candidate> both = new ArrayList<>(b);
        both.addAll(a);
        List<Candidate> expected = new ArrayList<>(Competition.resolve(new ArrayList<>(a), none));
        expected.addAll(Competition.resolve(new ArrayList<>(b), none));
        assertThat(Competition.resolve(both, none)).containsExactlyElementsOf(expected);
    }
}
