package stria.testutil;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import stria.io.ContigInfo;
import stria.io.Region;
import stria.out.ResultHeader;
import stria.score.MotifClass;

/** Invented TSV results in the format of DEVELOPERS.md, for report tests. */
public final class ResultFixtures {
    public static final String TSV_HEADER = "chrom\tstart\tend\tperiod\tmotif\tmotif_class\tcopies\tlength\tpurity"
            + "\tmismatches\tinsertions\tdeletions\tscore\tevalue\tentropy";
    public static final String SETTINGS = "mode=imperfect min-period=1 max-period=2000 min-copies=2 min-length=12 "
            + "min-purity=0.8 min-score=0 max-evalue=5 score-model=" + stria.score.ScoringModel.DESCRIPTION;

    private ResultFixtures() {
    }

    public static ResultHeader header(List<ContigInfo> contigs, String shard, List<Region> regions) {
        return new ResultHeader("0.1.0", "scan --tsv out.tsv invented.fa", SETTINGS, contigs, shard, regions);
    }

    /** A locus row; copies, length and the alignment columns follow from the others. */
    public static String row(String chrom, int start, int end, String motif, double purity) {
        int len = end - start;
        return String.format(Locale.ROOT, "%s\t%d\t%d\t%d\t%s\t%s\t%.2f\t%d\t%.3f\t%d\t0\t0\t%.1f\t%.1e\t1.500",
                chrom, start, end, motif.length(), motif, MotifClass.of(motif), (double) len / motif.length(), len,
                purity, Math.round(len * (1 - purity)), 1.7 * len, Math.pow(2, -1.7 * len / 2));
    }

    public static Path write(Path file, ResultHeader h, List<String> rows) throws IOException {
        List<String> lines = new ArrayList<>(h.lines());
        lines.add(TSV_HEADER);
        lines.addAll(rows);
        Files.write(file, lines, StandardCharsets.UTF_8);
        return file;
    }

    /**
     * A genome of {@code contigs} contigs, lengths falling off like a typical draft assembly (a few long
     * ones, many short), with loci of all four period classes planted at random, not overlapping.
     */
    public static Path genome(Path file, int contigs, long seed) throws IOException {
        Random r = new Random(seed);
        List<ContigInfo> cs = new ArrayList<>();
        for (int c = 0; c < contigs; c++) {
            int len = c < 5 ? 2_000_000 - 250_000 * c : 5_000 + r.nextInt(contigs > 50 ? 300_000 / (1 + c / 20) : 900_000);
            cs.add(new ContigInfo(String.format(Locale.ROOT, "scaffold_%03d", c + 1), len));
        }
        if (contigs == 1) {
            cs.set(0, new ContigInfo("chrI", 3_500_000));
        }
        String[] micro = {"A", "C", "AC", "AG", "AT", "CAG", "AAT", "GATA", "AAAG", "TTAGGG", "CCG", "ACGT"};
        List<String> rows = new ArrayList<>();
        for (ContigInfo c : cs) {
            int pos = r.nextInt(500);
            while (true) {
                pos += 50 + r.nextInt(contigs == 1 ? 3_000 : 6_000);
                // one denser stretch per long contig, so density plots have something to show
                if (c.length() > 500_000 && Math.abs(pos - c.length() / 3) < 60_000) {
                    pos -= r.nextInt(40);
                }
                String motif;
                double u = r.nextDouble();
                if (u < 0.85) {
                    motif = micro[r.nextInt(micro.length)];
                } else if (u < 0.98) {
                    motif = randomMotif(r, 7 + r.nextInt(60));
                } else {
                    motif = randomMotif(r, 100 + r.nextInt(250));
                }
                int len = Math.max(12, (int) (motif.length() * (2 + r.nextDouble() * (motif.length() < 7 ? 14 : 5))));
                if (pos + len > c.length()) {
                    break;
                }
                double purity = Math.min(1.0, 0.8 + r.nextDouble() * 0.25);
                rows.add(row(c.name(), pos, pos + len, motif, purity));
                pos += len;
            }
        }
        return write(file, header(cs, null, List.of()), rows);
    }

    public static String randomMotif(Random r, int n) {
        StringBuilder sb = new StringBuilder(n);
        for (int i = 0; i < n; i++) {
            sb.append("ACGT".charAt(r.nextInt(4)));
        }
        return sb.toString();
    }
}
