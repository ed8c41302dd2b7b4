package stria.report;

import java.util.Arrays;

/**
 * The loci of one contig as columns (a genome can have millions of loci; a record per locus would triple
 * the memory). Rows are appended while reading, then {@link #sortAndDeduplicate()} orders them by start,
 * end, period and motif and drops exact repeats of a row, which appear when a file is given twice or
 * overlapping parts are combined.
 */
public final class ContigLoci {
    private int size;
    private int[] start = new int[16];
    private int[] end = new int[16];
    private int[] period = new int[16];
    private int[] motif = new int[16];
    private int[] motifClass = new int[16];
    private float[] purity = new float[16];

    public void add(int s, int e, int p, int motifId, int classId, float pur) {
        if (size == start.length) {
            int n = size * 2;
            start = Arrays.copyOf(start, n);
            end = Arrays.copyOf(end, n);
            period = Arrays.copyOf(period, n);
            motif = Arrays.copyOf(motif, n);
            motifClass = Arrays.copyOf(motifClass, n);
            purity = Arrays.copyOf(purity, n);
        }
        start[size] = s;
        end[size] = e;
        period[size] = p;
        motif[size] = motifId;
        motifClass[size] = classId;
        purity[size] = pur;
        size++;
    }

    public void sortAndDeduplicate() {
        Integer[] order = new Integer[size];
        for (int i = 0; i < size; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> {
            int c = Integer.compare(start[a], start[b]);
            if (c == 0) {
                c = Integer.compare(end[a], end[b]);
            }
            if (c == 0) {
                c = Integer.compare(period[a], period[b]);
            }
            return c != 0 ? c : Integer.compare(motif[a], motif[b]);
        });
        int[] s2 = new int[size], e2 = new int[size], p2 = new int[size], m2 = new int[size], c2 = new int[size];
        float[] u2 = new float[size];
        int n = 0;
        for (int k = 0; k < size; k++) {
            int i = order[k];
            if (n > 0 && s2[n - 1] == start[i] && e2[n - 1] == end[i] && p2[n - 1] == period[i]
                    && m2[n - 1] == motif[i]) {
                continue;
            }
            s2[n] = start[i];
            e2[n] = end[i];
            p2[n] = period[i];
            m2[n] = motif[i];
            c2[n] = motifClass[i];
            u2[n] = purity[i];
            n++;
        }
        start = s2;
        end = e2;
        period = p2;
        motif = m2;
        motifClass = c2;
        purity = u2;
        size = n;
    }

    public int size() {
        return size;
    }

    public int start(int i) {
        return start[i];
    }

    public int end(int i) {
        return end[i];
    }

    public int period(int i) {
        return period[i];
    }

    public int motifClass(int i) {
        return motifClass[i];
    }

    public float purity(int i) {
        return purity[i];
    }
}
