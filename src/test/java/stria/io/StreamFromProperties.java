package stria.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static stria.io.FastaFiles.text;
import static org.assertj.core.api.Assertions.fail;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.stream.Collectors;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Assume;
import net.jqwik.api.Combinators;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tag;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;

import stria.StriaException;
import stria.io.FastaFiles.Form;

/**
 * A stream started in the middle of a contig ({@link GenomeReader#stream(ContigInfo, int)}) gives exactly
 * the bases from there on, in every storage form and whatever the lines look like; damage after the start
 * fails it with the message loading the whole contig gives; a .fai whose line layout is not the file's
 * is refused, and never makes it deliver a base from the wrong place; and in a plain file, or BGZF with a
 * .gzi, the bytes before the start are not read.
 */
class StreamFromProperties {
    private static FastaFiles.Scratch scratch;

    @BeforeContainer
    static void makeDir() {
        scratch = new FastaFiles.Scratch("stria-from-");
    }

    @AfterContainer
    static void removeDir() {
        scratch.delete();
    }


    private static String stalePrefix(Path p) {
        return p + ".fai does not match " + p + " (";
    }

    // ---- starting anywhere ----

    /**
     * Every contig, from starts at and next to line starts, the last base, the end and anywhere, read in
     * pieces of any size with other contigs read in between: the bases loading the whole contig gives,
     * from the start on. Ragged records (lines of other lengths, empty lines, a CR among the bases, mixed
     * line ends) have no layout and are read from their start. With a .fai that describes them wrongly
     * (samtools would not index them), loading may be refused with the stale-index message, and then a
     * stream started in the middle may be refused too, but never gives a base that is not the file's.
     */
    @Property(tries = 300)
    void startingAnywhereGivesTheRest(@ForAll("genomes") Genome g, @ForAll Form form, @ForAll long seed) {
        Map<String, String> want = g.expected();
        Path p = scratch.store(g.text(), form);
        boolean mayRefuse = form.fai() && !g.uniform();
        try {
            FastaFiles.withReader(p, form, r -> {
                Random rnd = new Random(seed);
                List<ContigInfo> order = new ArrayList<>(r.contigs());
                Collections.shuffle(order, rnd);
                for (ContigInfo c : order) {
                    boolean loads;
                    try {
                        assertThat(text(r.sequence(c), 0, c.length())).isEqualTo(want.get(c.name()));
                        loads = true;
                    } catch (StriaException e) {
                        assertThat(mayRefuse).as(e.getMessage()).isTrue();
                        assertThat(e.getMessage()).startsWith(stalePrefix(p) + "record " + c.name());
                        loads = false;
                    }
                    for (int t = 0; t < 4; t++) {
                        int from = start(rnd, g.lineStarts(c.name()), c.length());
                        try {
                            readFrom(r, c, from, want, g.widest(), rnd, !mayRefuse);
                        } catch (StriaException e) {
                            assertThat(loads).as(e.getMessage()).isFalse();
                            assertThat(e.getMessage()).startsWith(stalePrefix(p) + "record " + c.name());
                        }
                    }
                }
                return null;
            });
        } catch (StriaException e) {
            assertThat(mayRefuse).as(e.getMessage()).isTrue();
            assertThat(e.getMessage()).startsWith(stalePrefix(p));
        }
    }

    /** A start: often at a line start or one base beside it, sometimes the first or last base or the end. */
    private static int start(Random rnd, List<Integer> lineStarts, int length) {
        return switch (rnd.nextInt(6)) {
            case 0 -> rnd.nextInt(length + 1);
            case 1 -> rnd.nextBoolean() ? length - 1 : length;
            default -> Math.max(0, Math.min(length, lineStarts.get(rnd.nextInt(lineStarts.size())) + rnd.nextInt(3) - 1));
        };
    }

