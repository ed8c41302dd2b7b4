package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.GZIPInputStream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.testutil.Cli;

/**
 * Real bacterial genomes carried by Debian example packages (ragout-examples, bowtie-examples), scanned by
 * the real command; every reported interval is cut out of the genome by bedtools getfasta, an outside tool,
 * and checked to be periodic with the reported motif and period at (at least) the reported purity. This ties
 * our coordinates, motifs and purities to the genome as another program reads it.
 */
@Tag("tools")
class RealGenomeTest {
    static final Path PYLORI = Path.of("/usr/share/doc/ragout/examples/H.Pylori/references/SJM180.fasta.gz");
    static final Path COLI = Path.of("/usr/share/doc/bowtie/examples/genomes/NC_008253.fna.gz");

    @TempDir
    Path dir;

    static Path require(Path p) {
        if (!Files.exists(p)) {
            Cli.needTool("no-such-tool-" + p.getFileName()); // skips, or fails under CI
        }
        return p;
    }

    Path gunzip(Path gz) throws IOException {
        Path out = dir.resolve(gz.getFileName().toString().replace(".gz", ""));
        try (InputStream in = new GZIPInputStream(Files.newInputStream(gz))) {
            Files.copy(in, out);
        }
        return out;
    }

    /**
     * Best identity of {@code s} against an unbounded repetition of {@code motif} that starts at its phase 0,
     * allowing substitutions, insertions and deletions (unit costs), by wraparound dynamic programming
     * (Fischetti, Landau, Sellers & Schmidt 1993): identity = matches / alignment columns of a minimum-edit
     * alignment, the largest such value found among co-optimal alignments being taken.
     */
    static double identityAgainstRepeats(String s, String motif) {
        int n = s.length(), p = motif.length();
        // cost[j] for the current row over motif phases; ties broken towards more matches
        final int inf = Integer.MAX_VALUE / 4;
        int[] cost = new int[p];
        int[] match = new int[p];
        int[] cols = new int[p];
        // row 0: consensus positions consumed before any sequence letter (deletions from phase 0)
        for (int j = 0; j < p; j++) {
            cost[j] = j == 0 ? 0 : inf;
        }
        int[] nc = new int[p], nm = new int[p], ncol = new int[p];
        for (int i = 0; i < n; i++) {
            char c = s.charAt(i);
            for (int j = 0; j < p; j++) {
                nc[j] = inf;
            }
            // diagonal (match/mismatch) and insertion (sequence letter against nothing) into phase j
            for (int j = 0; j < p; j++) {
                if (cost[j] >= inf) {
                    continue;
                }
                int to = (j + 1) % p;
                boolean m = motif.charAt(j) == c;
                relax(nc, nm, ncol, to, cost[j] + (m ? 0 : 1), match[j] + (m ? 1 : 0), cols[j] + 1);
                relax(nc, nm, ncol, j, cost[j] + 1, match[j], cols[j] + 1);
            }
            // deletions (consensus letter skipped) wrap around the motif: two passes settle them
            for (int pass = 0; pass < 2; pass++) {
                for (int j = 0; j < p; j++) {
                    int to = (j + 1) % p;
                    if (nc[j] < inf) {
                        relax(nc, nm, ncol, to, nc[j] + 1, nm[j], ncol[j] + 1);
                    }
                }
            }
            int[] t = cost;
            cost = nc;
            nc = t;
            t = match;
            match = nm;
            nm = t;
            t = cols;
            cols = ncol;
            ncol = t;
        }
        double best = 0;
        int bestCost = inf;
        for (int j = 0; j < p; j++) {
            if (cost[j] < bestCost || (cost[j] == bestCost && match[j] / (double) cols[j] > best)) {
                bestCost = cost[j];
                best = match[j] / (double) cols[j];
            }
        }
        return best;
    }

    private static void relax(int[] c, int[] m, int[] col, int j, int cost, int matches, int columns) {
        if (cost < c[j] || (cost == c[j] && matches * (long) col[j] > m[j] * (long) columns)) {
            c[j] = cost;
            m[j] = matches;
            col[j] = columns;
        }
    }

    void check(Path genomeGz, String mode) throws IOException {
        Cli.needTool("bedtools");
        require(genomeGz);
        Path fa = gunzip(genomeGz);
        Path bed = dir.resolve("out.bed");
        Cli.Result r = Cli.stria(dir, "scan", mode, "--quiet", "--bed", bed.toString(), genomeGz.toString());
        assertThat(r.exit()).as(r.err()).isZero();
        List<String[]> records = new ArrayList<>();
        for (String l : Files.readAllLines(bed)) {
            if (!l.startsWith("#")) {
                records.add(l.split("\t"));
            }
        }
        assertThat(records).hasSizeGreaterThan(20);
        String seqs = Cli.tool(dir, "bedtools", "getfasta", "-fi", fa.toString(), "-bed", bed.toString(), "-tab");
        String[] lines = seqs.split("\n");
        assertThat(lines).hasSameSizeAs(records.toArray());
        for (int i = 0; i < records.size(); i++) {
            String[] rec = records.get(i);
            String[] got = lines[i].split("\t");
            String region = rec[0] + ":" + rec[1] + "-" + rec[2];
            assertThat(got[0]).isEqualTo(region);
            String s = got[1].toUpperCase();
            String motif = rec[3];
            int period = Integer.parseInt(rec[6]);
            double purity = Integer.parseInt(rec[4]) / 1000.0;
            assertThat(motif).hasSize(period);
            assertThat(s.length()).isEqualTo(Integer.parseInt(rec[2]) - Integer.parseInt(rec[1]));
            if (mode.equals("--exact")) {
                for (int k = 0; k < s.length(); k++) {
                    assertThat(s.charAt(k)).as("%s at %d", region, k).isEqualTo(motif.charAt(k % period));
                }
            } else {
                double id = identityAgainstRepeats(s, motif);
                // BED scores carry purity in thousandths; allow that rounding and a little for co-optimal paths
                assertThat(id).as("%s motif %s", region, motif).isGreaterThanOrEqualTo(purity - 0.0205);
            }
        }
    }

    @Test
    void exactRunsOfARealGenomeAreExactRepeatsWhereBedtoolsCutsThem() throws IOException {
        check(PYLORI, "--exact");
    }

    @Test
    void imperfectLociOfRealGenomesArePeriodicAtTheirPurity() throws IOException {
        check(PYLORI, "--min-length=12");
        check(COLI, "--min-length=12");
    }

    @Test
    void wraparoundIdentityOracleIsSane() {
        assertThat(identityAgainstRepeats("CAGCAGCAGCAG", "CAG")).isEqualTo(1.0);
        assertThat(identityAgainstRepeats("CAGCAGCTGCAG", "CAG")).isEqualTo(11 / 12.0);
        assertThat(identityAgainstRepeats("CAGCAGCAGGCAG", "CAG")).isEqualTo(12 / 13.0);
        // a deleted C: 11 letters plus one deletion column, 11 of the 12 columns match
        assertThat(identityAgainstRepeats("CAGCAGAGCAG", "CAG")).isEqualTo(11 / 12.0);
        assertThat(identityAgainstRepeats("ACGTACGTAC", "GGCC")).isLessThan(0.6);
    }
}
