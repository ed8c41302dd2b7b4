package stria.score;

/**
 * Thrown by {@link LocusCaller} when the exact runs it was given do not reach far enough to decide the
 * loci of the requested range; the pipeline widens the range of known runs and asks again.
 */
public final class NeedMoreContextException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    public NeedMoreContextException(String message) {
        super(message, null, false, false);
    }
}
