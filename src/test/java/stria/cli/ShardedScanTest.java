package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import htsjdk.samtools.util.BlockCompressedInputStream;
import htsjdk.tribble.readers.TabixReader;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.testutil.Cli;

/**
 * A split scan, merged, is the single scan: shards 1..N of the demo genome (2 Mb in three contigs, a
 * 200 kb satellite array across position 1,000,000 of ctg01, which is where a cut on the 1 Mb grain
 * falls) are scanned with {@code scripts/stria scan --shard K/N} and joined with {@code stria merge}, in the
 * default (imperfect) mode and with {@code --exact}.
 */
@Tag("slow")
class ShardedScanTest {
    private static final Path DEMO = Cli.projectDir().resolve("testdata/demo.fa.gz");

    @TempDir
    static Path dir;

    private static byte[] singleBed;
    private static byte[] singleTsv;
    private static byte[] singleExactBed;

    @BeforeAll
    static void scanWholeGenomeOnce() throws IOException {
        Cli.Result r = Cli.stria(dir, "scan", "-q", "--bed", "single.bed", "--tsv", "single.tsv", DEMO.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        singleBed = Files.readAllBytes(dir.resolve("single.bed"));
        singleTsv = Files.readAllBytes(dir.resolve("single.tsv"));
        assertThat(dataLines(singleBed)).as("the demo genome has loci on every contig")
                .anyMatch(l -> l.startsWith("ctg01\t")).anyMatch(l -> l.startsWith("ctg03\t"));
        Cli.Result e = Cli.stria(dir, "scan", "-q", "--exact", "--bed", "exact.bed", DEMO.toString());
        assertThat(e.exit()).as(e.err()).isZero();
        singleExactBed = Files.readAllBytes(dir.resolve("exact.bed"));
    }

    @Test
    void twoShardsCutThroughTheSatelliteArrayAndMergeToTheSingleRun() throws IOException {
        // the satellite array is planted at ctg01:951599-1151589; with two shards the cut is at 1,000,000
        assertThat(partitionLines(2)).contains("1\t2\t1000000\tctg01:1-1000000");
        assertSplitEqualsSingle(2, "");
    }

    @Test
    void threeShardsInBgzfMergeToTheSingleRunWithATabixIndex() throws IOException {
        assertSplitEqualsSingle(3, ".gz");
        Path merged = dir.resolve("n3/merged.bed.gz");
        assertThat(dir.resolve("n3/merged.bed.gz.tbi")).exists();
        List<String> expected = new ArrayList<>();
        for (String l : dataLines(singleBed)) {
            String[] f = l.split("\t");
            if (f[0].equals("ctg02") && Integer.parseInt(f[2]) > 100_000 && Integer.parseInt(f[1]) < 200_000) {
                expected.add(l);
            }
        }
        List<String> hits = new ArrayList<>();
        try (TabixReader t = new TabixReader(merged.toString())) {
            TabixReader.Iterator it = t.query("ctg02", 100_001, 200_000);
            for (String l = it.next(); l != null; l = it.next()) {
                hits.add(l);
            }
        }
        assertThat(hits).isNotEmpty().containsExactlyElementsOf(expected);
    }

    @Test
    void moreShardsThanContigsAndGrainsLeavesEmptyShardsThatStillMerge() throws IOException {
        List<String> plan = partitionLines(7);
        assertThat(plan).anyMatch(l -> l.endsWith("\t0\t-"));
        assertSplitEqualsSingle(7, "");
        Path empty = dir.resolve("n7/shard-" + firstEmptyShard(plan) + ".tsv");
        List<String> lines = Files.readAllLines(empty);
        assertThat(lines.get(lines.size() - 2)).startsWith("chrom\tstart\tend\t");
        // closed with no loci: SHA-256 of the empty message begins e3b0c44298fc1c14 (FIPS 180-4 test vector)
        assertThat(lines.get(lines.size() - 1)).isEqualTo("#end: loci=0 sha256=e3b0c44298fc1c14");
    }

    @Test
    void exactRunsSplitAndMergeToo() throws IOException {
        Path work = Files.createDirectories(dir.resolve("exact4"));
        List<String> beds = new ArrayList<>();
        for (int k = 1; k <= 4; k++) {
            Cli.Result r = Cli.stria(work, "scan", "-q", "--exact", "--shard", k + "/4", "--bed", "s" + k + ".bed",
                    DEMO.toString());
            assertThat(r.exit()).as(r.err()).isZero();
            beds.add("s" + k + ".bed");
        }
        merge(work, "--bed", "merged.bed", beds);
        byte[] merged = Files.readAllBytes(work.resolve("merged.bed"));
        assertThat(dataSection(merged)).isEqualTo(dataSection(singleExactBed));
        assertThat(headerWithoutCommand(merged)).isEqualTo(headerWithoutCommand(singleExactBed));
    }

    @Test
    void refusesIncompleteDuplicatedAndMismatchedSets() throws IOException {
        Path n = scanShards("refuse", 3, "", "-q", "--exact");
        String s1 = n.resolve("shard-1.bed").toString();
        String s2 = n.resolve("shard-2.bed").toString();
        String s3 = n.resolve("shard-3.bed").toString();

        assertRefused(n, List.of("merge", "--bed", "out.bed", s1, s3), "shard 2 of 3 missing", "shard-3.bed");
        assertRefused(n, List.of("merge", "--bed", "out.bed", s1, s2, s2, s3), "both shard 2/3", "shard-2.bed");

        Cli.Result other = Cli.stria(n, "scan", "-q", "--shard", "2/3", "--exact", "--min-length", "40", "--bed",
                "other.bed", DEMO.toString());
        assertThat(other.exit()).as(other.err()).isZero();
        assertRefused(n, List.of("merge", "--bed", "out.bed", s1, n.resolve("other.bed").toString(), s3),
                "different settings", "other.bed");

        Cli.Result four = Cli.stria(n, "scan", "-q", "--shard", "4/4", "--exact", "--bed", "four.bed",
                DEMO.toString());
        assertThat(four.exit()).as(four.err()).isZero();
        assertRefused(n, List.of("merge", "--bed", "out.bed", s1, s2, s3, n.resolve("four.bed").toString()),
                "shard 4/4", "four.bed");

        assertRefused(n, List.of("merge", "--bed", "out.bed", s1, s2, dir.resolve("exact.bed").toString()),
                "no #shard line", "exact.bed");
        assertRefused(n, List.of("merge", "--tsv", "out.tsv", s1, s2, s3), "not TSV", "shard-1.bed");
        assertThat(n.resolve("out.bed")).doesNotExist();
        assertThat(n.resolve("out.tsv")).doesNotExist();
    }

    /**
     * A BGZF part whose first block has a damaged BSIZE or ISIZE field (SAM/BAM specification section 4.1)
     * is refused in one line naming it, not with a stack trace or a false out-of-memory advice.
     */
    @Test
    void refusesDamagedBgzfParts() throws IOException {
        Path n = scanShards("damaged", 2, ".gz", "-q", "--exact");
        byte[] clean = Files.readAllBytes(n.resolve("shard-2.bed.gz"));
        int blockEnd = ((clean[16] & 0xFF) | (clean[17] & 0xFF) << 8) + 1;
        byte[] shortBlock = clean.clone();
        shortBlock[16] = 20;
        shortBlock[17] = 0;
        byte[] hugeBlock = clean.clone();
        hugeBlock[blockEnd - 1] = 0x7F;
        for (byte[] damaged : List.of(shortBlock, hugeBlock)) {
            Path part = Files.write(n.resolve("shard-2-damaged.bed.gz"), damaged);
            assertRefused(n, List.of("merge", "--bed", "out.bed", n.resolve("shard-1.bed.gz").toString(),
                    part.toString()), "cannot read", "shard-2-damaged.bed.gz");
            assertThat(n.resolve("out.bed")).doesNotExist();
        }
    }

    private static void assertRefused(Path work, List<String> args, String fragment, String file) {
        Cli.Result r = Cli.stria(work, args.toArray(String[]::new));
        assertThat(r.exit()).as(r.err()).isEqualTo(1);
        assertThat(r.err()).startsWith("stria: ").contains(fragment).contains(file)
                .satisfies(e -> assertThat(e.strip().lines().count()).as(e).isEqualTo(1));
    }

    /** Scans shards 1..n into dir/n{n}/shard-K.{bed,tsv}{suffix}, merges both formats, compares. */
    private void assertSplitEqualsSingle(int n, String suffix) throws IOException {
        Path work = scanShards("n" + n, n, suffix, "-q");
        List<String> beds = new ArrayList<>();
        List<String> tsvs = new ArrayList<>();
        // given in reverse: merge orders shards by their headers, not by their names
        for (int k = n; k >= 1; k--) {
            beds.add(work.resolve("shard-" + k + ".bed" + suffix).toString());
            tsvs.add(work.resolve("shard-" + k + ".tsv" + suffix).toString());
        }
        merge(work, "--bed", "merged.bed" + suffix, beds);
        merge(work, "--tsv", "merged.tsv" + suffix, tsvs);

        byte[] bed = read(work.resolve("merged.bed" + suffix));
        byte[] tsv = read(work.resolve("merged.tsv" + suffix));
        assertThat(dataSection(bed)).as("BED data lines of %d shards", n).isEqualTo(dataSection(singleBed));
        assertThat(dataSection(tsv)).as("TSV data lines and column row of %d shards", n)
                .isEqualTo(dataSection(singleTsv));
        assertThat(headerWithoutCommand(bed)).isEqualTo(headerWithoutCommand(singleBed));
        assertThat(headerWithoutCommand(tsv)).isEqualTo(headerWithoutCommand(singleTsv));
        assertThat(new String(bed, StandardCharsets.UTF_8)).contains("#command: merge --bed merged.bed")
                .doesNotContain("#shard");
    }

    private static Path scanShards(String name, int n, String suffix, String... extra) throws IOException {
        Path work = Files.createDirectories(dir.resolve(name));
        for (int k = 1; k <= n; k++) {
            List<String> args = new ArrayList<>(List.of("scan", "--shard", k + "/" + n, "--bed",
                    "shard-" + k + ".bed" + suffix, "--tsv", "shard-" + k + ".tsv" + suffix));
            args.addAll(List.of(extra));
            args.add(DEMO.toString());
            Cli.Result r = Cli.stria(work, args.toArray(String[]::new));
            assertThat(r.exit()).as("shard %d/%d: %s", k, n, r.err()).isZero();
            assertThat(new String(read(work.resolve("shard-" + k + ".bed" + suffix)), StandardCharsets.UTF_8))
                    .contains("#shard: " + k + "/" + n + "\n");
        }
        return work;
    }

    private static void merge(Path work, String format, String out, List<String> files) {
        List<String> args = new ArrayList<>(List.of("merge", format, out));
        args.addAll(files);
        Cli.Result r = Cli.stria(work, args.toArray(String[]::new));
        assertThat(r.exit()).as(r.err()).isZero();
    }

    private static List<String> partitionLines(int n) {
        Cli.Result r = Cli.stria(dir, "partition", "--shards", String.valueOf(n), DEMO.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        return r.out().lines().toList();
    }

    private static int firstEmptyShard(List<String> plan) {
        for (String l : plan) {
            if (l.endsWith("\t0\t-")) {
                return Integer.parseInt(l.split("\t")[0]);
            }
        }
        throw new AssertionError("no empty shard in " + plan);
    }

    /** The file's bytes, decompressed when it is block-gzipped. */
    static byte[] read(Path p) throws IOException {
        try (InputStream raw = Files.newInputStream(p)) {
            byte[] all = raw.readAllBytes();
            if (all.length >= 2 && (all[0] & 0xff) == 0x1f && (all[1] & 0xff) == 0x8b) {
                try (InputStream in = new BlockCompressedInputStream(new java.io.ByteArrayInputStream(all))) {
                    ByteArrayOutputStream out = new ByteArrayOutputStream();
                    in.transferTo(out);
                    return out.toByteArray();
                }
            }
            return all;
        }
    }

    /** Everything after the # lines, as bytes: the TSV column row and the data lines. */
    static byte[] dataSection(byte[] file) {
        int i = 0;
        while (i < file.length && file[i] == '#') {
            while (i < file.length && file[i] != '\n') {
                i++;
            }
            i++;
        }
        return java.util.Arrays.copyOfRange(file, Math.min(i, file.length), file.length);
    }

    static List<String> dataLines(byte[] file) throws IOException {
        List<String> out = new ArrayList<>();
        try (BufferedReader r = new BufferedReader(new InputStreamReader(new java.io.ByteArrayInputStream(file),
                StandardCharsets.UTF_8))) {
            for (String l = r.readLine(); l != null; l = r.readLine()) {
                if (!l.startsWith("#")) {
                    out.add(l);
                }
            }
        }
        return out;
    }

    private static List<String> headerWithoutCommand(byte[] file) throws IOException {
        List<String> out = new ArrayList<>();
        for (String l : new String(file, StandardCharsets.UTF_8).split("\n")) {
            if (!l.startsWith("#")) {
                break;
            }
            if (!l.startsWith("#command: ")) {
                out.add(l);
            }
        }
        return out;
    }
}
