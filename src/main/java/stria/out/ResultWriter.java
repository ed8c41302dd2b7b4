package stria.out;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.List;
import stria.StriaException;
import stria.io.ContigBytes;
import stria.io.Region;
import stria.score.Locus;

/**
 * Writes loci in one {@link ResultFormat} to a stream (usually one of {@link AtomicOutputs}): the header
 * first, then one line per locus. Lines are gathered in a buffer and written in large blocks.
 */
public final class ResultWriter implements LocusSink {
    private static final int BLOCK = 1 << 16;

    private final OutputStream out;
    private final String name;
    private final Lines lines;
    private final String columnRow;
    private final StringBuilder buf = new StringBuilder(BLOCK);
    /** Set by {@link #sealed}: the closing line's count and checksum, over the data lines only. */
    private ResultSeal seal;
    /** The buffer holds data lines (loci), which the seal counts; the header lines it does not. */
    private boolean data;

    /** The text of a locus in one format; told each stretch's bases first, for formats that quote them. */
    public interface Lines {
        /** Appends the line of one locus, line end included. */
        void append(StringBuilder sb, String contig, Locus locus);

        /** The loci of {@code stretch} follow; {@code seq} is as {@link LocusSink#begin} describes it. */
        default void begin(Region stretch, ContigBytes seq) {
        }

        /** As {@link LocusSink#reach}. */
        default int reach() {
            return 0;
        }
    }

    /** @param name the output as the user named it, for messages */
    public ResultWriter(OutputStream out, String name, ResultFormat format) {
        this(out, name, format::append, format.columnRow());
    }

    /** A writer of other lines: {@code columnRow} (or null) follows the header lines. */
    public ResultWriter(OutputStream out, String name, Lines lines, String columnRow) {
        this.out = out;
        this.name = name;
        this.lines = lines;
        this.columnRow = columnRow;
    }

    /**
     * Ends the result with a {@link ResultSeal} line (a shard's result, which {@code merge} checks). Call
     * before {@link #header}.
     */
    public ResultWriter sealed() {
        seal = new ResultSeal();
        return this;
    }

    /** Writes the {@code #} lines and, for TSV, the column row. */
    public void header(List<String> lines) {
        for (String l : lines) {
            buf.append(l).append('\n');
        }
        if (columnRow != null) {
            buf.append(columnRow).append('\n');
        }
        write();
    }

    @Override
    public int reach() {
        return lines.reach();
    }

    @Override
    public void begin(Region stretch, ContigBytes seq) {
        lines.begin(stretch, seq);
    }

    @Override
    public void locus(String contig, Locus l) {
        lines.append(buf, contig, l);
        data = true;
        if (buf.length() > BLOCK) {
            write();
        }
    }

    @Override
    public void finish() {
        write();
        if (seal != null) {
            buf.append(seal.closingLine()).append('\n');
            seal = null;
            write();
        }
        try {
            out.flush();
        } catch (IOException | UncheckedIOException | htsjdk.samtools.util.RuntimeIOException e) {
            throw failure(e);
        }
    }

    private void write() {
        byte[] bytes = buf.toString().getBytes(StandardCharsets.UTF_8);
        if (seal != null && data) {
            // a format may skip a locus (the catalogue keeps short periods only) or write no line for it
            long n = lineEnds(bytes);
            if (n > 0) {
                seal.data(bytes, 0, bytes.length, n);
            }
        }
        data = false;
        try {
            out.write(bytes);
        } catch (IOException | UncheckedIOException | htsjdk.samtools.util.RuntimeIOException e) {
            throw failure(e);
        }
        buf.setLength(0);
    }

    private static long lineEnds(byte[] bytes) {
        long n = 0;
        for (byte b : bytes) {
            if (b == '\n') {
                n++;
            }
        }
        return n;
    }

    private StriaException failure(Exception e) {
        return StriaException.io("cannot write " + name, e);
    }
}
