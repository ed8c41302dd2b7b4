package stria.io;

import java.util.Objects;
import java.util.function.Function;

import stria.StriaException;

/**
 * Reads one record's letters front to back in pieces, checking each byte, so that a chromosome can be
 * processed without ever being held whole. Between calls it keeps only its place: bases delivered, lines
 * passed and the uncompressed offset where it stopped. A piece always ends just after a letter, so the
 * place is at a line start (where a '>' ends the record) only before the first base. The cursor is
 * shared by every stream of the file, so each call takes the reader's lock and moves the cursor back to
 * that offset first (cheap while it is still inside the cursor's buffer).
 *
 * <p>A call that fails leaves the place unchanged, so calling again fails the same way.
 */
final class RecordStream implements BaseStream {
    private final Object lock;
    private final InputCursor in;
    private final String display;
    private final String name;
    private final int length;
    private final long headerLine;
    private final Function<String, String> mismatch;

    private int delivered;
    private long lines;
    private long offset;

    /**
     * @param lock       held during every read: the reader that owns the cursor
     * @param seqOffset  uncompressed offset of the record's first sequence byte
     * @param headerLine line number of the record's header, or 0 when unknown (then it is counted only if
     *                   a message needs it)
     * @param mismatch   the message for a record whose bases do not end where expected, given the detail
     */
    RecordStream(Object lock, InputCursor in, String display, String name, int length, long seqOffset,
                 long headerLine, Function<String, String> mismatch) {
        this.lock = lock;
        this.in = in;
        this.display = display;
        this.name = name;
        this.length = length;
        this.headerLine = headerLine;
        this.mismatch = mismatch;
        this.offset = seqOffset;
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

    /** The loop of {@link #read}, with the place in locals: it runs once per byte of the genome. */
    private void parse(byte[] dst, int off, int n) {
        if (!in.moveTo(offset)) {
            throw new StriaException(mismatch.apply(delivered == 0 ? "record " + name + " is past the end of the file"
                    : "record " + name + " ends after " + delivered + " of " + length + " bases"));
        }
        final boolean[] letter = FastaSyntax.LETTER;
        long lines = this.lines;
        boolean lineStart = delivered == 0;
        int k = 0;
        while (k < n) {
            if (in.pos == in.lim && !in.refill()) {
                throw new StriaException(mismatch.apply("record " + name + " ends after " + (delivered + k) + " of "
                        + length + " bases"));
            }
            byte[] b = in.buf;
            int i = in.pos;
            int lim = in.lim;
            while (i < lim && k < n) {
                if (lineStart && b[i] == '>') {
                    throw new StriaException(mismatch.apply("record " + name + " ends after " + (delivered + k)
                            + " of " + length + " bases"));
                }
                lineStart = false;
                int max = Math.min(lim, i + (n - k));
                int s = i;
                while (i < max && letter[b[i] & 0xFF]) {
                    i++;
                }
                System.arraycopy(b, s, dst, off + k, i - s);
                k += i - s;
                if (i == max) {
                    break;
                }
                int c = b[i];
                if (c == '\n') {
                    lines++;
                    lineStart = true;
                } else if (c != '\r') {
                    in.pos = i;
                    long line = headerLine > 0 ? headerLine + 1 + lines : lineOf(in, in.position());
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
        this.offset = in.position();
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
