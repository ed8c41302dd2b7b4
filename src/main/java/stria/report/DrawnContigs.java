package stria.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Which contigs the per-contig charts draw one by one: the longest scanned ones, so a genome of any
 * contig count fits; the rest are folded into one "others" entry or left out, as each chart says.
 */
final class DrawnContigs {
    /** Contigs drawn one by one. */
    static final int MAX = 20;

    private DrawnContigs() {
    }

    /** Indices (header order) of the {@code max} contigs with most bases scanned, in decreasing order; ties by index. */
    static List<Integer> longest(ResultSet r, int max) {
        List<Integer> idx = new ArrayList<>();
        for (int c = 0; c < r.header().contigs().size(); c++) {
            if (r.scannedBases(c) > 0) {
                idx.add(c);
            }
        }
        idx.sort(Comparator.<Integer>comparingLong(c -> -r.scannedBases(c)).thenComparingInt(c -> c));
        return idx.size() <= max ? idx : idx.subList(0, max);
    }

    /** The contigs drawn one by one. */
    static List<Integer> of(ResultSet r) {
        return longest(r, MAX);
    }

    /** How many contigs have any base scanned. */
    static int scanned(ResultSet r) {
        return longest(r, Integer.MAX_VALUE).size();
    }
}
