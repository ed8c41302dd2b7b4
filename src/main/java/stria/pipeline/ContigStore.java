package stria.pipeline;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Path;

import stria.StriaException;
import stria.io.BaseStream;
import stria.io.ContigBytes;
import stria.io.ContigInfo;
import stria.io.TempDir;
import stria.score.Background;
import stria.score.ScoringModel;

/**
 * The bases of a stretch {@code [origin, end)} of a contig being scanned (the whole contig, or the context
 * around a region or shard piece), in contig coordinates: filled front to back from a stream
 * ({@link #fill}, one thread) and read anywhere already filled, by any thread. A stretch up to
 * {@code inMemoryMax} bases is held in an array; a longer one goes to a temporary file, so memory does not
 * grow with chromosome length (the page cache holds the file, not the heap). The file is unlinked as soon
 * as it is open: nothing is left behind whatever way the process ends.
 *
 * <p>As it fills, the store tallies the composition of the contig's composition blocks
 * ({@link Background}, blocks of {@code block} bases from the contig's first base); {@link #background}
 * gives the models of the blocks read whole so far.
 */
abstract class ContigStore implements ContigBytes, AutoCloseable {
    private static final int PIECE = 1 << 20;

    final ContigInfo contig;
    final int origin;
    final int end;
    private final BaseStream in;
    private volatile int filledTo;
    final int block;
    // G or C, and A, C, G or T, bases read so far per composition block; written by the filling thread
    // before filledTo moves past them, read by others only below filledTo
    private final long[] gc;
    private final long[] acgt;

    private ContigStore(ContigInfo contig, int origin, int end, BaseStream in, int block) {
        this.contig = contig;
        this.origin = origin;
        this.end = end;
        this.in = in;
        this.filledTo = origin;
        this.block = block;
        int n = Background.blocks(contig.length(), block);
        this.gc = new long[n];
        this.acgt = new long[n];
    }

    /**
     * @param in    the contig's bases from {@code origin} on
     * @param block length of the composition blocks
     */
    static ContigStore open(ContigInfo contig, int origin, int end, BaseStream in, int inMemoryMax, int block) {
        if (origin < 0 || origin > end || end > contig.length()) {
            throw new IllegalArgumentException("[" + origin + ", " + end + ") outside " + contig);
        }
        return end - origin <= inMemoryMax ? new InMemory(contig, origin, end, in, block)
                : new Spooled(contig, origin, end, in, block);
    }

    /** Contig position of the first base of the composition block holding {@code pos}. */
    static int blockStartAt(int pos, int length, int block) {
        return Background.blockStart(Background.blockOf(pos, length, block), block);
    }

    /** Contig position one past the composition block holding {@code pos}. */
    static int blockEndAt(int pos, int length, int block) {
        return Background.blockEnd(Background.blockOf(pos, length, block), length, block);
    }

    /** The composition models of the blocks that lie whole in {@code [origin, filled())}; others unknown. */
    final Background background() {
        int filled = filledTo;
        int n = gc.length;
        boolean[] known = new boolean[n];
        for (int k = 0; k < n; k++) {
            known[k] = Background.blockStart(k, block) >= origin
                    && Background.blockEnd(k, contig.length(), block) <= filled;
        }
        return Background.of(contig.length(), block, gc, acgt, known);
    }

    /** The model of composition block {@code k}, or null while it is not read whole. */
    final ScoringModel blockModel(int k) {
        int len = contig.length();
        if (Background.blockStart(k, block) < origin || Background.blockEnd(k, len, block) > filledTo) {
            return null;
        }
        return ScoringModel.forClass(ScoringModel.classOf(gc[k], acgt[k]));
    }

    /** Tallies the bases {@code buf[off, off + n)}, which are contig positions {@code [pos, pos + n)}. */
    final void tally(byte[] buf, int off, int n, int pos) {
        int len = contig.length();
        int i = 0;
        while (i < n) {
            int k = Background.blockOf(pos + i, len, block);
            int stop = Math.min(n, Background.blockEnd(k, len, block) - pos);
            long t = Background.tally(buf, off + i, off + stop);
            gc[k] += t >>> 32;
            acgt[k] += t & 0xFFFFFFFFL;
            i = stop;
        }
    }

