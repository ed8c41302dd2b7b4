package stria.repeats;

/**
 * Finds every run (maximal repetition) of a stretch of DNA codes. Placeholder: the engine is being written.
 */
public final class RunFinder {
    /**
     * Appends to {@code out} every run of {@code codes[from, from + len)} whose smallest period is at most
     * {@code maxPeriod}, with coordinates relative to {@code from}. Codes are 0..3 for ACGT and
     * {@link stria.io.Bases#BREAK} for letters that break repeats: no reported run contains one.
     * Order of the appended runs is unspecified; callers sort.
     */
    public void find(byte[] codes, int from, int len, int maxPeriod, RunList out) {
        throw new UnsupportedOperationException("engine not written yet");
    }
}
