package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import java.util.zip.GZIPOutputStream;

import htsjdk.samtools.reference.FastaSequenceIndexCreator;
import htsjdk.samtools.util.BlockCompressedOutputStream;
import htsjdk.samtools.util.GZIIndex;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import stria.testutil.Cli;

/**
 * Bad input, bad options and interruptions as a user meets them: the real command, its exit status, what
 * it prints on stderr and what it leaves on disk.
 */
@Tag("slow")
class InputErrorsTest {
    /** The default (imperfect) mode and the exact mode: both must see the same genome whatever its form. */
    private static final List<List<String>> MODES = List.of(List.of(), List.of("--exact"));
    private static final String PREVIOUS = "output of an earlier run\n";

    @TempDir
    Path dir;

    // ---- an invented genome with planted repeats, in the forms users have it in ----

    private record Rec(String name, String seq) {
    }

    private static final List<Rec> GENOME = genome();

    private static List<Rec> genome() {
        Random rnd = new Random(42);
        List<Rec> recs = new ArrayList<>();
        String[] planted = {"CA", "AGAT", "GGCCT", "T", "ACGTTGCA"};
        for (int c = 0; c < 3; c++) {
            StringBuilder s = new StringBuilder();
            for (int k = 0; k < 8; k++) {
                for (int i = 0; i < 300 + rnd.nextInt(400); i++) {
                    s.append("ACGT".charAt(rnd.nextInt(4)));
                }
                String m = planted[(c + k) % planted.length];
                s.append(m.repeat(6 + rnd.nextInt(10)));
                // ambiguity codes are legal and break repeats
                s.append("NNRYKM".charAt(rnd.nextInt(6)));
            }
            recs.add(new Rec("contig" + (c + 1), s.toString()));
        }
        return recs;
    }

    private static String fasta(List<Rec> recs, int width, String eol, boolean finalEol, boolean descriptions) {
        StringBuilder sb = new StringBuilder();
        for (Rec r : recs) {
            sb.append('>').append(r.name()).append(descriptions ? " invented sequence, len=" + r.seq().length() : "")
                    .append(eol);
            int w = width == 0 ? r.seq().length() : width;
            for (int i = 0; i < r.seq().length(); i += w) {
                sb.append(r.seq(), i, Math.min(r.seq().length(), i + w)).append(eol);
            }
        }
        if (!finalEol) {
            sb.setLength(sb.length() - eol.length());
        }
        return sb.toString();
    }

    private static final String CLEAN = fasta(GENOME, 60, "\n", true, false);

    private static byte[] bytes(String s) {
        return s.getBytes(StandardCharsets.ISO_8859_1);
    }

    private static byte[] gzip(byte[] data) {
        ByteArrayOutputStream bos = new ByteArrayOutputStream();
        try (OutputStream out = new GZIPOutputStream(bos)) {
            out.write(data);
        } catch (IOException e) {
            throw new AssertionError(e);
        }
        return bos.toByteArray();
    }

    private Path write(String name, byte[] data) throws IOException {
        return Files.write(dir.resolve(name), data);
    }

    private Path bgzf(String name, byte[] data) throws IOException {
        Path p = dir.resolve(name);
        try (BlockCompressedOutputStream out = new BlockCompressedOutputStream(p.toFile())) {
            out.write(data);
        }
        return p;
    }

    private static void faidx(Path p) throws IOException {
        FastaSequenceIndexCreator.create(p, true);
    }

    private static void gzindex(Path p) throws IOException {
        GZIIndex.createIndex(p, true);
    }

    /** Everything but the #command line, which names the input file. */
    private static List<String> comparable(String output) {
        List<String> lines = new ArrayList<>();
        for (String l : output.split("\n")) {
            if (!l.startsWith("#command")) {
                lines.add(l);
            }
        }
        return lines;
    }

    private static String[] scan(List<String> mode, String... rest) {
        List<String> args = new ArrayList<>();
        args.add("scan");
        args.addAll(mode);
        args.addAll(Arrays.asList(rest));
        return args.toArray(String[]::new);
    }

