package stria.report;

import java.util.ArrayList;
import java.util.List;
import stria.Intervals;

/**
 * Bases scanned (without the N gaps when they are known, see {@link Gaps}), loci and bases in repeats, for the genome and for each contig, split by
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
        return of(r, Gaps.unknown(r.header().contigs().size()));
    }

    /** As {@link #of(ResultSet)}, with the bases scanned counted without the N gaps. */
    public static Summary of(ResultSet r, Gaps gaps) {
        int k = PeriodClass.values().length;
        List<Row> rows = new ArrayList<>();
        long gScanned = 0, gLoci = 0, gBases = 0;
        long[] gClassLoci = new long[k], gClassBases = new long[k];
        for (int c = 0; c < r.header().contigs().size(); c++) {
            long sequenced = r.scannedBases(c) - gaps.inside(c, r.scanned().get(c));
            Row row = contigRow(r.header().contigs().get(c).name(), sequenced, r.loci().get(c));
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
        int n = l.size();
        long[] classLoci = new long[k];
        int[] cls = new int[n];
        for (int i = 0; i < n; i++) {
            cls[i] = PeriodClass.of(l.period(i)).ordinal();
            classLoci[cls[i]]++;
        }
        // loci are sorted by start, so are the loci of each class: the union of each, and of all (slot k)
        int[][] starts = new int[k + 1][];
        int[][] ends = new int[k + 1][];
        int[] count = new int[k + 1];
        for (int slot = 0; slot <= k; slot++) {
            int size = slot == k ? n : (int) classLoci[slot];
            starts[slot] = new int[size];
            ends[slot] = new int[size];
        }
        for (int i = 0; i < n; i++) {
            int c = cls[i];
            starts[c][count[c]] = l.start(i);
            ends[c][count[c]++] = l.end(i);
            starts[k][i] = l.start(i);
            ends[k][i] = l.end(i);
        }
        count[k] = n;
        long[] covered = new long[k + 1];
        for (int slot = 0; slot <= k; slot++) {
            int m = Intervals.union(starts[slot], ends[slot], count[slot]);
            covered[slot] = Intervals.covered(starts[slot], ends[slot], m);
        }
        long[] classBases = java.util.Arrays.copyOf(covered, k);
        return new Row(name, scanned, n, covered[k], classLoci, classBases);
    }
}
