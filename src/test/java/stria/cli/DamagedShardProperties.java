package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import stria.testutil.InProcess;
import stria.testutil.SmallGenome;

/**
 * A shard must prove it is whole: merge refuses every shard cut short (at any line or byte), with a byte
 * flipped anywhere that matters, emptied of its loci or with a row that is not a locus of the genome, with
 * exit 1, one line naming the file, and the output left as it was. Good shards still merge into the data
 * lines of one whole scan. The checksum is SHA-256 (FIPS 180-4); an empty body digests to e3b0c442...
 */
class DamagedShardProperties {
    static Path dir;
    static Path genome;
    static final String[] FORMATS = {"tsv", "bed"};

    @BeforeContainer
    static void shards() throws IOException {
        dir = Files.createTempDirectory("stria-damaged");
        genome = SmallGenome.write(dir.resolve("g.fa"), 11);
        for (String f : FORMATS) {
            for (int k = 1; k <= 3; k++) {
                InProcess.Result r = InProcess.stria("scan", "--shard", k + "/3", "--" + f,
                        dir.resolve("s" + k + "." + f).toString(), genome.toString());
                assertThat(r.exit()).as(r.err()).isZero();
            }
            InProcess.Result r = InProcess.stria("scan", "--" + f, dir.resolve("whole." + f).toString(),
                    genome.toString());
            assertThat(r.exit()).as(r.err()).isZero();
        }
    }

