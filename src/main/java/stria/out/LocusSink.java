package stria.out;

import java.util.List;
import stria.io.ContigBytes;
import stria.io.Region;
import stria.score.Locus;

/**
 * Where a scan delivers its loci: stretch by stretch in genome order, and within a stretch sorted by start,
 * end and period. Every output (BED, TSV, masked FASTA) is one; a scan writes to a list of them through
 * {@link #all}.
 */
public interface LocusSink {
    /**
     * The loci that start in {@code stretch} follow. {@code seq} holds the stretch's bases and some context
     * around it (the whole contig when the stretch is one; {@code seq.length()} is the contig's length), and
     * is readable until {@link #end} returns.
     */
    default void begin(Region stretch, ContigBytes seq) {
    }

    /**
     * Bases on each side of a locus this sink reads from {@code seq} (flanks). A scan of a stretch that is not
     * a whole contig reads a context wide enough that they are there, except where the contig ends.
     */
    default int reach() {
        return 0;
    }

    void locus(String contig, Locus locus);

    /** The last locus of {@code stretch} has been delivered. */
    default void end(Region stretch, ContigBytes seq) {
    }

    /** The scan is complete: write out what is buffered. */
    default void finish() {
    }

    /** Every sink of {@code sinks}, in order. */
    static LocusSink all(List<? extends LocusSink> sinks) {
        List<LocusSink> list = List.copyOf(sinks);
        return new LocusSink() {
            @Override
            public int reach() {
                int r = 0;
                for (LocusSink s : list) {
                    r = Math.max(r, s.reach());
                }
                return r;
            }

            @Override
            public void begin(Region stretch, ContigBytes seq) {
                for (LocusSink s : list) {
                    s.begin(stretch, seq);
                }
            }

            @Override
            public void locus(String contig, Locus locus) {
                for (LocusSink s : list) {
                    s.locus(contig, locus);
                }
            }

            @Override
            public void end(Region stretch, ContigBytes seq) {
                for (LocusSink s : list) {
                    s.end(stretch, seq);
                }
            }

            @Override
            public void finish() {
                for (LocusSink s : list) {
                    s.finish();
                }
            }
        };
    }
}
