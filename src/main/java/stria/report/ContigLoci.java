package stria.report;

import java.util.Arrays;

/**
 * The loci of one contig as columns (a genome can have millions of loci; a record per locus would triple
 * the memory). Rows are appended while reading, then {@link #sortAndDeduplicate()} orders them by start,
 * end, period and motif and drops exact repeats of a row, which appear when a file is given twice or
 * overlapping parts are combined.
 */
public final class ContigLoci {
    private int count;
    private int[] start = new int[16];
    private int[] end = new int[16];
    private int[] period = new int[16];
    private int[] motif = new int[16];
    private int[] motifClass = new int[16];
    private float[] purity = new float[16];
    // nested periodicity: the subunit's length and how many make one unit; 0 when none
    private int[] subunitPeriod = new int[16];
    private int[] subunits = new int[16];

    public void add(int s, int e, int p, int motifId, int classId, float pur) {
        add(s, e, p, motifId, classId, pur, 0, 0);
    }

    /** A locus whose unit is made of {@code units} diverged subunits of {@code subPeriod} (0 and 0: none). */
    public void add(int s, int e, int p, int motifId, int classId, float pur, int subPeriod, int units) {
        if (count == start.length) {
            int n = count * 2;
            start = Arrays.copyOf(start, n);
            end = Arrays.copyOf(end, n);
            period = Arrays.copyOf(period, n);
            motif = Arrays.copyOf(motif, n);
            motifClass = Arrays.copyOf(motifClass, n);
            purity = Arrays.copyOf(purity, n);
            subunitPeriod = Arrays.copyOf(subunitPeriod, n);
            subunits = Arrays.copyOf(subunits, n);
        }
        start[count] = s;
        end[count] = e;
        period[count] = p;
        motif[count] = motifId;
        motifClass[count] = classId;
        purity[count] = pur;
        subunitPeriod[count] = subPeriod;
        subunits[count] = units;
        count++;
    }

    public void sortAndDeduplicate() {
        Integer[] order = new Integer[count];
        for (int i = 0; i < count; i++) {
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
        int[] s2 = new int[count], e2 = new int[count], p2 = new int[count], m2 = new int[count], c2 = new int[count];
        float[] u2 = new float[count];
        int[] q2 = new int[count], k2 = new int[count];
        int n = 0;
        for (int k = 0; k < count; k++) {
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
            q2[n] = subunitPeriod[i];
            k2[n] = subunits[i];
            n++;
        }
        start = s2;
        end = e2;
        period = p2;
        motif = m2;
        motifClass = c2;
        purity = u2;
        subunitPeriod = q2;
        subunits = k2;
        count = n;
    }

    public int size() {
        return count;
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

    /** Length of the subunit the unit is made of; 0 when the locus has no nested structure. */
    public int subunitPeriod(int i) {
        return subunitPeriod[i];
    }

    /** Subunits in one unit; 0 when the locus has no nested structure. */
    public int subunits(int i) {
        return subunits[i];
    }
}
