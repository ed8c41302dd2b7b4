package stria.out;

import java.io.FileDescriptor;
import java.io.FileOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import stria.StriaException;

/**
 * Standard output as a data stream whose failures are not lost. {@link System#out} is a {@link PrintStream},
 * which swallows write errors (a full disk, {@code /dev/full}, a closed descriptor, a reader gone), so a run
 * would exit 0 with its output cut short; every write and flush here fails with a {@link StriaException}
 * ("cannot write standard output: ...") instead. Closing flushes and leaves the descriptor open.
 */
public final class StandardOutput {
    /** What stdout is called in messages. */
    public static final String NAME = "standard output";

    private static volatile boolean descriptor;

    private StandardOutput() {
    }

    /**
     * Writes to the process's descriptor 1 itself rather than through {@link System#out}, so that the cause
     * of a failure can be told (the launcher's {@code main} does this; a command run inside another program,
     * such as a test, writes through its {@code System.out} and can only tell that writing failed).
     */
    public static void useDescriptor() {
        descriptor = true;
    }

    /** A new buffered stream on standard output. */
    public static OutputStream open() {
        System.out.flush();
        OutputStream raw = descriptor ? new FileOutputStream(FileDescriptor.out) : new Checked(System.out);
        return new Reporting(new java.io.BufferedOutputStream(raw, 1 << 16));
    }

    /**
     * Fails when {@link System#out} has had a write error so far (for output that did not go through
     * {@link #open}, such as a library's); the exit status must not say success after a lost write.
     */
    public static void checkSystemOut() {
        if (System.out.checkError()) {
            throw new StriaException("cannot write " + NAME + " (closed, full or its reader gone)");
        }
    }

    /** Makes a PrintStream's swallowed errors visible after each call. */
    private static final class Checked extends OutputStream {
        private final PrintStream out;

        Checked(PrintStream out) {
            this.out = out;
        }

        @Override
        public void write(int b) throws IOException {
            out.write(b);
            check();
        }

        @Override
        public void write(byte[] b, int off, int len) throws IOException {
            out.write(b, off, len);
            check();
        }

        @Override
        public void flush() throws IOException {
            out.flush();
            check();
        }

        private void check() throws IOException {
            if (out.checkError()) {
                throw new IOException("closed, full or its reader gone");
            }
        }
    }

    /** Every failure as the one user-facing error, named; close is a flush. */
    private static final class Reporting extends java.io.FilterOutputStream {
        Reporting(OutputStream out) {
            super(out);
        }

        @Override
        public void write(int b) {
            try {
                out.write(b);
            } catch (IOException e) {
                throw failure(e);
            }
        }

        @Override
        public void write(byte[] b, int off, int len) {
            try {
                out.write(b, off, len);
            } catch (IOException e) {
                throw failure(e);
            }
        }

        @Override
        public void flush() {
            try {
                out.flush();
            } catch (IOException e) {
                throw failure(e);
            }
        }

        @Override
        public void close() {
            flush();
        }

        private static StriaException failure(IOException e) {
            return StriaException.io("cannot write " + NAME, e);
        }
    }
}
