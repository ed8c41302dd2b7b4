package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.compare.CompareRow;
import stria.sim.AssemblyPairSimulator;
import stria.sim.GenomeSimulator;
import stria.testutil.Cli;

/**
 * {@code stria compare} as a user runs it, on an invented pair (B: about 100 loci expanded or contracted,
 * background edits, a contig split, one reverse-complemented, two joined, all renamed): the same bytes for
 * any thread count, with scan results reused, and split into parts and merged; the same file twice; the
 * results it must refuse and the bad input that must leave nothing behind.
 */
@Tag("slow")
class CompareCommandTest {
    @TempDir
    static Path dir;
    static Path a;
    static Path b;
    static GenomeSimulator.Genome genome;
    static AssemblyPairSimulator.Pair pair;

    @BeforeAll
    static void pair() throws IOException {
        genome = GenomeSimulator.generate("--seed", "5", "--size", "1200000", "--contigs", "4", "--gaps", "3",
                "--lower", "6");
        pair = AssemblyPairSimulator.make(genome, AssemblyPairSimulator.Options.defaults(7));
        a = dir.resolve("a.fa");
        try (OutputStream os = Files.newOutputStream(a)) {
            for (int c = 0; c < genome.names().size(); c++) {
                os.write((">" + genome.names().get(c) + "\n").getBytes());
                os.write(genome.sequences().get(c));
                os.write('\n');
            }
        }
        b = dir.resolve("b.fa");
        AssemblyPairSimulator.write(pair, b, dir.resolve("truth.tsv"));
    }

    private static int run(String... args) {
        return Main.run(args);
    }

    /** The lines of a file but its #command line (which says how it was made, not what it holds). */
    private static List<String> content(Path p) throws IOException {
        List<String> out = new ArrayList<>();
        for (String l : Files.readAllLines(p)) {
            if (!l.startsWith("#command: ")) {
                out.add(l);
            }
        }
        return out;
    }

    private static List<String[]> rows(Path tsv) throws IOException {
        List<String[]> out = new ArrayList<>();
        for (String l : Files.readAllLines(tsv)) {
            if (!l.startsWith("#") && !l.startsWith("chrom\t")) {
                out.add(l.split("\t", -1));
            }
        }
        return out;
    }

