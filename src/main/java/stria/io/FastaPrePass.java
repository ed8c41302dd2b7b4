package stria.io;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;

import stria.StriaException;

/**
 * One streaming pass over a genome file that finds every record, its length and where its sequence
 * starts, and checks every byte on the way. It reads bytes, not lines: a chromosome written on one
 * line must cost no more than one written in short lines, and line numbers are needed for messages.
 * Knowing every length first is what lets the loader allocate each contig exactly once.
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
                case SEQUENCE -> sequence();
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
        current = name.toString(StandardCharsets.UTF_8);
        length = 0;
    }

    private void description() {
        byte[] b = in.buf;
        int i = in.pos;
        int lim = in.lim;
        while (i < lim) {
            int c = b[i] & 0xFF;
            if (c == '\n') {
                line++;
                in.pos = i + 1;
                seqOffset = in.position();
                mode = Mode.SEQUENCE;
                lineStart = true;
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

    /** The hot loop: almost every byte of a genome passes through the inner scan of letters. */
    private void sequence() {
        final boolean[] letter = FastaSyntax.LETTER;
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
            while (i < lim && letter[b[i] & 0xFF]) {
                i++;
            }
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

    private void endRecord() {
        table.add(current, length, mode == Mode.SEQUENCE ? seqOffset : in.position(), headerLine);
        current = null;
    }
}