    /**
     * Reads contig {@code c} from {@code from} to its end and compares with the genome; reads others in
     * between if asked. A contig whose length is not the genome's (a .fai can claim anything) must be
     * refused before its end.
     */
    private static void readFrom(GenomeReader r, ContigInfo c, int from, Map<String, String> want, int lineWidth,
                                 Random rnd, boolean interleave) {
        String real = want.get(c.name());
        BaseStream in = r.stream(c, from);
        byte[] buf = new byte[c.length() - from + 2];
        int done = 0;
        while (from + done < c.length()) {
            int n = FastaFiles.piece(rnd, lineWidth, c.length() - from - done);
            in.read(buf, 1 + done, n);
            int at = from + done;
            assertThat(at + n).as("bases past the end of " + c.name()).isLessThanOrEqualTo(real.length());
            assertThat(text(buf, 1 + done, n)).as(c.name() + " from " + from + " at " + at)
                    .isEqualTo(real.substring(at, at + n));
            done += n;
            if (interleave && rnd.nextInt(4) == 0) {
                ContigInfo other = r.contigs().get(rnd.nextInt(r.contigs().size()));
                int o = rnd.nextInt(other.length());
                byte[] one = new byte[1];
                r.stream(other, o).read(one, 0, 1);
                assertThat((char) one[0]).isEqualTo(want.get(other.name()).charAt(o));
            }
        }
        if (from < c.length()) {
            assertThat(c.length()).as("length of " + c.name()).isEqualTo(real.length());
        }
        assertThat(buf[0]).isZero();
        assertThat(buf[buf.length - 1]).isZero();
        assertThatThrownBy(() -> in.read(buf, 0, 1)).isInstanceOf(IllegalArgumentException.class);
    }

    @Example
    void aStartOutsideTheContigIsRefused() {
        Path p = scratch.store(FastaFiles.bytes(">a\nACGT\nAC\n"), Form.PLAIN);
        FastaFiles.withReader(p, Form.PLAIN, r -> {
            ContigInfo a = r.contigs().get(0);
            assertThatThrownBy(() -> r.stream(a, -1)).isInstanceOf(IllegalArgumentException.class);
            assertThatThrownBy(() -> r.stream(a, 7)).isInstanceOf(IllegalArgumentException.class);
            assertThatThrownBy(() -> r.stream(a, 6).read(new byte[1], 0, 1)).isInstanceOf(IllegalArgumentException.class);
            return null;
        });
    }

    // ---- damage after the start ----

    /** Bytes that are not letters; a '>' opening a line ends the record early. */
    private static final byte[] BAD = {'X', 'U', '*', '-', ' ', '\t', (byte) 0xE9, 0, '>'};

    /**
     * A bad letter at or after the start, or a '>' opening a line there (the record is shorter than the
     * .fai says), in a file whose .fai was made before the damage: reading from the start fails with the
     * message loading the whole contig gives, at the piece that reaches the problem, or already when the
     * stream is made if the problem lies in the line read to check the index's layout; every piece before
     * gives the right bases.
     */
    @Property(tries = 300)
    void damageAfterTheStartFailsAsLoadingDoes(@ForAll("uniformGenomes") Genome g,
                                               @ForAll("indexedForms") Form form, @ForAll long seed) {
        Random rnd = new Random(seed);
        int target = g.anyRecordWithBases(rnd);
        Laid rec = g.recs().get(target);
        String real = rec.bases();
        int width = rec.lines().get(0).replace("\r", "").replace("\n", "").length();
        byte pick = BAD[rnd.nextInt(BAD.length)];
        // a '>' on the last base would break the line layout the .fai promises and be refused at open
        byte bad = pick == '>' && real.length() == 1 ? (byte) 'X' : pick;
        int problem = rnd.nextInt(bad == '>' ? real.length() - 1 : real.length());
        byte[] text = g.text();
        text[(int) g.offsetOf(target, problem)] = bad;
        Path p = scratch.store(text, form);
        // the index describes the file as it was before the damage
        FastaFiles.faidxLikeSamtools(p, g.text());
        int from = switch (rnd.nextInt(4)) {
            case 0 -> problem;
            case 1 -> problem - problem % width;
            default -> rnd.nextInt(problem + 1);
        };
        FastaFiles.withReader(p, form, r -> {
            ContigInfo c = r.contigs().stream().filter(x -> x.name().equals(rec.name())).findFirst().orElseThrow();
            String expected = messageOf(() -> r.sequence(c));
            assertThat(expected).contains(bad == '>' && problem % width == 0
                    ? "record " + rec.name() + " ends after " + problem + " of " + real.length() + " bases"
                    : "record " + rec.name() + ", line " + g.lineOf(g.offsetOf(target, problem)) + ": ");
            BaseStream in;
            try {
                in = r.stream(c, from);
            } catch (StriaException e) {
                assertThat(e.getMessage()).isEqualTo(expected);
                // only when the line read to check the layout holds the problem
                long line = from / width;
                long check = line == (real.length() - 1) / width ? line - 1 : line;
                assertThat(check >= 0 && problem <= (check + 1) * width).as(from + " " + problem).isTrue();
                return null;
            }
            byte[] buf = new byte[real.length()];
            int done = from;
            while (true) {
                int n = FastaFiles.piece(rnd, g.widest(), real.length() - done);
                int at = done;
                if (done + n > problem) {
                    assertThatThrownBy(() -> in.read(buf, at, n)).isInstanceOf(StriaException.class).hasMessage(expected);
                    assertThatThrownBy(() -> in.read(buf, at, n)).isInstanceOf(StriaException.class).hasMessage(expected);
                    break;
                }
                in.read(buf, at, n);
                assertThat(text(buf, at, n)).isEqualTo(real.substring(at, at + n));
                done += n;
            }
            return null;
        });
    }