    @AfterContainer
    static void clean() throws IOException {
        try (var files = Files.walk(dir)) {
            files.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }

    private static byte[] shard(String format, int k) throws IOException {
        return Files.readAllBytes(dir.resolve("s" + k + "." + format));
    }

    /** Merges the three shards with shard {@code k} replaced by {@code damaged}; asserts the refusal. */
    private static void refused(String format, int k, byte[] damaged, String what) throws IOException {
        Path bad = dir.resolve("bad." + format);
        Files.write(bad, damaged);
        Path out = dir.resolve("out." + format);
        Files.writeString(out, "earlier result\n");
        List<String> args = new ArrayList<>(List.of("merge", "--" + format, out.toString()));
        for (int i = 1; i <= 3; i++) {
            args.add(i == k ? bad.toString() : dir.resolve("s" + i + "." + format).toString());
        }
        InProcess.Result r = InProcess.stria(args.toArray(String[]::new));
        assertThat(r.exit()).as(what + ": " + r.err()).isEqualTo(1);
        assertThat(r.errLines()).as(r.err()).isEqualTo(1);
        assertThat(r.err()).as(what).contains(bad.toString()).doesNotContain("internal error");
        assertThat(Files.readString(out)).as(what).isEqualTo("earlier result\n");
        assertThat(dir.resolve("out.bed.gz")).doesNotExist();
    }

    @Example
    void goodShardsMergeIntoTheWholeScan() throws IOException {
        for (String f : FORMATS) {
            Path out = dir.resolve("good." + f);
            InProcess.Result r = InProcess.stria("merge", "--" + f, out.toString(), dir.resolve("s3." + f).toString(),
                    dir.resolve("s1." + f).toString(), dir.resolve("s2." + f).toString());
            assertThat(r.exit()).as(r.err()).isZero();
            assertThat(data(Files.readAllLines(out))).isEqualTo(data(Files.readAllLines(dir.resolve("whole." + f))))
                    .isNotEmpty();
            assertThat(Files.readAllLines(out)).noneMatch(l -> l.startsWith("#end"));
        }
    }

    private static List<String> data(List<String> lines) {
        return lines.stream().filter(l -> !l.startsWith("#")).toList();
    }

    @Property(tries = 150)
    void aShardCutShortIsRefused(@ForAll @IntRange(min = 1, max = 3) int k, @ForAll @IntRange(max = 1) int f,
                                 @ForAll @IntRange(max = 1_000_000) int cut) throws IOException {
        byte[] s = shard(FORMATS[f], k);
        int keep = cut % (s.length - 1); // keeps at most all but the final line feed and one more byte
        byte[] damaged = java.util.Arrays.copyOf(s, keep);
        refused(FORMATS[f], k, damaged, "cut to " + keep + " of " + s.length + " bytes");
    }

    @Property(tries = 100)
    void aShardCutAtEveryLineIsRefused(@ForAll @IntRange(min = 1, max = 3) int k, @ForAll @IntRange(max = 1) int f,
                                       @ForAll @IntRange(max = 10_000) int at) throws IOException {
        List<String> lines = Files.readAllLines(dir.resolve("s" + k + "." + FORMATS[f]), StandardCharsets.ISO_8859_1);
        int keep = at % lines.size();
        String text = lines.subList(0, keep).stream().map(l -> l + "\n").reduce("", String::concat);
        refused(FORMATS[f], k, text.getBytes(StandardCharsets.ISO_8859_1), "first " + keep + " lines");
    }

    /** A line feed turned into a lone carriage return, once read as a line end (found by a random seed). */
    @Example
    void aLineFeedTurnedIntoACarriageReturnIsRefused() throws IOException {
        for (String f : FORMATS) {
            byte[] s = shard(f, 2);
            String text = new String(s, StandardCharsets.ISO_8859_1);
            int at = text.indexOf("\n#shard: ") + 1;
            at = text.indexOf('\n', at);
            byte[] damaged = s.clone();
            damaged[at] = '\r';
            refused(f, 2, damaged, "line feed at " + at + " made a carriage return");
        }
    }

    /**
     * A digit of a #contig line of the first shard damaged (into a carriage return, or a letter): the header
     * was parsed, to tell a comparison from a scan, before any check, so merge stopped with an internal
     * error (NumberFormatException) carrying the raw carriage return (found by an exhaustive sweep of
     * header bytes; the flipped-byte property reaches it too, rarely).
     */
    @Example
    void aDamagedContigLengthInTheFirstShardIsRefused() throws IOException {
        for (String f : FORMATS) {
            byte[] s = shard(f, 1);
            String text = new String(s, StandardCharsets.ISO_8859_1);
            int line = text.indexOf("\n#contig: ") + 1;
            int digit = text.indexOf(' ', line + "#contig: ".length()) + 2;
            for (byte b : new byte[] {'\r', 'A', ' ', '-'}) {
                byte[] damaged = s.clone();
                damaged[digit] = b;
                refused(f, 1, damaged, "byte " + digit + " of a #contig line made " + b);
            }
            byte[] cut = s.clone();
            cut[text.indexOf('\n', line)] = '\r';
            refused(f, 1, cut, "the line feed of a #contig line made a carriage return");
        }
    }

    @Property(tries = 200)
    void aFlippedByteIsRefused(@ForAll @IntRange(min = 1, max = 3) int k, @ForAll @IntRange(max = 1) int f,
                               @ForAll @IntRange(max = 1_000_000) int at, @ForAll @IntRange(min = 1, max = 255) int xor)
            throws IOException {
        byte[] s = shard(FORMATS[f], k);
        String text = new String(s, StandardCharsets.ISO_8859_1);
        // the #command line is informational (it differs between shards by design): not damage that matters
        int cmd = text.indexOf("\n#command: ") + 1;
        int cmdEnd = text.indexOf('\n', cmd);
        int pos = at % (s.length - (cmdEnd - cmd));
        if (pos >= cmd) {
            pos += cmdEnd - cmd;
        }
        byte[] damaged = s.clone();
        damaged[pos] ^= (byte) xor;
        if (pos == s.length - 1 && damaged[pos] == '\r') {
            return; // a CRLF end on the last line reads as the same line
        }
        refused(FORMATS[f], k, damaged, "byte " + pos + " xor " + xor);
    }

    @Example
    void aHeaderOnlyShardIsRefused() throws IOException {
        for (String f : FORMATS) {
            for (int k = 1; k <= 3; k++) {
                List<String> lines = Files.readAllLines(dir.resolve("s" + k + "." + f));
                List<String> kept = lines.stream().filter(l -> l.startsWith("#") && !l.startsWith("#end")
                        || l.startsWith("chrom\t")).toList();
                if (kept.size() < lines.size() - 1) {
                    refused(f, k, (String.join("\n", kept) + "\n").getBytes(StandardCharsets.UTF_8), "header only");
                }
            }
        }
    }

    /** Rows that are not loci, in a shard whose closing line was made to agree: the rows themselves are checked. */
    @Example
    void rowsThatAreNotLociAreRefusedEvenWhenSealed() throws Exception {
        int k = 1;
        while (Files.readAllLines(dir.resolve("s" + k + ".tsv")).stream().noneMatch(l -> l.startsWith("ctg"))) {
            k++;
        }
        List<String> lines = new ArrayList<>(Files.readAllLines(dir.resolve("s" + k + ".tsv")));
        int row = lines.indexOf(lines.stream().filter(l -> l.startsWith("ctg")).findFirst().orElseThrow());
        String[] f = lines.get(row).split("\t");
        List<String> fourColumns = new ArrayList<>(lines);
        fourColumns.set(row, String.join("\t", f[0], f[1], f[2], f[3]));
        refused("tsv", k, resealed(fourColumns), "a row of 4 columns");
        List<String> pastEnd = new ArrayList<>(lines);
        f[2] = "999999999";
        pastEnd.set(row, String.join("\t", f));
        refused("tsv", k, resealed(pastEnd), "an end past the contig");
    }

    /** The lines with a closing line computed here: count and SHA-256 of the data lines. */
    private static byte[] resealed(List<String> lines) throws Exception {
        MessageDigest md = MessageDigest.getInstance("SHA-256");
        long n = 0;
        StringBuilder sb = new StringBuilder();
        for (String l : lines) {
            if (l.startsWith("#end")) {
                continue;
            }
            sb.append(l).append('\n');
            if (!l.startsWith("#") && !l.startsWith("chrom\t")) {
                md.update((l + "\n").getBytes(StandardCharsets.UTF_8));
                n++;
            }
        }
        sb.append("#end: loci=").append(n).append(" sha256=").append(HexFormat.of().formatHex(md.digest()), 0, 16)
                .append('\n');
        return sb.toString().getBytes(StandardCharsets.UTF_8);
    }

    @Example
    void anEmptyBodyDigestsAsSha256OfNothing() throws Exception {
        // FIPS 180-4 test vector: SHA-256 of the empty message begins e3b0c44298fc1c14
        assertThat(new stria.out.ResultSeal().closingLine()).isEqualTo("#end: loci=0 sha256=e3b0c44298fc1c14");
    }
}
