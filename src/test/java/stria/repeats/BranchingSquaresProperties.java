package stria.repeats;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import java.util.Random;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

class BranchingSquaresProperties {

    /** The radix sort of packed (end, length) keys must agree with a plain sort of the same longs. */
    @Property(tries = 200)
    void sortByEndThenLengthEqualsPlainSort(@ForAll long seed, @ForAll @IntRange(min = 2, max = 20_000_000) int n,
                                            @ForAll @IntRange(min = 1, max = 5000) int maxLength,
                                            @ForAll @IntRange(max = 3000) int count) {
        Random rnd = new Random(seed);
        int maxL = Math.min(maxLength, n / 2);
        long[] keys = new long[count];
        for (int i = 0; i < count; i++) {
            int l = 1 + rnd.nextInt(maxL);
            int end = 2 * l + rnd.nextInt(n - 2 * l + 1);
            keys[i] = ((long) end << 32) | l;
        }
        BranchingSquares squares = new BranchingSquares();
        squares.addAllForTest(keys);
        squares.sortByEndThenLength(n, maxL);
        long[] expected = keys.clone();
        Arrays.sort(expected);
        assertThat(Arrays.copyOf(squares.squares(), squares.count())).containsExactly(expected);
    }
}