    /**
     * A record made one base shorter or longer after the file was opened (the table says otherwise, from
     * the pre-pass or the .fai): started anywhere before its end, a stream fails at the piece that reaches
     * the end, with the message loading the whole contig gives. The records are larger than the cursor's
     * buffer, so the changed bytes are read from the file.
     */
    @Tag("slow")
    @Example
    void aRecordChangedAfterOpeningFailsAsLoadingDoes() throws IOException {
        Random rnd = new Random(13);
        List<FastaFiles.Rec> recs = FastaFiles.twoLongRecords(rnd, 1_300_017);
        String text = FastaFiles.format(recs, 60, "\n", true);
        String real = recs.get(0).seq();
        int n = real.length();
        int end = text.indexOf("\n>second");
        for (boolean longer : List.of(false, true)) {
            String changed = longer ? text.substring(0, end) + "A" + text.substring(end)
                    : text.substring(0, end - 1) + text.substring(end);
            String why = longer ? "record first has more than " + n + " bases"
                    : "record first ends after " + (n - 1) + " of " + n + " bases";
            for (Form form : List.of(Form.PLAIN, Form.PLAIN_FAI, Form.GZIP, Form.BGZF, Form.BGZF_FAI, Form.STDIN)) {
                Path p = scratch.store(FastaFiles.bytes(text), form);
                byte[] replacement = form == Form.STDIN ? FastaFiles.bytes(changed)
                        : Files.readAllBytes(scratch.store(FastaFiles.bytes(changed), form));
                FastaFiles.withReader(p, form, r -> {
                    try {
                        // in place: the open file sees the new bytes
                        Files.write(form == Form.STDIN ? r.path() : p, replacement);
                    } catch (IOException e) {
                        throw new UncheckedIOException(e);
                    }
                    ContigInfo c = r.contigs().get(0);
                    String expected = messageOf(() -> r.sequence(c));
                    assertThat(expected).as(form + " " + longer).contains(why);
                    for (int from : List.of(0, n / 2 + 7, n - n % 60, n - 2, n - 1)) {
                        BaseStream in = r.stream(c, from);
                        byte[] buf = new byte[n];
                        int done = from;
                        while (true) {
                            int k = FastaFiles.piece(rnd, 60, n - done);
                            int at = done;
                            if (done + k == n) {
                                assertThatThrownBy(() -> in.read(buf, at, k)).as(form + " " + longer + " from " + from)
                                        .isInstanceOf(StriaException.class).hasMessage(expected);
                                break;
                            }
                            in.read(buf, at, k);
                            done += k;
                        }
                        assertThat(text(buf, from, done - from)).isEqualTo(real.substring(from, done));
                    }
                    return null;
                });
            }
        }
    }

    private static String messageOf(Runnable r) {
        try {
            r.run();
        } catch (StriaException e) {
            return e.getMessage();
        }
        throw new AssertionError("no StriaException");
    }

