package stria.shard;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** {@code K/N} as typed and as result headers carry it: one parser for all. */
class ShardIdTest {
    @Test
    void parsesAndPrintsTheSameText() {
        assertThat(ShardId.parse("3/16")).isEqualTo(new ShardId(3, 16));
        assertThat(ShardId.parse(" 1 / 1 ")).isEqualTo(new ShardId(1, 1));
        assertThat(new ShardId(16, 16)).hasToString("16/16");
    }

    @ParameterizedTest
    @ValueSource(strings = {"0/4", "5/4", "1/0", "x", "1/2/3", "a/b", "3", "/", "-1/4", ""})
    void refusesWhatIsNotOneOfN(String text) {
        assertThatThrownBy(() -> ShardId.parse(text)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("K/N");
    }
}
