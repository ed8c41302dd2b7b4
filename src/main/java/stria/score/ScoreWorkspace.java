package stria.score;

/**
 * Scratch space of one {@link LocusCaller} call: the aligners, the vote counts and the word table of the
 * recurrence seeds. Buffers grow on demand and are reused, so a thread that keeps one workspace allocates
 * them once. One call at a time: threads each need their own.
 */
public final class ScoreWorkspace {
    /** Extends rightwards and holds the path that is tallied or measured. */
    final WrapAligner right;
    /** The left end of a candidate is found while the right end's path is still wanted. */
    final WrapAligner left;
    final VoteTally tally = new VoteTally();
    final RecurrenceSeeds recurrence = new RecurrenceSeeds();
    /** The sides ({@link LocusCaller#LEFT}, {@link LocusCaller#RIGHT}) the last failed solve lacked a quiet point on. */
    int unsolvedSides;

    public ScoreWorkspace() {
        this(WrapAligner.SEGMENT_ROWS, WrapAligner.TEMPLATE_ROLL);
    }

    /** Aligners that keep {@code segmentRows} rows of traceback and unroll {@code templateRoll} letters. */
    ScoreWorkspace(int segmentRows, int templateRoll) {
        right = new WrapAligner(segmentRows, templateRoll);
        left = new WrapAligner(segmentRows, templateRoll);
    }
}
