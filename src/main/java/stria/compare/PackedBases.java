package stria.compare;

import java.util.ArrayList;
import java.util.List;

/**
 * Stretches of A, two bits a base, appended one after the other in pages of longs: a locus keeps the
 * bases between its outermost anchors (which never hold anything but A, C, G, T) at a quarter of a byte a
 * base and without an object of its own.
 */
final class PackedBases {
    private static final int PAGE_BITS = 20;
    private static final int PAGE = 1 << PAGE_BITS;
    private final List<long[]> pages = new ArrayList<>();
    private long size;

    /** Appends codes 0..3 of {@code codes[from, to)}; returns the index of the first. */
    long append(byte[] codes, int from, int to) {
        long first = size;
        for (int i = from; i < to; i++) {
            long at = size++;
            int page = (int) (at >>> (PAGE_BITS + 5));
            if (page == pages.size()) {
                pages.add(new long[PAGE]);
            }
            int word = (int) ((at >>> 5) & (PAGE - 1));
            int shift = (int) (at & 31) * 2;
            pages.get(page)[word] |= (long) (codes[i] & 3) << shift;
        }
        return first;
    }

    /** Writes the codes of {@code [at, at + n)} to {@code dst[off, off + n)}. */
    void get(long at, int n, byte[] dst, int off) {
        for (int i = 0; i < n; i++, at++) {
            long[] page = pages.get((int) (at >>> (PAGE_BITS + 5)));
            dst[off + i] = (byte) ((page[(int) ((at >>> 5) & (PAGE - 1))] >>> ((int) (at & 31) * 2)) & 3);
        }
    }

    long bytes() {
        return (long) pages.size() * PAGE * 8;
    }
}