    private static void rewriteFai(Path fasta, String name, java.util.function.Consumer<String[]> change) {
        Path fai = IndexFiles.faiOf(fasta);
        try {
            List<String> lines = new ArrayList<>();
            for (String line : Files.readAllLines(fai)) {
                String[] f = line.split("\t");
                if (f[0].equals(name)) {
                    change.accept(f);
                }
                lines.add(String.join("\t", f));
            }
            Files.write(fai, lines);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    // ---- a false layout in the index ----

    /**
     * A CR among the bases of a record's last line, in a file whose .fai counts it as a base (the lines
     * before keep the layout, and the last base is where the index puts it): a stream started on the last
     * line after the CR is refused rather than started one byte off.
     */
    @Example
    void aCrAmongTheBasesOfTheLastLineIsNotSteppedOver() {
        Random rnd = new Random(17);
        String seq = FastaFiles.letters(rnd, 150);
        String last = seq.substring(120);
        String text = ">a\n" + seq.substring(0, 60) + "\n" + seq.substring(60, 120) + "\n" + last.substring(0, 10) + "\r"
                + last.substring(10) + "\n>b\nACGT\n";
        for (Form form : List.of(Form.PLAIN_FAI, Form.BGZF_FAI)) {
            Path p = scratch.store(FastaFiles.bytes(text), form);
            FastaFiles.withReader(p, form, r -> {
                ContigInfo a = r.contigs().get(0);
                // the CR counted as a base
                assertThat(a.length()).isEqualTo(151);
                for (int from = 121; from < 151; from++) {
                    int start = from;
                    assertThatThrownBy(() -> r.stream(a, start).read(new byte[151 - start], 0, 151 - start))
                            .as("from " + from).isInstanceOf(StriaException.class)
                            .hasMessageStartingWith(stalePrefix(p) + "record a, line 4: line end after 10 of 60 bases");
                }
                return null;
            });
        }
    }

    /**
     * A .fai line with another line width or line-end width than the file has, and a length that puts the
     * last base exactly where the file has it, passes every check at open. Started anywhere, a stream
     * under it gives only right bases until it is refused with the stale-index message; it is always
     * refused before the end, and so is loading the whole contig.
     */
    @Property(tries = 300)
    void aFalseLayoutInTheIndexIsNeverReadAtTheWrongPlace(@ForAll("uniformGenomes") Genome g,
                                                          @ForAll("indexedForms") Form form, @ForAll long seed) {
        Random rnd = new Random(seed);
        int target = g.anyRecordWithBases(rnd);
        Laid rec = g.recs().get(target);
        String real = rec.bases();
        List<int[]> lies = falseLayouts(g, target);
        Assume.that(!lies.isEmpty());
        int[] lie = lies.get(rnd.nextInt(lies.size()));
        Path p = scratch.store(g.text(), form);
        FastaFiles.faidxLikeSamtools(p, g.text());
        rewriteFai(p, rec.name(), f -> {
            f[1] = "" + lie[2];
            f[3] = "" + lie[0];
            f[4] = "" + (lie[0] + lie[1]);
        });
        String refusal = stalePrefix(p) + "record " + rec.name();
        FastaFiles.withReader(p, form, r -> {
            ContigInfo c = r.contigs().stream().filter(x -> x.name().equals(rec.name())).findFirst().orElseThrow();
            assertThat(c.length()).isEqualTo(lie[2]);
            assertThat(messageOf(() -> r.sequence(c))).startsWith(refusal);
            for (int t = 0; t < 4; t++) {
                int from = rnd.nextInt(c.length());
                try {
                    BaseStream in = r.stream(c, from);
                    byte[] buf = new byte[c.length()];
                    int done = from;
                    while (done < c.length()) {
                        int n = FastaFiles.piece(rnd, g.widest(), c.length() - done);
                        in.read(buf, done, n);
                        assertThat(done + n).as("bases past the record's end").isLessThanOrEqualTo(real.length());
                        assertThat(text(buf, done, n)).as("from " + from + " at " + done)
                                .isEqualTo(real.substring(done, done + n));
                        done += n;
                    }
                    fail("read all of %s from %d under the false layout %s", rec.name(), from, Arrays.toString(lie));
                } catch (StriaException e) {
                    assertThat(e.getMessage()).startsWith(refusal);
                }
            }
            return null;
        });
    }

    /**
     * Claims of shorter lines whose line ends fall on some of the file's line ends: the claimed line 100
     * of 50 bases is the second half of the file's line 50 of 100, with the file's line end after it, so
     * reading that line alone looks right; only the byte before its start shows that no line starts
     * there. A stream started on any claimed line is refused or gives the file's bases.
     */
    @Tag("slow")
    @Example
    void aClaimedLineThatEndsWhereAFileLineEndsIsNotEnough() {
        Random rnd = new Random(19);
        String seq = FastaFiles.letters(rnd, 20_000);
        Genome g = new Genome(List.of(new Laid("a", "", wrap(seq, 100, "\n")), new Laid("b", "", List.of("ACGT\n"))),
                "\n", true, true);
        byte[] text = g.text();
        List<int[]> lies = falseLayouts(g, 0).stream().filter(l -> l[0] >= 40 && l[0] < 100).toList();
        assertThat(lies).anyMatch(l -> l[0] == 50 && l[1] == 1);
        for (int[] lie : lies) {
            Path p = scratch.store(text, Form.PLAIN_FAI);
            rewriteFai(p, "a", f -> {
                f[1] = "" + lie[2];
                f[3] = "" + lie[0];
                f[4] = "" + (lie[0] + lie[1]);
            });
            FastaFiles.withReader(p, Form.PLAIN_FAI, r -> {
                ContigInfo a = r.contigs().get(0);
                byte[] two = new byte[2];
                for (int from = lie[0]; from + 2 <= Math.min(a.length(), seq.length()); from += lie[0]) {
                    try {
                        r.stream(a, from + 1).read(two, 0, 1);
                        assertThat((char) two[0]).as(Arrays.toString(lie) + " from " + (from + 1))
                                .isEqualTo(seq.charAt(from + 1));
                    } catch (StriaException e) {
                        assertThat(e.getMessage()).startsWith(stalePrefix(p) + "record a");
                    }
                }
                return null;
            });
        }
    }

    /**
     * Line layouts (bases per line, line-end bytes, claimed length) other than the file's that put the last
     * base of record {@code i} where it is. For a record on one line, any width at least its length with
     * its own length is the same layout.
     */
    private static List<int[]> falseLayouts(Genome g, int i) {
        Laid rec = g.recs().get(i);
        int real = rec.bases().length();
        int width = rec.lines().get(0).replace("\r", "").replace("\n", "").length();
        int end = g.eol().length();
        long last = g.offsetOf(i, real - 1) - g.seqOffset(i);
        List<int[]> out = new ArrayList<>();
        for (int w = 1; w <= last + 1; w++) {
            for (int e = 1; e <= 2; e++) {
                long q = last / (w + e);
                long r = last % (w + e);
                long claimed = q * w + r + 1;
                boolean oneLine = claimed <= w && real <= width;
                if (r < w && !(w == width && e == end) && !(oneLine && claimed == real)) {
                    out.add(new int[] {w, e, (int) claimed});
                }
            }
        }
        return out;
    }

    // ---- what is read ----

    /**
     * Started near the end of a long record, a stream of a plain file, or of BGZF with a .gzi, reads a
     * few buffers, not the record before it: the bytes this thread reads from files (Linux's rchar) grow
     * by far less than the record. With a layout from the pre-pass, a record on one line is entered the
     * same way.
     */
    @Tag("slow")
    @Example
    void aStreamStartedLateReadsOnlyAroundItsStart() throws IOException {
        Path io = Path.of("/proc/thread-self/io");
        Assume.that(Files.isReadable(io));
        Random rnd = new Random(3);
        List<FastaFiles.Rec> recs = List.of(new FastaFiles.Rec("lines", "", FastaFiles.letters(rnd, 24_000_000)),
                new FastaFiles.Rec("after", "", FastaFiles.letters(rnd, 1000)));
        String oneLine = ">one\n" + FastaFiles.letters(rnd, 8_000_000) + "\n";
        byte[] text = FastaFiles.bytes(FastaFiles.format(recs, 60, "\n", true) + oneLine);
        Map<String, String> want = FastaFiles.expected(recs);
        want.put("one", oneLine.substring(5, oneLine.length() - 1));
        for (Form form : List.of(Form.PLAIN, Form.PLAIN_FAI, Form.BGZF_GZI, Form.BGZF_FAI_GZI)) {
            Path p = scratch.store(text, form);
            FastaFiles.withReader(p, form, r -> {
                for (ContigInfo c : r.contigs()) {
                    if (c.name().equals("after") || (c.name().equals("one") && form.fai())) {
                        // short, or a record the .fai puts on one line: read from its start
                        continue;
                    }
                    for (int from : List.of(c.length() - 5000, c.length() / 2 + 17)) {
                        long before = bytesRead(io);
                        byte[] buf = new byte[5000];
                        r.stream(c, from).read(buf, 0, buf.length);
                        long read = bytesRead(io) - before;
                        assertThat(text(buf, 0, buf.length)).isEqualTo(want.get(c.name()).substring(from, from + 5000));
                        assertThat(read).as(form + " " + c.name() + " from " + from).isLessThan(3L << 20);
                    }
                }
                return null;
            });
        }
    }

    private static long bytesRead(Path io) {
        try {
            for (String line : Files.readAllLines(io)) {
                if (line.startsWith("rchar:")) {
                    return Long.parseLong(line.substring(6).strip());
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        throw new AssertionError("no rchar in " + io);
    }

    // ---- layouts seen by the pre-pass ----

    /** Each record's layout as the pre-pass notes it: bases per line and line-end bytes, or none. */
    @Example
    void thePrePassNotesALayoutOnlyWhereOneHolds() throws IOException {
        String[][] cases = {
                {">a\nACGT\nACGT\nAC\n", "4 1"},
                {">b\r\nACGT\r\nACGT\r\nAC\r\n", "4 2"},
                {">c x\r\nACGT\nAC\n", "4 1"},
                {">d\nA\nC\nG\n", "1 1"},
                {">e\nACGT\nAC\n\n\n", "4 1"},
                {">f\nACGT\r\nACGT\n", "4 2"},
                {">g\nACGT\nACGT\r\n", "4 1"},
                {">h\nACGTACGT", "8 1"},
                {">i\nACGT\nAC", "4 1"},
                {">j\nACGT\nACG\nAC\n", "none"},
                {">k\nACGT\nACGTA\n", "none"},
                {">l\nAC\nACGT\n", "none"},
                {">m\n\nACGT\nAC\n", "none"},
                {">n\nACGT\n\nACGT\n", "none"},
                {">o\nAC\rGT\nACGT\n", "none"},
                {">p\nACGT\r\r\nACGT\n", "none"},
                {">q\nACGT\nACGT\r\nAC\n", "none"},
                {">r\nACGT\nACGTAC", "none"},
                {">s\nACGT\nAC\rGT", "none"},
                {">t\nACGT\r\nAC\nGT\n", "none"},
                {">u\n", "none"},
                {">v\nACGT\nACGT\rACG\n", "none"},
                {">w\r\nACGT\r\nACGT\n\nAC\r\n", "none"},
        };
        for (String[] c : cases) {
            Path p = FastaFiles.write(scratch.file("layout", ".fa"), FastaFiles.bytes(c[0]));
            try (InputCursor in = new InputCursor(p, Compression.PLAIN, null, p.toString())) {
                RecordTable t = FastaPrePass.scan(in, p.toString());
                LineLayout l = t.layout(0);
                String got = l.exists() ? l.basesPerLine() + " " + l.lineEnd() : "none";
                assertThat(got).as(c[0].replace("\r", "\\r").replace("\n", "\\n")).isEqualTo(c[1]);
            }
        }
    }

    /**
     * Records larger than the cursor's buffer, with the buffer's end falling at every place of a line
     * (between CR and LF too), and the line there kept, shorter or longer: the pre-pass notes a layout
     * exactly when the record keeps one, and streams started around the buffer's end give the right bases.
     */
    @Tag("slow")
    @Example
    void layoutsAcrossTheEndOfABuffer() {
        int buffer = 1 << 20;
        Random rnd = new Random(11);
        String seq = FastaFiles.letters(rnd, 1_200_000);
        for (String eol : List.of("\n", "\r\n")) {
            for (int there : List.of(7, 5, 9)) {
                for (int shift = 0; shift < 7 + eol.length(); shift++) {
                    // a longer header each time moves the buffer's end to another place of the line
                    StringBuilder sb = new StringBuilder(">r" + "x".repeat(shift) + eol);
                    for (int i = 0; i < seq.length(); ) {
                        boolean crossing = sb.length() <= buffer && buffer < sb.length() + 7 + eol.length();
                        int e = Math.min(seq.length(), i + (crossing ? there : 7));
                        sb.append(seq, i, e).append(eol);
                        i = e;
                    }
                    Path p = FastaFiles.write(scratch.file("edge", ".fa"), FastaFiles.bytes(sb.toString()));
                    try (InputCursor in = new InputCursor(p, Compression.PLAIN, null, p.toString())) {
                        RecordTable t = FastaPrePass.scan(in, p.toString());
                        assertThat(t.layout(0).basesPerLine()).as(eol.length() + " " + there + " " + shift)
                                .isEqualTo(there == 7 ? 7 : 0);
                    }
                    int near = buffer / (7 + eol.length()) * 7;
                    FastaFiles.withReader(p, Form.PLAIN, r -> {
                        ContigInfo c = r.contigs().get(0);
                        for (int from = near - 20; from < near + 20; from += 3) {
                            byte[] buf = new byte[30];
                            r.stream(c, from).read(buf, 0, buf.length);
                            assertThat(text(buf, 0, buf.length)).isEqualTo(seq.substring(from, from + 30));
                        }
                        return null;
                    });
                }
            }
        }
    }

    // ---- generated genomes ----

    /** A record as written: name, description and its sequence lines, each with its line end. */
    record Laid(String name, String description, List<String> lines) {
        String bases() {
            return String.join("", lines).replace("\r", "").replace("\n", "");
        }
    }

    /**
     * A genome as written, with one line end for headers; {@code uniform} when every record was written
     * with one line width (the last line may be shorter), otherwise records may be ragged.
     */
    record Genome(List<Laid> recs, String eol, boolean finalEol, boolean uniform) {

        /** The index of a record with sequence, chosen at random. */
        int anyRecordWithBases(Random rnd) {
            List<Integer> eligible = new ArrayList<>();
            for (int i = 0; i < recs.size(); i++) {
                if (!recs.get(i).lines().isEmpty()) {
                    eligible.add(i);
                }
            }
            return eligible.get(rnd.nextInt(eligible.size()));
        }

        byte[] text() {
            StringBuilder sb = new StringBuilder();
            for (Laid r : recs) {
                sb.append('>').append(r.name());
                if (!r.description().isEmpty()) {
                    sb.append(' ').append(r.description());
                }
                sb.append(eol);
                r.lines().forEach(sb::append);
            }
            if (!finalEol && sb.toString().endsWith(eol)) {
                sb.setLength(sb.length() - eol.length());
            }
            return FastaFiles.bytes(sb.toString());
        }

        Map<String, String> expected() {
            Map<String, String> m = new LinkedHashMap<>();
            for (Laid r : recs) {
                if (!r.bases().isEmpty()) {
                    m.put(r.name(), r.bases());
                }
            }
            return m;
        }

        /** Longest line, for choosing piece sizes around it. */
        int widest() {
            return recs.stream().flatMap(r -> r.lines().stream()).mapToInt(String::length).max().orElse(1);
        }

        long seqOffset(int i) {
            long off = 0;
            for (int k = 0; k <= i; k++) {
                Laid r = recs.get(k);
                off += 1 + r.name().length() + (r.description().isEmpty() ? 0 : 1 + r.description().length())
                        + eol.length();
                if (k < i) {
                    off += r.lines().stream().mapToInt(String::length).sum();
                }
            }
            return off;
        }

        /** Offset of base {@code j} of record {@code i}. */
        long offsetOf(int i, int j) {
            long off = seqOffset(i);
            int seen = 0;
            for (String line : recs.get(i).lines()) {
                for (int k = 0; k < line.length(); k++) {
                    char ch = line.charAt(k);
                    if (ch != '\r' && ch != '\n' && seen++ == j) {
                        return off + k;
                    }
                }
                off += line.length();
            }
            throw new IllegalArgumentException("no base " + j);
        }

        /** 1-based line number of an offset. */
        long lineOf(long offset) {
            byte[] t = text();
            long line = 1;
            for (int k = 0; k < offset; k++) {
                if (t[k] == '\n') {
                    line++;
                }
            }
            return line;
        }

        /** The bases at which the lines of the named record start. */
        List<Integer> lineStarts(String name) {
            Laid r = recs.stream().filter(x -> x.name().equals(name)).findFirst().orElseThrow();
            List<Integer> out = new ArrayList<>();
            int seen = 0;
            for (String line : r.lines()) {
                out.add(seen);
                seen += line.replace("\r", "").replace("\n", "").length();
            }
            return out;
        }

        @Override
        public String toString() {
            return "Genome[" + (uniform ? "uniform" : "ragged") + ", final eol " + finalEol + ", "
                    + recs.stream().map(r -> r.name() + ":" + r.lines().stream().map(Genome::describe)
                            .collect(Collectors.joining("|"))).collect(Collectors.joining(" ")) + "]";
        }

        /** A line as counts of letters and its CRs and LFs: {@code 42CR18LF}. */
        private static String describe(String line) {
            StringBuilder sb = new StringBuilder();
            int letters = 0;
            for (char ch : line.toCharArray()) {
                if (ch == '\r' || ch == '\n') {
                    sb.append(letters > 0 ? letters + "" : "").append(ch == '\r' ? "CR" : "LF");
                    letters = 0;
                } else {
                    letters++;
                }
            }
            return sb.append(letters > 0 ? letters + "" : "").toString();
        }
    }

    @Provide
    Arbitrary<Genome> genomes() {
        return Arbitraries.oneOf(uniformGenomes(), raggedGenomes());
    }

    @Provide
    Arbitrary<Genome> uniformGenomes() {
        return genomes(false);
    }

    private Arbitrary<Genome> raggedGenomes() {
        return genomes(true);
    }

    private static Arbitrary<Genome> genomes(boolean ragged) {
        return Combinators.combine(Arbitraries.longs(), Arbitraries.integers().between(1, 5),
                        Arbitraries.of(0, 1, 2, 3, 5, 60, 61, 80), Arbitraries.of("\n", "\r\n"), Arbitraries.of(true, false))
                .as((seed, n, width, eol, finalEol) -> {
                    Random rnd = new Random(seed);
                    List<Laid> recs = new ArrayList<>();
                    for (int i = 0; i < n; i++) {
                        int len = rnd.nextInt(8) == 0 ? 0 : 1 + rnd.nextInt(rnd.nextBoolean() ? 20 : 900);
                        String s = FastaFiles.letters(rnd, len);
                        if (rnd.nextBoolean()) {
                            s = s.toLowerCase(Locale.ROOT);
                        }
                        List<String> lines = wrap(s, width == 0 ? Math.max(1, len) : width, eol);
                        if (ragged && !lines.isEmpty() && rnd.nextInt(3) > 0) {
                            lines = roughen(lines, eol, rnd);
                        }
                        recs.add(new Laid("r" + i + (rnd.nextBoolean() ? "_x" : ""),
                                rnd.nextBoolean() ? "desc " + rnd.nextInt(1000) : "", lines));
                    }
                    if (recs.stream().allMatch(r -> r.bases().isEmpty())) {
                        recs.set(0, new Laid("r0", "", List.of("ACGT" + eol, "TGCA" + eol)));
                    }
                    return new Genome(recs, eol, finalEol, !ragged);
                });
    }

    private static List<String> wrap(String s, int width, String eol) {
        List<String> lines = new ArrayList<>();
        for (int i = 0; i < s.length(); i += width) {
            lines.add(s.substring(i, Math.min(s.length(), i + width)) + eol);
        }
        return lines;
    }

    /** One way of breaking a record's layout, chosen at random; the record keeps its bases. */
    private static List<String> roughen(List<String> lines, String eol, Random rnd) {
        List<String> out = new ArrayList<>(lines);
        String other = eol.equals("\n") ? "\r\n" : "\n";
        // the last line often: it alone may be shorter, so a stream started there reads it only in part
        int k = rnd.nextBoolean() ? out.size() - 1 : rnd.nextInt(out.size());
        String bases = out.get(k).replace("\r", "").replace("\n", "");
        switch (rnd.nextInt(6)) {
            case 0 -> {
                // lines of any length
                String all = String.join("", out).replace("\r", "").replace("\n", "");
                out.clear();
                for (int i = 0; i < all.length(); ) {
                    int e = Math.min(all.length(), i + 1 + rnd.nextInt(2 * bases.length() + 1));
                    out.add(all.substring(i, e) + eol);
                    i = e;
                }
            }
            case 1 -> out.add(rnd.nextInt(out.size() + 1), eol);
            case 2 -> {
                int at = rnd.nextInt(bases.length() + 1);
                out.set(k, bases.substring(0, at) + "\r" + bases.substring(at) + eol);
            }
            case 3 -> out.set(k, bases + other);
            case 4 -> {
                if (out.size() > 1) {
                    String last = out.remove(out.size() - 1);
                    int j = out.size() - 1;
                    out.set(j, out.get(j).replace("\r", "").replace("\n", "") + last);
                }
            }
            default -> {
                int at = rnd.nextInt(bases.length() + 1);
                out.set(k, bases.substring(0, at) + eol);
                out.add(k + 1, bases.substring(at) + eol);
            }
        }
        return out;
    }

    @Provide
    Arbitrary<Form> indexedForms() {
        return Arbitraries.of(Arrays.stream(Form.values()).filter(Form::fai).toList());
    }
}
