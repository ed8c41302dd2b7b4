package stria.io;

/**
 * How a record's sequence is broken into lines, when it is broken regularly: every line but the last
 * holds {@code basesPerLine} bases followed by the same line end of {@code lineEnd} bytes (1 for LF, 2 for
 * CRLF), and the last holds no more bases. Then base {@code b} (0-based) lies {@link #offset} bytes after
 * the record's first sequence byte, and a stream can start there without reading what comes before.
 * {@link #NONE} stands for a record whose lines are not alike (or that has no sequence).
 *
 * <p>This is the one statement of the rule: the pre-pass finds a layout with a {@link Finder}, a .fai
 * entry becomes one through {@link #fromIndex}, and a {@link RecordStream} places itself and checks line
 * ends by it. The lexers' loops copy the two numbers into locals and keep to primitive arrays.
 */
record LineLayout(int basesPerLine, int lineEnd) {
    /** No layout: bases can be found only by reading the record from its start. */
    static final LineLayout NONE = new LineLayout(0, 0);

    /** Longest line a layout describes: longer ones are of no use for entering a record, and would overflow. */
    private static final int MAX_BASES = Integer.MAX_VALUE - 2;

    LineLayout {
        if (!(basesPerLine == 0 && lineEnd == 0) && (basesPerLine < 1 || basesPerLine > MAX_BASES || lineEnd < 1
                || lineEnd > 2)) {
            throw new IllegalArgumentException("no line layout has " + basesPerLine + " bases and " + lineEnd
                    + " line-end bytes per line");
        }
    }

    /**
     * The layout a .fai entry claims, from its bases and bytes per line (line end included), or null when
     * no record can have it.
     */
    static LineLayout fromIndex(long basesPerLine, long bytesPerLine) {
        long eol = bytesPerLine - basesPerLine;
        return basesPerLine < 1 || basesPerLine > MAX_BASES || eol < 1 || eol > 2 ? null
                : new LineLayout((int) basesPerLine, (int) eol);
    }

    /** Whether the record has a layout at all. */
    boolean exists() {
        return basesPerLine > 0;
    }

    /** The line (0-based) that holds base {@code base}. */
    long line(long base) {
        return base / basesPerLine;
    }

    /** Bases before {@code base} on its line. */
    int column(long base) {
        return (int) (base % basesPerLine);
    }

    /** Bytes from the record's first sequence byte to base {@code base}. */
    long offset(long base) {
        return base / basesPerLine * ((long) basesPerLine + lineEnd) + base % basesPerLine;
    }

    /** Whether a record of {@code length} bases lies on one line, so that no line end checks the layout. */
    boolean oneLine(long length) {
        return length <= basesPerLine;
    }

    /** Byte {@code k} (0-based) of the line end: CR then LF, or LF alone. */
    int lineEndByte(int k) {
        return k == lineEnd - 1 ? '\n' : '\r';
    }

    /** Whether the bytes at {@code at} are exactly the line end; {@code b} must hold {@link #lineEnd} of them. */
    static boolean isLineEnd(byte[] b, int at, int lineEnd) {
        return lineEnd == 1 ? b[at] == '\n' : b[at] == '\r' && b[at + 1] == '\n';
    }

    /** The line end for messages. */
    String lineEndName() {
        return lineEnd == 1 ? "LF" : "CRLF";
    }

    /**
     * Finds the layout of one record from its lines, noted one after the other. Full lines that repeat the
     * first may be skipped while {@link #open}: they change nothing, which is what lets a lexer take them
     * in a tight loop and note only the lines it stops at.
     */
    static final class Finder {
        /** Bases and line-end bytes of the first line with bases; 0 before it. */
        private int width;
        private int lineEnd;
        /** A line shorter than the first, or ending otherwise, was seen: only empty lines may follow. */
        private boolean closed;
        private boolean ragged;

        /** Starts a new record. */
        void reset() {
            width = 0;
            lineEnd = 0;
            closed = false;
            ragged = false;
        }

        /**
         * Notes the next line of the record.
         *
         * @param bases letters on the line
         * @param bytes the line's bytes with its line end
         * @param eol   the bytes of its line end (1 or 2) if it is a line end; a line that holds anything
         *              else (a CR among the bases) has {@code bytes != bases + eol}
         */
        void line(long bases, long bytes, int eol) {
            if (bytes != bases + eol || (bases > 0 && closed) || bases > MAX_BASES) {
                ragged = true;
            } else if (bases == 0) {
                closed = true;
            } else if (width == 0) {
                width = (int) bases;
                lineEnd = eol;
            } else if (bases > width) {
                ragged = true;
            } else if (bases < width || eol != lineEnd) {
                closed = true;
            }
        }

        /** Whether the record was seen to have no layout: nothing more needs noting. */
        boolean ragged() {
            return ragged;
        }

        /** Whether lines like the first may still follow, and so be skipped. */
        boolean open() {
            return width > 0 && !closed && !ragged;
        }

        /** Bases on the first line; meaningful while {@link #open}. */
        int width() {
            return width;
        }

        /** Line-end bytes of the first line; meaningful while {@link #open}. */
        int lineEnd() {
            return lineEnd;
        }

        /** The layout of the record noted, which has {@code length} bases. */
        LineLayout layout(long length) {
            return length > 0 && !ragged && width > 0 ? new LineLayout(width, lineEnd) : NONE;
        }
    }
}
