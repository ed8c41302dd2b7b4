package stria.score;

import stria.io.Bases;

/**
 * Nested periodicity: a locus whose unit is itself made of shorter diverged units, as in higher-order
 * satellite arrays, where a block of k diverged units repeats with copies far more alike than the units.
 *
 * <p>The measure is {@link #agreement}: how often a base equals the base {@code d} further on, over short
 * windows spread along the locus, each window at its best offset within a few bases of {@code d} (copies
 * differ by small insertions and deletions too). Random sequence agrees in about a quarter to two fifths of
 * the bases; copies at identity x in about x.
 *
 * <p>The rule, for a locus of period P of {@link #MIN_PERIOD} or more:
 * <ul>
 *   <li><em>Block above the unit.</em> For k = 2..{@link #MAX_UNITS} with k P within the period limit, the
 *       smallest k whose distance k P disagrees in at most half as many bases as P ({@link #CLEARER}) and
 *       agrees in at least {@link #BLOCK_AGREEMENT} of them: the copies of the block explain the array
 *       clearly better than the units. The block's length is k P moved by {@link #shift}, the offset at
 *       which its copies line up best (the units' consensus can be a base or two off the units' mean length,
 *       k times over). The locus is realigned with the block as its unit; it keeps the block when that
 *       alignment covers the locus as well and is purer, with P as the subunit and k subunits; or, when P
 *       is itself m diverged units (P / m agrees at least {@link #UNIT_AGREEMENT} and as well as P, within
 *       {@link #ALIKE}), with P / m as the subunit and k m subunits.
 *   <li><em>Units inside the motif.</em> Otherwise, the largest k = 2..{@link #MAX_UNITS} such that the
 *       distance q = P / k (at least {@link #MIN_SUBUNIT}) agrees in at least {@link #UNIT_AGREEMENT} of the
 *       bases, and P disagrees in at most half as many: q is the subunit, k the subunits.
 * </ul>
 * Loci without either get no nested structure. A block longer than the period limit is not looked for:
 * the array then comes out at the unit level.
 */
final class NestedUnits {
    static final int MIN_PERIOD = 40;
    static final int MIN_SUBUNIT = 20;
    static final int MAX_UNITS = 16;
    static final double CLEARER = 0.5;
    static final double BLOCK_AGREEMENT = 0.8;
    static final double UNIT_AGREEMENT = 0.6;
    static final double ALIKE = 0.05;
    private static final int WINDOW = 32;
    private static final int MAX_WINDOWS = 600;

    private NestedUnits() {
    }

    /** {@code k} with its nested structure, or realigned at the block level, or {@code k} itself. */
    static Candidate of(CandidateBuilder builder, LocusFilter filter, int maxPeriod, Candidate k, int cap) {
        int p = k.period;
        if (p < MIN_PERIOD) {
            return k;
        }
        byte[] seq = builder.seq();
        double unit = agreement(seq, k.start, k.end, p);
        for (int n = 2; n <= MAX_UNITS && (long) n * p <= maxPeriod && 3L * n * p <= k.length(); n++) {
            double block = agreement(seq, k.start, k.end, n * p);
            if (block >= BLOCK_AGREEMENT && 1 - block <= CLEARER * (1 - unit)) {
                // n P is the block only as far as the units' consensus length is exact: the copies of the
                // block say its length, as the offset at which they line up best
                int length = n * p + shift(seq, k.start, k.end, n * p);
                Candidate b = length > p && length <= maxPeriod ? asBlock(builder, filter, k, length, cap) : null;
                if (b != null) {
                    // the unit may itself be m diverged units, as alike as the units of a block are: the
                    // subunit is then the shortest of them
                    for (int m = MAX_UNITS; m >= 2; m--) {
                        int q = Math.round(p / (float) m);
                        if (q >= MIN_SUBUNIT && agreement(seq, k.start, k.end, q) >= Math.max(UNIT_AGREEMENT, unit - ALIKE)) {
                            return b.withSubunits(q, n * m);
                        }
                    }
                    return b.withSubunits(p, n);
                }
                break;
            }
        }
        for (int n = MAX_UNITS; n >= 2; n--) {
            int q = Math.round(p / (float) n);
            if (q < MIN_SUBUNIT) {
                continue;
            }
            double sub = agreement(seq, k.start, k.end, q);
            if (sub >= UNIT_AGREEMENT && 1 - unit <= CLEARER * (1 - sub)) {
                return k.withSubunits(q, n);
            }
        }
        return k;
    }

