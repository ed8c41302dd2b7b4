package stria.io;

import java.util.Objects;
import java.util.function.Function;

import stria.StriaException;

/**
 * Reads one record's letters front to back in pieces, checking each byte, so that a chromosome can be
 * processed without ever being held whole. Between calls it keeps only its place: bases delivered, lines
 * passed, bases on the current line and the uncompressed offset where it stopped. A piece always ends
 * just after a letter, so the place is at a line start (where a '>' ends the record) only where the
 * stream starts. The cursor is shared by every stream of the file, so each call takes the reader's lock
 * and moves the cursor back to that offset first (cheap while it is still inside the cursor's buffer).
 *
 * <p>When the record has a {@link LineLayout} every line end passed must be exactly
 * where and what the layout says: this costs a few comparisons per line, and it is what lets a stream
 * start in the middle of the record ({@link #enter}) and still notice a layout that is not the file's.
 * Without a layout line ends may come anywhere.
 *
 * <p>A call that fails leaves the place unchanged, so calling again fails the same way.
 */
final class RecordStream implements BaseStream {
    private final Object lock;
    private final InputCursor in;
    private final String display;
    private final String name;
    private final int length;
    private final long seqOffset;
    private final long headerLine;
    private final LineLayout layout;
    private final Function<String, String> mismatch;

    private int delivered;
    private long lines;
    /** Bases on the current line before the place. */
    private int column;
    private long offset;

    /**
     * A stream at the first base of a record.
     *
     * @param lock       held during every read: the reader that owns the cursor
     * @param seqOffset  uncompressed offset of the record's first sequence byte
     * @param headerLine line number of the record's header, or 0 when unknown (then it is counted only if
     *                   a message needs it)
     * @param mismatch   the message for a record whose bases do not end where expected, given the detail
     */
    RecordStream(Object lock, InputCursor in, String display, String name, int length, long seqOffset,
                 long headerLine, LineLayout layout, Function<String, String> mismatch) {
        this.lock = lock;
        this.in = in;
        this.display = display;
        this.name = name;
        this.length = length;
        this.seqOffset = seqOffset;
        this.headerLine = headerLine;
        this.layout = layout;
        this.mismatch = mismatch;
        this.offset = seqOffset;
    }

    /**
     * Moves a stream that has not been read yet to base {@code from} (at most the length).
     *
     * <p>With a line layout the place is computed, and only the bytes from about there on are read: the
     * line end before the line of {@code from} must be exactly the layout's. A layout the file was seen to
     * have ({@code trusted}) needs nothing more. One taken from an index is a claim, and a wrong one could
     * land on the wrong base while the line ends around it still look right; so one whole line is read
     * first, with its line end before and after: the line of {@code from}, or, when that is the record's
     * last (which may be shorter), the one before it and the last up to {@code from}. Where every line of
     * the record is as long as the first, that passes only when the claim is the file's layout, and the
     * last line then holds nothing but bases up to {@code from}. Without a layout, and when the index puts
     * the whole record on one line (no line end to check it by), the bases before {@code from} are parsed
     * and dropped.
     *
     * <p>What lies before the line of {@code from} is not read, so damage there (a bad letter, a line of
     * another length) is not reported, where reading from the start would report it.
     */
    void enter(int from, boolean trusted) {
        synchronized (lock) {
            if (from == 0) {
                return;
            }
            if (from == length) {
                delivered = length;
                return;
            }
            if (!layout.exists() || (!trusted && layout.oneLine(length))) {
                parse(null, 0, from);
                return;
            }
            int width = layout.basesPerLine();
            long line = layout.line(from);
            long check = !trusted && line == layout.line(length - 1) ? line - 1 : line;
            placeAt(check * width);
            if (check > 0) {
                checkLineStart();
            }
            if (!trusted) {
                parse(null, 0, (int) Math.max(width + 1L, from - check * width));
            }
            placeAt(from);
        }
    }

    private void placeAt(long base) {
        delivered = (int) base;
        lines = layout.line(base);
        column = layout.column(base);
        offset = seqOffset + layout.offset(base);
    }

    /**
     * At a line start other than the first: the bytes before must be exactly the layout's line end, after
     * a byte that is not part of one (a bad letter there lies before the stream and is not reported).
     */
    private void checkLineStart() {
        int lineEnd = layout.lineEnd();
        boolean ok = in.moveTo(offset - lineEnd - 1);
        for (int k = -1; ok && k < lineEnd; k++) {
            int c = in.peek();
            ok = k < 0 ? c >= 0 && c != '\r' && c != '\n' : c == layout.lineEndByte(k);
            if (ok) {
                in.pos++;
            }
        }
        if (!ok) {
            throw layout(lineNumber(lines, offset), "no line starts at offset " + offset);
        }
    }

    @Override
    public void read(byte[] dst, int off, int n) {
        Objects.checkFromIndexSize(off, n, dst.length);
        synchronized (lock) {
            if (n > length - delivered) {
                throw new IllegalArgumentException(display + ": cannot read " + n + " more bases of record " + name
                        + ", only " + (length - delivered) + " of its " + length + " are left");
            }
            if (n > 0) {
                parse(dst, off, n);
            }
        }
    }

