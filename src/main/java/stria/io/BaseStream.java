package stria.io;

/**
 * The bases of one contig, read front to back in pieces of any size and checked as they come, so that a
 * chromosome never has to sit in memory whole.
 */
public interface BaseStream {
    /**
     * Copies the next {@code n} bases, as in the file (case kept, no line ends), into
     * {@code dst[off, off + n)}. Reading past the contig's length is a programming error.
     *
     * @throws stria.StriaException on a bad letter or a record that does not end where expected, naming the
     *                              file, record and line, at the first call that reaches the problem
     */
    void read(byte[] dst, int off, int n);
}
