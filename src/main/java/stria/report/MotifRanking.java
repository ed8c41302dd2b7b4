package stria.report;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * The most frequent motif classes: by loci, then bases in loci, then name, at most {@link #MAX}.
 *
 * @param labels  the motif class as drawn: long motifs shortened to their first 10 letters and their
 *                length, made unique by trailing spaces where two shortened motifs meet
 * @param loci    loci of each class
 * @param classes the period class of each motif class (by its length)
 */
record MotifRanking(String[] labels, long[] loci, PeriodClass[] classes) {
    static final int MAX = 20;
    /** Motifs longer than this are shortened. */
    private static final int LONGEST_LABEL = 14;

    static MotifRanking of(ResultSet r) {
        int n = r.motifClasses().size();
        long[] loci = new long[n];
        long[] bases = new long[n];
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                loci[l.motifClass(i)]++;
                bases[l.motifClass(i)] += l.end(i) - l.start(i);
            }
        }
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, Comparator.<Integer>comparingLong(i -> -loci[i]).thenComparingLong(i -> -bases[i])
                .thenComparing(i -> r.motifClasses().get(i)));
        int shown = Math.min(MAX, n);
        String[] labels = new String[shown];
        long[] counts = new long[shown];
        PeriodClass[] classes = new PeriodClass[shown];
        List<String> used = new ArrayList<>();
        for (int k = 0; k < shown; k++) {
            String motif = r.motifClasses().get(order[k]);
            String label = motif.length() <= LONGEST_LABEL ? motif
                    : motif.substring(0, 10) + "\u2026 (" + motif.length() + " bp)";
            while (used.contains(label)) {
                label = label + " ";
            }
            used.add(label);
            labels[k] = label;
            counts[k] = loci[order[k]];
            classes[k] = PeriodClass.of(motif.length());
        }
        return new MotifRanking(labels, counts, classes);
    }

    int size() {
        return labels.length;
    }
}
