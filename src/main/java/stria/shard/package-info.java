/**
 * Splitting one genome into shards that separate jobs scan, and joining their results again.
 *
 * <p>{@link stria.shard.Partition} decides which bases each shard owns; a shard reports the loci that
 * start on its bases, so every locus is reported by exactly one shard. {@link stria.shard.ShardMerge} checks
 * that a set of shard results belongs together and concatenates them into the result one run would have
 * written.
 */
package stria.shard;