    @Test
    void sameBytesForAnyThreadCountWithResultsReusedAndSplitAndMerged() throws IOException {
        Path one = dir.resolve("t1.tsv");
        Path two = dir.resolve("t2.tsv");
        Path aBed = dir.resolve("a1.bed");
        Path bBed = dir.resolve("b1.bed");
        Path sum = dir.resolve("s1.tsv");
        assertThat(run("compare", "-q", "--threads", "1", "--tsv", one.toString(), "--a-bed", aBed.toString(),
                "--b-bed", bBed.toString(), "--summary", sum.toString(), a.toString(), b.toString())).isZero();
        assertThat(run("compare", "-q", "--threads", "2", "--tsv", two.toString(), a.toString(), b.toString())).isZero();
        assertThat(content(two)).isEqualTo(content(one));

        // the columns, in the order checks rely on, and what the rows say
        List<String> lines = Files.readAllLines(one);
        assertThat(lines).anyMatch(l -> l.startsWith("#other-input: fingerprint="))
                .anyMatch(l -> l.startsWith("#input: fingerprint="))
                .anyMatch(l -> l.startsWith("#settings: mode=imperfect") && l.contains("anchors=6"));
        assertThat(lines.stream().filter(l -> l.startsWith("chrom\t")).findFirst().orElseThrow())
                .startsWith("chrom\tstart\tend\tperiod\tmotif_class\tother_chrom\tother_start\tother_end\tother_strand"
                        + "\tlength_change\tstatus\t");
        List<String[]> rows = rows(one);
        int changed = 0;
        int minus = 0;
        for (String[] f : rows) {
            assertThat(f).hasSize(19);
            if (f[10].equals("unplaced")) {
                assertThat(f[5]).isEqualTo(".");
                assertThat(f[9]).isEqualTo(".");
            } else if (!f[10].equals("new")) {
                int change = Integer.parseInt(f[7]) - Integer.parseInt(f[6]) - (Integer.parseInt(f[2]) - Integer.parseInt(f[1]));
                assertThat(Integer.parseInt(f[9])).isEqualTo(change);
                assertThat(f[10].equals("same")).isEqualTo(change == 0);
                changed += change != 0 ? 1 : 0;
                minus += f[8].equals("-") ? 1 : 0;
            }
        }
        assertThat(changed).isGreaterThan(50);
        assertThat(minus).isGreaterThan(10);
        long bedA = Files.readAllLines(aBed).stream().filter(l -> !l.startsWith("#")).count();
        assertThat(bedA).isEqualTo(rows.stream().filter(f -> f[10].equals("changed") || f[10].equals("lost")).count());
        List<String> summary = Files.readAllLines(sum);
        assertThat(summary.get(0)).isEqualTo("status\tp1\tp2_6\tp7_99\tp100\tall");
        assertThat(summary.get(summary.size() - 1)).endsWith("\t" + rows.size());

        // reused scan results give the same bytes
        Path aTsv = dir.resolve("a.scan.tsv");
        Path bTsv = dir.resolve("b.scan.tsv");
        assertThat(run("scan", "-q", "--tsv", aTsv.toString(), a.toString())).isZero();
        assertThat(run("scan", "-q", "--tsv", bTsv.toString(), b.toString())).isZero();
        Path reused = dir.resolve("t3.tsv");
        assertThat(run("compare", "-q", "--a-result", aTsv.toString(), "--b-result", bTsv.toString(), "--tsv",
                reused.toString(), a.toString(), b.toString())).isZero();
        assertThat(content(reused)).isEqualTo(content(one));

        // three parts, merged in any order: the unsplit bytes, BEDs and summary included
        List<String> parts = new ArrayList<>();
        for (int k = 1; k <= 3; k++) {
            Path p = dir.resolve("part" + k + ".tsv" + (k == 2 ? ".gz" : ""));
            assertThat(run("compare", "-q", "--shard", k + "/3", "--a-result", aTsv.toString(), "--b-result",
                    bTsv.toString(), "--tsv", p.toString(), a.toString(), b.toString())).isZero();
            parts.add(p.toString());
        }
        Path merged = dir.resolve("merged.tsv");
        Path mA = dir.resolve("ma.bed");
        Path mB = dir.resolve("mb.bed");
        Path mS = dir.resolve("ms.tsv");
        assertThat(run("merge", "--tsv", merged.toString(), "--a-bed", mA.toString(), "--b-bed", mB.toString(),
                "--summary", mS.toString(), parts.get(2), parts.get(0), parts.get(1))).isZero();
        assertThat(content(merged)).isEqualTo(content(one));
        assertThat(content(mA)).isEqualTo(content(aBed));
        assertThat(content(mB)).isEqualTo(content(bBed));
        assertThat(Files.readAllLines(mS)).isEqualTo(summary);

        // an incomplete set is refused and leaves nothing
        Path bad = dir.resolve("bad.tsv");
        assertThat(run("merge", "--tsv", bad.toString(), parts.get(0), parts.get(1))).isEqualTo(1);
        assertThat(bad).doesNotExist();

        // a part ends with the closing line over its rows; one cut short or edited is refused by name
        List<String> part1 = Files.readAllLines(Path.of(parts.get(0)));
        assertThat(part1.get(part1.size() - 1)).matches("#end: loci=\\d+ sha256=[0-9a-f]{16}");
        long rowsOfPart1 = part1.stream().filter(l -> !l.startsWith("#")).count() - 1;
        assertThat(part1.get(part1.size() - 1)).startsWith("#end: loci=" + rowsOfPart1 + " ");
        Path cut = dir.resolve("cut.tsv");
        Files.write(cut, part1.subList(0, part1.size() - 2));
        Cli.Result r = Cli.stria(dir, "merge", "--tsv", bad.toString(), cut.toString(), parts.get(1), parts.get(2));
        assertThat(r.exit()).isEqualTo(1);
        assertThat(r.err()).contains("cut.tsv is incomplete");
        List<String> edited = new ArrayList<>(part1);
        int row = edited.indexOf(CompareRow.HEADER) + 1;
        assertThat(edited.get(row)).doesNotStartWith("#");
        String[] f = edited.get(row).split("\t", -1);
        f[10] = f[10].equals("changed") ? "same" : "changed"; // the status column, as a hand edit would
        edited.set(row, String.join("\t", f));
        Path damaged = dir.resolve("damaged.tsv");
        Files.write(damaged, edited);
        r = Cli.stria(dir, "merge", "--tsv", bad.toString(), damaged.toString(), parts.get(1), parts.get(2));
        assertThat(r.exit()).isEqualTo(1);
        assertThat(r.err()).contains("damaged.tsv is damaged");
        assertThat(bad).doesNotExist();
    }

