package stria.io;

import java.util.List;
import stria.StriaException;

/** Temporary minimal region parser (to be replaced). */
public record Region(String contig, int start, int end) {
    public static Region parse(String text, List<ContigInfo> contigs) {
        String name = text;
        int s = -1, e = -1;
        int colon = text.lastIndexOf(':');
        if (colon > 0) {
            name = text.substring(0, colon);
            String[] f = text.substring(colon + 1).replace(",", "").split("-");
            s = Integer.parseInt(f[0]) - 1;
            e = f.length > 1 ? Integer.parseInt(f[1]) : -1;
        }
        for (ContigInfo c : contigs) {
            if (c.name().equals(name)) {
                return new Region(name, Math.max(0, s), e < 0 ? c.length() : e);
            }
        }
        throw new StriaException("region " + text + ": no contig named " + name);
    }
}
