package stria.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

import stria.StriaException;

class RegionProperties {
    private static String grouped(long n, boolean commas) {
        return commas ? String.format(java.util.Locale.ROOT, "%,d", n) : Long.toString(n);
    }

    /** What people type, 1-based inclusive, always lands on the same 0-based half-open stretch. */
    @Property
    void typedRangesConvertOnce(@ForAll @IntRange(min = 1, max = 2_000_000_000) int length,
                                @ForAll @IntRange(min = 0, max = Integer.MAX_VALUE) int a,
                                @ForAll @IntRange(min = 0, max = Integer.MAX_VALUE) int b,
                                @ForAll boolean commas, @ForAll boolean openEnd) {
        List<ContigInfo> genome = List.of(new ContigInfo("c", length));
        long first = 1 + (long) a % length;
        long last = first + (long) b % (length - first + 1);
        String text = "c:" + grouped(first, commas) + (openEnd ? "-" : "-" + grouped(last, commas));
        Region r = Region.parse(text, genome);
        assertThat(r.start()).isEqualTo(first - 1);
        assertThat(r.end()).isEqualTo(openEnd ? length : last);
        assertThat(r.length()).isPositive();
    }

    @Property
    void rangesBeyondTheContigAreInputErrors(@ForAll @IntRange(min = 1, max = 1_000_000) int length,
                                             @ForAll @IntRange(min = 1, max = 1_000_000) int beyond) {
        List<ContigInfo> genome = List.of(new ContigInfo("c", length));
        assertThatThrownBy(() -> Region.parse("c:1-" + ((long) length + beyond), genome))
                .isInstanceOf(StriaException.class).hasMessageContaining("outside c");
        assertThatThrownBy(() -> Region.parse("c:" + ((long) length + beyond), genome))
                .isInstanceOf(StriaException.class);
    }
}
