package stria.out;

import java.nio.charset.StandardCharsets;
import java.util.List;
import stria.io.ContigBytes;
import stria.io.Region;
import stria.score.Locus;

/**
 * A locus as a row of the STR catalogue: loci up to a period limit, each with a stable {@link LocusId} and
 * the genome's bases beside it. Coordinates are 0-based, end exclusive, as in the BED and TSV; the motif is
 * the consensus read from the phase of the locus's first base (the reference phase). A flank is shorter, or
 * empty, where the contig ends. The columns are {@link #COLUMNS}; README.md says what each holds.
 */
public final class CatalogLines implements ResultWriter.Lines {
    public static final String COLUMNS = "id\tchrom\tstart\tend\tperiod\tmotif\tmotif_class\tcopies\tpurity"
            + "\tinterruptions\tleft_flank\tright_flank";
    public static final String SETTINGS_PREFIX = "#catalog: ";
    public static final int DEFAULT_MAX_PERIOD = 6;
    public static final int DEFAULT_FLANK = 50;
    /** Flanks are read from the context a scan holds anyway; this keeps them well inside it. */
    public static final int MAX_FLANK = 10_000;

    private final int maxPeriod;
    private final int flank;
    private final LocusId.Sequence ids = new LocusId.Sequence();
    private final byte[] bases;
    private ContigBytes seq;

    public CatalogLines(int maxPeriod, int flank) {
        if (maxPeriod < 1 || flank < 0 || flank > MAX_FLANK) {
            throw new IllegalArgumentException("catalogue period limit " + maxPeriod + ", flank " + flank);
        }
        this.maxPeriod = maxPeriod;
        this.flank = flank;
        this.bases = new byte[flank];
    }

    /** The {@code #} lines that follow the result header: the catalogue's own settings and the caution. */
    public List<String> headerLines() {
        return List.of(SETTINGS_PREFIX + "max-period=" + maxPeriod + " flank=" + flank,
                "#note: start and end are 0-based, end exclusive; the id holds the 1-based, inclusive span and the "
                        + "motif class",
                "#caution: research-grade results from an assembly, not a validated test. Repeat-expansion loci "
                        + "matter clinically: genotypes",
                "#caution: called against this catalogue are no diagnosis; defer to validated assays, licensed "
                        + "practice and local rules.");
    }

    @Override
    public int reach() {
        return flank;
    }

    @Override
    public void begin(Region stretch, ContigBytes seq) {
        this.seq = seq;
    }

    @Override
    public void append(StringBuilder sb, String chrom, Locus l) {
        if (l.period() > maxPeriod) {
            return;
        }
        sb.append(ids.next(chrom, l)).append('\t').append(chrom).append('\t').append(l.start()).append('\t')
                .append(l.end()).append('\t').append(l.period()).append('\t').append(l.motif()).append('\t')
                .append(l.motifClass()).append('\t');
        LocusFormat.copies(sb, l);
        sb.append('\t');
        LocusFormat.fixed(sb, l.purity(), 3);
        sb.append('\t').append(l.mismatches() + l.insertions() + l.deletions()).append('\t');
        bases(sb, Math.max(0, l.start() - flank), l.start());
        sb.append('\t');
        bases(sb, l.end(), (int) Math.min(seq.length(), (long) l.end() + flank));
        sb.append('\n');
    }

    private void bases(StringBuilder sb, int from, int to) {
        seq.copy(from, to, bases, 0);
        sb.append(new String(bases, 0, to - from, StandardCharsets.ISO_8859_1));
    }
}
