package stria.out;

import stria.score.Locus;

/**
 * Text of one locus as a BED6+3 line and as a TSV row (DEVELOPERS.md lists the columns). Numbers are
 * written with fixed decimals without going through {@code String.format}, which would dominate the run time
 * of an exact scan that reports every run.
 */
public final class LocusFormat {
    public static final String TSV_HEADER = "chrom\tstart\tend\tperiod\tmotif\tmotif_class\tcopies\tlength\tpurity"
            + "\tmismatches\tinsertions\tdeletions\tscore\tentropy";

    private LocusFormat() {
    }

    public static void bed(StringBuilder sb, String chrom, Locus l) {
        sb.append(chrom).append('\t').append(l.start()).append('\t').append(l.end()).append('\t')
                .append(l.motif()).append('\t').append(Math.round(l.purity() * 1000)).append("\t.\t")
                .append(l.period()).append('\t');
        copies(sb, l);
        sb.append('\t').append(l.motifClass()).append('\n');
    }

    public static void tsv(StringBuilder sb, String chrom, Locus l) {
        sb.append(chrom).append('\t').append(l.start()).append('\t').append(l.end()).append('\t')
                .append(l.period()).append('\t').append(l.motif()).append('\t').append(l.motifClass()).append('\t');
        copies(sb, l);
        sb.append('\t').append(l.length()).append('\t');
        fixed(sb, l.purity(), 3);
        sb.append('\t').append(l.mismatches()).append('\t').append(l.insertions()).append('\t')
                .append(l.deletions()).append('\t').append(l.score()).append('\t');
        fixed(sb, l.entropy(), 3);
        sb.append('\n');
    }

    /** Copies as length / period, 2 decimals. */
    static void copies(StringBuilder sb, Locus l) {
        copies(sb, l.length(), l.period());
    }

    /**
     * Copies as {@code len / p}, rounded half up to 2 decimals from the exact fraction (a double product
     * could round a half the other way).
     */
    public static void copies(StringBuilder sb, long len, long p) {
        long hundredths = (len * 200 + p) / (2 * p);
        sb.append(hundredths / 100).append('.');
        long frac = hundredths % 100;
        if (frac < 10) {
            sb.append('0');
        }
        sb.append(frac);
    }

    /** A non-negative value with {@code digits} decimals, rounded half up. */
    public static void fixed(StringBuilder sb, double v, int digits) {
        long scale = digits == 3 ? 1000 : digits == 2 ? 100 : (long) Math.pow(10, digits);
        long x = Math.round(v * scale);
        if (x < 0) {
            sb.append('-');
            x = -x;
        }
        sb.append(x / scale).append('.');
        String frac = Long.toString(x % scale);
        for (int i = frac.length(); i < digits; i++) {
            sb.append('0');
        }
        sb.append(frac);
    }
}
