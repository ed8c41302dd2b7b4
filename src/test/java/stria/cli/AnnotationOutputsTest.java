package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import htsjdk.tribble.AbstractFeatureReader;
import htsjdk.tribble.gff.Gff3Codec;
import htsjdk.tribble.gff.Gff3Feature;
import htsjdk.tribble.readers.LineIterator;
import htsjdk.tribble.readers.TabixReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.testutil.Cli;

/**
 * The GFF3 and the STR catalogue of one scan of an invented genome (planted repeats, N gaps, and a contig
 * whose name needs GFF3 escaping and that starts and ends in repeats) against outside checks: Debian's
 * genometools validator with the Sequence Ontology, htsjdk's GFF3 codec (the intervals of the BED),
 * tabix, and samtools faidx (the flanks are the genome's bases).
 */
@Tag("slow")
class AnnotationOutputsTest {
    @TempDir
    static Path dir;
    static Path genome;
    static final String ODD = "odd;name=x,y%z";

    @BeforeAll
    static void scan() throws IOException {
        Path sim = dir.resolve("sim.fa");
        Cli.Result r = Cli.exec(dir, null, List.of("java", "-cp", System.getProperty("java.class.path"),
                "stria.sim.GenomeSimulator", "--seed", "17", "--size", "600000", "--contigs", "2", "--satellites", "1",
                "--satellite-length", "20000", "--gaps", "3", "--out", sim.toString(), "--truth",
                dir.resolve("sim.truth.tsv").toString()));
        assertThat(r.exit()).as(r.err()).isZero();
        // a contig that begins and ends inside repeats, so flanks are cut short at both contig ends
        String odd = "ACACACACACACACACACAC" + "GATTCGGCATCGATCGGACTTAGCTAGGCTTACGATCGA" + "T".repeat(30);
        genome = dir.resolve("g.fa");
        Files.writeString(genome, Files.readString(sim) + ">" + ODD + "\n" + odd + "\n");
        r = Cli.stria(dir, "scan", "-q", "--bed", "g.bed", "--gff", "g.gff", "--catalog", "g.cat.tsv",
                genome.toString());
        assertThat(r.exit()).as(r.err()).isZero();
    }

    static List<String[]> data(Path p) throws IOException {
        List<String[]> out = new ArrayList<>();
        for (String l : Files.readAllLines(p, StandardCharsets.UTF_8)) {
            if (!l.startsWith("#")) {
                out.add(l.split("\t", -1));
            }
        }
        return out;
    }

    @Tag("tools")
    @Test
    void genometoolsAcceptsTheGffWithSequenceOntologyTypes() {
        Cli.needTool("gt");
        Cli.Result r = Cli.exec(dir, null, List.of("gt", "gff3validator", "-typecheck", "so",
                dir.resolve("g.gff").toString()));
        assertThat(r.exit()).as(r.out() + r.err()).isZero();
        assertThat(r.out() + r.err()).contains("input is valid GFF3");
    }

