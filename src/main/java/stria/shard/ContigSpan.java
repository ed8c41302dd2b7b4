package stria.shard;

/** A contig of the input as the partition sees it: its name and its length in bases. */
public record ContigSpan(String name, int length) {
    public ContigSpan {
        if (length < 0) {
            throw new IllegalArgumentException("negative length for contig " + name);
        }
    }
}
