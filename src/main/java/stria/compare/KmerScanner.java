package stria.compare;

import stria.io.Bases;

/**
 * Streams one contig's bases past an {@link AnchorTable}: rolls the word ending at each base on both
 * strands, and looks up the sampled ones. Bases come in pieces of any size; positions count from the
 * contig's first base. A base other than A, C, G or T starts the words afresh.
 *
 * <p>Lookups are gathered in small batches and probed together, so the table's cache misses overlap
 * instead of following one another.
 */
final class KmerScanner {
    /** Receives every occurrence of a table word: its slot, the start of the word, its strand. */
    interface Hits {
        /**
         * @param canonicalOnPlus whether the contig's + strand reads the word in its canonical form
         */
        void hit(int slot, int start, boolean canonicalOnPlus);
    }

    private static final int BATCH = 64;
    private final AnchorTable table;
    private final int sampling;
    private final long[] bWord = new long[BATCH];
    private final long[] bHash = new long[BATCH];
    private final int[] bPos = new int[BATCH];
    private final boolean[] bFwd = new boolean[BATCH];
    private int batched;
    private long fwd;
    private long rev;
    private int valid;
    private int pos;

    KmerScanner(AnchorTable table, int sampling) {
        this.table = table;
        this.sampling = sampling;
    }

    /** Starts a contig. */
    void begin() {
        fwd = 0;
        rev = 0;
        valid = 0;
        pos = 0;
        batched = 0;
    }

    /** Bases seen so far in this contig. */
    int position() {
        return pos;
    }

    /**
     * Rolls over {@code seq[off, off + n)}; every occurrence whose word ends in it is reported before
     * this returns.
     */
    void feed(byte[] seq, int off, int n, Hits hits) {
        long f = fwd;
        long r = rev;
        int v = valid;
        int p = pos;
        int samplingMask = sampling - 1;
        for (int i = off, end = off + n; i < end; i++, p++) {
            int c = Bases.code(seq[i]);
            if (c < 0 || c > 3) {
                v = 0;
                continue;
            }
            f = ((f << 2) | c) & Kmer.MASK;
            r = (r >>> 2) | ((long) (3 - c) << Kmer.TOP_SHIFT);
            if (++v < Kmer.K) {
                continue;
            }
            boolean plusIsCanonical = f < r;
            long w = plusIsCanonical ? f : r;
            long h = Kmer.hash(w);
            if ((h & samplingMask) != 0) {
                continue;
            }
            int b = batched;
            bWord[b] = w;
            bHash[b] = h;
            bPos[b] = p - Kmer.K + 1;
            bFwd[b] = plusIsCanonical;
            batched = b + 1;
            if (b + 1 == BATCH) {
                flush(hits);
            }
        }
        fwd = f;
        rev = r;
        valid = v;
        pos = p;
        flush(hits);
    }

    private void flush(Hits hits) {
        int n = batched;
        batched = 0;
        AnchorTable t = table;
        for (int i = 0; i < n; i++) {
            int s = t.find(bWord[i], bHash[i]);
            if (s >= 0) {
                hits.hit(s, bPos[i], bFwd[i]);
            }
        }
    }
}
