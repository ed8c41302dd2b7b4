package stria.io;

import java.io.Closeable;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.zip.GZIPInputStream;

import htsjdk.samtools.SAMException;
import htsjdk.samtools.util.BlockCompressedInputStream;
import htsjdk.samtools.util.GZIIndex;
import stria.StriaException;

/**
 * The decompressed bytes of a genome file seen through one large buffer, addressed by uncompressed
 * offset. Parsers work on {@link #buf} between {@link #pos} and {@link #lim} directly: a method call
 * per byte would cost more than the parsing itself.
 */
final class InputCursor implements Closeable {
    private static final int BUFFER = 1 << 20;
    /** Below this distance reading forward is cheaper than a seek that decompresses a whole block anew. */
    private static final long SKIP_BY_READING = 8L << 20;

    private final Path path;
    private final Compression kind;
    private final GZIIndex gzi;
    private final String display;

    final byte[] buf = new byte[BUFFER];
    int pos;
    int lim;
    /** Uncompressed offset of {@code buf[0]}. */
    private long bufStart;

    private boolean damaged;
    private FileChannel channel;
    private InputStream stream;
    private BlockCompressedInputStream bgzf;

    InputCursor(Path path, Compression kind, GZIIndex gzi, String display) {
        this.path = path;
        this.kind = kind;
        this.gzi = gzi;
        this.display = display;
        reopen();
    }

    long position() {
        return bufStart + pos;
    }

    /**
     * Drops the consumed buffer and reads the next bytes. Call only when {@code pos == lim}.
     *
     * @return false at the end of the data
     */
    boolean refill() {
        bufStart += lim;
        pos = 0;
        lim = 0;
        try {
            int n;
            do {
                n = kind == Compression.PLAIN ? channel.read(ByteBuffer.wrap(buf)) : stream.read(buf, 0, buf.length);
            } while (n == 0);
            lim = Math.max(n, 0);
            return n > 0;
        } catch (IOException | RuntimeException e) {
            throw failure(e);
        } catch (OutOfMemoryError e) {
            throw outOfMemory(e);
        }
    }

    /** Next byte without consuming it, or -1 at the end. */
    int peek() {
        if (pos == lim && !refill()) {
            return -1;
        }
        return buf[pos] & 0xFF;
    }

    /**
     * Places the cursor at an uncompressed offset.
     *
     * @return false when the data ends before it
     */
    boolean moveTo(long target) {
        if (target >= bufStart && target <= bufStart + lim) {
            pos = (int) (target - bufStart);
            return true;
        }
        boolean canSeek = kind == Compression.PLAIN || (kind == Compression.BGZF && gzi != null);
        long here = position();
        if (target < here || (canSeek && target - here > SKIP_BY_READING)) {
            if (canSeek) {
                seek(target);
                return true;
            }
            close();
            reopen();
        }
        while (target > bufStart + lim) {
            pos = lim;
            if (!refill()) {
                return false;
            }
        }
        pos = (int) (target - bufStart);
        return true;
    }

    private void seek(long target) {
        try {
            if (kind == Compression.PLAIN) {
                channel.position(target);
            } else {
                bgzf.seek(gzi.getVirtualOffsetForSeek(target));
            }
        } catch (IllegalArgumentException e) {
            throw new StriaException(display + ": cannot seek to offset " + target + " (" + oneLine(e) + ")", e);
        } catch (IOException | RuntimeException e) {
            throw failure(e);
        } catch (OutOfMemoryError e) {
            throw outOfMemory(e);
        }
        bufStart = target;
        pos = 0;
        lim = 0;
    }

    private void reopen() {
        bufStart = 0;
        pos = 0;
        lim = 0;
        try {
            switch (kind) {
                case PLAIN -> channel = FileChannel.open(path, StandardOpenOption.READ);
                case GZIP -> stream = new GZIPInputStream(Files.newInputStream(path), 1 << 16);
                case BGZF -> {
                    bgzf = new BlockCompressedInputStream(path);
                    bgzf.setCheckCrcs(true);
                    stream = bgzf;
                }
            }
        } catch (IOException | RuntimeException e) {
            throw failure(e);
        }
    }

    /**
     * A content error in compressed input can be the first visible sign of damage that the checksum at
     * the end of the stream would report; the damage is then the truer message. Reads to the end to find out.
     */
    StriaException preferDamage(StriaException contentError) {
        if (kind == Compression.PLAIN || damaged) {
            return contentError;
        }
        try {
            do {
                pos = lim;
            } while (refill());
        } catch (StriaException damage) {
            return damage;
        }
        return contentError;
    }

    /**
     * The user-facing form of a read failure: for compressed input it is almost always damage. Callers
     * pass any runtime exception of the library's decompressor too: on damaged blocks it fails with index
     * and argument errors as well as its own exceptions (a block size field smaller than the block header
     * gives an array index error).
     */
    StriaException failure(Exception e) {
        damaged = true;
        if (kind == Compression.PLAIN) {
            return new StriaException(display + ": cannot read (" + oneLine(e) + ")", e);
        }
        // the decompressor's index and argument errors name no cause a user could act on
        boolean bare = e instanceof IndexOutOfBoundsException
                || (e instanceof RuntimeException && !(e instanceof SAMException) && e.getMessage() == null);
        return new StriaException(display + ": truncated or corrupt " + kind.label + " data ("
                + (bare ? "a block does not decode" : oneLine(e)) + ")", e);
    }

    /**
     * A BGZF block whose size field (ISIZE) is damaged makes the library's decompressor allocate up to
     * 2 GB for it; valid blocks hold at most 64 KB, so running out of memory while reading compressed data
     * almost always means such damage. The failed allocation left the heap as it was.
     */
    private StriaException outOfMemory(OutOfMemoryError e) {
        damaged = true;
        if (kind == Compression.PLAIN) {
            throw e;
        }
        return new StriaException(display + ": truncated or corrupt " + kind.label + " data (a block claims more"
                + " data than memory holds); if 'gzip -t' finds the file sound, give stria more memory with"
                + " STRIA_JAVA_OPTS=-Xmx...", e);
    }

    static String oneLine(Throwable e) {
        String m = e instanceof java.io.EOFException && e.getMessage() == null ? "unexpected end of data"
                : e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
        m = m.replaceAll("\\s+", " ").strip();
        return m.length() > 200 ? m.substring(0, 200) + "..." : m;
    }

    @Override
    public void close() {
        try {
            if (channel != null) {
                channel.close();
            }
            if (stream != null) {
                stream.close();
            }
        } catch (IOException | SAMException e) {
            // nothing was written through it, so nothing can be lost by ignoring a failed close
        }
        channel = null;
        stream = null;
        bgzf = null;
    }
}