    @Test
    void theSameFileTwiceIsSameThroughout() throws IOException {
        Path out = dir.resolve("self.tsv");
        assertThat(run("compare", "-q", "--tsv", out.toString(), a.toString(), a.toString())).isZero();
        List<String[]> rows = rows(out);
        assertThat(rows).hasSizeGreaterThan(100);
        for (String[] f : rows) {
            assertThat(f[10]).as(String.join(" ", f)).isEqualTo("same");
            assertThat(f[5] + ":" + f[6] + "-" + f[7] + f[8]).isEqualTo(f[0] + ":" + f[1] + "-" + f[2] + "+");
            assertThat(f[16]).isEqualTo(f[17]);
        }
    }

    @Test
    void refusesResultsOfAnotherGenomeOrOtherSettingsAndBadInputLeavingNothing() throws IOException {
        Path sub = Files.createDirectories(dir.resolve("refuse"));
        Path aTsv = sub.resolve("a.exact.tsv");
        assertThat(run("scan", "-q", "--exact", "--tsv", aTsv.toString(), a.toString())).isZero();
        Path out = sub.resolve("out.tsv");

        Cli.Result r = Cli.stria(sub, "compare", "-q", "--a-result", aTsv.toString(), "--tsv", out.toString(),
                a.toString(), b.toString());
        assertThat(r.exit()).isEqualTo(1);
        assertThat(r.err().strip()).doesNotContain("\n").contains("a.exact.tsv").contains("other settings");

        r = Cli.stria(sub, "compare", "-q", "--exact", "--b-result", aTsv.toString(), "--tsv", out.toString(),
                a.toString(), b.toString());
        assertThat(r.exit()).isEqualTo(1);
        assertThat(r.err().strip()).doesNotContain("\n").contains("is not a result of");

        Path broken = sub.resolve("broken.fa");
        Files.writeString(broken, ">x\nACGTACGT\nACGT!CGT\n");
        r = Cli.stria(sub, "compare", "-q", "--tsv", out.toString(), "--a-bed", sub.resolve("x.bed").toString(),
                a.toString(), broken.toString());
        assertThat(r.exit()).isEqualTo(1);
        assertThat(r.err().strip()).doesNotContain("\n").contains("broken.fa");

        r = Cli.stria(sub, "compare", "--shard", "1/2", a.toString(), b.toString());
        assertThat(r.exit()).isEqualTo(2);
        assertThat(r.err()).contains("--shard needs --a-result and --b-result");
        try (Stream<Path> left = Files.list(sub)) {
            assertThat(left.map(p -> p.getFileName().toString())).containsExactlyInAnyOrder("a.exact.tsv", "broken.fa");
        }
    }
}
