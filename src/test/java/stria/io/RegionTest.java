package stria.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

import stria.StriaException;

class RegionTest {
    private static final List<ContigInfo> GENOME = List.of(new ContigInfo("chr1", 5000),
            new ContigInfo("chr2", 3000), new ContigInfo("alt:7", 100), new ContigInfo("alt", 50));

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
            "chr2                 | chr2  | 0    | 3000",
            "chr2:1-3000          | chr2  | 0    | 3000",
            "chr2:1,001-2,000     | chr2  | 1000 | 2000",
            "chr2:1001-2000       | chr2  | 1000 | 2000",
            "chr2:1001            | chr2  | 1000 | 3000",
            "chr2:1001-           | chr2  | 1000 | 3000",
            "chr2:3000            | chr2  | 2999 | 3000",
            "chr2:7-7             | chr2  | 6    | 7",
            "' chr1:1-10 '        | chr1  | 0    | 10",
            "alt:7                | alt:7 | 0    | 100",
            "alt:7:5-6            | alt:7 | 4    | 6",
            "alt:5-6              | alt   | 4    | 6",
    })
    void parsesWhatPeopleType(String text, String contig, int start, int end) {
        assertThat(Region.parse(text, GENOME)).isEqualTo(new Region(contig, start, end));
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "  ", "chr2:", "chr2:abc", "chr2:0-10", "chr2:10-5", "chr2:1-2-3", ":1-10",
            "chr2:-5", "chr2:1..10", "chr2:1e3"})
    void syntaxProblemsAreUsageErrors(String text) {
        assertThatThrownBy(() -> Region.parse(text, GENOME)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageNotContaining("\n");
    }

    @Test
    void unknownContigOrRangeOutsideItIsAnInputError() {
        assertThatThrownBy(() -> Region.parse("chrX", GENOME)).isInstanceOf(StriaException.class)
                .hasMessageContaining("chrX");
        assertThatThrownBy(() -> Region.parse("chrX:1-10", GENOME)).isInstanceOf(StriaException.class)
                .hasMessageContaining("region chrX:1-10").hasMessageContaining("no contig chrX");
        assertThatThrownBy(() -> Region.parse("chr2:2,001-3,001", GENOME)).isInstanceOf(StriaException.class)
                .hasMessage("region chr2:2,001-3,001 is outside chr2 (length 3000)");
        assertThatThrownBy(() -> Region.parse("chr2:3001", GENOME)).isInstanceOf(StriaException.class)
                .hasMessageContaining("outside chr2");
        assertThatThrownBy(() -> Region.parse("chr2:1-99999999999999999999", GENOME)).isInstanceOf(StriaException.class)
                .hasMessageContaining("outside chr2");
    }

    @Test
    void lengthIsEndMinusStart() {
        assertThat(Region.parse("chr1:11-20", GENOME).length()).isEqualTo(10);
    }
}
