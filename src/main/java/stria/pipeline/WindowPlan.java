package stria.pipeline;

/**
 * Overlapping windows over a stretch {@code [lo, hi)} of a contig, and which run starts each window owns.
 *
 * <p>Neighbouring windows share {@code overlap = 2 maxPeriod + 2} bases ({@link Geometry#overlap}). Window k owns the runs that start in
 * {@code [ownedFrom(k), ownedTo(k))}, where the boundary between k-1 and k lies {@code 2 maxPeriod} bases
 * before the end of window k-1. A run owned by window k then starts strictly inside it (so its start is
 * exact) and, if it reaches the end of window k, is seen by window k+1 over at least {@code 2 maxPeriod}
 * bases, enough to be reported there with the same period and stitched. Every run is thus reported exactly
 * once and whole, whatever the window length.
 */
public final class WindowPlan {
    private final int lo;
    private final int hi;
    private final int window;
    private final int overlap;
    private final int maxPeriod;
    private final int count;

    public WindowPlan(int lo, int hi, int window, int maxPeriod) {
        if (window < Geometry.minWindow(maxPeriod)) {
            throw new IllegalArgumentException("window " + window + " is too small for max period " + maxPeriod);
        }
        this.lo = lo;
        this.hi = hi;
        this.window = window;
        this.maxPeriod = maxPeriod;
        this.overlap = Geometry.overlap(maxPeriod);
        int len = hi - lo;
        int step = window - overlap;
        this.count = len <= window ? 1 : 1 + (int) ((len - window + (long) step - 1) / step);
    }

    public int count() {
        return count;
    }

    public int lo() {
        return lo;
    }

    public int hi() {
        return hi;
    }

    public int start(int k) {
        return (int) (lo + (long) k * (window - overlap));
    }

    public int end(int k) {
        return k == count - 1 ? hi : start(k) + window;
    }

    public boolean isLast(int k) {
        return k == count - 1;
    }

    public int ownedFrom(int k) {
        return k == 0 ? lo : end(k - 1) - Geometry.ownershipLead(maxPeriod);
    }

    public int ownedTo(int k) {
        return k == count - 1 ? hi : end(k) - Geometry.ownershipLead(maxPeriod);
    }
}