    private List<String> cleanOutput(List<String> mode) throws IOException {
        Path clean = write("clean.fa", bytes(CLEAN));
        Cli.Result r = Cli.stria(dir, scan(mode, clean.getFileName().toString()));
        assertThat(r.exit()).as(r.err()).isZero();
        assertThat(r.dataLines()).as("the planted repeats are found").hasSizeGreaterThan(10);
        return comparable(r.out());
    }

    // ---- input that must work ----

    @Test
    void everyAcceptedFormGivesTheCleanOutput() throws IOException {
        String lower = lowerSequences(CLEAN);
        StringBuilder mixed = new StringBuilder();
        Random rnd = new Random(1);
        for (String line : CLEAN.split("\n", -1)) {
            if (line.startsWith(">")) {
                mixed.append(line);
            } else {
                for (char c : line.toCharArray()) {
                    mixed.append(rnd.nextBoolean() ? Character.toLowerCase(c) : c);
                }
            }
            mixed.append('\n');
        }
        mixed.setLength(mixed.length() - 1);
        List<Path> inputs = new ArrayList<>();
        inputs.add(write("crlf.fa", bytes(fasta(GENOME, 60, "\r\n", true, false))));
        inputs.add(write("lower.fa", bytes(lower)));
        inputs.add(write("mixed.fa", bytes(mixed.toString())));
        inputs.add(write("width1.fa", bytes(fasta(GENOME, 1, "\n", true, false))));
        inputs.add(write("width7.fa", bytes(fasta(GENOME, 7, "\n", true, false))));
        inputs.add(write("width80.fa", bytes(fasta(GENOME, 80, "\n", true, false))));
        inputs.add(write("oneline.fa", bytes(fasta(GENOME, 0, "\n", true, false))));
        inputs.add(write("noeol.fa", bytes(fasta(GENOME, 60, "\n", false, false))));
        inputs.add(write("crlf-noeol.fa", bytes(fasta(GENOME, 60, "\r\n", false, false))));
        inputs.add(write("described.fa", bytes(fasta(GENOME, 60, "\n", true, true))));
        inputs.add(write("clean.fa.gz", gzip(bytes(CLEAN))));
        inputs.add(bgzf("clean.bgzf.fa.gz", bytes(CLEAN)));
        Path indexed = bgzf("indexed.fa.gz", bytes(CLEAN));
        faidx(indexed);
        gzindex(indexed);
        inputs.add(indexed);
        Path plainIndexed = write("indexed.fa", bytes(CLEAN));
        faidx(plainIndexed);
        inputs.add(plainIndexed);
        Path gz = write("stdin.fa.gz", gzip(bytes(fasta(GENOME, 70, "\r\n", true, true))));
        for (List<String> mode : MODES) {
            List<String> want = cleanOutput(mode);
            for (Path in : inputs) {
                Cli.Result r = Cli.stria(dir, scan(mode, in.getFileName().toString()));
                assertThat(r.exit()).as(mode + " " + in + ": " + r.err()).isZero();
                assertThat(r.err()).as(mode + " " + in).isEmpty();
                assertThat(comparable(r.out())).as(mode + " " + in).isEqualTo(want);
            }
            Cli.Result r = Cli.striaWithInput(dir, gz, scan(mode, "-"));
            assertThat(r.exit()).as(r.err()).isZero();
            assertThat(comparable(r.out())).as(mode + " standard input").isEqualTo(want);
        }
    }

    private static String lowerSequences(String fasta) {
        StringBuilder sb = new StringBuilder();
        for (String line : fasta.split("\n", -1)) {
            sb.append(line.startsWith(">") ? line : line.toLowerCase(Locale.ROOT)).append('\n');
        }
        sb.setLength(sb.length() - 1);
        return sb.toString();
    }

    // ---- input that must be refused ----

