package stria.shard;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Pieces of the merge that have no command around them; the command is tested in {@code cli.MergeCommandTest}. */
class ShardMergeTest {
    @Test
    void collapsesShardNumbersIntoRanges() {
        assertThat(ShardMerge.ranges(List.of(1, 3, 4, 5, 9, 10))).isEqualTo("1, 3-5, 9-10");
        assertThat(ShardMerge.ranges(List.of(7))).isEqualTo("7");
    }
}
