package stria.score;

import java.util.Arrays;
import stria.io.Bases;

/**
 * The background composition of a contig, position by position: the contig is cut into blocks of a fixed
 * length from its first base (the last block joins the one before when it is shorter than half a block),
 * and each block has the {@link ScoringModel} of its own GC class ({@link ScoringModel#classOf}). Blocks
 * depend on the contig alone, so every window, chunk, shard or thread that scores a position uses the same
 * model. Coordinates are 0-based contig positions (or shifted by {@link #shifted}, for a copy of a
 * stretch). Immutable.
 */
public final class Background {
    /** Per letter: 1 << 32 for G or C, plus 1 for A, C, G or T (either case). */
    private static final long[] COUNTS = new long[256];

    static {
        for (int b = 0; b < 256; b++) {
            int c = Bases.code((byte) b);
            COUNTS[b] = (c == 1 || c == 2 ? 1L << 32 : 0) + ((c >>> 2) == 0 ? 1 : 0);
        }
    }

    private final int length;
    private final int block;
    private final int offset;
    // GC class per block, -1 where the block was not read
    private final byte[] classes;

    private Background(int length, int block, int offset, byte[] classes) {
        this.length = length;
        this.block = block;
        this.offset = offset;
        this.classes = classes;
    }

    /** Blocks of a contig of {@code length} bases: whole blocks, the rest joined to the last when short. */
    public static int blocks(int length, int block) {
        int whole = length / block;
        int n = whole + (length % block >= (block + 1) / 2 ? 1 : 0);
        return Math.max(1, n);
    }

    /** The block holding position {@code pos}. */
    public static int blockOf(int pos, int length, int block) {
        return Math.min(pos / block, blocks(length, block) - 1);
    }

    /** First base of block {@code k}. */
    public static int blockStart(int k, int block) {
        return (int) ((long) k * block);
    }

    /** One past the last base of block {@code k}. */
    public static int blockEnd(int k, int length, int block) {
        return k == blocks(length, block) - 1 ? length : (int) ((long) (k + 1) * block);
    }

    /** The same uniform model everywhere. */
    public static Background uniform() {
        return new Background(Integer.MAX_VALUE, Integer.MAX_VALUE, 0, new byte[]{ScoringModel.UNIFORM_CLASS});
    }

    /**
     * The background of a contig of {@code length} bases from the tallies of its blocks ({@code gc[k]} G or C
     * among {@code acgt[k]} A, C, G, T); blocks with {@code known[k]} false must never be asked for.
     */
    public static Background of(int length, int block, long[] gc, long[] acgt, boolean[] known) {
        byte[] cls = new byte[blocks(length, block)];
        for (int k = 0; k < cls.length; k++) {
            cls[k] = (byte) (known[k] ? ScoringModel.classOf(gc[k], acgt[k]) : -1);
        }
        return new Background(length, block, 0, cls);
    }

    /** The background of a whole contig held in {@code seq[0, length)}. */
    public static Background of(byte[] seq, int length, int block) {
        int n = blocks(length, block);
        long[] gc = new long[n];
        long[] acgt = new long[n];
        for (int k = 0; k < n; k++) {
            long t = tally(seq, blockStart(k, block), blockEnd(k, length, block));
            gc[k] = t >>> 32;
            acgt[k] = t & 0xFFFFFFFFL;
        }
        boolean[] known = new boolean[n];
        Arrays.fill(known, true);
        return of(length, block, gc, acgt, known);
    }

    /** G or C bases (high 32 bits) and A, C, G, T bases (low 32 bits) of {@code seq[from, to)}. */
    public static long tally(byte[] seq, int from, int to) {
        // one load and one add a base: the two counts side by side in one long (a range holds fewer than
        // 2^31 bases, so the low count never carries into the high one)
        long sum = 0;
        for (int i = from; i < to; i++) {
            sum += COUNTS[seq[i] & 0xFF];
        }
        return sum;
    }

    /** The model at position {@code pos}. */
    public ScoringModel at(int pos) {
        if (classes.length == 1) {
            return known(0);
        }
        long x = (long) pos + offset;
        int k = (int) Math.min(x / block, classes.length - 1);
        return known(k);
    }

    private ScoringModel known(int k) {
        int c = classes[k];
        if (c < 0) {
            throw new IllegalStateException("composition block " + k + " was not read");
        }
        return ScoringModel.forClass(c);
    }

    /** The background of a copy of the contig that starts at contig position {@code d}. */
    public Background shifted(int d) {
        return new Background(length, block, offset + d, classes);
    }
}
