package stria.repeats;

import java.util.Arrays;

/**
 * A growable list of runs kept in three parallel primitive arrays (start, end exclusive, period), so hot
 * loops never box. Coordinates are whatever the producer says (segment-relative inside the engine,
 * contig coordinates after stitching).
 */
public final class RunList {
    private int[] start;
    private int[] end;
    private int[] period;
    private int count;

    public RunList() {
        this(64);
    }

    public RunList(int capacity) {
        int c = Math.max(4, capacity);
        start = new int[c];
        end = new int[c];
        period = new int[c];
    }

    public void add(int s, int e, int p) {
        if (count == start.length) {
            int c = start.length * 2;
            start = Arrays.copyOf(start, c);
            end = Arrays.copyOf(end, c);
            period = Arrays.copyOf(period, c);
        }
        start[count] = s;
        end[count] = e;
        period[count] = p;
        count++;
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

    public void clear() {
        count = 0;
    }

    /** Sorts by start, then end, then period: the order every output uses. */
    public void sort() {
        if (count < 2) {
            return;
        }
        // pack (start, end) into a long key alongside the index; period breaks remaining ties
        long[] keys = new long[count];
        for (int i = 0; i < count; i++) {
            keys[i] = ((long) start[i] << 32) | (end[i] & 0xFFFFFFFFL);
        }
        int[] idx = new int[count];
        for (int i = 0; i < count; i++) {
            idx[i] = i;
        }
        sortIndices(idx, keys);
        int[] ns = new int[start.length];
        int[] ne = new int[start.length];
        int[] np = new int[start.length];
        for (int i = 0; i < count; i++) {
            ns[i] = start[idx[i]];
            ne[i] = end[idx[i]];
            np[i] = period[idx[i]];
        }
        start = ns;
        end = ne;
        period = np;
    }

    private void sortIndices(int[] idx, long[] keys) {
        int[] tmp = new int[idx.length];
        mergeSort(idx, tmp, 0, idx.length, keys);
    }

    private void mergeSort(int[] a, int[] tmp, int lo, int hi, long[] keys) {
        if (hi - lo < 24) {
            for (int i = lo + 1; i < hi; i++) {
                int v = a[i];
                int j = i - 1;
                while (j >= lo && less(v, a[j], keys)) {
                    a[j + 1] = a[j];
                    j--;
                }
                a[j + 1] = v;
            }
            return;
        }
        int mid = (lo + hi) >>> 1;
        mergeSort(a, tmp, lo, mid, keys);
        mergeSort(a, tmp, mid, hi, keys);
        if (!less(a[mid], a[mid - 1], keys)) {
            return;
        }
        System.arraycopy(a, lo, tmp, lo, hi - lo);
        int i = lo, j = mid, k = lo;
        while (i < mid && j < hi) {
            a[k++] = less(tmp[j], tmp[i], keys) ? tmp[j++] : tmp[i++];
        }
        while (i < mid) {
            a[k++] = tmp[i++];
        }
        while (j < hi) {
            a[k++] = tmp[j++];
        }
    }

    private boolean less(int x, int y, long[] keys) {
        if (keys[x] != keys[y]) {
            return keys[x] < keys[y];
        }
        return period[x] < period[y];
    }

    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder("[");
        for (int i = 0; i < count; i++) {
            if (i > 0) {
                sb.append(", ");
            }
            sb.append(start[i]).append('-').append(end[i]).append('/').append(period[i]);
        }
        return sb.append(']').toString();
    }
}
