package stria.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static stria.io.FastaFiles.text;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
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
 * A contig read through {@link GenomeReader#stream} in pieces of any size is exactly what
 * {@link GenomeReader#sequence} returns, in every storage form, whatever else is read in between; and
 * damage is reported through a stream with the message {@code sequence} gives, by the first piece that
 * reaches it and no earlier one.
 */
class BaseStreamProperties {
    private static FastaFiles.Scratch scratch;

    @BeforeContainer
    static void makeDir() {
        scratch = new FastaFiles.Scratch("stria-stream-");
    }

    @AfterContainer
    static void removeDir() {
        scratch.delete();
    }


    /**
     * Each contig, in random order, read in random pieces, with whole sequences of random contigs loaded
     * between the pieces.
     */
    @Property(tries = 150)
    void piecesGiveTheWholeSequence(@ForAll("genomes") Genome g, @ForAll Form form, @ForAll long seed) {
        Map<String, String> want = FastaFiles.expected(g.recs());
        Path p = scratch.store(g.text(), form);
        FastaFiles.withReader(p, form, r -> {
            Random rnd = new Random(seed);
            List<ContigInfo> order = new ArrayList<>(r.contigs());
            java.util.Collections.shuffle(order, rnd);
            for (ContigInfo c : order) {
                String whole = new String(r.sequence(c), StandardCharsets.ISO_8859_1);
                assertThat(whole).as(c.name()).isEqualTo(want.get(c.name()));
                BaseStream in = r.stream(c);
                byte[] got = new byte[c.length() + 2];
                int done = 0;
                while (done < c.length()) {
                    int n = FastaFiles.piece(rnd, g.lineWidth(), c.length() - done);
                    in.read(got, 1 + done, n);
                    done += n;
                    if (rnd.nextInt(4) == 0) {
                        ContigInfo other = r.contigs().get(rnd.nextInt(r.contigs().size()));
                        assertThat(new String(r.sequence(other), StandardCharsets.ISO_8859_1))
                                .isEqualTo(want.get(other.name()));
                    }
                }
                assertThat(got[0]).isZero();
                assertThat(got[got.length - 1]).isZero();
                assertThat(text(got, 1, c.length())).as(c.name()).isEqualTo(whole);
            }
            return null;
        });
    }

    /** Two streams (two contigs, or the same one twice) read in turns, each piece checked as it comes. */
    @Property(tries = 150)
    void interleavedStreamsKeepTheirPlaces(@ForAll("genomes") Genome g, @ForAll Form form, @ForAll long seed) {
        Map<String, String> want = FastaFiles.expected(g.recs());
        Path p = scratch.store(g.text(), form);
        FastaFiles.withReader(p, form, r -> {
            Random rnd = new Random(seed);
            interleave(r, r.contigs().get(rnd.nextInt(r.contigs().size())),
                    r.contigs().get(rnd.nextInt(r.contigs().size())), want, g.lineWidth(), rnd);
            return null;
        });
    }

    /**
     * The same with contigs larger than the cursor's buffer and many BGZF blocks, so that every switch
     * between the streams moves the cursor for real: a seek, or decompressing again from the start.
     */
    @Tag("slow")
    @Example
    void interleavedStreamsOverLargeContigs() {
        Random rnd = new Random(5);
        List<FastaFiles.Rec> recs = List.of(new FastaFiles.Rec("big1", "", FastaFiles.letters(rnd, 2_500_000)),
                new FastaFiles.Rec("small", "", FastaFiles.letters(rnd, 3000)),
                new FastaFiles.Rec("big2", "x", FastaFiles.letters(rnd, 2_200_000)));
        Map<String, String> want = FastaFiles.expected(recs);
        byte[] text = FastaFiles.bytes(FastaFiles.format(recs, 60, "\n", true));
        for (Form form : Form.values()) {
            FastaFiles.withReader(scratch.store(text, form), form, r -> {
                interleave(r, r.contigs().get(0), r.contigs().get(2), want, 400_000, rnd);
                return null;
            });
        }
    }

    private static void interleave(GenomeReader r, ContigInfo a, ContigInfo b, Map<String, String> want,
                                   int lineWidth, Random rnd) {
        ContigInfo[] contig = {a, b};
        BaseStream[] in = {r.stream(a), r.stream(b)};
        int[] done = new int[2];
        byte[] buf = new byte[Math.max(a.length(), b.length())];
        while (done[0] < a.length() || done[1] < b.length()) {
            int s = done[0] == a.length() ? 1 : done[1] == b.length() ? 0 : rnd.nextInt(2);
            int n = FastaFiles.piece(rnd, lineWidth, contig[s].length() - done[s]);
            in[s].read(buf, 0, n);
            assertThat(text(buf, 0, n)).as(contig[s].name() + " at " + done[s])
                    .isEqualTo(want.get(contig[s].name()).substring(done[s], done[s] + n));
            done[s] += n;
            if (rnd.nextInt(8) == 0) {
                ContigInfo other = r.contigs().get(rnd.nextInt(r.contigs().size()));
                assertThat(new String(r.sequence(other), StandardCharsets.ISO_8859_1)).isEqualTo(want.get(other.name()));
            }
        }
    }

    /**
     * A bad letter, or a .fai that makes a record shorter or longer than it is, passes the checks at
     * open (only the pre-pass would see the letter, and the index's line layout still lands on the real
     * last base). Read through a stream, every piece before the problem gives the right bases, the
     * piece that reaches it fails with the message {@code sequence} gives, and so does the same call again.
     * A false length comes with a false line layout, so the problem is the first line end the two
     * layouts disagree on (see {@link Claim#failure}), unless the claimed record ends before it.
     */
    @Property(tries = 200)
    void damageFailsAtThePieceThatReachesIt(@ForAll("genomes") Genome g, @ForAll("damages") Damage d,
                                            @ForAll("indexedForms") Form form, @ForAll long seed) {
        List<Integer> eligible = new ArrayList<>();
        for (int i = 0; i < g.recs().size(); i++) {
            if (d.applies(g, i)) {
                eligible.add(i);
            }
        }
        Assume.that(!eligible.isEmpty());
        int target = eligible.get(d.record() % eligible.size());
        FastaFiles.Rec rec = g.recs().get(target);
        String real = rec.seq();
        byte[] text = g.text();
        // a '>' on the last base would break the line layout the .fai promises and be refused at open
        int at = d.base() % (d.bad() == '>' && real.length() > 1 ? real.length() - 1 : real.length());
        if (d.kind() == Kind.BAD_LETTER) {
            text[(int) g.baseOffset(target, at)] = (byte) d.bad();
        }
        Path p = scratch.store(text, form);
        // the index describes the file as it was before the damage
        FastaFiles.faidxLikeSamtools(p, g.text());
        String display = p.toString();
        int claimed;
        String expected;
        // the first base the reader cannot deliver; for a record longer than claimed, the last one it can
        int problem;
        if (d.kind() == Kind.BAD_LETTER) {
            claimed = real.length();
            problem = at;
            // a '>' opening a line starts a record of its own: the one read ends before it
            expected = d.bad() == '>' && g.atLineStart(target, at)
                    ? stale(display, "record " + rec.name() + " ends after " + at + " of " + claimed + " bases")
                    : display + ": record " + rec.name() + ", line " + g.lineOf(g.baseOffset(target, at)) + ": "
                            + d.described() + " is not a nucleotide letter (IUPAC codes ACGTNRYSWKMBDHV only)";
        } else {
            Claim claim = d.claimIndex(g, target, p);
            claimed = claim.length();
            Map.Entry<Integer, String> failure = claim.failure(g, target);
            problem = failure.getKey();
            expected = stale(display, failure.getValue());
        }
        Map<String, String> want = FastaFiles.expected(g.recs());
        FastaFiles.withReader(p, form, r -> {
            Random rnd = new Random(seed);
            ContigInfo c = r.contigs().stream().filter(x -> x.name().equals(rec.name())).findFirst().orElseThrow();
            assertThat(c.length()).isEqualTo(claimed);
            BaseStream in = r.stream(c);
            byte[] buf = new byte[claimed];
            int done = 0;
            while (true) {
                int n = FastaFiles.piece(rnd, g.lineWidth(), claimed - done);
                int from = done;
                if (done + n > problem) {
                    // a failed call leaves the place unchanged, so the same call fails again
                    assertThatThrownBy(() -> in.read(buf, from, n)).isInstanceOf(StriaException.class).hasMessage(expected);
                    assertThatThrownBy(() -> in.read(buf, from, n)).isInstanceOf(StriaException.class).hasMessage(expected);
                    break;
                }
                in.read(buf, from, n);
                assertThat(text(buf, from, n)).isEqualTo(real.substring(from, from + n));
                done += n;
            }
            assertThatThrownBy(() -> r.sequence(c)).isInstanceOf(StriaException.class).hasMessage(expected);
            for (ContigInfo other : r.contigs()) {
                if (other != c) {
                    byte[] all = new byte[other.length()];
                    r.stream(other).read(all, 0, all.length);
                    assertThat(text(all, 0, all.length)).isEqualTo(want.get(other.name()));
                }
            }
            return null;
        });
    }

    /**
     * Without an index a bad letter is caught by the pre-pass, unless the file changes after opening; the
     * line is then counted from the header's line and the line ends passed, across pieces, also in a
     * stream started in the middle of the record (at the bad letter, on its line, lines before it). A
     * stream started after the bad letter does not see it. The file is larger than the cursor's buffer,
     * so reading the first record goes back to the file.
     */
    @Tag("slow")
    @Example
    void aLetterDamagedAfterOpeningIsReportedWithItsLine() throws IOException {
        Random rnd = new Random(9);
        List<FastaFiles.Rec> recs = FastaFiles.twoLongRecords(rnd, 1_300_000);
        Genome g = new Genome(recs, 60, "\n", true);
        String real = recs.get(0).seq();
        for (Form form : List.of(Form.PLAIN, Form.GZIP, Form.BGZF)) {
            for (int at : List.of(0, 59, 60, 777_777, 1_299_999)) {
                Path p = scratch.store(g.text(), form);
                byte[] damaged = g.text();
                damaged[(int) g.baseOffset(0, at)] = 'J';
                String expected = p + ": record first, line " + g.lineOf(g.baseOffset(0, at))
                        + ": 'J' is not a nucleotide letter (IUPAC codes ACGTNRYSWKMBDHV only)";
                try (GenomeReader r = GenomeReader.open(p.toString(), w -> { })) {
                    // in place, as an editor or a copy would do it: the open file sees the new bytes
                    Files.write(p, Files.readAllBytes(scratch.store(damaged, form)));
                    ContigInfo c = r.contigs().get(0);
                    for (int start : List.of(0, at, at - at % 60, Math.max(0, at - 61), at / 2)) {
                        BaseStream in = r.stream(c, start);
                        byte[] buf = new byte[c.length()];
                        int done = start;
                        while (true) {
                            int n = FastaFiles.piece(rnd, 60_000, c.length() - done);
                            int from = done;
                            if (done + n > at) {
                                assertThatThrownBy(() -> in.read(buf, from, n)).as(form + " " + at + " from " + start)
                                        .isInstanceOf(StriaException.class).hasMessage(expected);
                                break;
                            }
                            in.read(buf, from, n);
                            done += n;
                        }
                        assertThat(text(buf, start, done - start)).isEqualTo(real.substring(start, done));
                    }
                    if (at + 1 < c.length()) {
                        byte[] rest = new byte[c.length() - at - 1];
                        r.stream(c, at + 1).read(rest, 0, rest.length);
                        assertThat(text(rest, 0, rest.length)).isEqualTo(real.substring(at + 1));
                    }
                    assertThatThrownBy(() -> r.sequence(c)).isInstanceOf(StriaException.class).hasMessage(expected);
                }
            }
        }
    }

    private static String stale(String display, String detail) {
        return display + ".fai does not match " + display + " (" + detail + "); rebuild it (samtools faidx) or delete it";
    }

    @Example
    void readingPastTheEndIsRefusedAndChangesNothing() {
        byte[] text = FastaFiles.bytes(">a\nACGT\nAC\n>b\nGGA\n");
        Path p = scratch.store(text, Form.PLAIN);
        FastaFiles.withReader(p, Form.PLAIN, r -> {
            ContigInfo a = r.contigs().get(0);
            BaseStream in = r.stream(a);
            byte[] buf = new byte[8];
            in.read(buf, 0, 5);
            assertThatThrownBy(() -> in.read(buf, 5, 2)).isInstanceOf(IllegalArgumentException.class)
                    .hasMessage(p + ": cannot read 2 more bases of record a, only 1 of its 6 are left");
            in.read(buf, 5, 1);
            assertThat(text(buf, 0, 6)).isEqualTo("ACGTAC");
            assertThatThrownBy(() -> in.read(buf, 6, 1)).isInstanceOf(IllegalArgumentException.class);
            assertThatThrownBy(() -> in.read(buf, 7, 2)).isInstanceOf(IndexOutOfBoundsException.class);
            assertThatThrownBy(() -> r.stream(new ContigInfo("a", 5))).isInstanceOf(IllegalArgumentException.class);
            return null;
        });
    }

    // ---- generated genomes ----

    /** Records with one line width (0: each sequence on one line) and one line end. */
    record Genome(List<FastaFiles.Rec> recs, int width, String eol, boolean finalEol) {
        byte[] text() {
            return FastaFiles.bytes(FastaFiles.format(recs, width, eol, finalEol));
        }

        /** Widest line of sequence, for choosing piece sizes around it. */
        int lineWidth() {
            return width > 0 ? width : recs.stream().mapToInt(r -> r.seq().length()).max().orElse(1);
        }

        /** Uncompressed offset of the first sequence byte of record {@code i}. */
        long seqOffset(int i) {
            FastaFiles.Rec r = recs.get(i);
            String header = ">" + r.name() + (r.description().isEmpty() ? "" : " " + r.description()) + eol;
            return FastaFiles.format(recs.subList(0, i), width, eol, true).length() + header.length();
        }

        /** Offset of base {@code j} of record {@code i}, from the layout alone. */
        long baseOffset(int i, int j) {
            int w = width == 0 ? recs.get(i).seq().length() : width;
            return seqOffset(i) + (long) (j / w) * (w + eol.length()) + j % w;
        }

        /** Whether base {@code j} of record {@code i} is the first of its line. */
        boolean atLineStart(int i, int j) {
            return j % (width == 0 ? recs.get(i).seq().length() : width) == 0;
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

        @Override
        public String toString() {
            return "Genome[width " + width + ", eol " + (eol.length() == 1 ? "LF" : "CRLF") + ", final eol " + finalEol
                    + ", " + recs.stream().map(r -> r.name() + ":" + r.seq().length()).collect(Collectors.joining(" "))
                    + "]";
        }
    }

    @Provide
    Arbitrary<Genome> genomes() {
        return Combinators.combine(Arbitraries.longs(), Arbitraries.integers().between(1, 5),
                        Arbitraries.of(0, 1, 2, 3, 5, 60, 61, 80), Arbitraries.of("\n", "\r\n"), Arbitraries.of(true, false))
                .as((seed, n, width, eol, finalEol) -> {
                    Random rnd = new Random(seed);
                    List<FastaFiles.Rec> recs = new ArrayList<>();
                    for (int i = 0; i < n; i++) {
                        int len = rnd.nextInt(8) == 0 ? 0 : 1 + rnd.nextInt(rnd.nextBoolean() ? 20 : 900);
                        String s = FastaFiles.letters(rnd, len);
                        if (rnd.nextBoolean()) {
                            s = s.toLowerCase(Locale.ROOT);
                        }
                        recs.add(new FastaFiles.Rec("r" + i + (rnd.nextBoolean() ? "_x" : ""),
                                rnd.nextBoolean() ? "desc " + rnd.nextInt(1000) : "", s));
                    }
                    if (recs.stream().allMatch(r -> r.seq().isEmpty())) {
                        recs.set(0, new FastaFiles.Rec("r0", "", "ACGTTGCA"));
                    }
                    return new Genome(recs, width, eol, finalEol);
                });
    }

    @Provide
    Arbitrary<Form> indexedForms() {
        return Arbitraries.of(Arrays.stream(Form.values()).filter(Form::fai).toList());
    }

    // ---- damage ----

    enum Kind { BAD_LETTER, SHORTER, LONGER }

    /** Bytes that are not letters, with the words a message uses for them. */
    private static final List<Map.Entry<Integer, String>> BAD = List.of(Map.entry((int) 'X', "'X'"),
            Map.entry((int) 'U', "'U'"), Map.entry((int) '*', "'*'"), Map.entry((int) '-', "'-'"),
            Map.entry((int) ' ', "a space"), Map.entry((int) '\t', "a tab"), Map.entry(0xE9, "byte 0xE9"),
            Map.entry(0, "byte 0x00"), Map.entry((int) '>', "'>'"));

    /**
     * A kind of damage and numbers choosing the record, the base, the byte of a bad letter and, for a
     * record longer than claimed, one of the false line layouts that fit it.
     */
    record Damage(Kind kind, int record, int base, int badIndex, int layout) {
        int bad() {
            return BAD.get(badIndex).getKey();
        }

        String described() {
            return BAD.get(badIndex).getValue();
        }

        boolean applies(Genome g, int i) {
            int len = g.recs().get(i).seq().length();
            return switch (kind) {
                case BAD_LETTER -> len > (bad() == '>' ? 1 : 0);
                // a false one-line layout claims the line ends as bases: more than there are when there are any
                case SHORTER -> len > 0 && lastBase(g, i) + 1 > len;
                case LONGER -> len > 0 && !shorterLayouts(g, i).isEmpty();
            };
        }

        private static long lastBase(Genome g, int i) {
            return g.baseOffset(i, g.recs().get(i).seq().length() - 1) - g.seqOffset(i);
        }

        /**
         * Line layouts (bases per line, line-end bytes, claimed length) whose arithmetic puts the last
         * base exactly where the record's real last base is, with fewer bases than the record has.
         */
        private static List<long[]> shorterLayouts(Genome g, int i) {
            long last = lastBase(g, i);
            List<long[]> out = new ArrayList<>();
            for (long bpl = 1; bpl <= last; bpl++) {
                for (int t = 1; t <= 2; t++) {
                    long q = last / (bpl + t);
                    long rest = last % (bpl + t);
                    long claimed = q * bpl + rest + 1;
                    if (rest < bpl && claimed < g.recs().get(i).seq().length()) {
                        out.add(new long[] {bpl, t, claimed});
                    }
                }
            }
            return out;
        }

        /** Rewrites the .fai line of record {@code i} with a false layout and returns what it claims. */
        Claim claimIndex(Genome g, int i, Path fasta) {
            long bpl;
            long bytes;
            long claimed;
            if (kind == Kind.SHORTER) {
                claimed = lastBase(g, i) + 1;
                bpl = claimed;
                bytes = claimed + 1;
            } else {
                List<long[]> layouts = shorterLayouts(g, i);
                long[] l = layouts.get(layout % layouts.size());
                bpl = l[0];
                bytes = l[0] + l[1];
                claimed = l[2];
            }
            String name = g.recs().get(i).name();
            Path fai = IndexFiles.faiOf(fasta);
            try {
                List<String> lines = new ArrayList<>();
                for (String line : Files.readAllLines(fai)) {
                    String[] f = line.split("\t");
                    lines.add(f[0].equals(name) ? String.join("\t", name, "" + claimed, f[2], "" + bpl, "" + bytes) : line);
                }
                Files.write(fai, lines);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            return new Claim((int) bpl, (int) (bytes - bpl), (int) claimed);
        }
    }

    /** What a false .fai line says of a record: bases per line, line-end bytes and length. */
    record Claim(int width, int lineEnd, int length) {
        /**
         * Where reading record {@code i} from its start under this claim fails, and the detail of the
         * message: the base the reader cannot deliver (for a record longer than claimed, the last one it
         * can) and why. The layouts first disagree at the end of the first line of one of them.
         */
        Map.Entry<Integer, String> failure(Genome g, int i) {
            String name = g.recs().get(i).name();
            int real = g.recs().get(i).seq().length();
            int first = Math.min(g.width() == 0 ? real : g.width(), real);
            long line = g.lineOf(g.seqOffset(i));
            int both = Math.min(width, first);
            if (length <= both) {
                return Map.entry(length - 1, "record " + name + " has more than " + length + " bases");
            }
            if (width < first) {
                return Map.entry(width, "record " + name + ", line " + line + ": more than " + width
                        + " bases on the line");
            }
            if (real == first) {
                // the record is one line: after it comes the next header or the end of the file
                return Map.entry(real, "record " + name + " ends after " + real + " of " + length + " bases");
            }
            if (width > first) {
                return Map.entry(first, "record " + name + ", line " + line + ": line end after " + first + " of "
                        + width + " bases");
            }
            return Map.entry(width, "record " + name + ", line " + line + ": line end is not "
                    + (lineEnd == 1 ? "LF" : "CRLF"));
        }
    }

    @Provide
    Arbitrary<Damage> damages() {
        Arbitrary<Integer> any = Arbitraries.integers().between(0, 1_000_000);
        return Combinators.combine(Arbitraries.of(Kind.class), any, any,
                Arbitraries.integers().between(0, BAD.size() - 1), any).as(Damage::new);
    }
}