    @Override
    public final int length() {
        return contig.length();
    }

    /** {@code [origin, filled())} may be copied. */
    final int filled() {
        return filledTo;
    }

    /** Reads bases from the stream until {@code [origin, upTo)} is filled (at most to {@code end}). */
    final void fill(int upTo) {
        int at = filledTo;
        int stop = Math.min(upTo, end);
        while (at < stop) {
            at += put(in, at - origin, stop - at);
            filledTo = at;
        }
    }

    @Override
    public final void copy(int from, int to, byte[] dst, int off) {
        if (from < origin || from > to || to > filledTo) {
            throw new IllegalStateException(contig.name() + ": [" + from + ", " + to + ") read outside the stretch ["
                    + origin + ", " + filledTo + ") filled so far");
        }
        get(from - origin, to - origin, dst, off);
    }

    /** Takes up to {@code max} bases from {@code in} to stretch offset {@code at}; returns how many, at least 1. */
    abstract int put(BaseStream in, int at, int max);

    /** Copies stretch offsets {@code [from, to)}. */
    abstract void get(int from, int to, byte[] dst, int off);

    @Override
    public abstract void close();

    private static final class InMemory extends ContigStore {
        private final byte[] seq;

        InMemory(ContigInfo contig, int origin, int end, BaseStream in, int block) {
            super(contig, origin, end, in, block);
            this.seq = new byte[end - origin];
        }

        @Override
        int put(BaseStream in, int at, int max) {
            in.read(seq, at, max);
            tally(seq, at, max, origin + at);
            return max;
        }

        @Override
        void get(int from, int to, byte[] dst, int off) {
            System.arraycopy(seq, from, dst, off, to - from);
        }

        @Override
        public byte[] array() {
            return origin == 0 && filled() == contig.length() ? seq : null;
        }

        @Override
        public void close() {
        }
    }

    private static final class Spooled extends ContigStore {
        private final Path dir;
        private final FileChannel channel;
        private final byte[] piece = new byte[PIECE];

        Spooled(ContigInfo contig, int origin, int end, BaseStream in, int block) {
            super(contig, origin, end, in, block);
            this.dir = TempDir.directory();
            try {
                channel = TempDir.scratch(dir, "stria-contig-");
            } catch (IOException e) {
                throw failure(e);
            }
        }

        @Override
        int put(BaseStream in, int at, int max) {
            int n = Math.min(max, PIECE);
            in.read(piece, 0, n);
            tally(piece, 0, n, origin + at);
            ByteBuffer b = ByteBuffer.wrap(piece, 0, n);
            try {
                long pos = at;
                while (b.hasRemaining()) {
                    pos += channel.write(b, pos);
                }
            } catch (IOException e) {
                throw failure(e);
            }
            return n;
        }

        @Override
        void get(int from, int to, byte[] dst, int off) {
            ByteBuffer b = ByteBuffer.wrap(dst, off, to - from);
            try {
                long pos = from;
                while (b.hasRemaining()) {
                    int n = channel.read(b, pos);
                    if (n < 0) {
                        throw new IOException("temporary file ends early");
                    }
                    pos += n;
                }
            } catch (IOException e) {
                throw failure(e);
            }
        }

        private StriaException failure(IOException e) {
            String why = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
            return new StriaException("cannot keep a temporary copy of contig " + contig.name() + " in " + dir
                    + " (" + why.replaceAll("\\s+", " ").strip() + "); set TMPDIR to a directory with room for the"
                    + " longest contig", e);
        }

        @Override
        public void close() {
            try {
                channel.close();
            } catch (IOException e) {
                // the file is already unlinked; closing it cannot lose results
            }
        }
    }
}
