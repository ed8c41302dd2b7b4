package stria.compare;

/**
 * Anchor words: {@link #K} bases packed two bits a base (A, C, G, T = 0..3, first base in the highest
 * bits) into a long. A word and its reverse complement are one anchor, keyed by the smaller of the two
 * (canonical form), so an anchor is found on either strand. K is odd, so no word is its own reverse
 * complement and the strand of every occurrence is defined.
 */
final class Kmer {
    /** Bases per anchor: long enough to be unique in a human genome outside recent repeats, and one long. */
    static final int K = 31;
    static final long MASK = (1L << (2 * K)) - 1;
    static final int TOP_SHIFT = 2 * (K - 1);

    private Kmer() {
    }

    /** A well-mixed 64-bit hash of a packed word (the splitmix64 finalizer): sampling and slots use its bits. */
    static long hash(long word) {
        long z = word;
        z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
        z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
        return z ^ (z >>> 31);
    }

    /**
     * Whether a word is one of the sampled ones: only these can be anchors, and only these are looked up
     * while a genome streams past the index, which saves most lookups. Sampling depends on the canonical
     * word alone, so both strands of an anchor are sampled alike.
     */
    static boolean sampled(long hash, int sampling) {
        return (hash & (sampling - 1)) == 0;
    }
}
