package stria.out;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import stria.io.ContigInfo;
import stria.io.Region;

/**
 * The {@code #} lines that open every BED and TSV result: tool version, command line, settings, a
 * fingerprint of the input (names and lengths of all contigs), the contigs, and for split runs the shard.
 * A result file thereby says how it was made, and a merge can check that its parts belong together.
 *
 * @param version     tool version
 * @param command     the command line as typed (informational; differs between shards)
 * @param settings    every option that changes the data lines, as {@code key=value} words
 * @param contigs     all contigs of the input in order
 * @param shard       {@code K/N} for the output of one shard, otherwise null
 * @param regions     regions the scan was limited to (0-based, end exclusive), empty for whole genomes
 */
public record ResultHeader(String version, String command, String settings, List<ContigInfo> contigs, String shard,
                           List<Region> regions) {

    public static final String PREFIX_SETTINGS = "#settings: ";
    public static final String PREFIX_INPUT = "#input: ";
    public static final String PREFIX_COMMAND = "#command: ";
    public static final String PREFIX_CONTIG = "#contig: ";
    public static final String PREFIX_SHARD = "#shard: ";
    public static final String PREFIX_REGION = "#region: ";
    public static final String PREFIX_TOOL = "#stria ";

    public long totalBases() {
        long t = 0;
        for (ContigInfo c : contigs) {
            t += c.length();
        }
        return t;
    }

    /** First 16 hex digits of SHA-256 over {@code name\tlength\n} of every contig, in order. */
    public String fingerprint() {
        return fingerprint(contigs);
    }

    public static String fingerprint(List<ContigInfo> contigs) {
        try {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            for (ContigInfo c : contigs) {
                md.update((c.name() + "\t" + c.length() + "\n").getBytes(StandardCharsets.UTF_8));
            }
            return HexFormat.of().formatHex(md.digest()).substring(0, 16);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    /** The line that identifies the input; equal lines mean the same genome layout. */
    public String inputLine() {
        return PREFIX_INPUT + "fingerprint=" + fingerprint() + " contigs=" + contigs.size() + " bases=" + totalBases();
    }

    public List<String> lines() {
        List<String> out = new ArrayList<>();
        out.add(PREFIX_TOOL + escape(version));
        out.add(PREFIX_COMMAND + escape(command));
        out.add(PREFIX_SETTINGS + escape(settings));
        out.add(inputLine());
        for (ContigInfo c : contigs) {
            out.add(PREFIX_CONTIG + escape(c.name()) + " " + c.length());
        }
        for (Region r : regions) {
            out.add(PREFIX_REGION + escape(r.contig()) + " " + r.start() + " " + r.end());
        }
        if (shard != null) {
            out.add(PREFIX_SHARD + escape(shard));
        }
        return out;
    }

    /**
     * Parses the {@code #} lines of a result (lines not starting with {@code #} are ignored). Returns null
     * when there is no {@code #stria} line; a {@code #contig} or {@code #region} line that cannot be read
     * is an {@link IllegalArgumentException} that quotes it (escaped, on one line). The fingerprint is recomputed from the contig lines; a file whose
     * {@code #input} line disagrees is reported through {@link #inputLineMatches}.
     */
    public static ResultHeader parse(List<String> lines) {
        String version = null, command = "", settings = null, shard = null;
        List<ContigInfo> contigs = new ArrayList<>();
        List<Region> regions = new ArrayList<>();
        for (String l : lines) {
            if (l.startsWith(PREFIX_TOOL)) {
                version = l.substring(PREFIX_TOOL.length()).trim();
            } else if (l.startsWith(PREFIX_COMMAND)) {
                command = unescape(l.substring(PREFIX_COMMAND.length()));
            } else if (l.startsWith(PREFIX_SETTINGS)) {
                settings = l.substring(PREFIX_SETTINGS.length());
            } else if (l.startsWith(PREFIX_CONTIG)) {
                String[] f = fields(l, PREFIX_CONTIG, 2);
                try {
                    contigs.add(new ContigInfo(unescape(f[0]), number(f[1], l)));
                } catch (IllegalArgumentException e) {
                    throw damaged(l);
                }
            } else if (l.startsWith(PREFIX_REGION)) {
                String[] f = fields(l, PREFIX_REGION, 3);
                try {
                    regions.add(new Region(unescape(f[0]), number(f[1], l), number(f[2], l)));
                } catch (IllegalArgumentException e) {
                    throw damaged(l);
                }
            } else if (l.startsWith(PREFIX_SHARD)) {
                shard = l.substring(PREFIX_SHARD.length()).trim();
            }
        }
        if (version == null) {
            return null;
        }
        return new ResultHeader(version, command, settings == null ? "" : settings, List.copyOf(contigs), shard,
                List.copyOf(regions));
    }

    /** The {@code n} space-separated fields after {@code prefix}; refused when there are not exactly n. */
    public static String[] fields(String line, String prefix, int n) {
        String[] f = line.substring(prefix.length()).split(" ", -1);
        if (f.length != n) {
            throw damaged(line);
        }
        return f;
    }

    /** A length or position of a header line: digits only, within int. */
    public static int number(String field, String line) {
        if (field.isEmpty() || field.length() > 10 || !field.chars().allMatch(c -> c >= '0' && c <= '9')
                || Long.parseLong(field) > Integer.MAX_VALUE) {
            throw damaged(line);
        }
        return Integer.parseInt(field);
    }

    private static IllegalArgumentException damaged(String line) {
        return new IllegalArgumentException("cannot read the line " + escape(line));
    }

    /**
     * A header value on one line that no reader takes for data: a backslash, tab, line feed, carriage return
     * and every other control character are written as {@code \\}, {@code \t}, {@code \n}, {@code \r} and
     * {@code \xHH}; anything else is kept. A file name with a line feed in it (a shell allows it) would
     * otherwise end the {@code #command} line and start a data line of its own choosing.
     */
    public static String escape(String value) {
        int i = 0;
        while (i < value.length() && value.charAt(i) >= 0x20 && value.charAt(i) != 0x7f && value.charAt(i) != '\\') {
            i++;
        }
        if (i == value.length()) {
            return value;
        }
        StringBuilder sb = new StringBuilder(value.length() + 8).append(value, 0, i);
        for (; i < value.length(); i++) {
            char c = value.charAt(i);
            switch (c) {
                case '\\' -> sb.append("\\\\");
                case '\t' -> sb.append("\\t");
                case '\n' -> sb.append("\\n");
                case '\r' -> sb.append("\\r");
                default -> {
                    if (c < 0x20 || c == 0x7f) {
                        sb.append(String.format("\\x%02x", (int) c));
                    } else {
                        sb.append(c);
                    }
                }
            }
        }
        return sb.toString();
    }

    /** The inverse of {@link #escape}; an escape it does not know is kept as written. */
    public static String unescape(String text) {
        if (text.indexOf('\\') < 0) {
            return text;
        }
        StringBuilder sb = new StringBuilder(text.length());
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            char next = i + 1 < text.length() ? text.charAt(i + 1) : 0;
            if (c != '\\' || next == 0) {
                sb.append(c);
            } else if (next == '\\' || next == 't' || next == 'n' || next == 'r') {
                sb.append(next == 't' ? '\t' : next == 'n' ? '\n' : next == 'r' ? '\r' : '\\');
                i++;
            } else if (next == 'x' && i + 3 < text.length() && isHex(text.charAt(i + 2)) && isHex(text.charAt(i + 3))) {
                sb.append((char) Integer.parseInt(text.substring(i + 2, i + 4), 16));
                i += 3;
            } else {
                sb.append(c);
            }
        }
        return sb.toString();
    }

    private static boolean isHex(char c) {
        return Character.digit(c, 16) >= 0;
    }

    /** Whether the {@code #input} line among {@code lines} agrees with the contig lines. */
    public boolean inputLineMatches(List<String> lines) {
        for (String l : lines) {
            if (l.startsWith(PREFIX_INPUT)) {
                return l.equals(inputLine());
            }
        }
        return false;
    }
}
