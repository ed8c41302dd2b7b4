package stria.io;

/**
 * Read access to the bases of one contig by contig coordinate (0-based), as in the file: case kept, no
 * line ends. The scan keeps long contigs out of memory behind this interface and copies out only the
 * stretch a task works on.
 */
public interface ContigBytes {
    /** Bases in the contig. */
    int length();

    /** Copies {@code [from, to)} into {@code dst} at {@code off}. Safe to call from several threads at once. */
    void copy(int from, int to, byte[] dst, int off);

    /** The whole contig as one array when it is held that way, else null; callers then avoid the copy. */
    default byte[] array() {
        return null;
    }

    /** A contig held in an array: {@code seq[0, length)}. */
    static ContigBytes of(byte[] seq, int length) {
        if (length < 0 || length > seq.length) {
            throw new IllegalArgumentException("length " + length + " outside an array of " + seq.length);
        }
        return new ContigBytes() {
            @Override
            public int length() {
                return length;
            }

            @Override
            public void copy(int from, int to, byte[] dst, int off) {
                if (from < 0 || to > length || from > to) {
                    throw new IndexOutOfBoundsException("[" + from + ", " + to + ") outside [0, " + length + ")");
                }
                System.arraycopy(seq, from, dst, off, to - from);
            }

            @Override
            public byte[] array() {
                return seq;
            }
        };
    }

    static ContigBytes of(byte[] seq) {
        return of(seq, seq.length);
    }
}
