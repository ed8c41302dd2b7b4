package stria;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.NoSuchFileException;

/**
 * The one user-facing error: bad input, unreadable or unwritable files, inconsistent shard sets.
 * Its message is printed as a single line on stderr and the process exits with status 1.
 * The message names the file and, where it applies, the record and line.
 *
 * <p>Failures of the libraries underneath (the JDK's I/O, htsjdk's compressed streams) become this error in
 * one place, {@link #io}, so every command words them alike.
 */
public final class StriaException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public StriaException(String message) {
        super(message);
    }

    public StriaException(String message, Throwable cause) {
        super(message, cause);
    }

    /** {@code what: why}, e.g. {@code cannot write out.bed: no space left on device}. */
    public static StriaException io(String what, Throwable failure) {
        return new StriaException(what + ": " + describe(failure), failure);
    }

    /**
     * A short description of an I/O failure, without class names or stack: the causes wrapped by
     * {@link UncheckedIOException} and htsjdk's {@code RuntimeIOException} are described instead of the wrapper.
     */
    public static String describe(Throwable e) {
        if ((e instanceof UncheckedIOException || e instanceof htsjdk.samtools.util.RuntimeIOException)
                && e.getCause() instanceof IOException io) {
            return describe(io);
        }
        if (e instanceof AccessDeniedException) {
            return "permission denied";
        }
        if (e instanceof NoSuchFileException) {
            return "no such file or directory";
        }
        if (e instanceof IndexOutOfBoundsException) {
            // the decompressor's index and argument errors name no cause a user could act on
            return "a compressed block does not decode; the file is damaged";
        }
        String m = e.getMessage();
        if (m != null && m.contains("No space left")) {
            return "no space left on device";
        }
        return m == null ? e.getClass().getSimpleName() : m;
    }
}
