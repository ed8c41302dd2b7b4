package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import htsjdk.samtools.util.BlockCompressedOutputStream;
import htsjdk.tribble.readers.TabixReader;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import stria.StriaException;
import stria.io.ContigInfo;
import stria.out.ResultHeader;

/** {@code stria merge} on hand-made shard results: the output, and the sets merge must refuse. */
class MergeCommandTest {
    private static final String SETTINGS = "mode=imperfect min-period=1 max-period=2000 min-copies=2";
    private static final List<ContigInfo> GENOME = List.of(new ContigInfo("chrA", 5000),
            new ContigInfo("chrB", 3000));
    private static final String COLUMNS = "chrom\tstart\tend\tperiod\tmotif\tmotif_class\tcopies\tlength\tpurity"
            + "\tmismatches\tinsertions\tdeletions\tscore\tevalue\tentropy";

    // shard 1 owns chrA:0-3000, shard 2 chrA:3000-5000, shard 3 chrB (which has no loci)
    private static final List<List<String>> BED = List.of(
            List.of("chrA\t10\t40\tCA\t1000\t.\t2\t15.00\tAC", "chrA\t2990\t3050\tAAT\t933\t.\t3\t20.00\tAAT"),
            List.of("chrA\t3000\t3012\tA\t1000\t.\t1\t12.00\tA"),
            List.of());
    private static final List<List<String>> TSV = List.of(
            List.of("chrA\t10\t40\t2\tCA\tAC\t15.00\t30\t1.000\t0\t0\t0\t51.8\t2.1e-07\t1.000"),
            List.of(),
            List.of("chrB\t7\t19\t1\tT\tA\t12.00\t12\t1.000\t0\t0\t0\t18.0\t4.5e+00\t0.000"));

    @TempDir
    Path dir;

    @Test
    void bedShardsGivenInAnyOrderJoinInShardOrder() throws IOException {
        List<String> files = write("s", BED, null, 3, Compression.PLAIN);
        Path out = dir.resolve("all.bed");

        merge("--bed", out.toString(), files.get(2), files.get(0), files.get(1));

        List<String> expected = new ArrayList<>(header("merge --bed " + out + " " + files.get(2) + " "
                + files.get(0) + " " + files.get(1)));
        BED.forEach(expected::addAll);
        assertThat(Files.readAllLines(out)).containsExactlyElementsOf(expected);
        assertThat(Files.readString(out)).doesNotContain("#shard").endsWith(BED.get(1).get(0) + "\n");
    }

    @Test
    void tsvKeepsOneColumnRowAndAcceptsEmptyShards() throws IOException {
        List<String> files = write("t", TSV, COLUMNS, 3, Compression.PLAIN);
        Path out = dir.resolve("all.tsv");

        merge("--tsv", out.toString(), files.get(0), files.get(1), files.get(2));

        List<String> lines = Files.readAllLines(out);
        List<String> data = lines.subList(lines.indexOf(COLUMNS) + 1, lines.size());
        assertThat(lines).filteredOn(COLUMNS::equals).hasSize(1);
        assertThat(data).containsExactly(TSV.get(0).get(0), TSV.get(2).get(0));
        assertThat(lines.get(0)).isEqualTo("#stria 0.1.0");
        assertThat(lines.get(1)).startsWith("#command: merge --tsv ");
    }

    @Test
    void bgzfAndGzipInputsGiveTheSameBytesAsPlainOnes() throws IOException {
        List<String> plain = write("p", BED, null, 3, Compression.PLAIN);
        List<String> bgzf = write("b", BED, null, 3, Compression.BGZF);
        List<String> gzip = write("g", BED, null, 3, Compression.GZIP);
        Path a = dir.resolve("a.bed");
        Path b = dir.resolve("b.bed");
        Path c = dir.resolve("c.bed");

        merge("--bed", a.toString(), plain.get(0), plain.get(1), plain.get(2));
        merge("--bed", b.toString(), bgzf.get(0), bgzf.get(1), bgzf.get(2));
        merge("--bed", c.toString(), gzip.get(0), plain.get(1), bgzf.get(2));

        assertThat(dataLines(b)).isEqualTo(dataLines(a)).isEqualTo(dataLines(c)).hasSize(3);
    }

