package stria.io;

/** A record of a FASTA file: its order in the file, name and sequence length. */
public record ContigInfo(int index, String name, int length) {
}
