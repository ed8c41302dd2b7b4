package stria.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static stria.io.FastaFiles.bytes;
import static stria.io.FastaFiles.expected;
import static stria.io.FastaFiles.format;
import static stria.io.FastaFiles.gzip;
import static stria.io.FastaFiles.read;
import static stria.io.FastaFiles.sample;
import static stria.io.FastaFiles.write;

import java.io.ByteArrayInputStream;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.stream.Stream;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import stria.StriaException;

class GenomeReaderTest {
    @TempDir
    Path dir;

    private static final List<FastaFiles.Rec> SAMPLE = sample();
    private static final Map<String, String> CLEAN = expected(SAMPLE);

    private static Map<String, String> upper(Map<String, String> m) {
        Map<String, String> u = new LinkedHashMap<>();
        m.forEach((k, v) -> u.put(k, v.toUpperCase(Locale.ROOT)));
        return u;
    }

    static Stream<Arguments> acceptedVariants() {
        String clean = format(SAMPLE);
        StringBuilder mixed = new StringBuilder();
        Random rnd = new Random(3);
        for (char c : clean.toCharArray()) {
            mixed.append(c != '>' && rnd.nextBoolean() ? Character.toLowerCase(c) : c);
        }
        // irregular widths: a record cut at random places
        StringBuilder ragged = new StringBuilder();
        for (FastaFiles.Rec r : SAMPLE) {
            ragged.append('>').append(r.name()).append('\n');
            for (int i = 0; i < r.seq().length(); ) {
                int w = 1 + rnd.nextInt(90);
                ragged.append(r.seq(), i, Math.min(r.seq().length(), i + w)).append('\n');
                i += w;
            }
        }
        return Stream.of(
                Arguments.of("clean", clean),
                Arguments.of("CRLF", format(SAMPLE, 60, "\r\n", true)),
                Arguments.of("lower case", clean.replaceAll("(?m)^([^>].*)$", "") .isEmpty() ? clean : lowerSequences(clean)),
                Arguments.of("mixed case", mixed.toString().replace(">ctg", ">ctg")),
                Arguments.of("width 1", format(SAMPLE, 1, "\n", true)),
                Arguments.of("width 7", format(SAMPLE, 7, "\n", true)),
                Arguments.of("width 80", format(SAMPLE, 80, "\n", true)),
                Arguments.of("one line per record", format(SAMPLE, 0, "\n", true)),
                Arguments.of("ragged widths", ragged.toString()),
                Arguments.of("no final newline", format(SAMPLE, 60, "\n", false)),
                Arguments.of("CRLF without final line end", format(SAMPLE, 60, "\r\n", false)),
                Arguments.of("tab before description", clean.replace(">ctg1 first", ">ctg1\tfirst")),
                Arguments.of("byte order mark", "\u00ef\u00bb\u00bf" + clean),
                Arguments.of("blank lines", "\n\n" + clean.replace("\n>", "\n\n\n>") + "\n\n"));
    }