    /** Each case: a label, how to build the input in a directory, and words the message must contain. */
    interface Maker {
        Path make(InputErrorsTest t) throws IOException;
    }

    static Stream<Arguments> refusedInputs() {
        return Stream.of(
                Arguments.of("missing file", (Maker) t -> t.dir.resolve("absent.fa"), List.of("no such file")),
                Arguments.of("directory", (Maker) t -> Files.createDirectory(t.dir.resolve("folder.fa")), List.of("directory")),
                Arguments.of("empty file", (Maker) t -> t.write("empty.fa", new byte[0]), List.of("empty")),
                Arguments.of("random bytes", (Maker) t -> {
                    byte[] junk = new byte[20000];
                    new Random(9).nextBytes(junk);
                    return t.write("random.fa", junk);
                }, List.of("binary")),
                Arguments.of("text without header", (Maker) t -> t.write("notes.fa",
                        bytes("These are notes about an assembly.\nACGT\n")), List.of("not a FASTA file")),
                Arguments.of("truncated gzip", (Maker) t -> {
                    byte[] gz = gzip(bytes(CLEAN));
                    return t.write("cut.fa.gz", Arrays.copyOf(gz, gz.length / 2));
                }, List.of("truncated or corrupt")),
                Arguments.of("corrupt gzip", (Maker) t -> {
                    byte[] gz = gzip(bytes(CLEAN));
                    for (int i = gz.length / 2; i < gz.length / 2 + 16; i++) {
                        gz[i] ^= 0x33;
                    }
                    return t.write("corrupt.fa.gz", gz);
                }, List.of("truncated or corrupt")),
                Arguments.of("truncated BGZF", (Maker) t -> {
                    byte[] b = Files.readAllBytes(t.bgzf("whole.fa.gz", bytes(CLEAN)));
                    return t.write("cut.bgzf.fa.gz", Arrays.copyOf(b, b.length - 50));
                }, List.of("truncated or corrupt")),
                // BSIZE and ISIZE are the block fields of SAM/BAM specification section 4.1
                Arguments.of("BGZF block size field shorter than a block header", (Maker) t -> {
                    byte[] b = Files.readAllBytes(t.bgzf("whole.fa.gz", bytes(CLEAN)));
                    b[16] = 20;
                    b[17] = 0;
                    return t.write("bsize.fa.gz", b);
                }, List.of("truncated or corrupt BGZF")),
                Arguments.of("BGZF block claiming 2 GB of data", (Maker) t -> {
                    byte[] b = Files.readAllBytes(t.bgzf("whole.fa.gz", bytes(CLEAN)));
                    int end = ((b[16] & 0xFF) | (b[17] & 0xFF) << 8) + 1;
                    b[end - 1] = 0x7F;
                    return t.write("isize.fa.gz", b);
                }, List.of("truncated or corrupt BGZF")),
                Arguments.of("BGZF with another file's .fai", (Maker) t -> {
                    Path other = t.bgzf("other.fa.gz", bytes(fasta(GENOME.subList(1, 3), 60, "\n", true, false)));
                    faidx(other);
                    Path p = t.bgzf("g.fa.gz", bytes(CLEAN));
                    Files.move(t.dir.resolve("other.fa.gz.fai"), t.dir.resolve("g.fa.gz.fai"));
                    return p;
                }, List.of("g.fa.gz.fai does not match")),
                Arguments.of("BGZF with another file's .gzi", (Maker) t -> {
                    Random rnd = new Random(5);
                    StringBuilder big = new StringBuilder(">big\n");
                    for (int i = 0; i < 400_000; i++) {
                        big.append("ACGT".charAt(rnd.nextInt(4)));
                        if (i % 60 == 59) {
                            big.append('\n');
                        }
                    }
                    Path other = t.bgzf("other.fa.gz", bytes(big.toString().replace(">big", ">other")));
                    gzindex(other);
                    Path p = t.bgzf("g.fa.gz", bytes(big + "\n>tail\n" + CLEAN.substring(1)));
                    Files.move(t.dir.resolve("other.fa.gz.gzi"), t.dir.resolve("g.fa.gz.gzi"));
                    return p;
                }, List.of("g.fa.gz.gzi does not match")),
                Arguments.of("lines that end with a carriage return alone", (Maker) t -> t.write("cr.fa",
                        bytes(CLEAN.replace("\n", "\r"))), List.of("line 1", "carriage return not followed")),
                // 0xFF never occurs in UTF-8 (RFC 3629, section 1)
                Arguments.of("record name that is not UTF-8", (Maker) t -> t.write("latin.fa",
                        bytes(CLEAN.replaceFirst(">contig2", ">contig\u00ff2"))), List.of("not valid UTF-8")),
                Arguments.of("duplicate record names", (Maker) t -> t.write("dup.fa",
                        bytes(CLEAN + ">contig2 again\nACGTACGT\n")), List.of("duplicate record name contig2")),
                Arguments.of("non-IUPAC letter", (Maker) t -> t.write("bad.fa",
                        bytes(CLEAN.replaceFirst("\n(.{10})[ACGT]", "\n$1X"))), List.of("record contig1, line 2: 'X'")),
                Arguments.of("non-IUPAC letter in the last contig, found while scanning", (Maker) t -> {
                    // with a matching .fai no pre-pass runs: the letter is met after output has begun
                    int at = CLEAN.lastIndexOf('\n', CLEAN.length() - 2) + 5;
                    Path p = t.write("late.fa", bytes(CLEAN));
                    faidx(p);
                    return t.write("late.fa", bytes(CLEAN.substring(0, at) + "J" + CLEAN.substring(at + 1)));
                }, List.of("record contig3, line", "'J'")));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("refusedInputs")
    void refusedInputExitsWithOneLineAndLeavesNoOutput(String label, Maker maker, List<String> words) throws IOException {
        Path input = maker.make(this);
        String name = input.getFileName().toString();
        Path bed = write("previous.bed", bytes(PREVIOUS));
        List<String> before = listing();

        Cli.Result r = Cli.stria(dir, "scan", "--bed", "previous.bed", "--tsv", "new.tsv", name);

        assertThat(r.exit()).as(label + ": " + r.err()).isEqualTo(1);
        assertOneLine(r.err(), label);
        assertThat(r.err()).as(label).contains(name).contains(words);
        assertThat(Files.readString(bed)).as(label + ": existing output untouched").isEqualTo(PREVIOUS);
        assertThat(listing()).as(label + ": nothing new on disk").isEqualTo(before);
        assertThat(r.out()).as(label).isEmpty();
    }

    @Test
    void unreadableFile() throws IOException {
        Path p = write("locked.fa", bytes(CLEAN));
        Files.setPosixFilePermissions(p, java.util.Set.of());
        Assumptions.assumeFalse(Files.isReadable(p), "running as root: file permissions are not enforced");
        Cli.Result r = Cli.stria(dir, "scan", "locked.fa");
        assertThat(r.exit()).isEqualTo(1);
        assertOneLine(r.err(), "unreadable");
        assertThat(r.err()).contains("locked.fa");
    }

    private static void assertOneLine(String err, String label) {
        assertThat(err).as(label + ": stderr").endsWith("\n");
        assertThat(err.strip().split("\n")).as(label + ": exactly one line on stderr: " + err).hasSize(1);
        assertThat(err).as(label).doesNotContain("Exception").doesNotContain("\tat ").doesNotContain("internal error");
    }

    private List<String> listing() throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    // ---- usage errors ----

    static Stream<Arguments> usageErrors() {
        return Stream.of(
                Arguments.of(List.of("--frobnicate"), "--frobnicate"),
                Arguments.of(List.of("--min-period", "abc"), "--min-period"),
                Arguments.of(List.of("--min-period", "0"), "--min-period"),
                Arguments.of(List.of("--max-period", "0"), "--max-period"),
                Arguments.of(List.of("--max-period", "-3"), "--max-period"),
                Arguments.of(List.of("--min-copies", "-1"), "--min-copies"),
                Arguments.of(List.of("--min-copies", "two"), "--min-copies"),
                Arguments.of(List.of("--min-length", "-5"), "--min-length"),
                Arguments.of(List.of("--min-purity", "1.5"), "--min-purity"),
                Arguments.of(List.of("--min-purity", "-0.1"), "--min-purity"),
                Arguments.of(List.of("--min-period", "10", "--max-period", "5"), "--min-period"),
                Arguments.of(List.of("--shard", "0/4"), "--shard"),
                Arguments.of(List.of("--shard", "5/4"), "--shard"),
                Arguments.of(List.of("--shard", "1/0"), "--shard"),
                Arguments.of(List.of("--shard", "x"), "--shard"),
                Arguments.of(List.of("--threads", "0"), "--threads"),
                Arguments.of(List.of("-", "-"), "standard input (-) is given more than once"),
                Arguments.of(List.of("--region", "contig1:0-10"), "--region"),
                Arguments.of(List.of("--region", "contig1:50-10"), "--region"));
    }

    @ParameterizedTest
    @MethodSource("usageErrors")
    void usageErrorsExitWithTwo(List<String> options, String mentioned) throws IOException {
        write("g.fa", bytes(CLEAN));
        Path bed = write("previous.bed", bytes(PREVIOUS));
        List<String> before = listing();
        List<String> args = new ArrayList<>(List.of("scan", "--bed", "previous.bed", "--tsv", "new.tsv"));
        args.addAll(options);
        args.add("g.fa");
        Cli.Result r = Cli.stria(dir, args.toArray(String[]::new));
        assertThat(r.exit()).as(options + ": " + r.err()).isEqualTo(2);
        assertThat(r.err()).as(options.toString()).contains(mentioned).doesNotContain("Exception").doesNotContain("\tat ");
        assertThat(Files.readString(bed)).isEqualTo(PREVIOUS);
        assertThat(listing()).isEqualTo(before);
    }

    @Test
    void unknownRegionIsAnInputError() throws IOException {
        write("g.fa", bytes(CLEAN));
        for (String region : List.of("contig9", "contig1:1-999999")) {
            Cli.Result r = Cli.stria(dir, "scan", "--region", region, "g.fa");
            assertThat(r.exit()).as(region + ": " + r.err()).isEqualTo(1);
            assertOneLine(r.err(), region);
            assertThat(r.err()).contains(region);
        }
    }

    @Test
    void anOutputPathThatIsAnInputIsRefused() throws IOException {
        Path genome = write("g.fa", bytes(CLEAN));
        for (String option : List.of("--bed", "-o", "--tsv")) {
            Cli.Result r = Cli.stria(dir, "scan", option, "g.fa", "g.fa");
            assertThat(r.exit()).as(option + ": " + r.err()).isNotZero();
            assertThat(Files.readString(genome, StandardCharsets.ISO_8859_1)).as(option).isEqualTo(CLEAN);
        }
    }

    // ---- outputs that cannot be written ----

    @Test
    void outputInAMissingOrUnwritableDirectory() throws IOException {
        write("g.fa", bytes(CLEAN));
        write("plain-file", bytes("not a directory\n"));
        List<String> targets = new ArrayList<>(List.of("no/such/dir/out.bed", "plain-file/out.bed"));
        Path locked = Files.createDirectory(dir.resolve("locked"));
        Files.setPosixFilePermissions(locked, java.nio.file.attribute.PosixFilePermissions.fromString("r-xr-xr-x"));
        if (!Files.isWritable(locked)) {
            targets.add("locked/out.bed");
        }
        for (String target : targets) {
            for (String option : List.of("--bed", "--tsv")) {
                List<String> before = listing();
                Cli.Result r = Cli.stria(dir, "scan", option, target, "g.fa");
                assertThat(r.exit()).as(target + ": " + r.err()).isEqualTo(1);
                assertOneLine(r.err(), target);
                assertThat(r.err()).contains(target);
                assertThat(listing()).isEqualTo(before);
            }
        }
        Files.setPosixFilePermissions(locked, java.nio.file.attribute.PosixFilePermissions.fromString("rwxr-xr-x"));
        try (Stream<Path> s = Files.list(locked)) {
            assertThat(s.toList()).isEmpty();
        }
    }

    // ---- interruption ----

    @Test
    void sigtermOrSigintMidRunLeavesNothingBehind() throws Exception {
        Path genome = dir.resolve("big.fa");
        Random rnd = new Random(3);
        try (OutputStream out = new java.io.BufferedOutputStream(Files.newOutputStream(genome), 1 << 20)) {
            byte[] line = new byte[61];
            line[60] = '\n';
            for (int c = 0; c < 6; c++) {
                out.write(bytes(">chunk" + c + "\n"));
                for (int l = 0; l < 5_000_000 / 60; l++) {
                    for (int i = 0; i < 60; i++) {
                        line[i] = (byte) "ACGT".charAt(rnd.nextInt(4));
                    }
                    out.write(line);
                }
            }
        }
        Path tmp = Files.createDirectory(dir.resolve("tmp"));
        Files.write(dir.resolve("previous.bed"), bytes(PREVIOUS));
        // from the file, from standard input (spooled to a temporary file that must go too), and Ctrl-C
        for (String run : List.of("file", "stdin", "interrupt")) {
            boolean stdin = run.equals("stdin");
            List<String> before = listing();
            ProcessBuilder pb = new ProcessBuilder(Cli.projectDir().resolve("scripts/stria").toString(), "scan",
                    "--threads", "1", "--bed", "previous.bed", "--tsv", "new.tsv", stdin ? "-" : "big.fa")
                    .directory(dir.toFile())
                    .redirectOutput(ProcessBuilder.Redirect.DISCARD)
                    .redirectError(dir.resolve("tmp/stderr.txt").toFile());
            if (stdin) {
                pb.redirectInput(genome.toFile());
            }
            pb.environment().put("STRIA_CLASSPATH", System.getProperty("java.class.path"));
            pb.environment().put("STRIA_JAVA_OPTS", "-Djava.io.tmpdir=" + tmp);
            pb.environment().put("TMPDIR", tmp.toString());
            Process p = pb.start();
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
            while (!temporaryOutputExists() && p.isAlive() && System.nanoTime() < deadline) {
                Thread.sleep(20);
            }
            assertThat(p.isAlive()).as("scan still running when interrupted (%s)", Files.readString(dir.resolve("tmp/stderr.txt")))
                    .isTrue();
            assertThat(temporaryOutputExists()).as("temporary outputs appeared").isTrue();
            Thread.sleep(300);
            if (run.equals("interrupt")) {
                // the launcher execs java, so the pid is the JVM's: SIGINT is what Ctrl-C sends
                assertThat(new ProcessBuilder("kill", "-INT", Long.toString(p.pid())).start().waitFor()).isZero();
            } else {
                p.destroy();
            }
            assertThat(p.waitFor(60, TimeUnit.SECONDS)).as("exits after SIGTERM").isTrue();
            assertThat(p.exitValue()).as("interrupted, not successful").isNotZero();
            assertThat(listing()).as("outputs after SIGTERM").isEqualTo(before);
            assertThat(Files.readString(dir.resolve("previous.bed"))).isEqualTo(PREVIOUS);
            try (Stream<Path> s = Files.list(tmp)) {
                assertThat(s.map(x -> x.getFileName().toString()).toList()).as("temporary files").containsOnly("stderr.txt");
            }
        }
    }

    private boolean temporaryOutputExists() throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.anyMatch(p -> p.getFileName().toString().startsWith(".stria-tmp-"));
        }
    }
}
