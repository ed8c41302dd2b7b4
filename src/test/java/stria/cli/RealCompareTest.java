package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.zip.GZIPInputStream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.testutil.Cli;

/**
 * {@code stria compare} on real pairs of bacterial assemblies from Debian's ragout-examples, every
 * {@code changed} row re-checked from the sequences with {@code bedtools getfasta} (strand-aware):
 * <ul>
 *   <li>the 20 bases on each side of A's repeat and of B's (read on the strand B holds the locus on) are
 *       homologous: where both repeats are at least 90 % pure, at most 4 of the 40 differ within one strain
 *       and 12 between two (strains of H. pylori are unusually diverse); at most 15 where an impure array's
 *       end is less sharp; unrelated sequence differs in about 30;
 *   <li>B's stretch is A's length plus {@code length_change}; where both are at least 90 % pure it is A's
 *       stretch with that many bases taken out or put in at one place, up to a few substitutions (at most
 *       2 + 10 % of the shorter); impure arrays may differ by copies rearranged.
 * </ul>
 * E. coli K-12 MG1655: the reference against an assembly in contigs of the same strain, where nearly
 * every placed locus is {@code same}. H. pylori: two strains (G27, SJM180), whose short tracts really
 * differ in length (phase variation is well known in this species; general knowledge, from memory).
 */
@Tag("tools")
class RealCompareTest {
    private static final Path EXAMPLES = Path.of("/usr/share/doc/ragout/examples");
    private static final int FLANK = 20;

    @TempDir
    Path dir;

    @Test
    void ecoliReferenceAgainstContigsOfTheSameStrainIsNearlyAllSame() throws IOException {
        List<String[]> rows = compareAndRecheck(EXAMPLES.resolve("E.Coli/references/MG1655-K12.fasta.gz"),
                EXAMPLES.resolve("E.Coli/mg1655_contigs.fasta.gz"), 4);
        Map<String, Integer> n = count(rows);
        int placed = n.getOrDefault("same", 0) + n.getOrDefault("changed", 0) + n.getOrDefault("lost", 0);
        int aRows = placed + n.getOrDefault("unplaced", 0);
        System.out.println("E. coli: " + n);
        assertThat(aRows).isGreaterThan(150);
        assertThat(n.getOrDefault("same", 0) / (double) placed).isGreaterThanOrEqualTo(0.95);
        assertThat(placed / (double) aRows).isGreaterThanOrEqualTo(0.85);
    }

    @Test
    void pyloriStrainsDifferInShortTracts() throws IOException {
        List<String[]> rows = compareAndRecheck(EXAMPLES.resolve("H.Pylori/references/G27.fasta.gz"),
                EXAMPLES.resolve("H.Pylori/references/SJM180.fasta.gz"), 12);
        Map<String, Integer> n = count(rows);
        System.out.println("H. pylori G27 / SJM180: " + n);
        long shortTracts = rows.stream().filter(f -> f[10].equals("changed") && Integer.parseInt(f[3]) <= 6).count();
        assertThat(n.getOrDefault("changed", 0)).isGreaterThanOrEqualTo(10);
        assertThat(shortTracts).isGreaterThanOrEqualTo(3);
    }

    private static Map<String, Integer> count(List<String[]> rows) {
        Map<String, Integer> n = new LinkedHashMap<>();
        for (String[] f : rows) {
            n.merge(f[10], 1, Integer::sum);
        }
        return n;
    }

