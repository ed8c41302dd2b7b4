package stria.pipeline;

import java.util.function.Function;

import stria.io.BaseStream;
import stria.io.ContigInfo;
import stria.io.Region;

/**
 * A stretch of one contig to scan: loci starting in {@code [from, to)} are reported; runs are computed over
 * a wider stretch around it when the stretch is not a whole contig, so that repeats crossing its ends are
 * reported whole, by exactly one unit. Units come from a {@link ScanPlan}.
 */
public record ScanUnit(Source source, ContigInfo contig, int from, int to) {
    /** Where the bases of a contig come from (a genome file, or memory). */
    @FunctionalInterface
    public interface Source {
        /** The contig's bases from {@code from} on, front to back. */
        BaseStream stream(ContigInfo contig, int from);

        /** A source of contigs already in memory. */
        static Source of(Function<ContigInfo, byte[]> sequences) {
            return (contig, from) -> {
                byte[] seq = sequences.apply(contig);
                int[] at = {from};
                return (dst, off, n) -> {
                    System.arraycopy(seq, at[0], dst, off, n);
                    at[0] += n;
                };
            };
        }
    }

    public ScanUnit {
        if (from < 0 || to < from || to > contig.length()) {
            throw new IllegalArgumentException("[" + from + ", " + to + ") outside " + contig);
        }
    }

    public boolean wholeContig() {
        return from == 0 && to == contig.length();
    }

    /** The stretch whose loci this unit reports. */
    public Region region() {
        return new Region(contig.name(), from, to);
    }
}
