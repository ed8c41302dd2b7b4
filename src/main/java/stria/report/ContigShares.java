package stria.report;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * The share of each drawn contig's scanned bases in repeats, by period class: the {@link DrawnContigs},
 * then the other scanned contigs together ("others (n)"), then the genome when there is more than one
 * entry before it.
 *
 * @param labels  the entries as drawn: contig names shortened to 22 characters, made unique by trailing
 *                spaces
 * @param percent per period class (ordinal), per entry: percent of the entry's scanned bases
 * @param drawn   contigs drawn one by one
 */
record ContigShares(List<String> labels, double[][] percent, int drawn) {
    private static final int LONGEST_NAME = 22;

    static ContigShares of(ResultSet r, Summary s) {
        List<Integer> top = DrawnContigs.of(r);
        List<Summary.Row> rows = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        for (int c : top) {
            rows.add(s.contigs().get(c));
            labels.add(Fmt.ellipsize(s.contigs().get(c).name(), LONGEST_NAME));
        }
        int others = 0;
        long[] oBases = new long[PeriodClass.values().length];
        long oScanned = 0;
        Set<Integer> topSet = new HashSet<>(top);
        for (int c = 0; c < s.contigs().size(); c++) {
            Summary.Row row = s.contigs().get(c);
            if (!topSet.contains(c) && row.scanned() > 0) {
                others++;
                oScanned += row.scanned();
                for (int k = 0; k < oBases.length; k++) {
                    oBases[k] += row.classBases()[k];
                }
            }
        }
        if (others > 0) {
            rows.add(new Summary.Row("others", oScanned, 0, 0, new long[oBases.length], oBases));
            labels.add("others (" + others + ")");
        }
        if (rows.size() > 1) {
            rows.add(s.genome());
            labels.add("genome");
        }
        double[][] percent = new double[PeriodClass.values().length][rows.size()];
        List<String> unique = new ArrayList<>();
        for (int i = 0; i < rows.size(); i++) {
            unique.add(uniq(labels, i));
            for (PeriodClass pc : PeriodClass.values()) {
                percent[pc.ordinal()][i] = 100 * rows.get(i).classShare(pc);
            }
        }
        return new ContigShares(List.copyOf(unique), percent, top.size());
    }

    /** Label {@code i}, with as many spaces added as it lies after the first equal label. */
    private static String uniq(List<String> labels, int i) {
        String l = labels.get(i);
        for (int j = 0; j < i; j++) {
            if (labels.get(j).equals(l)) {
                return l + " ".repeat(i - j);
            }
        }
        return l;
    }

    int size() {
        return labels.size();
    }
}
