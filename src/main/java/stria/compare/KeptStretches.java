package stria.compare;

import java.util.Arrays;

/**
 * B's bases kept per locus of A while B streams by: the stretch from the first anchor of one side to the
 * last of the other, on B's + strand, as B's contig number, start and end. Bases are kept two bits each
 * (A, C, G, T); a stretch that holds any other letter is kept a byte a base instead.
 */
final class KeptStretches {
    final int[] contig;
    final boolean[] plus;
    final int[] start;
    final int[] end;
    private final byte[][] bases;
    private final boolean[] raw;

    KeptStretches(int loci) {
        contig = new int[loci];
        Arrays.fill(contig, -1);
        plus = new boolean[loci];
        start = new int[loci];
        end = new int[loci];
        bases = new byte[loci][];
        raw = new boolean[loci];
    }

    /**
     * B's bases [from, to) of contig c to locus g, from a ring of codes ({@code ring[x & mask]} is base x);
     * appended to what g has when the contig, strand and start are the same, else in its place.
     */
    void keep(int g, int c, boolean onPlus, int from, int to, byte[] ring, int mask) {
        boolean same = contig[g] == c && plus[g] == onPlus && start[g] == from;
        if (same && to <= end[g]) {
            return;
        }
        int have = same ? end[g] - from : 0;
        boolean asBytes = same && raw[g];
        for (int x = from + have; x < to && !asBytes; x++) {
            int code = ring[x & mask];
            asBytes = code < 0 || code > 3;
        }
        int n = to - from;
        byte[] old = same ? bases[g] : null;
        if (asBytes && old != null && !raw[g]) {
            // a letter other than A, C, G, T arrives: what is kept goes over to a byte a base
            byte[] wide = new byte[n];
            for (int i = 0; i < have; i++) {
                wide[i] = packed(old, i);
            }
            old = wide;
        }
        int size = asBytes ? n : (n + 3) >>> 2;
        byte[] dst = old != null && old.length >= size ? old : Arrays.copyOf(old == null ? new byte[0] : old, size);
        if (asBytes) {
            for (int x = from + have; x < to; x++) {
                dst[x - from] = ring[x & mask];
            }
        } else {
            for (int x = from + have; x < to; x++) {
                int i = x - from;
                dst[i >>> 2] |= (byte) ((ring[x & mask] & 3) << ((i & 3) * 2));
            }
        }
        bases[g] = dst;
        raw[g] = asBytes;
        contig[g] = c;
        plus[g] = onPlus;
        start[g] = from;
        end[g] = to;
    }

    /** Codes of B's bases [from, from + n) (B coordinates) kept for locus g, into {@code dst[0, n)}. */
    void copy(int g, int from, int n, byte[] dst) {
        byte[] b = bases[g];
        int off = from - start[g];
        if (raw[g]) {
            System.arraycopy(b, off, dst, 0, n);
        } else {
            for (int i = 0; i < n; i++) {
                dst[i] = packed(b, off + i);
            }
        }
    }

    private static byte packed(byte[] b, int i) {
        return (byte) ((b[i >>> 2] >>> ((i & 3) * 2)) & 3);
    }

    /** Whether locus g kept [lo, hi) of contig c on the given strand. */
    boolean covers(int g, int c, boolean onPlus, int lo, int hi) {
        return contig[g] == c && plus[g] == onPlus && start[g] <= lo && end[g] >= hi;
    }

    long bytes() {
        long t = 0;
        for (byte[] b : bases) {
            if (b != null) {
                t += 16 + b.length;
            }
        }
        return t + 14L * contig.length;
    }
}
