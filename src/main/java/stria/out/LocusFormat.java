package stria.out;

import stria.score.Locus;

/**
 * Text of one locus as a BED6+3 line and as a TSV row (DEVELOPERS.md lists the columns). Numbers are
 * written with fixed decimals without going through {@code String.format}, which would dominate the run time
 * of an exact scan that reports every run.
 */
public final class LocusFormat {
    public static final String TSV_HEADER = "chrom\tstart\tend\tperiod\tmotif\tmotif_class\tcopies\tlength\tpurity"
            + "\tmismatches\tinsertions\tdeletions\tscore\tevalue\tentropy\tsubunit_period\tsubunits";

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
                .append(l.deletions()).append('\t');
        fixed(sb, l.score(), 1);
        sb.append('\t');
        evalue(sb, l.evalue());
        sb.append('\t');
        fixed(sb, l.entropy(), 3);
        sb.append('\t');
        if (l.subunits() > 0) {
            sb.append(l.subunitPeriod()).append('\t').append(l.subunits());
        } else {
            sb.append('\t');
        }
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

    /** One formatted evalue; the cache holds one per slot, replaced whole, so threads may share it. */
    private record Formatted(double value, String text) {
    }

    private static final Formatted[] EVALUES = new Formatted[4096];

    /**
     * An evalue as {@code %.1e} ({@code 3.2e-05}), exactly 0 as {@code 0}. Loci of one GC class and score share
     * an evalue, so few distinct values occur and each is formatted once.
     */
    public static void evalue(StringBuilder sb, double v) {
        if (v == 0) {
            sb.append('0');
            return;
        }
        long bits = Double.doubleToLongBits(v);
        int slot = (int) ((bits ^ (bits >>> 29) ^ (bits >>> 41)) & (EVALUES.length - 1));
        Formatted f = EVALUES[slot];
        if (f == null || Double.doubleToLongBits(f.value()) != bits) {
            f = new Formatted(v, String.format(java.util.Locale.ROOT, "%.1e", v));
            EVALUES[slot] = f;
        }
        sb.append(f.text());
    }

    /** A non-negative value with {@code digits} decimals, rounded half up. */
    public static void fixed(StringBuilder sb, double v, int digits) {
        long scale = digits == 3 ? 1000 : digits == 2 ? 100 : digits == 1 ? 10 : (long) Math.pow(10, digits);
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
