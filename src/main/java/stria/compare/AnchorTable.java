package stria.compare;

import java.util.Arrays;

/**
 * The anchor words of all of A's loci in one open-addressing hash table (linear probing) of canonical
 * packed words, with, per slot, how often the word occurs in A and in B (saturating at 2: once is all
 * that matters), the strand A's anchor reads it on, where B has it first, and the anchors (locus, side,
 * number) that use it. Neighbouring loci often share an anchor; a word used at two places of A counts
 * twice in A and anchors neither.
 *
 * <p>Memory: 17 bytes a slot (word, state, B contig and position) at most {@link #LOAD} full, plus 4 bytes a
 * slot and 4 an anchor for the anchors using each word; see {@link #bytes}.
 */
final class AnchorTable {
    static final double LOAD = 0.6;
    static final long EMPTY = -1;
    private static final int A_SHIFT = 0;
    private static final int B_SHIFT = 2;
    /** A's anchor reads the word in its canonical form (A's + strand word is the smaller one). */
    private static final int A_FWD = 1 << 4;
    /** B's first occurrence reads the word in its canonical form on B's + strand. */
    private static final int B_FWD = 1 << 5;

    final long[] keys;
    /** Slot of each anchor, -1 for an absent one. */
    final int[] slotOfAnchor;
    private final byte[] state;
    private final int[] hitContig;
    private final int[] hitPos;
    private final int[] refStart;
    private final int[] refs;
    private final int capacity;
    private int distinct;

    /**
     * A table of the anchors {@code 0..n-1}, anchor {@code a} being the canonical word {@code words[a]}
     * read in canonical form by A when {@code aFwd[a]}; anchors with {@code words[a] < 0} are absent.
     */
    AnchorTable(long[] words, boolean[] aFwd, int n) {
        int present = 0;
        for (int a = 0; a < n; a++) {
            if (words[a] >= 0) {
                present++;
            }
        }
        capacity = Math.max(16, (int) Math.min(Integer.MAX_VALUE - 8, (long) Math.ceil(present / LOAD) + 1));
        keys = new long[capacity];
        Arrays.fill(keys, EMPTY);
        state = new byte[capacity];
        hitContig = new int[capacity];
        hitPos = new int[capacity];
        int[] slotOf = new int[n];
        int[] count = new int[capacity + 1];
        for (int a = 0; a < n; a++) {
            long w = words[a];
            if (w < 0) {
                slotOf[a] = -1;
                continue;
            }
            int s = insert(w, aFwd[a]);
            slotOf[a] = s;
            count[s + 1]++;
        }
        for (int s = 0; s < capacity; s++) {
            count[s + 1] += count[s];
        }
        refStart = count;
        refs = new int[present];
        int[] fill = Arrays.copyOf(count, capacity);
        for (int a = 0; a < n; a++) {
            if (slotOf[a] >= 0) {
                refs[fill[slotOf[a]]++] = a;
            }
        }
        this.slotOfAnchor = slotOf;
    }

    private int insert(long w, boolean fwd) {
        int s = home(Kmer.hash(w));
        while (true) {
            long k = keys[s];
            if (k == w) {
                return s;
            }
            if (k == EMPTY) {
                keys[s] = w;
                state[s] = (byte) (fwd ? A_FWD : 0);
                hitContig[s] = -1;
                distinct++;
                return s;
            }
            s = s + 1 == capacity ? 0 : s + 1;
        }
    }

    int home(long hash) {
        return (int) (((hash >>> 32) * capacity) >>> 32);
    }

    int distinct() {
        return distinct;
    }

    /** Slot of a canonical word with the given hash, or -1. */
    int find(long w, long hash) {
        int s = home(hash);
        while (true) {
            long k = keys[s];
            if (k == w) {
                return s;
            }
            if (k == EMPTY) {
                return -1;
            }
            s = s + 1 == capacity ? 0 : s + 1;
        }
    }

    void addA(int slot) {
        int st = state[slot];
        int c = (st >>> A_SHIFT) & 3;
        if (c < 2) {
            state[slot] = (byte) (st + (1 << A_SHIFT));
        }
    }

    int countA(int slot) {
        return (state[slot] >>> A_SHIFT) & 3;
    }

    /** Counts an occurrence in B; the first one is kept (contig, start of the word on B's + strand, strand). */
    void addB(int slot, int contig, int pos, boolean canonicalOnPlus) {
        int st = state[slot];
        int c = (st >>> B_SHIFT) & 3;
        if (c == 0) {
            hitContig[slot] = contig;
            hitPos[slot] = pos;
            st |= canonicalOnPlus ? B_FWD : 0;
        }
        if (c < 2) {
            st += 1 << B_SHIFT;
        }
        state[slot] = (byte) st;
    }

    int countB(int slot) {
        return (state[slot] >>> B_SHIFT) & 3;
    }

    int hitContig(int slot) {
        return hitContig[slot];
    }

    int hitPos(int slot) {
        return hitPos[slot];
    }

    /**
     * Whether B's first occurrence reads the word on the strand A's anchor does: B's + strand word equals
     * A's + strand word. Otherwise B holds the anchor reverse-complemented.
     */
    boolean sameStrand(int slot) {
        int st = state[slot];
        return ((st & A_FWD) != 0) == ((st & B_FWD) != 0);
    }

    /** Whether a word read on B's + strand in the given form agrees with A's strand for this slot. */
    boolean sameStrand(int slot, boolean canonicalOnPlus) {
        return ((state[slot] & A_FWD) != 0) == canonicalOnPlus;
    }

    int refStart(int slot) {
        return refStart[slot];
    }

    int refEnd(int slot) {
        return refStart[slot + 1];
    }

    int ref(int i) {
        return refs[i];
    }

    /** Bytes held, for the memory figures. */
    long bytes() {
        return (long) capacity * (8 + 1 + 4 + 4 + 4) + 4L * refs.length + 4L * slotOfAnchor.length;
    }
}
