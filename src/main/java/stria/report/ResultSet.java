package stria.report;

import java.util.List;
import stria.out.ResultHeader;
import stria.shard.ShardId;

/**
 * The results of one genome, read from one or more TSV files.
 *
 * @param files        the files as named by the user
 * @param header       header of the first file (contigs, settings, version)
 * @param commands     the {@code #command} line of each file, in file order, without repeats
 * @param shards       every shard among the files, sorted by K, without repeats
 * @param missingShards shard numbers of {@code 1..N} that none of the files holds (empty when complete)
 * @param regionLimited whether the scan covered only {@code #region} spans rather than whole contigs
 * @param scanned      per contig (header order), the scanned spans as sorted, disjoint
 *                     {@code [start, end)} pairs flattened into one array
 * @param loci         per contig (header order), the loci, sorted and free of duplicates
 * @param motifClasses motif class names, indexed by the ids stored in {@link ContigLoci}
 */
public record ResultSet(List<String> files, ResultHeader header, List<String> commands, List<ShardId> shards,
                        List<Integer> missingShards, boolean regionLimited, List<long[]> scanned,
                        List<ContigLoci> loci, List<String> motifClasses) {

    public String fingerprint() {
        return header.fingerprint();
    }

    /** Bases scanned on contig {@code c}. */
    public long scannedBases(int c) {
        long[] s = scanned.get(c);
        long t = 0;
        for (int i = 0; i < s.length; i += 2) {
            t += s[i + 1] - s[i];
        }
        return t;
    }

    /** Whether every locus has purity 1 (exact runs): then purity carries no information to plot. */
    public boolean allExact() {
        for (ContigLoci l : loci) {
            for (int i = 0; i < l.size(); i++) {
                if (l.purity(i) < 1) {
                    return false;
                }
            }
        }
        return true;
    }
}
