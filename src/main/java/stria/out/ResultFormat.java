package stria.out;

import stria.score.Locus;

/** The two text formats of a result (DEVELOPERS.md lists the columns): the line of a locus in each. */
public enum ResultFormat {
    /** BED6+3, no column row. */
    BED,
    /** TSV with one column row after the {@code #} lines. */
    TSV;

    /** The row naming the columns, written after the header, or null. */
    public String columnRow() {
        return this == TSV ? LocusFormat.TSV_HEADER : null;
    }

    /** Appends the line of one locus, line end included. */
    void append(StringBuilder sb, String contig, Locus locus) {
        if (this == BED) {
            LocusFormat.bed(sb, contig, locus);
        } else {
            LocusFormat.tsv(sb, contig, locus);
        }
    }
}
