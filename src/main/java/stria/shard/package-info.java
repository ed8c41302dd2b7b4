/**
 * Splitting one genome into shards that separate jobs scan, and joining their results again.
 *
 * <p>{@link stria.shard.Partition} decides which bases each shard owns ({@link stria.shard.Shard}, named by
 * its {@link stria.shard.ShardId}); a shard reports the loci that start on its bases, so every locus is
 * reported by exactly one shard. {@link stria.shard.ShardMerge} checks that a set of shard results belongs
 * together and concatenates them into the result one run would have written.
 *
 * <p>May use {@code io} (contig and region records) and {@code out} (result headers and result input); the
 * partition depends on the names and lengths of the contigs alone.
 */
package stria.shard;