    /**
     * The loop of {@link #read}, with the place in locals: it runs once per byte of the genome. With
     * {@code dst == null} the bases are checked and dropped.
     *
     * <p>With a layout, a line end that comes early (or is not the layout's kind) is held until the next
     * byte that is not a line end: a '>' opening a line or the end of the file means the record is shorter
     * than its length, reported as such; anything else means the layout does not hold.
     */
    private void parse(byte[] dst, int off, int n) {
        if (!in.moveTo(offset)) {
            throw new StriaException(mismatch.apply(delivered == 0 ? "record " + name + " is past the end of the file"
                    : "record " + name + " ends after " + delivered + " of " + length + " bases"));
        }
        final boolean[] letter = FastaSyntax.LETTER;
        final boolean checked = layout.exists();
        final int full = checked ? layout.basesPerLine() : Integer.MAX_VALUE;
        final int lineEnd = layout.lineEnd();
        long lines = this.lines;
        int column = this.column;
        boolean lineStart = column == 0;
        int crs = 0;
        int early = -1;
        long earlyLines = 0;
        long earlyAt = 0;
        int k = 0;
        while (k < n) {
            if (in.pos == in.lim && !in.refill()) {
                throw endsAfter(delivered + k);
            }
            byte[] b = in.buf;
            int i = in.pos;
            int lim = in.lim;
            while (i < lim && k < n) {
                int c = b[i];
                if (lineStart && c == '>') {
                    in.pos = i;
                    throw endsAfter(delivered + k);
                }
                if (early >= 0 && c != '\n' && c != '\r') {
                    in.pos = i;
                    throw layout(lineNumber(earlyLines, earlyAt), early < full ? "line end after " + early
                            + " of " + full + " bases" : "line end is not " + layout.lineEndName());
                }
                lineStart = false;
                int s = i;
                i = FastaSyntax.letters(b, i, i + Math.min(lim - i, Math.min(n - k, full - column)));
                if (dst != null) {
                    System.arraycopy(b, s, dst, off + k, i - s);
                }
                k += i - s;
                column += i - s;
                if (k == n || i == lim) {
                    break;
                }
                c = b[i];
                if (c == '\n' || c == '\r') {
                    if (checked && early < 0 && (column != full || crs != (c == '\n' ? lineEnd - 1 : 0)
                            || (c == '\r' && lineEnd == 1))) {
                        early = column;
                        earlyLines = lines;
                        in.pos = i;
                        earlyAt = in.position();
                    }
                    if (c == '\n') {
                        lines++;
                        column = 0;
                        crs = 0;
                        lineStart = true;
                    } else {
                        crs++;
                    }
                } else {
                    in.pos = i;
                    long line = lineNumber(lines, in.position());
                    if (letter[c & 0xFF]) {
                        throw layout(line, "more than " + full + " bases on the line");
                    }
                    throw new StriaException(FastaSyntax.notALetter(display, name, line, c));
                }
                i++;
            }
            in.pos = i;
        }
        if (delivered + n == length) {
            checkEnd();
        }
        this.delivered += n;
        this.lines = lines;
        this.column = column;
        this.offset = in.position();
    }

    private StriaException endsAfter(long bases) {
        return new StriaException(mismatch.apply("record " + name + " ends after " + bases + " of " + length
                + " bases"));
    }

    private StriaException layout(long line, String detail) {
        return new StriaException(mismatch.apply("record " + name + ", line " + line + ": " + detail));
    }

    /** The line number of an offset, {@code lines} line ends after the record's first sequence line. */
    private long lineNumber(long lines, long at) {
        return headerLine > 0 ? headerLine + 1 + lines : lineOf(in, at);
    }

    /** After the last base only line ends may follow before the next header or the end of the file. */
    private void checkEnd() {
        for (int c = in.peek(); c == '\r' || c == '\n'; c = in.peek()) {
            in.pos++;
        }
        int c = in.peek();
        if (c >= 0 && c != '>') {
            if (FastaSyntax.LETTER[c]) {
                throw new StriaException(mismatch.apply("record " + name + " has more than " + length + " bases"));
            }
            throw new StriaException(FastaSyntax.notALetter(display, name, lineOf(in, in.position()), c));
        }
    }

    /** 1-based line number of an uncompressed offset; only for messages, so a second pass is acceptable. */
    private static long lineOf(InputCursor in, long offset) {
        long keep = in.position();
        long line = 1;
        in.moveTo(0);
        while (in.position() < offset) {
            if (in.pos == in.lim && !in.refill()) {
                break;
            }
            int end = (int) Math.min(in.lim, in.pos + (offset - in.position()));
            for (int i = in.pos; i < end; i++) {
                if (in.buf[i] == '\n') {
                    line++;
                }
            }
            in.pos = end;
        }
        in.moveTo(keep);
        return line;
    }
}
