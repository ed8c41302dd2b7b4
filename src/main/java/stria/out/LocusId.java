package stria.out;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import stria.score.Locus;

/**
 * The identifier of a locus in the GFF3 and the catalogue: {@code chrom:start-end:class}, with the
 * coordinates 1-based and inclusive as people type regions, and the motif class. It depends on nothing but
 * the locus, so it is the same for any thread count, window and shard split, and stays the same when the
 * genome is scanned again with other filters. A motif class longer than {@link #LONGEST_CLASS} letters is
 * written as {@code p<period>-<10 hex digits of its SHA-256>}, so satellites get ids of reasonable length.
 *
 * <p>Two loci with the same coordinates and class would get the same id; the writers number the second and
 * later ones ({@code .2}, {@code .3}) through {@link Sequence}, which sees them one after the other because
 * loci arrive sorted by start, end and period.
 */
public final class LocusId {
    static final int LONGEST_CLASS = 20;

    private LocusId() {
    }

    public static String of(String chrom, Locus l) {
        return chrom + ":" + (l.start() + 1) + "-" + l.end() + ":" + classPart(l.motifClass());
    }

    static String classPart(String motifClass) {
        if (motifClass.length() <= LONGEST_CLASS) {
            return motifClass;
        }
        try {
            byte[] d = MessageDigest.getInstance("SHA-256").digest(motifClass.getBytes(StandardCharsets.US_ASCII));
            return "p" + motifClass.length() + "-" + HexFormat.of().formatHex(d).substring(0, 10);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Gives ids in delivery order, numbering repeats of the id of the locus before. */
    static final class Sequence {
        private String last;
        private int repeats;

        String next(String chrom, Locus l) {
            String id = of(chrom, l);
            if (id.equals(last)) {
                repeats++;
                return id + "." + (repeats + 1);
            }
            // loci with one id share start, end and period, so they are delivered one after the other
            last = id;
            repeats = 0;
            return id;
        }
    }
}