    /** Compares, then re-checks every changed row with bedtools; returns the rows. */
    private List<String[]> compareAndRecheck(Path aGz, Path bGz, int maxFlankDiff) throws IOException {
        for (Path p : List.of(aGz, bGz)) {
            if (!Files.isReadable(p)) {
                Cli.needTool("no-such-tool-" + p.getFileName()); // skips, or fails under CI
            }
        }
        Cli.needTool("bedtools");
        Path a = gunzip(aGz, dir.resolve("a.fa"));
        Path b = gunzip(bGz, dir.resolve("b.fa"));
        Path tsv = dir.resolve("cmp.tsv");
        assertThat(Main.run("compare", "-q", "--tsv", tsv.toString(), a.toString(), b.toString())).isZero();
        List<String[]> rows = new ArrayList<>();
        for (String l : Files.readAllLines(tsv)) {
            if (!l.startsWith("#") && !l.startsWith("chrom\t")) {
                rows.add(l.split("\t", -1));
            }
        }
        List<String[]> changed = rows.stream().filter(f -> f[10].equals("changed")).toList();
        // per row: A's left flank, stretch, right flank; B's the same, on A's strand
        StringBuilder aBed = new StringBuilder();
        StringBuilder bBed = new StringBuilder();
        List<String[]> checked = new ArrayList<>();
        for (String[] f : changed) {
            int s = Integer.parseInt(f[1]);
            int e = Integer.parseInt(f[2]);
            int os = Integer.parseInt(f[6]);
            int oe = Integer.parseInt(f[7]);
            if (s < FLANK || os < FLANK) {
                continue;
            }
            checked.add(f);
            aBed.append(bed(f[0], s - FLANK, s, '+')).append(bed(f[0], s, e, '+')).append(bed(f[0], e, e + FLANK, '+'));
            char st = f[8].charAt(0);
            if (st == '+') {
                bBed.append(bed(f[5], os - FLANK, os, '+')).append(bed(f[5], os, oe, '+'))
                        .append(bed(f[5], oe, oe + FLANK, '+'));
            } else {
                bBed.append(bed(f[5], oe, oe + FLANK, '-')).append(bed(f[5], os, oe, '-'))
                        .append(bed(f[5], os - FLANK, os, '-'));
            }
        }
        List<String> aSeq = getfasta(a, aBed);
        List<String> bSeq = getfasta(b, bBed);
        assertThat(aSeq).hasSize(3 * checked.size());
        assertThat(bSeq).hasSize(3 * checked.size());
        int clean = 0;
        for (int i = 0; i < checked.size(); i++) {
            String[] f = checked.get(i);
            String what = String.join(" ", f);
            String aL = aSeq.get(3 * i), aR = aSeq.get(3 * i + 2), aS = aSeq.get(3 * i + 1);
            String bL = bSeq.get(3 * i), bR = bSeq.get(3 * i + 2), bS = bSeq.get(3 * i + 1);
            boolean pure = Double.parseDouble(f[16]) >= 0.9 && !f[17].equals(".") && Double.parseDouble(f[17]) >= 0.9;
            assertThat(mismatches(aL, bL) + mismatches(aR, bR)).as("flanks of %s", what)
                    .isLessThanOrEqualTo(pure ? maxFlankDiff : 15);
            assertThat(bS.length()).as(what).isEqualTo(aS.length() + Integer.parseInt(f[9]));
            String longer = aS.length() >= bS.length() ? aS : bS;
            String shorter = longer == aS ? bS : aS;
            if (!pure) {
                continue; // an impure array may differ by copies rearranged, not one gain or loss
            }
            clean++;
            assertThat(oneIndel(longer, shorter)).as("%s: A %s, B %s", what, aS, bS)
                    .isLessThanOrEqualTo(2 + shorter.length() / 10);
        }
        System.out.printf(Locale.ROOT, "%d changed rows re-checked with bedtools getfasta, %d of them pure in both for"
                + " the one-indel check%n", checked.size(), clean);
        assertThat(checked.size()).isGreaterThanOrEqualTo(changed.size() - 2);
        return rows;
    }

    private static String bed(String chrom, int from, int to, char strand) {
        return chrom + "\t" + from + "\t" + to + "\tx\t0\t" + strand + "\n";
    }

    private List<String> getfasta(Path fa, CharSequence bed) throws IOException {
        Path b = Files.createTempFile(dir, "q", ".bed");
        Files.writeString(b, bed);
        String out = Cli.tool(dir, "bedtools", "getfasta", "-s", "-tab", "-fi", fa.toString(), "-bed", b.toString());
        List<String> seqs = new ArrayList<>();
        for (String l : out.split("\n")) {
            if (!l.isEmpty()) {
                seqs.add(l.substring(l.indexOf('\t') + 1).toUpperCase(Locale.ROOT));
            }
        }
        return seqs;
    }

    private static int mismatches(String x, String y) {
        int n = Math.abs(x.length() - y.length());
        for (int i = 0; i < Math.min(x.length(), y.length()); i++) {
            n += x.charAt(i) == y.charAt(i) ? 0 : 1;
        }
        return n;
    }

    /**
     * Fewest substitutions between {@code shorter} and {@code longer} with its surplus taken out at one
     * place: prefix sums of the two alignments, before and after the cut.
     */
    static int oneIndel(String longer, String shorter) {
        int d = longer.length() - shorter.length();
        int m = shorter.length();
        int[] pre = new int[m + 1];
        int[] suf = new int[m + 1];
        for (int i = 0; i < m; i++) {
            pre[i + 1] = pre[i] + (longer.charAt(i) == shorter.charAt(i) ? 0 : 1);
        }
        for (int i = m - 1; i >= 0; i--) {
            suf[i] = suf[i + 1] + (longer.charAt(i + d) == shorter.charAt(i) ? 0 : 1);
        }
        int best = Integer.MAX_VALUE;
        for (int cut = 0; cut <= m; cut++) {
            best = Math.min(best, pre[cut] + suf[cut]);
        }
        return best;
    }

    private static Path gunzip(Path gz, Path out) throws IOException {
        try (InputStream in = new GZIPInputStream(Files.newInputStream(gz)); OutputStream os = Files.newOutputStream(out)) {
            in.transferTo(os);
        }
        return out;
    }
}
