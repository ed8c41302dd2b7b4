package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.testutil.Cli;
import stria.testutil.InProcess;
import stria.testutil.SmallGenome;

/**
 * Where outputs may not go and how they must reach where they may: never over an input or one of its
 * indexes (report included), never two outputs into one file however it is spelled, straight into FIFOs and
 * devices (a rename would put a regular file in their place), and never a success on standard output that
 * was not written. Every refusal: exit 1, one line, nothing replaced.
 */
class OutputSafetyTest {
    @TempDir
    Path dir;
    Path genome;

    @BeforeEach
    void genome() throws IOException {
        genome = SmallGenome.write(dir.resolve("g.fa"), 3);
    }

    private Path scanTsv(String name, String... extra) {
        Path tsv = dir.resolve(name);
        String[] args = Stream.concat(Stream.of("scan", "--tsv", tsv.toString()),
                Stream.concat(Stream.of(extra), Stream.of(genome.toString()))).toArray(String[]::new);
        InProcess.Result r = InProcess.stria(args);
        assertThat(r.exit()).as(r.err()).isZero();
        return tsv;
    }

    private static void refused(InProcess.Result r, String... words) {
        assertThat(r.exit()).as(r.err()).isEqualTo(1);
        assertThat(r.errLines()).as(r.err()).isEqualTo(1);
        assertThat(r.err()).contains(words);
    }

    @Test
    void reportDoesNotWriteOverItsInput() throws IOException {
        Path tsv = scanTsv("r.tsv");
        byte[] before = Files.readAllBytes(tsv);
        refused(InProcess.stria("report", "--html", tsv.toString(), tsv.toString()), "is the input");
        refused(InProcess.stria("report", "--html", dir + "/./r.tsv", tsv.toString()), "is the input");
        assertThat(Files.readAllBytes(tsv)).isEqualTo(before);
        // a BGZF shard read by report, named again as the page
        Path shard = scanTsv("s1.tsv.gz", "--shard", "1/2");
        byte[] shardBefore = Files.readAllBytes(shard);
        Files.createDirectory(dir.resolve("x"));
        refused(InProcess.stria("report", "--html", dir + "/x/../s1.tsv.gz", "--summary", shard.toString()),
                "is the input");
        assertThat(Files.readAllBytes(shard)).isEqualTo(shardBefore);
    }

    @Test
    void indexesOfInputsAreNotOutputs() throws IOException {
        Path fai = dir.resolve("g.fa.fai");
        Files.writeString(fai, faidx(Files.readAllLines(genome)));
        byte[] before = Files.readAllBytes(fai);
        refused(InProcess.stria("scan", "--tsv", fai.toString(), genome.toString()), "index", "g.fa.fai");
        assertThat(Files.readAllBytes(fai)).isEqualTo(before);
    }

    @Test
    void oneFileUnderTwoSpellingsIsRefused() throws IOException {
        Files.createDirectory(dir.resolve("sub"));
        Files.createSymbolicLink(dir.resolve("link"), dir.resolve("sub"));
        Path o = dir.resolve("o.txt");
        Files.writeString(o, "keep me\n");
        Files.createLink(dir.resolve("hard.txt"), o);
        for (String[] pair : new String[][] {
            {"--bed", o.toString(), "--tsv", dir + "/./o.txt"},
            {"--bed", o.toString(), "--masked", dir + "/sub/../o.txt"},
            {"--tsv", o.toString(), "--bed", dir + "//o.txt"},
            {"--bed", o.toString(), "--tsv", dir + "/hard.txt"},
            // link/.. is the parent of sub, i.e. dir, as the kernel resolves it
            {"--bed", dir + "/sub/x.bed", "--tsv", dir + "/link/../sub/x.bed"},
            {"--bed", dir + "/b.bed.gz", "--tsv", dir + "/./b.bed.gz.tbi"}}) {
            String[] args = Stream.concat(Stream.of("scan"), Stream.concat(Stream.of(pair),
                    Stream.of(genome.toString()))).toArray(String[]::new);
            InProcess.Result r = InProcess.stria(args);
            refused(r, "output");
            assertThat(Files.readString(o)).as(String.join(" ", pair)).isEqualTo("keep me\n");
            assertThat(dir.resolve("sub/x.bed")).doesNotExist();
            assertThat(dir.resolve("b.bed.gz")).doesNotExist();
        }
    }

