package stria.io;

/** Byte classes and wording shared by the pre-pass, the index check and the record stream. */
final class FastaSyntax {
    /** True for the bytes a sequence line may hold: the IUPAC nucleotide letters, either case. */
    static final boolean[] LETTER = new boolean[256];
    /** Longest record name accepted; a longer one means the file is not what it claims to be. */
    static final int MAX_NAME = 1 << 16;

    static {
        for (int b = 0; b < 256; b++) {
            LETTER[b] = Bases.code((byte) b) != Bases.INVALID;
        }
    }

    private FastaSyntax() {
    }

    /**
     * The end of the run of letters that starts at {@code b[from]}, at most {@code max}. The scan every
     * byte of a genome goes through, kept in a method of its own so that it compiles to a tight loop
     * whatever the loop around it keeps in registers.
     */
    static int letters(byte[] b, int from, int max) {
        final boolean[] letter = LETTER;
        int i = from;
        while (i < max && letter[b[i] & 0xFF]) {
            i++;
        }
        return i;
    }

    /**
     * A record name's bytes as text, or null when they are not valid UTF-8. A name is written into every
     * output line, where tools match it byte for byte against the FASTA and its index; a name that cannot
     * be written back as the same bytes is refused rather than altered.
     */
    static String name(java.io.ByteArrayOutputStream bytes) {
        try {
            return java.nio.charset.StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(java.nio.charset.CodingErrorAction.REPORT)
                    .onUnmappableCharacter(java.nio.charset.CodingErrorAction.REPORT)
                    .decode(java.nio.ByteBuffer.wrap(bytes.toByteArray())).toString();
        } catch (java.nio.charset.CharacterCodingException e) {
            return null;
        }
    }

    /** Why a name of {@link #name} null is refused. */
    static final String NOT_UTF8 = "record name is not valid UTF-8 text (outputs must repeat it byte for byte); "
            + "rename the record";

    /** Why a header line with a carriage return not followed by a line feed is refused. */
    static final String LONE_CR = "a carriage return not followed by a line feed; lines that end with CR alone "
            + "are not read: convert the line ends to LF or CRLF";

    /** Control bytes never appear in FASTA text; seeing one means binary data. */
    static boolean isControl(int b) {
        return (b < 0x20 && b != '\t' && b != '\n' && b != '\r' && b != 0x0B && b != 0x0C) || b == 0x7F;
    }

    /** A byte as a reader should see it in a message: the letter itself or its hex code. */
    static String describe(int b) {
        b &= 0xFF;
        if (b == ' ') {
            return "a space";
        }
        if (b == '\t') {
            return "a tab";
        }
        if (b > 0x20 && b < 0x7F) {
            return "'" + (char) b + "'";
        }
        return String.format("byte 0x%02X", b);
    }

    static String notALetter(String display, String record, long line, int b) {
        return display + ": record " + record + ", line " + line + ": " + describe(b)
                + " is not a nucleotide letter (IUPAC codes ACGTNRYSWKMBDHV only)";
    }
}