    /** {@code k} realigned from its start with its first block as the unit, if that is as long and purer. */
    private static Candidate asBlock(CandidateBuilder builder, LocusFilter filter, Candidate k, int block, int cap) {
        byte[] seq = builder.seq();
        byte[] motif = new byte[block];
        for (int i = 0; i < block; i++) {
            int c = Bases.code(seq[k.start + i]);
            if (c < 0 || c > 3) {
                return null;
            }
            motif[i] = (byte) c;
        }
        Candidate b = builder.settle(k.start, motif, 0, cap, ArrayJoin.dropScale(block));
        if (b == null || b.end < k.end - k.period || b.purity() <= k.purity() || !filter.accepts(b)) {
            return null;
        }
        return b;
    }

    /**
     * The offset from {@code d}, within the slack of {@link #agreement}, at which the bases of the locus
     * line up with those {@code d} further on in most windows that line up well (at least three quarters
     * of their bases equal); 0 when no window does. Copies of a block whose units' consensus length is off
     * by a base or two line up that many bases per unit away from {@code d}.
     */
    static int shift(byte[] seq, int start, int end, int d) {
        int slack = slack(d);
        int[] votes = new int[2 * slack + 1];
        windows(seq, start, end, d, votes);
        int top = slack;
        for (int i = 0; i < votes.length; i++) {
            if (votes[i] > votes[top]) {
                top = i;
            }
        }
        return votes[top] == 0 ? 0 : top - slack;
    }

    /** Offsets from d tried, either way: copies drift apart by their indels. */
    private static int slack(int d) {
        return 2 + d / 50;
    }

    /** Stretch over which the windows of distance d start; none when it is not positive. */
    private static int span(int start, int end, int d) {
        return end - start - d - slack(d) - WINDOW;
    }

    /** How many windows {@link #windows} looks at, 0 when the stretch is too short for one. */
    private static int windowCount(int start, int end, int d) {
        int span = span(start, end, d);
        return span <= 0 ? 0 : Math.min(MAX_WINDOWS, Math.max(1, span / WINDOW));
    }

    /**
     * The windows of {@link #agreement} and {@link #shift}, {@link #windowCount} of them, each at the
     * offset from d where most of its bases equal those that far on (the offset nearest 0 on ties):
     * returns the sum of those counts, and when {@code votes} is not null adds one vote at
     * {@code votes[offset + slack]} for each window that lines up well (three quarters of its bases).
     */
    private static long windows(byte[] seq, int start, int end, int d, int[] votes) {
        int slack = slack(d);
        int span = span(start, end, d);
        int windows = windowCount(start, end, d);
        long total = 0;
        for (int w = 0; w < windows; w++) {
            int x = start + (int) ((long) span * w / windows);
            int top = -1;
            int at = 0;
            for (int s = -slack; s <= slack; s++) {
                int y = x + d + s;
                if (y < start) {
                    continue;
                }
                int same = same(seq, x, y);
                if (same > top || same == top && Math.abs(s) < Math.abs(at)) {
                    top = same;
                    at = s;
                }
            }
            total += Math.max(0, top);
            if (votes != null && 4 * top >= 3 * WINDOW) {
                votes[at + slack]++;
            }
        }
        return total;
    }

    /** Bases of the window at {@code x} equal to those of the window at {@code y}. */
    private static int same(byte[] seq, int x, int y) {
        int same = 0;
        for (int t = 0; t < WINDOW; t++) {
            byte u = Bases.code(seq[x + t]);
            if (u >= 0 && u <= 3 && u == Bases.code(seq[y + t])) {
                same++;
            }
        }
        return same;
    }

    /**
     * Fraction of bases equal to the base {@code d} further on, over windows of {@link #WINDOW} bases
     * spread evenly over {@code [start, end - d)} (at most {@link #MAX_WINDOWS}), each at its best offset
     * in {@code d} plus or minus 2 + d / 50.
     */
    static double agreement(byte[] seq, int start, int end, int d) {
        int windows = windowCount(start, end, d);
        return windows == 0 ? 0 : windows(seq, start, end, d, null) / (double) (windows * WINDOW);
    }
}
