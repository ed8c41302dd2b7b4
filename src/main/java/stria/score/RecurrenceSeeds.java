package stria.score;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;
import java.util.Arrays;
import stria.io.Bases;
import stria.repeats.RunList;

/**
 * Seeds for imperfect repeats of longer periods, where exact runs are too rare to rely on: at 85 %
 * identity two copies of a 30-base unit almost never agree over a whole unit, but short words still
 * recur at the unit's distance. A position is a candidate of period d when its {@link #K}-mer last
 * occurred d bases earlier; it becomes a seed when, over the {@link #WINDOW} positions around it, at
 * least {@link #AGREE} of the bases equal the base d positions before them. Random DNA agrees a quarter
 * of the time, so a chance recurrence of a word (which itself covers a few bases) rarely passes, while
 * two copies of a unit at 85 % identity agree about three quarters of the time. The 16 bases next to
 * the word are checked first ({@link #QUICK}), which spares the full count for most chance recurrences.
 *
 * <p>Each seed depends only on {@code seq[i - maxPeriod - WINDOW, i + WINDOW)}, so seeds far enough
 * inside the scanned range are the same wherever the scan started; {@link #context(int)} says how far.
 */
final class RecurrenceSeeds {
    static final int K = 7;
    static final int WINDOW = 64;
    /** Half of the window: 4.5 standard deviations above chance agreement in random DNA. */
    static final int AGREE = 32;
    /**
     * Longest distance looked at, whatever the largest period: beyond it almost every word has occurred
     * before by chance, and units that long are outside what a tandem-repeat scan is for.
     */
    static final int MAX_DISTANCE = 10_000;
    /** Agreements of 16 needed before the full window is counted. */
    static final int QUICK = 8;
    /** Shorter periods are seeded by exact runs, which separate neighbouring short periods better. */
    static final int MIN_PERIOD = 7;

    private static final int MASK = (1 << (2 * K)) - 1;
    /** Eight codes read as one long, in either byte order (only equal bytes are counted). */
    private static final VarHandle LONGS = MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);
    private static final long LOW7 = 0x7F7F7F7F7F7F7F7FL;

    private final int[] last = new int[1 << (2 * K)];
    private byte[] codes = new byte[0];

    /** Bases of sequence before a position that its seeds depend on. */
    static int context(int maxPeriod) {
        return Math.min(maxPeriod, MAX_DISTANCE) + WINDOW + K;
    }

    /**
     * Appends to {@code out} one seed per verified position {@code i} in {@code [from, to)} (K-mers ending
     * past {@code to} are not looked at): interval {@code [i - d, i + K)}, period d. The verification
     * window may read {@code seq} up to {@code length}; {@code to} must not pass it.
     */
    void find(byte[] seq, int length, int from, int to, int maxPeriod, RunList out) {
        if (to > length) {
            throw new IllegalArgumentException("seeds up to " + to + " asked of " + length + " readable positions");
        }
        if (maxPeriod < MIN_PERIOD) {
            return;
        }
        maxPeriod = Math.min(maxPeriod, MAX_DISTANCE);
        Arrays.fill(last, Integer.MIN_VALUE / 2);
        // the codes of every base the loop and the agreement windows read, looked up once
        int base = Math.max(0, from - maxPeriod - WINDOW);
        int top = Math.min(length, Math.max(to, from) + WINDOW);
        top = Math.max(top, base);
        if (codes.length < top - base) {
            codes = new byte[Math.max(top - base, 2 * codes.length)];
        }
        byte[] code = codes;
        Bases.encode(seq, base, top - base, code);
        int kmer = 0;
        int valid = 0;
        int half = WINDOW / 2;
        // agreement window of the previous position, slid instead of recounted while d stays the same
        int wd = -1;
        int wx0 = 0;
        int wx1 = 0;
        int agree = 0;
        // consecutive seeds of one distance are reported as one interval
        int blockD = -1;
        int blockFrom = 0;
        int blockLast = 0;
        for (int i = from; i < to; i++) {
            int c = code[i - base];
            if (c < 0 || c > 3) {
                valid = 0;
                continue;
            }
            kmer = ((kmer << 2) | c) & MASK;
            if (++valid < K) {
                continue;
            }
            int start = i - K + 1;
            int d = start - last[kmer];
            last[kmer] = start;
            if (d < MIN_PERIOD || d > maxPeriod) {
                continue;
            }
            int x0 = Math.max(start - half, d);
            int x1 = Math.min(start + half, length);
            if (x1 - x0 < AGREE) {
                continue;
            }
            if (d != wd || x0 < wx0 || x0 > wx1) {
                // a fresh distance: most are chance recurrences, so look at the 8 bases on each side of
                // the word first (a repeat agrees on about three quarters of them, chance on a quarter)
                if (quick(code, start - base, d, length - base) < QUICK) {
                    continue;
                }
                wd = d;
                wx0 = x0;
                wx1 = x0;
                agree = 0;
            }
            while (wx0 < x0) {
                agree -= agrees(code, wx0++ - base, d);
            }
            while (wx1 + 8 <= x1) {
                agree += agrees8(code, wx1 - base, d);
                wx1 += 8;
            }
            while (wx1 < x1) {
                agree += agrees(code, wx1++ - base, d);
            }
            if (agree < AGREE) {
                continue;
            }
            if (d == blockD && start == blockLast + 1) {
                blockLast = start;
                continue;
            }
            if (blockD > 0) {
                out.add(blockFrom - blockD, blockLast + K, blockD);
            }
            blockD = d;
            blockFrom = start;
            blockLast = start;
        }
        if (blockD > 0) {
            out.add(blockFrom - blockD, blockLast + K, blockD);
        }
    }

    /**
     * Agreements at distance d over the 8 bases before and the 8 after the word starting at start, in
     * {@code code} (codes from a base of the sequence on, {@code length} of them readable).
     */
    private static int quick(byte[] code, int start, int d, int length) {
        if (start - 8 >= d && start + K + 8 <= length) {
            return agrees8(code, start - 8, d) + agrees8(code, start + K, d);
        }
        int n = 0;
        for (int x = Math.max(d, start - 8); x < start; x++) {
            n += agrees(code, x, d);
        }
        for (int x = start + K, e = Math.min(length, start + K + 8); x < e; x++) {
            n += agrees(code, x, d);
        }
        return n;
    }

    /** {@link #agrees} summed over the 8 codes from x, read as one long each. */
    private static int agrees8(byte[] code, int x, int d) {
        long a = (long) LONGS.get(code, x);
        long b = (long) LONGS.get(code, x - d);
        // a byte of v is zero exactly where the codes are equal and in 0..3; count the zero bytes
        long v = (a ^ b) | (a & 0xFCFCFCFCFCFCFCFCL);
        long nonzero = ((v & LOW7) + LOW7) | v;
        return Long.bitCount(~nonzero & 0x8080808080808080L);
    }

    /** 1 when the code at x is A, C, G or T and equals the code d before it. */
    private static int agrees(byte[] code, int x, int d) {
        // zero exactly when the codes are equal and in 0..3: chance agreement is a coin toss for the branch
        // predictor, so the count is formed without branches
        int a = code[x];
        int v = (a ^ code[x - d]) | (a & ~3);
        return 1 - ((v | -v) >>> 31);
    }
}