    @Test
    void htsjdkReadsTheGffBackIntoTheIntervalsOfTheBed() throws IOException {
        List<String> fromBed = new ArrayList<>();
        Map<String, Integer> periods = new HashMap<>();
        for (String[] f : data(dir.resolve("g.bed"))) {
            // BED is 0-based, end exclusive; GFF3 1-based, inclusive
            String key = f[0] + "\t" + (Long.parseLong(f[1]) + 1) + "\t" + f[2];
            fromBed.add(key);
            periods.put(key, Integer.parseInt(f[6]));
        }
        List<String> fromGff = new ArrayList<>();
        Set<String> ids = new HashSet<>();
        Set<String> types = new HashSet<>();
        try (AbstractFeatureReader<Gff3Feature, LineIterator> reader = AbstractFeatureReader.getFeatureReader(
                dir.resolve("g.gff").toString(), null, new Gff3Codec(), false)) {
            for (Gff3Feature f : reader.iterator()) {
                String key = f.getContig() + "\t" + f.getStart() + "\t" + f.getEnd();
                fromGff.add(key);
                assertThat(ids.add(f.getID())).as("unique ID %s", f.getID()).isTrue();
                int p = periods.getOrDefault(key, -1);
                assertThat(f.getAttribute("period")).containsExactly(String.valueOf(p));
                // the documented rule; terms and ids checked against genometools' so.obo above
                String want = p == 1 ? "tandem_repeat" : p <= 10 ? "microsatellite" : p <= 40 ? "minisatellite"
                        : "satellite_DNA";
                assertThat(f.getType()).isEqualTo(want);
                types.add(f.getType());
            }
        }
        assertThat(fromGff).hasSizeGreaterThan(60).containsExactlyElementsOf(fromBed);
        assertThat(types).contains("tandem_repeat", "microsatellite", "minisatellite", "satellite_DNA");
        assertThat(fromGff).anyMatch(k -> k.startsWith(ODD + "\t"));
        String text = Files.readString(dir.resolve("g.gff"));
        assertThat(text).startsWith("##gff-version 3\n").contains("##sequence-region odd%3Bname%3Dx%2Cy%25z 1 89\n");
    }

