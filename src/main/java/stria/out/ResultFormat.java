package stria.out;

import stria.score.Locus;

/**
 * The text formats of a result (DEVELOPERS.md and README.md list the columns): what a merge needs to know of
 * each (the column row, where a line's contig and start are) and, for BED and TSV, the line of a locus.
 */
public enum ResultFormat {
    /** BED6+3, no column row. */
    BED,
    /** TSV with one column row after the {@code #} lines. */
    TSV,
    /** GFF3: pragmas first, no column row, contig percent-encoded in column 1, 1-based start in column 4. */
    GFF,
    /** The STR catalogue: TSV with a column row, the id first, then contig and start. */
    CATALOG;

    /** The row naming the columns, written after the header, or null. */
    public String columnRow() {
        return switch (this) {
            case TSV -> LocusFormat.TSV_HEADER;
            case CATALOG -> CatalogLines.COLUMNS;
            default -> null;
        };
    }

    /** Column (from 0) of the contig in a data line. */
    public int contigColumn() {
        return this == CATALOG ? 1 : 0;
    }

    /** Column (from 0) of the start in a data line. */
    public int startColumn() {
        return switch (this) {
            case BED, TSV -> 1;
            case CATALOG -> 2;
            case GFF -> 3;
        };
    }

    /** A contig name as the contig column writes it. */
    public String contigText(String name) {
        return this == GFF ? Gff3.seqid(name) : name;
    }

    /** The option that names an output of this format ({@code --bed}, ...). */
    public String option() {
        return "--" + name().toLowerCase(java.util.Locale.ROOT);
    }

    /** Appends the line of one locus, line end included (BED and TSV; the others have their own lines). */
    void append(StringBuilder sb, String contig, Locus locus) {
        switch (this) {
            case BED -> LocusFormat.bed(sb, contig, locus);
            case TSV -> LocusFormat.tsv(sb, contig, locus);
            default -> throw new IllegalStateException(this + " lines are written by their own class");
        }
    }
}
