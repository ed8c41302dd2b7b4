package stria.score;

/**
 * Scratch space of one {@link LocusCaller} call: the aligners, the vote counts and the word table of the
 * recurrence seeds. Buffers grow on demand and are reused, so a thread that keeps one workspace allocates
 * them once. One call at a time: threads each need their own.
 */
public final class ScoreWorkspace {
    /** Extends rightwards and holds the path that is tallied or measured. */
    final WrapAligner right = new WrapAligner();
    /** The left end of a candidate is found while the right end's path is still wanted. */
    final WrapAligner left = new WrapAligner();
    final VoteTally tally = new VoteTally();
    final RecurrenceSeeds recurrence = new RecurrenceSeeds();
    /** The sides ({@link LocusCaller#LEFT}, {@link LocusCaller#RIGHT}) the last failed solve lacked a quiet point on. */
    int unsolvedSides;
}
