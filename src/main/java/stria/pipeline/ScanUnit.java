package stria.pipeline;

import stria.io.ContigInfo;

/**
 * A stretch of one contig to scan: loci starting in {@code [from, to)} are reported; runs are computed over
 * a wider stretch around it when the stretch is not a whole contig, so that repeats crossing its ends are
 * reported whole, by exactly one unit.
 */
public record ScanUnit(Source source, ContigInfo contig, int from, int to) {
    /** Where the bases of a contig come from (a genome file, or memory in tests). */
    @FunctionalInterface
    public interface Source {
        byte[] sequence(ContigInfo contig);
    }

    public boolean wholeContig() {
        return from == 0 && to == contig.length();
    }
}
