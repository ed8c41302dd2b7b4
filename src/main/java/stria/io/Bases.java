package stria.io;

/**
 * Nucleotide codes shared by every stage. A, C, G, T (either case) map to 0..3; the other IUPAC codes
 * (N, R, Y, S, W, K, M, B, D, H, V and U is not one of them) map to {@link #BREAK}, which no repeat may
 * span; every other byte maps to {@link #INVALID}.
 */
public final class Bases {
    public static final byte A = 0, C = 1, G = 2, T = 3;
    /** Code of an IUPAC ambiguity letter: legal in input, breaks every repeat. */
    public static final byte BREAK = 4;
    /** Code of a byte that is not a nucleotide letter at all. */
    public static final byte INVALID = -1;

    private static final byte[] CODE = new byte[256];
    private static final byte[] UPPER_LETTER = {'A', 'C', 'G', 'T', 'N'};

    static {
        java.util.Arrays.fill(CODE, INVALID);
        for (char c : "NRYSWKMBDHV".toCharArray()) {
            CODE[c] = BREAK;
            CODE[Character.toLowerCase(c)] = BREAK;
        }
        String acgt = "ACGT";
        for (int i = 0; i < 4; i++) {
            CODE[acgt.charAt(i)] = (byte) i;
            CODE[Character.toLowerCase(acgt.charAt(i))] = (byte) i;
        }
    }

    private Bases() {
    }

    /** Code of an ASCII byte: 0..3 for ACGT, {@link #BREAK} for other IUPAC codes, {@link #INVALID} otherwise. */
    public static byte code(byte ascii) {
        return CODE[ascii & 0xFF];
    }

    /** Upper-case letter of a code 0..4 (4 gives N). */
    public static byte letter(int code) {
        return UPPER_LETTER[code];
    }

    /** Complement of a code 0..3 (A-T, C-G); BREAK stays BREAK. */
    public static int complement(int code) {
        return code == BREAK ? BREAK : 3 - code;
    }

    /**
     * Writes the codes of {@code ascii[from, from + len)} into {@code codes[0, len)}. Bytes that are not
     * nucleotide letters become {@link #INVALID}; validation happens when a genome is read, not here.
     * The two arrays may be the same one when {@code from == 0}: each byte is read before its code is written.
     */
    public static void encode(byte[] ascii, int from, int len, byte[] codes) {
        for (int i = 0; i < len; i++) {
            codes[i] = CODE[ascii[from + i] & 0xFF];
        }
    }
}
