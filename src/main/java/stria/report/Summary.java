package stria.report;

import java.util.ArrayList;
import java.util.List;

/**
 * Bases scanned, loci and bases in repeats, for the genome and for each contig, split by
 * {@link PeriodClass}. Bases in repeats are counted on the union of the loci, so a base covered by two
 * overlapping loci counts once; the same holds within each period class, but a base covered by loci of two
 * classes counts in both, so the class columns may add up to more than the total.
 */
public final class Summary {

    /** One line of the summary; {@code classLoci} and {@code classBases} are indexed by PeriodClass ordinal. */
    public record Row(String name, long scanned, long loci, long repeatBases, long[] classLoci, long[] classBases) {

        /** Bases in repeats per base scanned, 0 when nothing was scanned. */
        public double share() {
            return scanned == 0 ? 0 : (double) repeatBases / scanned;
        }

        public double classShare(PeriodClass c) {
            return scanned == 0 ? 0 : (double) classBases[c.ordinal()] / scanned;
        }
    }

    private final Row genome;
    private final List<Row> contigs;

    private Summary(Row genome, List<Row> contigs) {
        this.genome = genome;
        this.contigs = contigs;
    }

    public Row genome() {
        return genome;
    }

    /** One row per contig, in the input's contig order. */
    public List<Row> contigs() {
        return contigs;
    }

    public static Summary of(ResultSet r) {
        int k = PeriodClass.values().length;
        List<Row> rows = new ArrayList<>();
        long gScanned = 0, gLoci = 0, gBases = 0;
        long[] gClassLoci = new long[k], gClassBases = new long[k];
        for (int c = 0; c < r.header().contigs().size(); c++) {
            Row row = contigRow(r.header().contigs().get(c).name(), r.scannedBases(c), r.loci().get(c));
            rows.add(row);
            gScanned += row.scanned();
            gLoci += row.loci();
            gBases += row.repeatBases();
            for (int i = 0; i < k; i++) {
                gClassLoci[i] += row.classLoci()[i];
                gClassBases[i] += row.classBases()[i];
            }
        }
        return new Summary(new Row("genome", gScanned, gLoci, gBases, gClassLoci, gClassBases), List.copyOf(rows));
    }

    static Row contigRow(String name, long scanned, ContigLoci l) {
        int k = PeriodClass.values().length;
        long[] classLoci = new long[k];
        long[] classBases = new long[k];
        long[] runStart = new long[k + 1];
        long[] runEnd = new long[k + 1];
        long[] covered = new long[k + 1];
        java.util.Arrays.fill(runStart, -1);
        // one sweep over loci sorted by start keeps, per class and for all loci (slot k), the interval of the
        // union currently being extended
        for (int i = 0; i < l.size(); i++) {
            int cls = PeriodClass.of(l.period(i)).ordinal();
            classLoci[cls]++;
            extend(runStart, runEnd, covered, cls, l.start(i), l.end(i));
            extend(runStart, runEnd, covered, k, l.start(i), l.end(i));
        }
        for (int slot = 0; slot <= k; slot++) {
            if (runStart[slot] >= 0) {
                covered[slot] += runEnd[slot] - runStart[slot];
            }
        }
        System.arraycopy(covered, 0, classBases, 0, k);
        return new Row(name, scanned, l.size(), covered[k], classLoci, classBases);
    }

    private static void extend(long[] runStart, long[] runEnd, long[] covered, int slot, long s, long e) {
        if (runStart[slot] < 0) {
            runStart[slot] = s;
            runEnd[slot] = e;
        } else if (s > runEnd[slot]) {
            covered[slot] += runEnd[slot] - runStart[slot];
            runStart[slot] = s;
            runEnd[slot] = e;
        } else if (e > runEnd[slot]) {
            runEnd[slot] = e;
        }
    }
}
