package stria.io;

import java.util.function.Function;

import stria.StriaException;

/**
 * Copies one record's letters into an array of exactly its length, checking each byte. The length is
 * known beforehand (pre-pass or .fai), so nothing is ever grown or trimmed: a 200 Mb chromosome costs
 * 200 MB once.
 */
final class SequenceLoader {
    private SequenceLoader() {
    }

    /**
     * @param headerLine line number of the record's header, or 0 when unknown (then it is counted only if
     *                   a message needs it)
     * @param mismatch   the message for a record whose bases do not end where expected, given the detail
     */
    static byte[] load(InputCursor in, String display, String name, int length, long seqOffset, long headerLine,
                       Function<String, String> mismatch) {
        if (!in.moveTo(seqOffset)) {
            throw new StriaException(mismatch.apply("record " + name + " is past the end of the file"));
        }
        final boolean[] letter = FastaSyntax.LETTER;
        byte[] out = new byte[length];
        int n = 0;
        long lines = 0;
        boolean lineStart = true;
        while (n < length) {
            if (in.pos == in.lim && !in.refill()) {
                throw new StriaException(mismatch.apply("record " + name + " ends after " + n + " of " + length + " bases"));
            }
            byte[] b = in.buf;
            int i = in.pos;
            int lim = in.lim;
            while (i < lim && n < length) {
                if (lineStart && b[i] == '>') {
                    throw new StriaException(mismatch.apply("record " + name + " ends after " + n + " of " + length
                            + " bases"));
                }
                lineStart = false;
                int max = Math.min(lim, i + (length - n));
                int s = i;
                while (i < max && letter[b[i] & 0xFF]) {
                    i++;
                }
                System.arraycopy(b, s, out, n, i - s);
                n += i - s;
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
        return out;
    }

    /** 1-based line number of an uncompressed offset; only for messages, so a second pass is acceptable. */
    static long lineOf(InputCursor in, long offset) {
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
