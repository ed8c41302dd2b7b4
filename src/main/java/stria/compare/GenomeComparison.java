package stria.compare;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import stria.io.ContigBytes;
import stria.io.ContigInfo;
import stria.io.Region;
import stria.out.LocusSink;
import stria.pipeline.Genome;
import stria.pipeline.GenomeScan;
import stria.pipeline.Progress;
import stria.pipeline.ScanPlan;
import stria.pipeline.ScanSettings;
import stria.pipeline.Selection;
import stria.score.Locus;
import stria.shard.ShardId;

/**
 * A whole comparison of two genomes as a library call: A's loci (scanned, or read back from a result), the
 * engine's four steps in order, and B's loci (scanned, or read back) for the {@code new} rows. Rows go to
 * the consumer in output order: A's loci in A's order, then B's new loci in B's order.
 *
 * <p>Each genome is read front to back a few times and never held whole: A while it is scanned (the
 * engine takes the bases around each locus as the scan hands over the contig) and once more to count the
 * anchor words, B once to stream past the anchors and once while it is scanned. B's loci are taken one
 * contig at a time, after A's rows are out, so only A's loci and the engine's state grow with the genome.
 *
 * <p>A split run ({@code shard}) compares the K-th of N equal parts of A's loci, in order; the other loci
 * are still known as neighbours, so each row is the one an unsplit run writes. Its {@code new} rows are
 * candidates: the loci of B that no locus of this part claims; a locus of B is new when every part has it
 * ({@link CompareMerge}).
 */
public final class GenomeComparison {
    private GenomeComparison() {
    }

    /**
     * @param aLoci A's loci per contig (read back from a result), or null to scan A
     * @param bLoci B's loci per contig, or null to scan B
     * @param shard the part of A's loci to compare, or null for all; needs {@code aLoci}
     */
    public static void run(Genome a, Genome b, List<List<Locus>> aLoci, List<List<Locus>> bLoci, ScanSettings scan,
                           CompareSettings settings, ShardId shard, boolean progress, Consumer<ComparedLocus> rows) {
        Comparison.Builder bd = Comparison.builder(settings);
        List<ContigInfo> ac = a.contigs();
        if (aLoci == null) {
            if (shard != null) {
                throw new IllegalArgumentException("a split comparison needs A's loci");
            }
            ScanPlan plan = ScanPlan.of(a, Selection.wholeGenome());
            List<Locus> current = new ArrayList<>();
            scan(scan, plan, progress, new LocusSink() {
                @Override
                public void begin(Region stretch, ContigBytes seq) {
                    current.clear();
                }

                @Override
                public void locus(String contig, Locus locus) {
                    current.add(ScanResults.asWritten(locus));
                }

                @Override
                public void end(Region stretch, ContigBytes seq) {
                    bd.addContig(stretch.contig(), seq, List.copyOf(current));
                }
            });
        } else {
            long n = 0;
            for (List<Locus> l : aLoci) {
                n += l.size();
            }
            long from = shard == null ? 0 : (shard.k() - 1) * n / shard.n();
            long to = shard == null ? n : shard.k() * n / shard.n();
            bd.select((int) from, (int) to);
            long first = 0;
            for (int i = 0; i < ac.size(); i++) {
                List<Locus> l = aLoci.get(i);
                String name = ac.get(i).name();
                if (first < to && first + l.size() > from) {
                    a.withContig(i, bytes -> bd.addContig(name, bytes, l));
                } else {
                    bd.addContig(name, lengthOnly(ac.get(i).length()), l);
                }
                first += l.size();
            }
        }
        Comparison cmp = bd.build();
        for (int i = 0; i < ac.size(); i++) {
            cmp.countA(i, a.stream(i), ac.get(i).length());
        }
        List<ContigInfo> bc = b.contigs();
        for (int i = 0; i < bc.size(); i++) {
            cmp.streamB(bc.get(i).name(), bc.get(i).length(), b.stream(i));
        }
        for (ComparedLocus r : cmp.results(scan.threads())) {
            rows.accept(r);
        }
        if (bLoci != null) {
            for (int i = 0; i < bc.size(); i++) {
                cmp.newLoci(bc.get(i).name(), bLoci.get(i)).forEach(rows);
            }
            return;
        }
        List<Locus> current = new ArrayList<>();
        scan(scan, ScanPlan.of(b, Selection.wholeGenome()), progress, new LocusSink() {
            @Override
            public void begin(Region stretch, ContigBytes seq) {
                current.clear();
            }

            @Override
            public void locus(String contig, Locus locus) {
                current.add(ScanResults.asWritten(locus));
            }

            @Override
            public void end(Region stretch, ContigBytes seq) {
                cmp.newLoci(stretch.contig(), current).forEach(rows);
            }
        });
    }

    private static void scan(ScanSettings scan, ScanPlan plan, boolean progress, LocusSink sink) {
        try (Progress p = new Progress(plan.bases(), progress, System.err)) {
            new GenomeScan(scan, p).run(plan, sink);
        }
    }

    /** A contig none of whose loci are compared: only its length is looked at. */
    private static ContigBytes lengthOnly(int length) {
        return new ContigBytes() {
            @Override
            public int length() {
                return length;
            }

            @Override
            public void copy(int from, int to, byte[] dst, int off) {
                throw new IllegalStateException("bases of a contig whose loci are not compared");
            }
        };
    }
}
