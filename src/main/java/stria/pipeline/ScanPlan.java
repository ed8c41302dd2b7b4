package stria.pipeline;

import java.util.ArrayList;
import java.util.List;
import stria.io.ContigInfo;
import stria.io.Region;
import stria.out.ResultHeader;
import stria.shard.Partition;
import stria.shard.ShardId;

/**
 * What one scan does: the units of a {@link Genome} that a {@link Selection} picks, in genome order, and what
 * the result header says about them (the contigs, the {@code #region} spans, the shard).
 */
public final class ScanPlan {
    private final Genome genome;
    private final List<ScanUnit> units;
    private final List<Region> regions;
    private final ShardId shard;

    private ScanPlan(Genome genome, List<ScanUnit> units, List<Region> regions, ShardId shard) {
        this.genome = genome;
        this.units = List.copyOf(units);
        this.regions = List.copyOf(regions);
        this.shard = shard;
    }

    /**
     * Regions are scanned in genome order, overlapping and touching ones merged, so that output stays sorted
     * and every locus is reported once.
     */
    public static ScanPlan of(Genome genome, Selection selection) {
        List<ScanUnit> units = new ArrayList<>();
        if (selection instanceof Selection.Regions r) {
            List<Region> merged = Region.union(r.regions(), genome.contigs());
            for (Region g : merged) {
                units.add(genome.unit(g.contig(), g.start(), g.end()));
            }
            return new ScanPlan(genome, units, merged, null);
        }
        if (selection instanceof Selection.OneShard s) {
            List<Region> pieces = Partition.of(genome.contigs(), s.id().n(), s.grain()).get(s.id().k() - 1).pieces();
            for (Region p : pieces) {
                units.add(genome.unit(p.contig(), p.start(), p.end()));
            }
            return new ScanPlan(genome, units, List.of(), s.id());
        }
        for (ContigInfo c : genome.contigs()) {
            units.add(genome.unit(c.name(), 0, c.length()));
        }
        return new ScanPlan(genome, units, List.of(), null);
    }

    public Genome genome() {
        return genome;
    }

    /** The stretches to scan, in genome order. */
    public List<ScanUnit> units() {
        return units;
    }

    /** The regions the scan is limited to (empty unless the selection was regions). */
    public List<Region> regions() {
        return regions;
    }

    /** The shard scanned, or null for an unsplit run. */
    public ShardId shard() {
        return shard;
    }

    /** Bases whose loci are reported, for progress. */
    public long bases() {
        long t = 0;
        for (ScanUnit u : units) {
            t += u.to() - u.from();
        }
        return t;
    }

    /** The {@code #} lines of a result of this plan. */
    public ResultHeader header(String version, String command, ScanSettings settings) {
        return new ResultHeader(version, command, settings.describe(), genome.contigs(),
                shard == null ? null : shard.toString(), regions);
    }
}
