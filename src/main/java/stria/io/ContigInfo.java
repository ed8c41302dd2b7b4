package stria.io;

/**
 * One record of a genome file that has sequence. {@code index} is its position in
 * {@link GenomeReader#contigs()}, which follows file order; records without sequence are not counted,
 * so the index can be used directly as an array slot by later stages.
 */
public record ContigInfo(int index, String name, int length) {
    public ContigInfo {
        if (index < 0 || length < 1 || name == null || name.isEmpty()) {
            throw new IllegalArgumentException("bad contig " + index + " " + name + " " + length);
        }
    }
}