    @Tag("tools")
    @Test
    void bgzfGffHasATabixIndexThatQueriesLikeThePlainFile() throws IOException {
        Cli.needTool("tabix");
        Cli.Result r = Cli.stria(dir, "scan", "-q", "--gff", "z.gff.gz", genome.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        assertThat(dir.resolve("z.gff.gz.tbi")).exists();
        String got = Cli.tool(dir, "tabix", dir.resolve("z.gff.gz").toString(), "ctg01:50001-150000");
        StringBuilder want = new StringBuilder();
        for (String l : Files.readAllLines(dir.resolve("g.gff"))) {
            String[] f = l.split("\t");
            if (f[0].equals("ctg01") && Long.parseLong(f[4]) >= 50001 && Long.parseLong(f[3]) <= 150000) {
                want.append(l).append('\n');
            }
        }
        assertThat(want.length()).isGreaterThan(0);
        assertThat(got).isEqualTo(want.toString());
        // and through the library's own tabix reader
        try (TabixReader t = new TabixReader(dir.resolve("z.gff.gz").toString())) {
            TabixReader.Iterator it = t.query("ctg02", 1, 1000000);
            int n = 0;
            for (String l = it.next(); l != null; l = it.next()) {
                assertThat(l).startsWith("ctg02\t");
                n++;
            }
            assertThat(n).isGreaterThan(0);
        }
    }

    @Tag("tools")
    @Test
    void catalogueFlanksAreTheGenomesBasesAndIdsAreUnique() throws IOException {
        Cli.needTool("samtools");
        List<String[]> rows = data(dir.resolve("g.cat.tsv"));
        String[] columns = rows.remove(0);
        assertThat(String.join("\t", columns)).startsWith("id\tchrom\tstart\tend\tperiod\tmotif\tmotif_class\tcopies"
                + "\tpurity\tinterruptions\tleft_flank\tright_flank");
        assertThat(rows).hasSizeGreaterThan(30);
        Set<String> ids = new HashSet<>();
        Map<String, Long> lengths = new HashMap<>();
        for (String l : Files.readAllLines(genome.resolveSibling("g.cat.tsv"))) {
            if (l.startsWith("#contig: ")) {
                String[] f = l.substring(9).split(" ");
                lengths.put(f[0], Long.parseLong(f[1]));
            }
        }
        Cli.tool(dir, "samtools", "faidx", genome.toString());
        List<String> regions = new ArrayList<>();
        List<String> expected = new ArrayList<>();
        for (String[] f : rows) {
            assertThat(ids.add(f[0])).as("unique id %s", f[0]).isTrue();
            assertThat(Integer.parseInt(f[4])).isBetween(1, 6);
            long s = Long.parseLong(f[2]), e = Long.parseLong(f[3]), len = lengths.get(f[1]);
            assertThat(f[0]).isEqualTo(f[1] + ":" + (s + 1) + "-" + e + ":" + f[6]);
            long ls = Math.max(0, s - 50), re = Math.min(len, e + 50);
            assertThat(f[10]).hasSize((int) (s - ls));
            assertThat(f[11]).hasSize((int) (re - e));
            if (f[1].equals(ODD)) {
                continue; // samtools region syntax cannot name it; its flanks are checked by length above
            }
            if (s > ls) {
                regions.add(f[1] + ":" + (ls + 1) + "-" + s);
                expected.add(f[10]);
            }
            if (re > e) {
                regions.add(f[1] + ":" + (e + 1) + "-" + re);
                expected.add(f[11]);
            }
            // the motif in reference phase: an exact locus starts with its motif
            if (f[8].equals("1.000")) {
                regions.add(f[1] + ":" + (s + 1) + "-" + (s + Integer.parseInt(f[4])));
                expected.add(f[5]);
            }
        }
        List<String> cmd = new ArrayList<>(List.of("samtools", "faidx", genome.toString()));
        cmd.addAll(regions);
        String fasta = Cli.tool(dir, cmd.toArray(String[]::new));
        List<String> got = new ArrayList<>();
        StringBuilder cur = null;
        for (String l : fasta.split("\n")) {
            if (l.startsWith(">")) {
                if (cur != null) {
                    got.add(cur.toString());
                }
                cur = new StringBuilder();
            } else {
                cur.append(l);
            }
        }
        got.add(cur.toString());
        assertThat(got).hasSize(expected.size());
        for (int i = 0; i < got.size(); i++) {
            assertThat(expected.get(i)).as(regions.get(i)).isEqualToIgnoringCase(got.get(i));
        }
        // the odd contig starts and ends in repeats: the flanks there are empty
        assertThat(rows).anyMatch(f -> f[1].equals(ODD) && f[2].equals("0") && f[10].isEmpty());
        assertThat(rows).anyMatch(f -> f[1].equals(ODD) && f[3].equals("89") && f[11].isEmpty());
        assertThat(Files.readString(dir.resolve("g.cat.tsv"))).contains("#caution: research-grade");
    }

    @Test
    void shardsMergeToTheSingleRunInBothFormats() throws IOException {
        Path work = Files.createDirectories(dir.resolve("shards"));
        List<String> gffs = new ArrayList<>();
        List<String> cats = new ArrayList<>();
        for (int k = 1; k <= 3; k++) {
            Cli.Result r = Cli.stria(work, "scan", "-q", "--shard", k + "/3", "--window", "9000", "--threads", "2",
                    "--gff", "s" + k + ".gff", "--catalog", "s" + k + ".tsv", genome.toString());
            assertThat(r.exit()).as(r.err()).isZero();
            gffs.add(0, "s" + k + ".gff");
            cats.add(0, "s" + k + ".tsv");
        }
        List<String> args = new ArrayList<>(List.of("merge", "--gff", "m.gff"));
        args.addAll(gffs);
        Cli.Result r = Cli.stria(work, args.toArray(String[]::new));
        assertThat(r.exit()).as(r.err()).isZero();
        args = new ArrayList<>(List.of("merge", "--catalog", "m.tsv"));
        args.addAll(cats);
        r = Cli.stria(work, args.toArray(String[]::new));
        assertThat(r.exit()).as(r.err()).isZero();
        assertThat(withoutCommand(work.resolve("m.gff"))).isEqualTo(withoutCommand(dir.resolve("g.gff")));
        assertThat(withoutCommand(work.resolve("m.tsv"))).isEqualTo(withoutCommand(dir.resolve("g.cat.tsv")));
        r = Cli.stria(work, "merge", "--bed", "x.bed", "s1.gff", "s2.gff", "s3.gff");
        assertThat(r.exit()).isEqualTo(1);
        assertThat(r.err()).contains("merge it with --gff");
    }

    static String withoutCommand(Path p) throws IOException {
        return Files.readString(p).replaceAll("(?m)^#command: .*\n", "");
    }
}
