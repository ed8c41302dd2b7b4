package stria.compare;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import stria.io.ContigInfo;

/**
 * BED of the loci whose length differs ({@code changed} and {@code lost}), on either side, for genome
 * browsers: BED6+3 {@code chrom start end motif_class 0 strand period length_change status}, 0-based, end
 * exclusive. A's side has strand {@code .} (the motif is read on A's + strand, as in a scan); B's side has
 * the strand B holds the locus on relative to A, and leaves out lost loci with nothing left (an empty
 * interval). Lines are made from the comparison's TSV row alone, so the command and {@code merge} write
 * the same bytes; B's lines are sorted by B's contig order, start and end.
 */
public final class ChangedBed {
    private ChangedBed() {
    }

    /** Whether a row (its TSV fields) goes into the BED files. */
    static boolean wanted(String[] f) {
        return f.length > 10 && (f[10].equals("changed") || f[10].equals("lost"));
    }

    /** A's line of a row, or null. */
    public static String aLine(String[] f) {
        if (!wanted(f) || f[0].equals(".")) {
            return null;
        }
        return f[0] + "\t" + f[1] + "\t" + f[2] + "\t" + f[4] + "\t0\t.\t" + f[3] + "\t" + f[9] + "\t" + f[10];
    }

    /** B's line of a row, or null. */
    public static String bLine(String[] f) {
        if (!wanted(f) || f[5].equals(".") || f[6].equals(f[7])) {
            return null;
        }
        return f[5] + "\t" + f[6] + "\t" + f[7] + "\t" + f[4] + "\t0\t" + f[8] + "\t" + f[3] + "\t" + f[9] + "\t" + f[10];
    }

    /** B's lines collected as rows come, sorted at the end. */
    public static final class BSide {
        private final Map<String, Integer> rank = new HashMap<>();
        private final List<String> lines = new ArrayList<>();

        public BSide(List<ContigInfo> bContigs) {
            for (ContigInfo c : bContigs) {
                rank.put(c.name(), rank.size());
            }
        }

        public void add(String[] f) {
            String l = bLine(f);
            if (l != null) {
                lines.add(l);
            }
        }

        public List<String> sorted() {
            List<String> out = new ArrayList<>(lines);
            out.sort(Comparator.<String>comparingInt(l -> rank.getOrDefault(field(l, 0), Integer.MAX_VALUE))
                    .thenComparingLong(l -> Long.parseLong(field(l, 1)))
                    .thenComparingLong(l -> Long.parseLong(field(l, 2)))
                    .thenComparing(Comparator.naturalOrder()));
            return out;
        }

        private static String field(String line, int k) {
            int from = 0;
            for (int i = 0; i < k; i++) {
                from = line.indexOf('\t', from) + 1;
            }
            int to = line.indexOf('\t', from);
            return line.substring(from, to < 0 ? line.length() : to);
        }
    }
}
