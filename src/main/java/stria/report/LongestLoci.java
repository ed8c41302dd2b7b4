package stria.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/** The longest loci of the results, longest first; ties in genome order. */
record LongestLoci(List<Row> rows) {
    static final int SHOWN = 20;

    /**
     * One locus: contig, start and end (0-based, end exclusive), period, motif class, purity, and the nested
     * structure of its unit (subunit period and subunits per unit; 0 and 0 when none).
     */
    record Row(String contig, int start, int end, int period, String motifClass, float purity, int subunitPeriod,
               int subunits) {
        int length() {
            return end - start;
        }
    }

    static LongestLoci of(ResultSet r, int n) {
        // a bounded heap of the n longest, the shortest on top, so millions of loci cost n rows of memory
        Comparator<long[]> order = Comparator.<long[]>comparingLong(x -> x[0])
                .thenComparing(Comparator.<long[]>comparingLong(x -> x[1]).reversed())
                .thenComparing(Comparator.<long[]>comparingLong(x -> x[2]).reversed());
        java.util.PriorityQueue<long[]> heap = new java.util.PriorityQueue<>(order);
        for (int c = 0; c < r.loci().size(); c++) {
            ContigLoci l = r.loci().get(c);
            for (int i = 0; i < l.size(); i++) {
                long[] x = {l.end(i) - (long) l.start(i), c, i};
                if (heap.size() < n) {
                    heap.add(x);
                } else if (order.compare(x, heap.peek()) > 0) {
                    heap.poll();
                    heap.add(x);
                }
            }
        }
        List<long[]> top = new ArrayList<>(heap);
        top.sort(order.reversed());
        List<Row> rows = new ArrayList<>();
        for (long[] x : top) {
            int c = (int) x[1], i = (int) x[2];
            ContigLoci l = r.loci().get(c);
            rows.add(new Row(r.header().contigs().get(c).name(), l.start(i), l.end(i), l.period(i),
                    r.motifClasses().get(l.motifClass(i)), l.purity(i), l.subunitPeriod(i), l.subunits(i)));
        }
        return new LongestLoci(List.copyOf(rows));
    }
}
