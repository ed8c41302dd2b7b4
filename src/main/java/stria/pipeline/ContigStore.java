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

/**
 * The bases of a contig being scanned: filled front to back by the reader thread ({@link #fill}) and read
 * anywhere already filled, by any thread. A contig up to {@code inMemoryMax} bases is held in an array;
 * a longer one goes to a temporary file, so memory does not grow with chromosome length (the page cache
 * holds the file, not the heap). The file is unlinked as soon as it is open: nothing is left behind
 * whatever way the process ends.
 */
abstract class ContigStore implements ContigBytes, AutoCloseable {
    private static final int PIECE = 1 << 20;

    final ContigInfo contig;
    private final BaseStream in;
    private volatile int filled;

    private ContigStore(ContigInfo contig, BaseStream in) {
        this.contig = contig;
        this.in = in;
    }

    static ContigStore open(ContigInfo contig, BaseStream in, int inMemoryMax) {
        return contig.length() <= inMemoryMax ? new InMemory(contig, in) : new Spooled(contig, in);
    }

    @Override
    public final int length() {
        return contig.length();
    }

    /** Bases read so far: {@code [0, filled())} may be copied. */
    final int filled() {
        return filled;
    }

    /** Reads bases from the input until {@code [0, upTo)} is filled. Reader thread only. */
    final void fill(int upTo) {
        int at = filled;
        while (at < upTo) {
            at += put(in, at, Math.min(upTo, contig.length()) - at);
            filled = at;
        }
    }

    @Override
    public final void copy(int from, int to, byte[] dst, int off) {
        if (from < 0 || from > to || to > filled) {
            throw new IllegalStateException(contig.name() + ": [" + from + ", " + to + ") read before it was filled ("
                    + filled + " bases)");
        }
        get(from, to, dst, off);
    }

    /** Takes up to {@code max} bases from {@code in} into {@code [at, at + n)}; returns n, at least 1. */
    abstract int put(BaseStream in, int at, int max);

    abstract void get(int from, int to, byte[] dst, int off);

    @Override
    public abstract void close();

    private static final class InMemory extends ContigStore {
        private final byte[] seq;

        InMemory(ContigInfo contig, BaseStream in) {
            super(contig, in);
            this.seq = new byte[contig.length()];
        }

        @Override
        int put(BaseStream in, int at, int max) {
            in.read(seq, at, max);
            return max;
        }

        @Override
        void get(int from, int to, byte[] dst, int off) {
            System.arraycopy(seq, from, dst, off, to - from);
        }

        @Override
        public byte[] array() {
            return filled() == seq.length ? seq : null;
        }

        @Override
        public void close() {
        }
    }

    private static final class Spooled extends ContigStore {
        private final Path dir;
        private final FileChannel channel;
        private final byte[] piece = new byte[PIECE];

        Spooled(ContigInfo contig, BaseStream in) {
            super(contig, in);
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
