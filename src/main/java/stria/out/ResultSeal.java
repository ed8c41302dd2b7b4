package stria.out;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import stria.StriaException;

/**
 * The closing line of a shard's result, written last: {@code #end: loci=N sha256=H}, the number of data
 * lines and the first 16 hex digits of SHA-256 over their bytes (each line with its line feed; the header
 * and the TSV column row excluded). A shard file is complete when it ends with this line and its body agrees
 * with it: a file cut short (a full disk, a killed job, a copy interrupted), emptied of its loci or edited
 * loses the line or disagrees with it, and {@code merge} refuses it rather than lose loci silently.
 */
public final class ResultSeal {
    public static final String PREFIX = "#end: ";
    private static final Pattern LINE = Pattern.compile("#end: loci=(\\d{1,18}) sha256=([0-9a-f]{16})");

    private final MessageDigest digest;
    private long lines;

    public ResultSeal() {
        try {
            digest = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Adds data bytes: whole lines, each with its line feed. */
    public void data(byte[] b, int off, int len, long lineCount) {
        digest.update(b, off, len);
        lines += lineCount;
    }

    /** Adds one data line given without its line feed (as read back, ISO-8859-1: byte for byte). */
    public void line(String line) {
        digest.update(line.getBytes(StandardCharsets.ISO_8859_1));
        digest.update((byte) '\n');
        lines++;
    }

    public long lines() {
        return lines;
    }

    /** The closing line for the data added so far (ends the digest: call once). */
    public String closingLine() {
        return PREFIX + "loci=" + lines + " sha256=" + HexFormat.of().formatHex(digest.digest()).substring(0, 16);
    }

    /**
     * Refuses {@code file} when its {@code closing} line (null: none was found) is missing or disagrees with
     * the data added here, in one line that says who writes the line and what to do.
     *
     * @param writer the command that writes the closing line, e.g. {@code scan --shard}
     * @param items what the data lines are, e.g. {@code loci}
     * @param again what to run again, e.g. {@code scan shard 2/3 again}
     */
    public void check(String file, String closing, String writer, String items, String again) {
        if (closing == null) {
            throw new StriaException(file + " is incomplete: it does not end with the " + PREFIX.strip()
                    + " line that " + writer + " writes last (cut short, or emptied); " + again);
        }
        String expected = closingLine();
        if (!closing.equals(expected)) {
            throw new StriaException(file + " is damaged: its closing line says "
                    + closing.substring(PREFIX.length()) + " but its " + items + " give "
                    + expected.substring(PREFIX.length()) + "; " + again);
        }
    }

    /** Whether {@code line} is a well-formed closing line. */
    public static boolean isClosingLine(String line) {
        return LINE.matcher(line).matches();
    }

    /** The locus count a closing line states, or -1 when it is not one. */
    public static long statedLines(String line) {
        Matcher m = LINE.matcher(line);
        return m.matches() ? Long.parseLong(m.group(1)) : -1;
    }
}
