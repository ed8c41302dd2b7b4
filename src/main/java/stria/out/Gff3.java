package stria.out;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import stria.io.ContigInfo;

/**
 * What stria writes as GFF3 (the GFF3 specification of the Sequence Ontology project, version 1.26): the
 * Sequence Ontology type of a locus by its period, the percent-encoding of column 1 and of attribute values,
 * and the pragmas that open the file.
 *
 * <p>The type rule follows the definitions in the Sequence Ontology itself (as shipped with genometools,
 * {@code so.obo}): units of 2 to 10 bp make a {@code microsatellite} (SO:0000289), 11 to 40 bp a
 * {@code minisatellite} (SO:0000643, whose definition is 10 to 40 bp; 10 goes to the microsatellites),
 * longer units {@code satellite_DNA} (SO:0000005). A homopolymer (period 1) is none of these and is typed
 * with their parent term {@code tandem_repeat} (SO:0000705).
 */
public final class Gff3 {
    /** The Sequence Ontology terms used, by period. */
    public enum SoType {
        TANDEM_REPEAT("tandem_repeat", "SO:0000705"),
        MICROSATELLITE("microsatellite", "SO:0000289"),
        MINISATELLITE("minisatellite", "SO:0000643"),
        SATELLITE_DNA("satellite_DNA", "SO:0000005");

        public final String term;
        public final String accession;

        SoType(String term, String accession) {
            this.term = term;
            this.accession = accession;
        }

        public static SoType of(int period) {
            if (period < 1) {
                throw new IllegalArgumentException("period " + period);
            }
            return period == 1 ? TANDEM_REPEAT : period <= 10 ? MICROSATELLITE : period <= 40 ? MINISATELLITE
                    : SATELLITE_DNA;
        }
    }

    public static final String VERSION_PRAGMA = "##gff-version 3";

    private static final char[] HEX = "0123456789ABCDEF".toCharArray();

    private Gff3() {
    }

    /** The first lines of the file: the version and one {@code ##sequence-region} per contig (1-based). */
    public static List<String> pragmas(List<ContigInfo> contigs) {
        List<String> out = new ArrayList<>();
        out.add(VERSION_PRAGMA);
        for (ContigInfo c : contigs) {
            if (c.length() > 0) {
                out.add("##sequence-region " + seqid(c.name()) + " 1 " + c.length());
            }
        }
        return out;
    }

    /** Column 1: every character outside {@code [a-zA-Z0-9.:^*$@!+_?|-]} percent-encoded (as UTF-8). */
    public static String seqid(String name) {
        return encode(name, true);
    }

    /** An attribute value: tab, newline, control characters, {@code ; = & ,} and {@code %} encoded. */
    public static String attribute(String value) {
        return encode(value, false);
    }

    private static String encode(String s, boolean seqid) {
        boolean plain = true;
        for (int i = 0; i < s.length() && plain; i++) {
            plain = keeps(s.charAt(i), seqid);
        }
        if (plain) {
            return s;
        }
        StringBuilder sb = new StringBuilder(s.length() + 8);
        byte[] utf8 = s.getBytes(StandardCharsets.UTF_8);
        for (int i = 0; i < utf8.length; i++) {
            int b = utf8[i] & 0xff;
            if (b < 0x80 && keeps((char) b, seqid)) {
                sb.append((char) b);
            } else {
                sb.append('%').append(HEX[b >> 4]).append(HEX[b & 15]);
            }
        }
        return sb.toString();
    }

    private static boolean keeps(char c, boolean seqid) {
        if (seqid) {
            return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9')
                    || ".:^*$@!+_?|-".indexOf(c) >= 0;
        }
        return c >= 0x20 && c < 0x7f && c != ';' && c != '=' && c != '&' && c != ',' && c != '%';
    }

    /** Undoes {@link #seqid} and {@link #attribute}. */
    public static String decode(String s) {
        if (s.indexOf('%') < 0) {
            return s;
        }
        java.io.ByteArrayOutputStream b = new java.io.ByteArrayOutputStream(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c == '%' && i + 2 < s.length()) {
                b.write(Integer.parseInt(s.substring(i + 1, i + 3), 16));
                i += 2;
            } else {
                byte[] u = String.valueOf(c).getBytes(StandardCharsets.UTF_8);
                b.write(u, 0, u.length);
            }
        }
        return b.toString(StandardCharsets.UTF_8);
    }
}
