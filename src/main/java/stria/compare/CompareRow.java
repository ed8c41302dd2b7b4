package stria.compare;

import stria.out.LocusFormat;
import stria.score.Locus;

/**
 * Text of one comparison row. The first eleven columns are the ones checks rely on (A's side first,
 * {@code other_*} for B, 0-based, end exclusive, on B's + strand), then A's consensus motif and the
 * measured figures of both sides; {@code .} stands for an absent value (B's side of an unplaced locus, A's
 * side of a new one, B's purity where nothing of the repeat is left).
 */
public final class CompareRow {
    public static final String HEADER = "chrom\tstart\tend\tperiod\tmotif_class\tother_chrom\tother_start\tother_end"
            + "\tother_strand\tlength_change\tstatus\tmotif\tlength\tother_length\tcopies\tother_copies\tpurity"
            + "\tother_purity\tnote";

    private CompareRow() {
    }

    /** Appends the row, with its line end. */
    public static void tsv(StringBuilder sb, ComparedLocus r) {
        Locus a = r.locus();
        Locus b = r.otherLocus();
        if (a != null) {
            sb.append(r.chrom()).append('\t').append(a.start()).append('\t').append(a.end());
        } else {
            sb.append(".\t.\t.");
        }
        sb.append('\t').append(r.period()).append('\t').append(r.motifClass()).append('\t');
        if (r.placed()) {
            sb.append(r.otherChrom()).append('\t').append(r.otherStart()).append('\t').append(r.otherEnd())
                    .append('\t').append(r.otherStrand());
        } else {
            sb.append(".\t.\t.\t.");
        }
        sb.append('\t');
        if (r.hasLengthChange()) {
            sb.append(r.lengthChange());
        } else {
            sb.append('.');
        }
        sb.append('\t').append(r.status().word()).append('\t').append(a != null ? a.motif() : b.motif()).append('\t');
        if (a != null) {
            sb.append(a.length());
        } else {
            sb.append('.');
        }
        sb.append('\t');
        if (r.placed()) {
            sb.append(r.otherLength());
        } else {
            sb.append('.');
        }
        sb.append('\t');
        if (a != null) {
            copies(sb, a.length(), a.period());
        } else {
            sb.append('.');
        }
        sb.append('\t');
        if (r.placed()) {
            copies(sb, r.otherLength(), r.period());
        } else {
            sb.append('.');
        }
        sb.append('\t');
        fraction(sb, a != null ? a.purity() : Double.NaN);
        sb.append('\t');
        fraction(sb, r.otherPurity());
        sb.append('\t').append(r.note() != null ? r.note() : ".").append('\n');
    }

    static void copies(StringBuilder sb, long len, long p) {
        LocusFormat.copies(sb, len, p);
    }

    private static void fraction(StringBuilder sb, double v) {
        if (Double.isNaN(v)) {
            sb.append('.');
        } else {
            LocusFormat.fixed(sb, v, 3);
        }
    }
}
