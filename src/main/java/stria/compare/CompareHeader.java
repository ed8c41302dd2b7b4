package stria.compare;

import java.util.ArrayList;
import java.util.List;
import stria.io.ContigInfo;
import stria.out.ResultHeader;

/**
 * The {@code #} lines that open a comparison: those of a scan result for A ({@code #stria}, {@code #command},
 * {@code #settings}, {@code #input}, {@code #contig}, {@code #shard}), so tools that read scan headers read
 * this one, and B's fingerprint and contigs as {@code #other-input} and {@code #other-contig} lines.
 * {@code #settings} holds the scan's settings, used for both genomes, and the comparison's own.
 *
 * @param a     A's header (version, command, settings, contigs, shard)
 * @param other B's contigs in order
 */
public record CompareHeader(ResultHeader a, List<ContigInfo> other) {
    public static final String PREFIX_OTHER_INPUT = "#other-input: ";
    public static final String PREFIX_OTHER_CONTIG = "#other-contig: ";

    public List<String> lines() {
        List<String> out = new ArrayList<>();
        List<String> mine = a.lines();
        String shard = a.shard() == null ? null : ResultHeader.PREFIX_SHARD + a.shard();
        for (String l : mine) {
            if (!l.equals(shard)) {
                out.add(l);
            }
        }
        out.add(otherInputLine(other));
        for (ContigInfo c : other) {
            out.add(PREFIX_OTHER_CONTIG + c.name() + " " + c.length());
        }
        if (shard != null) {
            out.add(shard);
        }
        return out;
    }

    /** B's {@code #other-input} line: as a scan's {@code #input} line for B. */
    public static String otherInputLine(List<ContigInfo> contigs) {
        String in = new ResultHeader("", "", "", contigs, null, List.of()).inputLine();
        return PREFIX_OTHER_INPUT + in.substring(ResultHeader.PREFIX_INPUT.length());
    }

    /** The comparison's header, or null when {@code lines} have no {@code #other-input} line (a scan result). */
    public static CompareHeader parse(List<String> lines) {
        boolean compare = false;
        List<ContigInfo> other = new ArrayList<>();
        for (String l : lines) {
            if (l.startsWith(PREFIX_OTHER_INPUT)) {
                compare = true;
            } else if (l.startsWith(PREFIX_OTHER_CONTIG)) {
                String[] f = ResultHeader.fields(l, PREFIX_OTHER_CONTIG, 2);
                other.add(new ContigInfo(f[0], ResultHeader.number(f[1], l)));
            }
        }
        ResultHeader a = ResultHeader.parse(lines);
        return compare && a != null ? new CompareHeader(a, List.copyOf(other)) : null;
    }

    /** Whether the {@code #other-input} line among {@code lines} agrees with the {@code #other-contig} lines. */
    public boolean otherInputMatches(List<String> lines) {
        for (String l : lines) {
            if (l.startsWith(PREFIX_OTHER_INPUT)) {
                return l.equals(otherInputLine(other));
            }
        }
        return false;
    }
}
