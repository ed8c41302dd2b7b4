package stria.out;

import java.io.Closeable;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import stria.Intervals;
import stria.StriaException;
import stria.io.ContigBytes;
import stria.io.Region;
import stria.score.Locus;

/**
 * Writes a genome as FASTA with the reported repeats masked, contig by contig in input order.
 *
 * <p>Every line of sequence has the same width (the last line of a record may be shorter), so a BGZF
 * output can be indexed with {@code samtools faidx}. Records carry the contig name only: a description
 * would be copied unchecked from the input and is of no use to a masked copy.
 *
 * <p>As a {@link LocusSink} it masks the loci of each stretch, which must be a whole contig, when the stretch
 * ends. {@link #close()} (and {@link #finish()}) flushes but leaves {@code out} open: the stream belongs to the
 * caller (usually {@link AtomicOutputs}, which closes and renames it on commit).
 */
public final class MaskedFastaWriter implements LocusSink, Closeable {

    /** How repeat bases and the other bases are written. */
    public enum Mode {
        /** Repeats in lower case, every other base in upper case: the masking says only what this scan found. */
        SOFT,
        /** Repeats in lower case, every other base as in the input, so earlier soft-masking survives. */
        SOFT_KEEP,
        /** Repeats replaced by N, every other base as in the input. */
        HARD
    }

    public static final int DEFAULT_LINE_WIDTH = 60;

    private static final byte[] UPPER = new byte[256];
    private static final byte[] LOWER = new byte[256];

    static {
        for (int i = 0; i < 256; i++) {
            UPPER[i] = (byte) (i >= 'a' && i <= 'z' ? i - 32 : i);
            LOWER[i] = (byte) (i >= 'A' && i <= 'Z' ? i + 32 : i);
        }
    }

    /** Lines read from the contig at a time. */
    private static final int BLOCK_LINES = 16_384;

    private final OutputStream out;
    private final Mode mode;
    private final int lineWidth;
    private final byte[] buf;
    private int used;
    /** Loci of the contig being scanned, as a sink. */
    private int[] lociStarts = new int[1024];
    private int[] lociEnds = new int[1024];
    private int loci;

    public MaskedFastaWriter(OutputStream out, Mode mode, int lineWidth) {
        if (lineWidth < 1) {
            throw new IllegalArgumentException("line width must be positive: " + lineWidth);
        }
        this.out = out;
        this.mode = mode;
        this.lineWidth = lineWidth;
        // whole lines always fit, so a line is never split across two writes
        this.buf = new byte[Math.max(1 << 16, 2 * (lineWidth + 1))];
    }

    public MaskedFastaWriter(OutputStream out, Mode mode) {
        this(out, mode, DEFAULT_LINE_WIDTH);
    }

    /**
     * Writes one contig. {@code seq[0..length)} holds the bases as read; the repeats are the intervals
     * {@code [starts[k], ends[k])} for {@code k < count}, 0-based, end exclusive, sorted by start, and may
     * overlap or nest.
     */
    public void writeContig(String name, byte[] seq, int length, int[] starts, int[] ends, int count) {
        writeContig(name, ContigBytes.of(seq, length), starts, ends, count);
    }

    /** As above for a contig read in blocks, so that a chromosome is never copied whole. */
    public void writeContig(String name, ContigBytes seq, int[] starts, int[] ends, int count) {
        int length = seq.length();
        checkIntervals(name, length, starts, ends, count);
        int[] maskStarts = Arrays.copyOf(starts, count);
        int[] maskEnds = Arrays.copyOf(ends, count);
        int masks = Intervals.union(maskStarts, maskEnds, count);
        put(('>' + name + '\n').getBytes(StandardCharsets.UTF_8));
        byte[] plain = mode == Mode.SOFT ? UPPER : null;
        byte[] whole = seq.array();
        byte[] block = whole != null ? whole : new byte[Math.min(length, BLOCK_LINES * lineWidth)];
        int blockStart = 0;
        int blockEnd = whole != null ? length : 0;
        int next = 0; // the first mask that does not end before the current base
        for (int lineStart = 0; lineStart < length; lineStart += lineWidth) {
            int lineEnd = Math.min(length, lineStart + lineWidth);
            if (lineEnd > blockEnd) {
                // blocks hold whole lines, so a line never spans two
                blockStart = lineStart;
                blockEnd = Math.min(length, lineStart + block.length);
                seq.copy(blockStart, blockEnd, block, 0);
            }
            if (used + (lineEnd - lineStart) + 1 > buf.length) {
                drain();
            }
            for (int i = lineStart; i < lineEnd; i++) {
                while (next < masks && maskEnds[next] <= i) {
                    next++;
                }
                int b = block[i - blockStart] & 0xff;
                byte o;
                if (next < masks && maskStarts[next] <= i) {
                    o = mode == Mode.HARD ? (byte) 'N' : LOWER[b];
                } else {
                    o = plain == null ? (byte) b : plain[b];
                }
                buf[used++] = o;
            }
            buf[used++] = '\n';
        }
    }

    @Override
    public void begin(Region stretch, ContigBytes seq) {
        if (stretch.start() != 0 || stretch.end() != seq.length()) {
            throw new IllegalStateException("a masked genome is written whole, not " + stretch);
        }
        loci = 0;
    }

    @Override
    public void locus(String contig, Locus l) {
        if (loci == lociStarts.length) {
            lociStarts = Arrays.copyOf(lociStarts, 2 * loci);
            lociEnds = Arrays.copyOf(lociEnds, 2 * loci);
        }
        lociStarts[loci] = l.start();
        lociEnds[loci] = l.end();
        loci++;
    }

    @Override
    public void end(Region stretch, ContigBytes seq) {
        writeContig(stretch.contig(), seq, lociStarts, lociEnds, loci);
    }

    @Override
    public void finish() {
        close();
    }

    private static void checkIntervals(String name, int length, int[] starts, int[] ends, int count) {
        if (count < 0 || count > starts.length || count > ends.length) {
            throw new IllegalArgumentException(name + ": interval count " + count + " out of range");
        }
        for (int k = 0; k < count; k++) {
            if (starts[k] < 0 || starts[k] > ends[k] || ends[k] > length) {
                throw new IllegalArgumentException(name + ": interval [" + starts[k] + ", " + ends[k]
                        + ") outside the contig of length " + length);
            }
            if (k > 0 && starts[k] < starts[k - 1]) {
                throw new IllegalArgumentException(name + ": intervals not sorted by start at index " + k);
            }
        }
    }

    private void put(byte[] bytes) {
        if (used + bytes.length > buf.length) {
            drain();
        }
        if (bytes.length > buf.length) {
            write(bytes, bytes.length);
            return;
        }
        System.arraycopy(bytes, 0, buf, used, bytes.length);
        used += bytes.length;
    }

    private void drain() {
        write(buf, used);
        used = 0;
    }

    private void write(byte[] b, int n) {
        try {
            out.write(b, 0, n);
        } catch (IOException e) {
            throw StriaException.io("cannot write the masked FASTA", e);
        }
    }

    /** Writes out what is buffered and flushes {@code out}, which stays open. */
    @Override
    public void close() {
        drain();
        try {
            out.flush();
        } catch (IOException e) {
            throw StriaException.io("cannot write the masked FASTA", e);
        }
    }
}