    @Test
    void bgzfBedOutputGetsATabixIndexThatAnswersQueries() throws IOException {
        List<String> files = write("x", BED, null, 3, Compression.BGZF);
        Path out = dir.resolve("all.bed.gz");

        merge("--bed", out.toString(), files.get(0), files.get(1), files.get(2));

        assertThat(dir.resolve("all.bed.gz.tbi")).exists();
        try (TabixReader r = new TabixReader(out.toString())) {
            TabixReader.Iterator it = r.query("chrA", 3001, 3010); // 1-based, inclusive
            List<String> hits = new ArrayList<>();
            for (String l = it.next(); l != null; l = it.next()) {
                hits.add(l);
            }
            assertThat(hits).containsExactly(BED.get(0).get(1), BED.get(1).get(0));
        }
        try (var left = Files.list(dir)) {
            assertThat(left.map(p -> p.getFileName().toString())).noneMatch(n -> n.endsWith(".tmp"));
        }
    }

    @Test
    void standardOutputTakesTheMergedResult() {
        List<String> files = write("o", BED, null, 3, Compression.PLAIN);
        ByteArrayOutputStream captured = new ByteArrayOutputStream();
        PrintStream old = System.out;
        System.setOut(new PrintStream(captured, true, StandardCharsets.UTF_8));
        try {
            merge("--bed", "-", files.get(0), files.get(1), files.get(2));
        } finally {
            System.setOut(old);
        }
        assertThat(captured.toString(StandardCharsets.UTF_8)).startsWith("#stria 0.1.0\n#command: merge --bed - ")
                .endsWith(BED.get(1).get(0) + "\n");
    }

    @Test
    void refusesAnIncompleteSetAndNamesTheMissingShards() {
        List<String> f = write("i", List.of(List.of(), List.of(), List.of(), List.of(), List.of(), List.of()),
                null, 6, Compression.PLAIN);
        assertRefused(List.of(f.get(0), f.get(3), f.get(5)), "shards 2-3, 5 of 6 missing", f.get(0));
        assertRefused(List.of(f.get(0), f.get(1), f.get(2), f.get(3), f.get(4)), "shard 6 of 6 missing", f.get(4));
    }

    @Test
    void refusesAShardGivenTwice() throws IOException {
        List<String> f = write("d", BED, null, 3, Compression.PLAIN);
        Path copy = dir.resolve("copy-of-1.bed");
        Files.copy(Path.of(f.get(0)), copy);
        assertRefused(List.of(f.get(0), f.get(1), copy.toString(), f.get(2)), "both shard 1/3", copy.toString());
    }

    @Test
    void refusesShardsOfRunsSplitDifferently() {
        List<String> three = write("n3", BED, null, 3, Compression.PLAIN);
        List<String> four = write("n4", List.of(List.of(), List.of(), List.of(), List.of()), null, 4,
                Compression.PLAIN);
        assertRefused(List.of(three.get(0), three.get(1), four.get(2)), "shard 3/4", four.get(2));
    }

    @Test
    void refusesShardsOfDifferentInputs() {
        List<String> f = write("in", BED, null, 3, Compression.PLAIN);
        String other = writeOne("other.bed", new ResultHeader("0.1.0", "scan", SETTINGS,
                List.of(new ContigInfo("chrA", 5000), new ContigInfo("chrB", 3001)), "2/3",
                List.of()), null, List.of(), Compression.PLAIN);
        assertRefused(List.of(f.get(0), other, f.get(2)), "different inputs", other);
    }

    @Test
    void refusesShardsMadeWithDifferentSettings() {
        List<String> f = write("se", BED, null, 3, Compression.PLAIN);
        String other = writeOne("other.bed", new ResultHeader("0.1.0", "scan", SETTINGS.replace("2000", "500"),
                GENOME, "3/3", List.of()), null, List.of(), Compression.PLAIN);
        assertRefused(List.of(f.get(0), f.get(1), other), "different settings", other);
    }

    @Test
    void refusesAResultThatIsNotAShard() {
        List<String> f = write("ns", BED, null, 3, Compression.PLAIN);
        String whole = writeOne("whole.bed", new ResultHeader("0.1.0", "scan", SETTINGS, GENOME, null, List.of()),
                null, BED.get(0), Compression.PLAIN);
        assertRefused(List.of(f.get(0), whole, f.get(2)), "no #shard line", whole);
    }

    @Test
    void refusesBedMixedWithTsvAndTheWrongFormatOption() {
        List<String> bed = write("mb", BED, null, 3, Compression.PLAIN);
        List<String> tsv = write("mt", TSV, COLUMNS, 3, Compression.PLAIN);
        assertRefused(List.of(bed.get(0), tsv.get(1), bed.get(2)), "is BED but", tsv.get(1));
        Path out = dir.resolve("out.tsv");
        assertThatThrownBy(() -> merge("--tsv", out.toString(), bed.get(0), bed.get(1), bed.get(2)))
                .isInstanceOf(StriaException.class).hasMessageContaining("--bed");
        assertThat(out).doesNotExist();
    }