    private static String lowerSequences(String fasta) {
        StringBuilder sb = new StringBuilder();
        for (String line : fasta.split("\n", -1)) {
            sb.append(line.startsWith(">") ? line : line.toLowerCase(Locale.ROOT)).append('\n');
        }
        sb.setLength(sb.length() - 1);
        return sb.toString();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("acceptedVariants")
    void acceptedVariantsEqualCleanInput(String label, String text) {
        byte[] data = bytes(text);
        Path plain = write(dir.resolve("g.fa"), data);
        Path gz = write(dir.resolve("g.fa.gz"), gzip(data));
        Path bgz = FastaFiles.writeBgzf(dir.resolve("g.bgz.fa.gz"), data);
        for (Path p : List.of(plain, gz, bgz)) {
            List<String> warnings = new ArrayList<>();
            Map<String, String> got = read(p, warnings);
            assertThat(upper(got)).as(label + " " + p.getFileName()).isEqualTo(CLEAN);
            assertThat(warnings).isEmpty();
        }
    }

    @Test
    void caseIsKept() {
        Path p = write(dir.resolve("soft.fa"), bytes(">a\nACgtnN\nacg\n"));
        assertThat(read(p)).containsExactly(Map.entry("a", "ACgtnNacg"));
    }

    @Test
    void standardInputIsReadLikeAFileAndTheCopyIsDeleted() throws Exception {
        InputStream saved = System.in;
        try {
            System.setIn(new ByteArrayInputStream(gzip(bytes(format(SAMPLE)))));
            Path copy;
            try (GenomeReader r = GenomeReader.open("-", w -> { })) {
                assertThat(r.displayName()).isEqualTo("<stdin>");
                copy = r.path();
                assertThat(copy).exists();
                Map<String, String> got = new LinkedHashMap<>();
                for (ContigInfo c : r.contigs()) {
                    got.put(c.name(), new String(r.sequence(c), StandardCharsets.ISO_8859_1));
                }
                assertThat(got).isEqualTo(CLEAN);
            }
            assertThat(copy).doesNotExist();
            System.setIn(new ByteArrayInputStream(new byte[0]));
            assertThatThrownBy(() -> GenomeReader.open("-", w -> { }))
                    .isInstanceOf(StriaException.class).hasMessage("<stdin>: file is empty");
        } finally {
            System.setIn(saved);
        }
    }

    @Test
    void aPipeIsReadLikeStandardInput() throws Exception {
        org.junit.jupiter.api.Assumptions.assumeTrue(Files.isExecutable(Path.of("/usr/bin/mkfifo")));
        Path fifo = dir.resolve("pipe.fa");
        assertThat(new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor()).isZero();
        Thread writer = new Thread(() -> write(fifo, gzip(bytes(format(SAMPLE)))));
        writer.start();
        List<String> warnings = new ArrayList<>();
        assertThat(read(fifo, warnings)).isEqualTo(CLEAN);
        writer.join();
    }

    @Test
    void contigsAreListedInFileOrderWithExactLengths() {
        Path p = write(dir.resolve("g.fa"), bytes(format(SAMPLE)));
        try (GenomeReader r = GenomeReader.open(p.toString(), w -> { })) {
            assertThat(r.displayName()).isEqualTo(p.toString());
            assertThat(r.contigs()).containsExactly(new ContigInfo("ctg1", 250), new ContigInfo("ctg2", 61),
                    new ContigInfo("ctg_3.x", 1), new ContigInfo("ctg4", 1000));
        }
    }

    @Test
    void emptyRecordsAreSkippedWithOneWarning() {
        Path p = write(dir.resolve("g.fa"), bytes(">e1\n>a\nACGT\n>e2 nothing here\n\n>b\nGG\n>e3"));
        List<String> warnings = new ArrayList<>();
        try (GenomeReader r = GenomeReader.open(p.toString(), warnings::add)) {
            assertThat(r.contigs()).containsExactly(new ContigInfo("a", 4), new ContigInfo("b", 2));
            assertThat(new String(r.sequence(r.contigs().get(1)), StandardCharsets.US_ASCII)).isEqualTo("GG");
        }
        assertThat(warnings).containsExactly(p + ": skipped 3 records with no sequence (first: e1)");
    }

    /** Each storage form, with and without indexes, read backwards: the non-streaming path. */
    @ParameterizedTest
    @MethodSource("storageForms")
    void randomOrderGivesTheSameSequences(String form) throws Exception {
        Random rnd = new Random(11);
        List<FastaFiles.Rec> recs = new ArrayList<>();
        for (int i = 0; i < 12; i++) {
            // big enough that BGZF spreads the genome over many blocks and seeks are real seeks
            recs.add(new FastaFiles.Rec("r" + i, "", FastaFiles.letters(rnd, 1 + rnd.nextInt(i % 3 == 0 ? 3_000_000 : 5000))));
        }
        Path p = storeAs(form, bytes(format(recs, 70, "\n", true)));
        Map<String, String> want = expected(recs);
        try (GenomeReader r = GenomeReader.open(p.toString(), w -> { })) {
            List<ContigInfo> order = new ArrayList<>(r.contigs());
            java.util.Collections.shuffle(order, rnd);
            order.add(order.get(0));
            for (ContigInfo c : order) {
                assertThat(new String(r.sequence(c), StandardCharsets.ISO_8859_1)).as(c.name()).isEqualTo(want.get(c.name()));
            }
        }
    }

    static Stream<String> storageForms() {
        return Stream.of("plain", "plain+fai", "gzip", "bgzf", "bgzf+fai", "bgzf+gzi", "bgzf+fai+gzi");
    }

    private Path storeAs(String form, byte[] data) {
        Path p;
        if (form.startsWith("plain")) {
            p = write(dir.resolve("g.fa"), data);
        } else if (form.equals("gzip")) {
            p = write(dir.resolve("g.fa.gz"), gzip(data));
        } else {
            p = FastaFiles.writeBgzf(dir.resolve("g.fa.gz"), data);
        }
        if (form.contains("fai")) {
            FastaFiles.faidx(p);
        }
        if (form.contains("+gzi")) {
            FastaFiles.gzindex(p);
        }
        return p;
    }

    @Test
    void aFaiThatLeavesOutEmptyRecordsStillMatches() {
        Path p = write(dir.resolve("e.fa"), bytes(">e0\n>a\nACGT\nAC\n>e desc\n>b\nGG\n>e2\n"));
        // as samtools faidx writes it: the records without sequence are not listed
        write(dir.resolve("e.fa.fai"), bytes("a\t6\t7\t4\t5\nb\t2\t26\t2\t3\n"));
        List<String> warnings = new ArrayList<>();
        assertThat(read(p, warnings)).containsExactly(Map.entry("a", "ACGTAC"), Map.entry("b", "GG"));
        assertThat(warnings).containsExactly(p + ": skipped 3 records with no sequence (first: e0)");
        write(dir.resolve("e.fa.fai"), bytes("a\t6\t7\t4\t5\nb\t2\t26\t2\t3\nc\t2\t30\t2\t3\n"));
        refusedAtOpen(p, "e.fa.fai does not match", "record c");
    }

    @Test
    void aMatchingFaiIsUsedInsteadOfAPrePass() throws Exception {
        Path p = write(dir.resolve("g.fa"), bytes(format(SAMPLE)));
        FastaFiles.faidx(p);
        // a bad letter is caught by the pre-pass at open, but with a usable index only when loaded
        byte[] data = Files.readAllBytes(p);
        int at = new String(data, StandardCharsets.ISO_8859_1).indexOf(">ctg2") + 10;
        data[at] = 'Z';
        Files.write(p, data);
        try (GenomeReader r = GenomeReader.open(p.toString(), w -> { })) {
            assertThat(r.contigs()).hasSize(4);
            assertThat(r.sequence(r.contigs().get(0))).hasSize(250);
            assertThatThrownBy(() -> r.sequence(r.contigs().get(1)))
                    .isInstanceOf(StriaException.class)
                    .hasMessageStartingWith(p + ": record ctg2, line ")
                    .hasMessageContaining("'Z' is not a nucleotide letter");
        }
    }

    // ---- refused input ----

    private void refused(Path p, String... parts) {
        assertThatThrownBy(() -> read(p))
                .isInstanceOf(StriaException.class)
                .hasMessageStartingWith(p.toString())
                .hasMessageContainingAll(parts)
                .satisfies(e -> assertThat(e.getMessage()).doesNotContain("\n"));
    }

    /** Refused before any sequence is loaded, so that a command fails before it writes anything. */
    private void refusedAtOpen(Path p, String... parts) {
        assertThatThrownBy(() -> GenomeReader.open(p.toString(), w -> { }).close())
                .isInstanceOf(StriaException.class)
                .hasMessageStartingWith(p.toString())
                .hasMessageContainingAll(parts);
    }

    @Test
    void missingFile() {
        refused(dir.resolve("nope.fa"), "no such file");
    }

    @Test
    void directory() {
        refused(dir, "is a directory");
    }

    @Test
    void unreadableFile() throws Exception {
        Path p = write(dir.resolve("locked.fa"), bytes(">a\nACGT\n"));
        Files.setPosixFilePermissions(p, java.util.Set.of());
        org.junit.jupiter.api.Assumptions.assumeFalse(Files.isReadable(p), "running as root: permissions not enforced");
        refused(p, "cannot read");
    }

    @Test
    void emptyFile() {
        refused(write(dir.resolve("empty.fa"), new byte[0]), "file is empty");
        refused(write(dir.resolve("empty.fa.gz"), gzip(new byte[0])), "file is empty");
    }

    @Test
    void binaryData() {
        byte[] junk = new byte[5000];
        new Random(5).nextBytes(junk);
        junk[0] = '>';
        refused(write(dir.resolve("junk.fa"), junk), "binary data");
        refused(write(dir.resolve("junk.fa.gz"), gzip(junk)), "binary data");
    }

    @Test
    void otherCompressionsAreNamed() {
        refused(write(dir.resolve("g.fa.xz"), bytes("\u00fd7zXZ\u0000\u0000\u0004rest")), "xz-compressed", "xz -dc");
        refused(write(dir.resolve("g.fa.bz2"), bytes("BZh91AY&SYrest")), "bzip2-compressed");
        refused(write(dir.resolve("g.fa.zst"), bytes("\u0028\u00b5\u002f\u00fdrest")), "zstd-compressed");
        refused(write(dir.resolve("g.zip"), bytes("PK\u0003\u0004rest")), "zip-compressed");
    }

    @Test
    void textWithoutHeader() {
        refused(write(dir.resolve("seq.txt"), bytes("ACGTACGT\nACGT\n")), "not a FASTA file: line 1");
        refused(write(dir.resolve("notes.txt"), bytes("\nsome notes about a genome\n>a\nACGT\n")), "line 2");
        refused(write(dir.resolve("blank.fa"), bytes("\n\n  \n")), "no FASTA record");
    }

    @Test
    void headerWithoutName() {
        refused(write(dir.resolve("g.fa"), bytes(">a\nAC\n> b\nAC\n")), "line 3", "no record name");
    }

    @Test
    void noSequenceAtAll() {
        refused(write(dir.resolve("g.fa"), bytes(">a\n>b\n")), "no record has any sequence");
    }

    @Test
    void truncatedGzip() {
        byte[] gz = gzip(bytes(format(SAMPLE)));
        refused(write(dir.resolve("t.fa.gz"), Arrays.copyOf(gz, gz.length * 2 / 3)), "truncated or corrupt gzip");
        refused(write(dir.resolve("t2.fa.gz"), Arrays.copyOf(gz, gz.length - 3)), "truncated or corrupt gzip");
    }

    @Test
    void corruptGzip() {
        byte[] gz = gzip(bytes(format(SAMPLE)));
        for (int i = gz.length / 3; i < gz.length / 3 + 8; i++) {
            gz[i] ^= 0x5A;
        }
        refused(write(dir.resolve("c.fa.gz"), gz), "truncated or corrupt gzip");
    }

    @Test
    void truncatedBgzf() throws Exception {
        Path full = FastaFiles.writeBgzf(dir.resolve("full.fa.gz"), bytes(format(SAMPLE)));
        byte[] b = Files.readAllBytes(full);
        refused(write(dir.resolve("t.fa.gz"), Arrays.copyOf(b, b.length - 40)), "truncated or corrupt BGZF");
        refused(write(dir.resolve("t2.fa.gz"), Arrays.copyOf(b, b.length / 2)), "truncated or corrupt BGZF");
    }

    /**
     * BSIZE (bytes 16-17 of a BGZF block, SAM/BAM specification section 4.1) claims a block shorter than
     * its own header and footer; the decompressor of the library then fails with an index error, which
     * must still reach the user as damage.
     */
    @Tag("slow")
    @Test
    void bgzfBlockSizeFieldTooSmall() throws Exception {
        Path full = FastaFiles.writeBgzf(dir.resolve("full.fa.gz"), bytes(format(SAMPLE)));
        for (int bsize = 17; bsize < 26; bsize++) {
            byte[] b = Files.readAllBytes(full);
            b[16] = (byte) bsize;
            b[17] = 0;
            refused(write(dir.resolve("bsize" + bsize + ".fa.gz"), b), "truncated or corrupt BGZF");
        }
    }

    /**
     * Every single-byte damage to the header, CRC32 and the low half of ISIZE of the first BGZF block (the
     * fields of SAM/BAM specification section 4.1) either is refused with a one-line message naming the
     * file or leaves the genome unchanged (fields no reader uses). The high half of ISIZE is left out: a
     * damaged one makes the library allocate up to 2 GB before it notices.
     */
    @Tag("slow")
    @Test
    void everyDamageToTheFirstBlocksFieldsIsRefusedOrHarmless() throws Exception {
        Path full = FastaFiles.writeBgzf(dir.resolve("full.fa.gz"), bytes(format(SAMPLE)));
        byte[] clean = Files.readAllBytes(full);
        int blockSize = ((clean[16] & 0xFF) | (clean[17] & 0xFF) << 8) + 1;
        List<Integer> fields = new ArrayList<>();
        for (int i = 0; i < 18; i++) {
            fields.add(i);
        }
        for (int i = blockSize - 8; i < blockSize - 2; i++) {
            fields.add(i);
        }
        Path p = dir.resolve("damaged.fa.gz");
        int refused = 0;
        for (int at : fields) {
            for (int mask = 1; mask < 256; mask++) {
                byte[] b = clean.clone();
                b[at] ^= (byte) mask;
                write(p, b);
                try {
                    assertThat(read(p)).as("byte %d ^ %02X", at, mask).isEqualTo(CLEAN);
                } catch (StriaException e) {
                    assertThat(e.getMessage()).as("byte %d ^ %02X", at, mask).startsWith(p.toString())
                            .doesNotContain("\n");
                    refused++;
                }
            }
        }
        // the magic bytes, the block size and the CRC alone are refused whatever the damage
        assertThat(refused).isGreaterThan((4 + 2 + 4) * 255);
    }

    @Test
    void bgzfMissingOnlyItsEndMarkerIsReadWithAWarning() throws Exception {
        Path full = FastaFiles.writeBgzf(dir.resolve("full.fa.gz"), bytes(format(SAMPLE)));
        byte[] b = Files.readAllBytes(full);
        Path cut = write(dir.resolve("cut.fa.gz"), Arrays.copyOf(b, b.length - 28));
        List<String> warnings = new ArrayList<>();
        assertThat(read(cut, warnings)).isEqualTo(CLEAN);
        assertThat(warnings).containsExactly(cut + ": BGZF file has no end-of-file marker; it may be truncated");
    }

    private byte[] bigGenome(long seed) {
        Random rnd = new Random(seed);
        List<FastaFiles.Rec> recs = new ArrayList<>();
        for (int i = 0; i < 5; i++) {
            recs.add(new FastaFiles.Rec("c" + i, "", FastaFiles.letters(rnd, 200_000)));
        }
        return bytes(format(recs));
    }

    @Test
    void bgzfWithAnotherFilesFai() throws Exception {
        Path p = FastaFiles.writeBgzf(dir.resolve("g.fa.gz"), bigGenome(1));
        Path other = FastaFiles.writeBgzf(dir.resolve("other.fa.gz"), bytes(format(SAMPLE)));
        FastaFiles.faidx(other);
        Files.copy(dir.resolve("other.fa.gz.fai"), dir.resolve("g.fa.gz.fai"));
        refusedAtOpen(p, "g.fa.gz.fai does not match", "record ctg1");
    }

    @Test
    void bgzfWithAStaleFai() throws Exception {
        byte[] data = bigGenome(1);
        Path p = FastaFiles.writeBgzf(dir.resolve("g.fa.gz"), data);
        FastaFiles.faidx(p);
        // same names and layout, one record a line shorter
        String text = new String(data, StandardCharsets.ISO_8859_1);
        int cut = text.indexOf(">c3");
        String shorter = text.substring(0, cut - 61) + text.substring(cut);
        FastaFiles.writeBgzf(p, bytes(shorter));
        refusedAtOpen(p, "g.fa.gz.fai does not match");
    }

    @Tag("slow")
    @Test
    void bgzfWithAnotherFilesGzi() throws Exception {
        Path p = FastaFiles.writeBgzf(dir.resolve("g.fa.gz"), bigGenome(1));
        Path other = FastaFiles.writeBgzf(dir.resolve("other.fa.gz"), bigGenome(2));
        FastaFiles.gzindex(other);
        FastaFiles.gzindex(p);
        assertThat(read(p)).hasSize(5);
        // same sizes of input, different content: block boundaries differ
        Files.copy(dir.resolve("other.fa.gz.gzi"), dir.resolve("g.fa.gz.gzi"), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        refusedAtOpen(p, "g.fa.gz.gzi does not match");
        Path small = FastaFiles.writeBgzf(dir.resolve("small.fa.gz"), bytes(format(SAMPLE)));
        FastaFiles.gzindex(small);
        Files.copy(dir.resolve("small.fa.gz.gzi"), dir.resolve("g.fa.gz.gzi"), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        refusedAtOpen(p, "g.fa.gz.gzi does not match");
        write(dir.resolve("g.fa.gz.gzi"), bytes("garbage"));
        refusedAtOpen(p, "g.fa.gz.gzi");
    }

    @Test
    void plainFileWithAStaleFai() throws Exception {
        Path p = write(dir.resolve("g.fa"), bytes(format(SAMPLE)));
        FastaFiles.faidx(p);
        write(p, bytes(format(SAMPLE).replace(">ctg2", ">ctg2b")));
        refusedAtOpen(p, "g.fa.fai does not match", "record ctg2");
        write(p, bytes(format(SAMPLE) + ">extra\nACGT\n"));
        refusedAtOpen(p, "g.fa.fai does not match", "more records");
        write(p, bytes(format(SAMPLE, 50, "\n", true)));
        refusedAtOpen(p, "g.fa.fai does not match");
        write(dir.resolve("g.fa.fai"), bytes("not an index\n"));
        refusedAtOpen(p, "g.fa.fai");
    }

    @Test
    void duplicateNames() {
        refused(write(dir.resolve("g.fa"), bytes(">a\nAC\n>b x\nAC\n>a again\nGG\n")),
                "duplicate record name a (lines 1 and 5)");
        refused(write(dir.resolve("g2.fa"), bytes(">a\n>a\nAC\n")), "duplicate record name a");
    }

    @Test
    void nonNucleotideLetters() {
        String text = format(SAMPLE);
        // line 8 is the first sequence line of ctg2 (ctg1: header + 5 lines, then the header of ctg2)
        String[] lines = text.split("\n", -1);
        lines[7] = lines[7].substring(0, 3) + "X" + lines[7].substring(4);
        String bad = String.join("\n", lines);
        String msg = "record ctg2, line 8: 'X' is not a nucleotide letter";
        refused(write(dir.resolve("g.fa"), bytes(bad)), msg);
        refused(write(dir.resolve("g.fa.gz"), gzip(bytes(bad))), msg);
        refused(write(dir.resolve("crlf.fa"), bytes(bad.replace("\n", "\r\n"))), msg);
        refused(write(dir.resolve("u.fa"), bytes(">a\nACGU\n")), "record a, line 2: 'U'");
        refused(write(dir.resolve("sp.fa"), bytes(">a\nACGT \n")), "a space is not a nucleotide letter");
        refused(write(dir.resolve("dash.fa"), bytes(">a\nAC\n>b\nAC-GT\n")), "record b, line 4: '-'");
        refused(write(dir.resolve("star.fa"), bytes(">a\nAC*\n")), "'*'");
        refused(write(dir.resolve("hi.fa"), bytes(">a\nAC\u00e9\n")), "byte 0xE9");
    }

    @Test
    void nonNucleotideLetterFoundThroughAnIndexStillHasItsLine() throws Exception {
        Path p = FastaFiles.writeBgzf(dir.resolve("g.fa.gz"), bytes(format(SAMPLE)));
        FastaFiles.faidx(p);
        String bad = format(SAMPLE).replace(">ctg4\n", ">ctg4\nACGTJ");
        // keep the layout identical so that the index still matches: replace five letters in place
        String good = format(SAMPLE);
        int at = good.indexOf(">ctg4\n") + 6;
        bad = good.substring(0, at) + "ACGTJ" + good.substring(at + 5);
        FastaFiles.writeBgzf(p, bytes(bad));
        FastaFiles.gzindex(p);
        long line = bad.substring(0, at).chars().filter(c -> c == '\n').count() + 1;
        try (GenomeReader r = GenomeReader.open(p.toString(), w -> { })) {
            assertThatThrownBy(() -> r.sequence(r.contigs().get(3)))
                    .isInstanceOf(StriaException.class)
                    .hasMessage(p + ": record ctg4, line " + line
                            + ": 'J' is not a nucleotide letter (IUPAC codes ACGTNRYSWKMBDHV only)");
        }
    }

    @Test
    void aFileReplacedAfterOpeningIsRefusedWhenLoaded() throws Exception {
        Random rnd = new Random(2);
        List<FastaFiles.Rec> recs = new ArrayList<>();
        for (int i = 0; i < 4; i++) {
            // larger than the read buffer, so that later records come from the disk again
            recs.add(new FastaFiles.Rec("big" + i, "", FastaFiles.letters(rnd, 600_000)));
        }
        Path p = write(dir.resolve("g.fa"), bytes(format(recs)));
        try (GenomeReader r = GenomeReader.open(p.toString(), w -> { })) {
            Files.write(p, bytes(format(recs, 50, "\n", true)));
            assertThatThrownBy(() -> {
                for (ContigInfo c : r.contigs()) {
                    r.sequence(c);
                }
            }).isInstanceOf(StriaException.class).hasMessageStartingWith(p + " changed while being read");
        }
    }

    @Test
    void aContigFromAnotherReaderIsRejected() {
        Path p = write(dir.resolve("g.fa"), bytes(format(SAMPLE)));
        try (GenomeReader r = GenomeReader.open(p.toString(), w -> { })) {
            assertThatThrownBy(() -> r.sequence(new ContigInfo("zzz", 5))).isInstanceOf(IllegalArgumentException.class);
        }
    }
}
