package stria.io;

import java.io.ByteArrayOutputStream;

import stria.StriaException;

/**
 * One streaming pass over a genome file that finds every record, its length and where its sequence
 * starts, and checks every byte on the way. It reads bytes, not lines: a chromosome written on one
 * line must cost no more than one written in short lines, and line numbers are needed for messages.
 * Knowing every name and length first is what lets a scan write its header and plan its work before
 * reading any base, and decide how to hold each contig. On the way it
 * notes whether each record has a line layout (a {@link LineLayout.Finder}), at the cost of a few
 * comparisons per line, so that a stream can later start in the middle of the record.
 */
final class FastaPrePass {
    /** How much of the start of a file is inspected for control bytes before anything else. */
    private static final int SNIFF = 1 << 16;

    private enum Mode { PREAMBLE, NAME, DESCRIPTION, SEQUENCE }

    private final InputCursor in;
    private final String display;
    private final RecordTable table = new RecordTable();
    private final ByteArrayOutputStream name = new ByteArrayOutputStream();

    private Mode mode = Mode.PREAMBLE;
    private boolean lineStart = true;
    private long line = 1;
    private long headerLine;
    private String current;
    private long length;
    private long seqOffset;

    /** The line layout of the current record. */
    private final LineLayout.Finder layout = new LineLayout.Finder();
    /** Offset of the first byte of the current line, and the record's bases before it. */
    private long lineOffset;
    private long lineBases;
    /** Offset of the last CR seen by the byte loop, which tells a CRLF line end from a CR among the bases. */
    private long lastCr = -1;
    /** The header line's last byte was a carriage return: the next must be its line feed. */
    private boolean headerCr;
    /** The byte loop stopped at the line end in.pos points at, for {@link #lineEnd} to look at the line. */
    private boolean lineToCheck;

    private FastaPrePass(InputCursor in, String display) {
        this.in = in;
        this.display = display;
    }

    /** Scans from the start of {@code in} to its end. */
    static RecordTable scan(InputCursor in, String display) {
        try {
            return new FastaPrePass(in, display).run();
        } catch (StriaException e) {
            throw in.preferDamage(e);
        }
    }

    private RecordTable run() {
        if (!in.moveTo(0) || in.peek() < 0) {
            throw new StriaException(display + ": file is empty");
        }
        sniff();
        skipByteOrderMark();
        while (in.pos < in.lim || in.refill()) {
            switch (mode) {
                case PREAMBLE -> preamble();
                case NAME -> name();
                case DESCRIPTION -> description();
                case SEQUENCE -> {
                    if (lineToCheck) {
                        lineEnd();
                    } else if (layout.ragged()) {
                        raggedSequence();
                    } else {
                        sequence();
                    }
                }
            }
        }
        switch (mode) {
            case PREAMBLE -> throw new StriaException(display + ": no FASTA record (no line starting with '>')");
            case NAME -> endName();
            default -> { }
        }
        if (current != null) {
            endRecord();
        }
        return table;
    }

    private void sniff() {
        int end = Math.min(in.lim, in.pos + SNIFF);
        for (int i = in.pos; i < end; i++) {
            int b = in.buf[i] & 0xFF;
            if (FastaSyntax.isControl(b)) {
                throw new StriaException(display + ": binary data, not a FASTA file (" + FastaSyntax.describe(b)
                        + " at offset " + i + ")");
            }
        }
    }

    /** Some editors start UTF-8 text with a byte order mark; it is not part of the first line. */
    private void skipByteOrderMark() {
        if (in.lim - in.pos >= 3 && (in.buf[in.pos] & 0xFF) == 0xEF && (in.buf[in.pos + 1] & 0xFF) == 0xBB
                && (in.buf[in.pos + 2] & 0xFF) == 0xBF) {
            in.pos += 3;
        }
    }

    private void preamble() {
        byte[] b = in.buf;
        int i = in.pos;
        int lim = in.lim;
        while (i < lim) {
            int c = b[i];
            if (c == '>' && lineStart) {
                in.pos = i + 1;
                startHeader();
                return;
            }
            if (c == '\n') {
                line++;
                lineStart = true;
            } else if (c == '\r' || c == ' ' || c == '\t') {
                lineStart = lineStart && c == '\r';
            } else {
                throw new StriaException(display + ": not a FASTA file: line " + line
                        + " comes before any header line starting with '>'");
            }
            i++;
        }
        in.pos = i;
    }

    private void startHeader() {
        if (current != null) {
            endRecord();
        }
        headerLine = line;
        name.reset();
        mode = Mode.NAME;
        lineStart = false;
    }

    private void name() {
        byte[] b = in.buf;
        int i = in.pos;
        int lim = in.lim;
        int s = i;
        while (i < lim) {
            int c = b[i] & 0xFF;
            if (c == ' ' || c == '\t' || c == '\r' || c == '\n') {
                break;
            }
            if (FastaSyntax.isControl(c)) {
                throw controlInHeader(c);
            }
            i++;
        }
        name.write(b, s, i - s);
        if (name.size() > FastaSyntax.MAX_NAME) {
            throw new StriaException(display + ": line " + headerLine + ": record name longer than "
                    + FastaSyntax.MAX_NAME + " bytes; this is not a FASTA file");
        }
        in.pos = i;
        if (i < lim) {
            endName();
            mode = Mode.DESCRIPTION;
        }
    }

