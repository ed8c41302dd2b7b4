package stria.io;

/**
 * A contig: its name and its length in bases. Genome files list the records that have sequence
 * ({@link GenomeReader#contigs()}, in file order); result headers and the shard partition list the contigs of
 * a whole genome, all inputs in order.
 */
public record ContigInfo(String name, int length) {
    public ContigInfo {
        if (length < 0 || name == null || name.isEmpty()) {
            throw new IllegalArgumentException("bad contig " + name + " " + length);
        }
    }
}
