package stria;

/**
 * The one user-facing error: bad input, unreadable or unwritable files, inconsistent shard sets.
 * Its message is printed as a single line on stderr and the process exits with status 1.
 * The message names the file and, where it applies, the record and line.
 */
public final class StriaException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public StriaException(String message) {
        super(message);
    }

    public StriaException(String message, Throwable cause) {
        super(message, cause);
    }
}