    @Test
    void refusesFilesThatAreMissingOrNotResults() throws IOException {
        Path junk = dir.resolve("junk.txt");
        Files.writeString(junk, "hello\n");
        assertRefused(List.of(junk.toString()), "not a stria result", junk.toString());
        String absent = dir.resolve("absent.bed").toString();
        assertRefused(List.of(absent), "cannot read", absent);
    }

    @Test
    void refusesShardsWhoseLociOverlapOrGoBackwards() {
        List<List<String>> overlap = List.of(BED.get(0), List.of(BED.get(0).get(1), BED.get(1).get(0)), List.of());
        List<String> f = write("ov", overlap, null, 3, Compression.PLAIN);
        assertRefused(f, "overlap or are out of order", f.get(1));

        List<List<String>> backwards = List.of(List.of(BED.get(1).get(0)), List.of(BED.get(0).get(0)), List.of());
        List<String> g = write("bw", backwards, null, 3, Compression.PLAIN);
        assertRefused(g, "comes after", g.get(0));

        List<List<String>> foreign = List.of(List.of("chrZ\t1\t20\tA\t1000\t.\t1\t19.00\tA"), List.of(), List.of());
        List<String> h = write("fo", foreign, null, 3, Compression.PLAIN);
        assertRefused(h, "not a locus of this genome", h.get(0));
    }

    private void assertRefused(List<String> files, String fragment, String namedFile) {
        Path out = dir.resolve("refused.bed");
        List<String> args = new ArrayList<>(List.of("--bed", out.toString()));
        args.addAll(files);
        assertThatThrownBy(() -> merge(args.toArray(String[]::new)))
                .isInstanceOf(StriaException.class)
                .hasMessageContaining(fragment)
                .hasMessageContaining(namedFile)
                .satisfies(e -> assertThat(e.getMessage()).doesNotContain("\n"));
        assertThat(out).doesNotExist();
    }

    static void merge(String... args) {
        MergeCommand c = new MergeCommand();
        new CommandLine(c).parseArgs(args);
        c.call();
    }

    private static List<String> header(String command) {
        return new ResultHeader("0.1.0", command, SETTINGS, GENOME, null, List.of()).lines();
    }

    private static List<String> dataLines(Path p) throws IOException {
        return Files.readAllLines(p).stream().filter(l -> !l.startsWith("#")).toList();
    }

    enum Compression { PLAIN, GZIP, BGZF }

    private List<String> write(String stem, List<List<String>> data, String columns, int n, Compression c) {
        List<String> files = new ArrayList<>();
        for (int k = 1; k <= data.size(); k++) {
            ResultHeader h = new ResultHeader("0.1.0", "scan --shard " + k + "/" + n, SETTINGS, GENOME, k + "/" + n,
                    List.of());
            String name = stem + "-" + k + (columns == null ? ".bed" : ".tsv") + (c == Compression.PLAIN ? "" : ".gz");
            files.add(writeOne(name, h, columns, data.get(k - 1), c));
        }
        return files;
    }

    /** What scan --shard writes last: the data line count and SHA-256 (FIPS 180-4) of the data lines. */
    static String closingLine(List<String> data) {
        try {
            java.security.MessageDigest md = java.security.MessageDigest.getInstance("SHA-256");
            data.forEach(l -> md.update((l + "\n").getBytes(StandardCharsets.US_ASCII)));
            return "#end: loci=" + data.size() + " sha256="
                    + java.util.HexFormat.of().formatHex(md.digest()).substring(0, 16);
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new AssertionError(e);
        }
    }

    private String writeOne(String name, ResultHeader h, String columns, List<String> data, Compression c) {
        Path p = dir.resolve(name);
        StringBuilder sb = new StringBuilder();
        h.lines().forEach(l -> sb.append(l).append('\n'));
        if (columns != null) {
            sb.append(columns).append('\n');
        }
        data.forEach(l -> sb.append(l).append('\n'));
        sb.append(closingLine(data)).append('\n');
        try (OutputStream raw = Files.newOutputStream(p);
             OutputStream out = switch (c) {
                 case PLAIN -> raw;
                 case GZIP -> new GZIPOutputStream(raw);
                 case BGZF -> new BlockCompressedOutputStream(raw, (Path) null);
             }) {
            out.write(sb.toString().getBytes(StandardCharsets.US_ASCII));
        } catch (IOException e) {
            throw new AssertionError(e);
        }
        return p.toString();
    }
}
