package stria.out;

import stria.score.Locus;

/**
 * A locus as a GFF3 feature line (see {@link Gff3}): 1-based, inclusive coordinates, the Sequence Ontology
 * type by period, the score in bits in column 6, no strand (the motif is read on the + strand), and the
 * attributes {@code ID}, {@code Ontology_term}, {@code motif}, {@code motif_class}, {@code period},
 * {@code copies}, {@code purity}, {@code score} (bits) and {@code evalue} (when calibrated), values percent-encoded.
 */
public final class GffLines implements ResultWriter.Lines {
    public static final String SOURCE = "stria";

    private final LocusId.Sequence ids = new LocusId.Sequence();
    private String contig;
    private String seqid;

    @Override
    public void append(StringBuilder sb, String chrom, Locus l) {
        if (!chrom.equals(contig)) {
            contig = chrom;
            seqid = Gff3.seqid(chrom);
        }
        Gff3.SoType type = Gff3.SoType.of(l.period());
        sb.append(seqid).append('\t').append(SOURCE).append('\t').append(type.term).append('\t')
                .append(l.start() + 1).append('\t').append(l.end()).append('\t');
        LocusFormat.fixed(sb, l.score(), 1);
        sb.append("\t.\t.\tID=").append(Gff3.attribute(ids.next(chrom, l)))
                .append(";Ontology_term=").append(type.accession)
                .append(";motif=").append(Gff3.attribute(l.motif()))
                .append(";motif_class=").append(Gff3.attribute(l.motifClass()))
                .append(";period=").append(l.period())
                .append(";copies=");
        LocusFormat.copies(sb, l);
        sb.append(";purity=");
        LocusFormat.fixed(sb, l.purity(), 3);
        sb.append(";score=");
        LocusFormat.fixed(sb, l.score(), 1);
        if (!Double.isNaN(l.evalue())) {
            sb.append(";evalue=");
            LocusFormat.evalue(sb, l.evalue());
        }
        sb.append('\n');
    }
}