    private void endName() {
        if (name.size() == 0) {
            throw new StriaException(display + ": line " + headerLine + ": header line has no record name after '>'");
        }
        current = FastaSyntax.name(name);
        if (current == null) {
            throw new StriaException(display + ": line " + headerLine + ": " + FastaSyntax.NOT_UTF8);
        }
        length = 0;
    }

    private void description() {
        byte[] b = in.buf;
        int i = in.pos;
        int lim = in.lim;
        while (i < lim) {
            int c = b[i] & 0xFF;
            if (headerCr && c != '\n') {
                throw new StriaException(display + ": line " + headerLine + ": " + FastaSyntax.LONE_CR);
            }
            headerCr = c == '\r';
            if (c == '\n') {
                line++;
                in.pos = i + 1;
                seqOffset = in.position();
                mode = Mode.SEQUENCE;
                lineStart = true;
                lineOffset = seqOffset;
                lineBases = 0;
                layout.reset();
                return;
            }
            if (FastaSyntax.isControl(c)) {
                throw controlInHeader(c);
            }
            i++;
        }
        in.pos = i;
        seqOffset = in.position();
    }

    private StriaException controlInHeader(int c) {
        return new StriaException(display + ": line " + headerLine + ": " + FastaSyntax.describe(c)
                + " in a header line; binary data, not a FASTA file");
    }

    /**
     * The hot loop, for a record that may have a layout: whole lines that keep it are taken by
     * {@link #fullLines}, then the bytes of one line up to its line end, where the loop stops for
     * {@link #lineEnd} to note the line. A record found to have no layout is scanned by
     * {@link #raggedSequence}. Neither loop holds a call but the scan of letters, which keeps both as fast
     * as a scan that looks for no layout.
     */
    private void sequence() {
        byte[] b = in.buf;
        int i = in.pos;
        int lim = in.lim;
        long n = length;
        if (lineStart) {
            if (layout.open()) {
                int width = layout.width();
                int lineEnd = layout.lineEnd();
                int j = fullLines(b, i, lim, width, lineEnd);
                long k = (j - i) / (width + lineEnd);
                n += k * width;
                line += k;
                lineOffset = in.position() - i + j;
                lineBases = n;
                i = j;
            }
            if (i < lim) {
                if (b[i] == '>') {
                    length = n;
                    in.pos = i + 1;
                    startHeader();
                    return;
                }
                lineStart = false;
            }
        }
        while (i < lim) {
            int s = i;
            i = FastaSyntax.letters(b, i, lim);
            n += i - s;
            if (i == lim) {
                break;
            }
            int c = b[i];
            if (c == '\n') {
                lineToCheck = true;
                break;
            }
            if (c != '\r') {
                throw new StriaException(FastaSyntax.notALetter(display, current, line, c));
            }
            lastCr = in.position() - in.pos + i;
            i++;
        }
        length = n;
        in.pos = i;
    }

    /** The loop for a record known to have no layout, which has nothing to note at line ends. */
    private void raggedSequence() {
        byte[] b = in.buf;
        int i = in.pos;
        int lim = in.lim;
        long n = length;
        while (i < lim) {
            if (lineStart) {
                if (b[i] == '>') {
                    length = n;
                    in.pos = i + 1;
                    startHeader();
                    return;
                }
                lineStart = false;
            }
            int s = i;
            i = FastaSyntax.letters(b, i, lim);
            n += i - s;
            if (i == lim) {
                break;
            }
            int c = b[i];
            if (c == '\n') {
                line++;
                lineStart = true;
            } else if (c != '\r') {
                throw new StriaException(FastaSyntax.notALetter(display, current, line, c));
            }
            i++;
        }
        length = n;
        in.pos = i;
    }

    /**
     * Whole lines of {@code width} letters and a line end of {@code lineEnd} bytes (LF or CRLF) from the
     * line start {@code i}: the line start after the last of them that fits before {@code lim}.
     */
    private static int fullLines(byte[] b, int i, int lim, int width, int lineEnd) {
        int row = width + lineEnd;
        while (lim - i >= row) {
            int end = i + width;
            if (FastaSyntax.letters(b, i, end) != end || !LineLayout.isLineEnd(b, end, lineEnd)) {
                break;
            }
            i += row;
        }
        return i;
    }

    /** The line end the byte loop stopped at: notes the line for the layout, then passes the line end. */
    private void lineEnd() {
        lineToCheck = false;
        long at = in.position();
        layout.line(length - lineBases, at + 1 - lineOffset, lastCr == at - 1 ? 2 : 1);
        line++;
        lineStart = true;
        in.pos++;
        lineOffset = at + 1;
        lineBases = length;
    }

    private void endRecord() {
        boolean sequence = mode == Mode.SEQUENCE;
        if (sequence && length > lineBases) {
            // a last line without a line end, at the end of the file
            layout.line(length - lineBases, in.position() - lineOffset + 1, 1);
        }
        table.add(current, length, sequence ? seqOffset : in.position(), headerLine,
                sequence ? layout.layout(length) : LineLayout.NONE);
        current = null;
    }
}
