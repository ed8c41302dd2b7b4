package stria.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;

/**
 * The line-layout rule against a direct reading of its definition: the pre-pass finds a layout exactly
 * when every line but the last holds as many bases as the first with the same line end, the last no
 * more, and only empty lines follow; and then {@link LineLayout#offset}, {@code line} and {@code column}
 * put every base where the file has it.
 */
class LineLayoutProperties {
    private static FastaFiles.Scratch scratch;

    @BeforeContainer
    static void makeDir() {
        scratch = new FastaFiles.Scratch("stria-layout-");
    }

    @AfterContainer
    static void removeDir() {
        scratch.delete();
    }

    /** A line of a record: its bases and its line end ("" only for the last line of the file). */
    record Line(int bases, String eol) {
    }

    @Provide
    Arbitrary<List<Line>> records() {
        // few widths, so that lines often agree and layouts are common
        Arbitrary<Line> line = Combinators.combine(Arbitraries.integers().between(0, 4),
                Arbitraries.of("\n", "\r\n")).as(Line::new);
        Arbitrary<Line> regular = Combinators.combine(Arbitraries.just(4), Arbitraries.of("\n", "\r\n"))
                .as(Line::new);
        return Arbitraries.frequencyOf(
                        Tuple.of(1, line),
                        Tuple.of(3, regular))
                .list().ofMinSize(1).ofMaxSize(12)
                .flatMap(lines -> Arbitraries.of(true, false).map(finalEol -> {
                    List<Line> out = new ArrayList<>(lines);
                    if (!finalEol) {
                        Line last = out.remove(out.size() - 1);
                        out.add(new Line(last.bases(), ""));
                    }
                    return out;
                }));
    }

    @Property(tries = 1000)
    void prePassFindsTheLayoutOfItsDefinition(@ForAll("records") List<Line> lines, @ForAll long seed) {
        Random rnd = new Random(seed);
        StringBuilder seq = new StringBuilder();
        List<Integer> basePlaces = new ArrayList<>();
        List<Integer> baseLines = new ArrayList<>();
        for (int k = 0; k < lines.size(); k++) {
            for (int b = 0; b < lines.get(k).bases(); b++) {
                basePlaces.add(seq.length());
                baseLines.add(k);
                seq.append("ACGTN".charAt(rnd.nextInt(5)));
            }
            seq.append(lines.get(k).eol());
        }
        // a record before, so that the record's lines do not start at offset 0; last, so it may end without a line end
        Path p = FastaFiles.write(scratch.file("layout", ".fa"), FastaFiles.bytes(">q\nACG\nT\n>r\n" + seq));
        LineLayout got;
        try (InputCursor in = new InputCursor(p, Compression.PLAIN, null, p.toString())) {
            got = FastaPrePass.scan(in, p.toString()).layout(1);
        }
        assertThat(got).isEqualTo(byDefinition(lines));
        if (got.exists()) {
            for (int b = 0; b < basePlaces.size(); b++) {
                assertThat(got.offset(b)).as("offset of base %d", b).isEqualTo((long) basePlaces.get(b));
                assertThat(got.line(b)).isEqualTo((long) baseLines.get(b));
                assertThat(got.column(b)).isEqualTo(b % got.basesPerLine());
            }
            assertThat(got.oneLine(basePlaces.size())).isEqualTo(baseLines.get(basePlaces.size() - 1) == 0);
        }
    }

    /** The definition read literally: no shortcuts shared with the code under test. */
    private static LineLayout byDefinition(List<Line> lines) {
        int k = lines.size();
        while (k > 0 && lines.get(k - 1).bases() == 0) {
            k--;
        }
        if (k == 0) {
            return LineLayout.NONE;
        }
        int width = lines.get(0).bases();
        String eol = lines.get(0).eol();
        for (int i = 0; i < k; i++) {
            Line l = lines.get(i);
            boolean ok = i < k - 1 ? l.bases() == width && l.eol().equals(eol) : l.bases() >= 1 && l.bases() <= width;
            if (!ok) {
                return LineLayout.NONE;
            }
        }
        // a lone last line without a line end counts as ending in LF: it has no line end to disagree with
        return new LineLayout(width, eol.equals("\r\n") ? 2 : 1);
    }

    @Example
    void indexEntriesBecomeLayoutsOnlyWhenPossible() {
        assertThat(LineLayout.fromIndex(60, 61)).isEqualTo(new LineLayout(60, 1));
        assertThat(LineLayout.fromIndex(60, 62)).isEqualTo(new LineLayout(60, 2));
        assertThat(LineLayout.fromIndex(60, 60)).isNull();
        assertThat(LineLayout.fromIndex(60, 63)).isNull();
        assertThat(LineLayout.fromIndex(0, 1)).isNull();
        assertThat(LineLayout.fromIndex(-5, -4)).isNull();
        assertThat(LineLayout.fromIndex(Integer.MAX_VALUE, Integer.MAX_VALUE + 1L)).isNull();
        assertThatThrownBy(() -> new LineLayout(0, 1)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> new LineLayout(5, 3)).isInstanceOf(IllegalArgumentException.class);
    }

    /** A chromosome-sized layout: offsets past 2^31 bytes do not overflow. */
    @Example
    void offsetsOfLongRecords() {
        LineLayout l = new LineLayout(60, 2);
        // 35,000,000 full lines of 62 bytes, then 7 bases of the next
        assertThat(l.offset(2_100_000_007L)).isEqualTo(2_170_000_007L);
        assertThat(l.line(2_100_000_007L)).isEqualTo(35_000_000L);
        assertThat(l.column(2_100_000_007L)).isEqualTo(7);
        assertThat(l.lineEndByte(0)).isEqualTo('\r');
        assertThat(l.lineEndByte(1)).isEqualTo('\n');
        assertThat(new LineLayout(60, 1).lineEndByte(0)).isEqualTo('\n');
    }
}