    @Test
    void aFifoIsWrittenIntoNotReplaced() throws Exception {
        Path fifo = dir.resolve("f.bed");
        Cli.Result mk = Cli.exec(dir, null, List.of("mkfifo", fifo.toString()));
        Assumptions.assumeTrue(mk.exit() == 0, "mkfifo not available: " + mk.err());
        CompletableFuture<byte[]> read = CompletableFuture.supplyAsync(() -> {
            try (InputStream in = Files.newInputStream(fifo)) {
                return in.readAllBytes();
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        });
        InProcess.Result r = InProcess.stria("scan", "--bed", fifo.toString(), genome.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        byte[] got = read.get(30, TimeUnit.SECONDS);
        assertThat(Files.isRegularFile(fifo)).as("the FIFO is still a FIFO").isFalse();
        assertThat(Files.exists(fifo)).isTrue();
        InProcess.Result plain = InProcess.stria("scan", "--bed", dir.resolve("plain.bed").toString(),
                genome.toString());
        assertThat(plain.exit()).isZero();
        // the same data lines (the #command lines differ by the output name)
        assertThat(dataLines(new String(got, StandardCharsets.UTF_8)))
                .isEqualTo(dataLines(Files.readString(dir.resolve("plain.bed")))).isNotEmpty();
        try (Stream<Path> left = Files.list(dir)) {
            assertThat(left.map(p -> p.getFileName().toString())).noneMatch(n -> n.startsWith(".stria-tmp"));
        }
    }

    @Test
    void aDeviceIsWrittenIntoNotReplaced() throws IOException {
        // a null device of our own (root), so that a failing run could not damage the system's /dev/null
        Path dev = dir.resolve("null");
        Cli.Result mk = Cli.exec(dir, null, List.of("mknod", dev.toString(), "c", "1", "3"));
        Assumptions.assumeTrue(mk.exit() == 0, "cannot make a device node (needs root): " + mk.err());
        InProcess.Result r = InProcess.stria("scan", "--tsv", dev.toString(), "--bed", dev + ".gz",
                genome.toString());
        if (r.exit() != 0 && r.err().contains("ermission denied")) {
            Assumptions.assumeTrue(false, "device nodes do not open here (nodev mount)");
        }
        assertThat(r.exit()).as(r.err()).isZero();
        assertThat(Files.isRegularFile(dev)).as("the device is still a device").isFalse();
        assertThat(Files.size(dev)).isZero();
    }

    /** The .fai of a FASTA with full lines of 60 bases and LF ends (samtools faidx's columns). */
    private static String faidx(List<String> lines) {
        StringBuilder fai = new StringBuilder();
        long offset = 0;
        String name = null;
        long length = 0;
        long start = 0;
        for (String l : lines) {
            if (l.startsWith(">")) {
                if (name != null) {
                    fai.append(name).append('\t').append(length).append('\t').append(start).append("\t60\t61\n");
                }
                name = l.substring(1);
                length = 0;
                start = offset + l.length() + 1;
            } else {
                length += l.length();
            }
            offset += l.length() + 1;
        }
        return fai.append(name).append('\t').append(length).append('\t').append(start).append("\t60\t61\n")
                .toString();
    }

    private static List<String> dataLines(String text) {
        return text.lines().filter(l -> !l.startsWith("#")).toList();
    }

    /** Standard output at its end (/dev/full) or closed: exit 1 and one line, for every command that prints. */
    @Tag("slow")
    @Test
    void writeErrorsOnStandardOutputAreFailures() throws IOException {
        Assumptions.assumeTrue(Files.exists(Path.of("/dev/full")), "no /dev/full here");
        Path s1 = scanTsv("s1.tsv", "--shard", "1/2");
        Path s2 = scanTsv("s2.tsv", "--shard", "2/2");
        Path whole = scanTsv("w.tsv");
        String launcher = Cli.projectDir().resolve("scripts/stria").toString();
        for (String command : new String[] {
            "scan " + genome, "scan --tsv - " + genome, "merge --tsv - " + s1 + " " + s2,
            "report --summary " + whole, "report --html - " + whole, "partition --shards 2 " + genome,
            "--help"}) {
            for (String redirect : new String[] {">/dev/full", ">&-"}) {
                Cli.Result r = Cli.exec(dir, null, List.of("sh", "-c", launcher + " " + command + " " + redirect));
                assertThat(r.exit()).as(command + " " + redirect + ": " + r.err()).isEqualTo(1);
                assertThat(r.err().strip().lines().count()).as(r.err()).isEqualTo(1);
                assertThat(r.err()).contains("standard output");
                if (redirect.equals(">/dev/full") && !command.equals("--help")) {
                    assertThat(r.err()).contains("no space left on device");
                }
            }
        }
    }
}
