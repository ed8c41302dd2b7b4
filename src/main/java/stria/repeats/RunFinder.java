package stria.repeats;

import java.util.Arrays;

import stria.index.LcpArray;
import stria.index.ShallowSuffixArray;
import stria.index.SuffixArray;
import stria.io.Bases;

/**
 * Finds every run (maximal repetition) of a stretch of DNA codes.
 *
 * <p>Per call: suffix array (SA-IS), LCP array and inverse suffix array (Phi), or, when maxPeriod is short,
 * the same index sorted only maxPeriod + 1 letters deep ({@link ShallowSuffixArray}: the traversal never
 * looks deeper), then the branching squares of period at most maxPeriod from the LCP intervals
 * ({@link BranchingSquares}). Every run of smallest
 * period p ends with exactly one branching square of length p, and a branching square whose root is
 * primitive belongs to the run of that period ending where it ends; so each run is one primitive
 * branching square, rotated left as far as the period holds. Squares are sorted by end and then length;
 * at one end a length l is skipped when a shorter period p dividing l, found at the same end, already
 * spans 2l letters (then the root of length l is a power, and only then). Only primitive squares are
 * rotated, never every square occurrence.
 *
 * <p>BREAK is sorted as a fifth letter, and runs that contain one are dropped at the end. That is exact:
 * a run of the whole stretch without BREAK lies in one BREAK-free piece and is a run there; a run of a
 * piece cannot be extended over the BREAK bounding it, since the letter one period inside is not BREAK.
 *
 * <p>An instance keeps its arrays for the next call (one thread, many windows): suffix, LCP and inverse
 * suffix arrays and a packed context word per rank, about 20 bytes per letter of the largest stretch so
 * far (36 once the shallow index has been used: its keys), plus 16 bytes per branching square (roughly a quarter of the letters on DNA). Not thread safe.
 */
public final class RunFinder {
    private final SuffixArray suffixArray = new SuffixArray();
    private final ShallowSuffixArray shallow = new ShallowSuffixArray();
    private final BranchingSquares branching = new BranchingSquares();
    private int[] sa = new int[0];
    private int[] lcp = new int[0];
    private int[] work = new int[0];
    /** Periods and starts of the runs already found at the end being processed. */
    private int[] endPeriod = new int[16];
    private int[] endStart = new int[16];

    /**
     * Appends to {@code out} every run of {@code codes[from, from + len)} whose smallest period is at most
     * {@code maxPeriod}, with coordinates relative to {@code from}. Codes are 0..3 for ACGT and
     * {@link stria.io.Bases#BREAK} for letters that break repeats: no reported run contains one.
     * Order of the appended runs is unspecified; callers sort.
     *
     * @throws IllegalArgumentException if a code is outside 0..4 or the range lies outside {@code codes}
     */
    public void find(byte[] codes, int from, int len, int maxPeriod, RunList out) {
        if (from < 0 || len < 0 || from > codes.length - len) {
            throw new IllegalArgumentException("range " + from + "+" + len + " outside codes of length " + codes.length);
        }
        if (len < 2 || maxPeriod < 1) {
            return;
        }
        ensure(len);
        // the traversal caps LCP values at maxPeriod + 1: suffixes need ordering no deeper than that
        int depth = maxPeriod + 1;
        if (maxPeriod < len && ShallowSuffixArray.fits(len, depth, Bases.BREAK + 1)) {
            shallow.build(codes, from, len, depth, Bases.BREAK + 1, sa, lcp, work);
        } else {
            suffixArray.sort(codes, from, len, Bases.BREAK + 1, sa);
            LcpArray.phiWithInverse(codes, from, len, sa, lcp, work);
        }
        runs(codes, from, len, sa, work, lcp, maxPeriod, out);
    }

    /**
     * The part of {@link #find} after the index: appends the runs given the suffix array and LCP array of
     * {@code codes[from, from + len)}. Public so the stages can be timed apart.
     */
    public void runsFromIndex(byte[] codes, int from, int len, int[] sa, int[] lcp, int maxPeriod, RunList out) {
        if (from < 0 || len < 0 || from > codes.length - len || sa.length < len || lcp.length < len) {
            throw new IllegalArgumentException("range " + from + "+" + len + " does not fit the arrays");
        }
        if (len < 2 || maxPeriod < 1) {
            return;
        }
        ensure(len);
        int[] isa = work;
        for (int r = 0; r < len; r++) {
            isa[sa[r]] = r;
        }
        runs(codes, from, len, sa, isa, lcp, maxPeriod, out);
    }

    private void runs(byte[] codes, int from, int len, int[] sa, int[] isa, int[] lcp, int maxPeriod, RunList out) {
        branching.collect(codes, from, sa, isa, lcp, len, maxPeriod);
        branching.sortByEndThenLength(len, Math.min(maxPeriod, len));
        long[] sq = branching.squares();
        int count = branching.count();
        boolean anyBreak = false;
        for (int i = from, e = from + len; i < e; i++) {
            if (codes[i] == Bases.BREAK) {
                anyBreak = true;
                break;
            }
        }
        int g = 0;
        while (g < count) {
            int end = (int) (sq[g] >>> 32);
            int found = 0;
            for (; g < count && (int) (sq[g] >>> 32) == end; g++) {
                int l = (int) sq[g];
                if (isPower(end, l, found)) {
                    continue;
                }
                // a branching square already ends its run; only the start is open
                int a = from + end - 2 * l - 1;
                while (a >= from && codes[a] == codes[a + l]) {
                    a--;
                }
                int s = a + 1 - from;
                if (found == endPeriod.length) {
                    endPeriod = Arrays.copyOf(endPeriod, found * 2);
                    endStart = Arrays.copyOf(endStart, found * 2);
                }
                endPeriod[found] = l;
                endStart[found] = s;
                found++;
                if (!anyBreak || !hasBreak(codes, from + s, l)) {
                    out.add(s, end, l);
                }
            }
        }
    }

    /**
     * Whether the root of the square of length l ending at end is a power: exactly when a run found at the
     * same end has a period dividing l and spans the square, since a power's primitive root makes such a
     * run end there (the square is branching) and is tried first, being shorter.
     */
    private boolean isPower(int end, int l, int found) {
        for (int y = 0; y < found; y++) {
            int p = endPeriod[y];
            if (l % p == 0 && end - endStart[y] >= 2 * l) {
                return true;
            }
        }
        return false;
    }

    /** A run is periodic, so it holds a BREAK iff its first period does. */
    private static boolean hasBreak(byte[] codes, int at, int p) {
        for (int i = at, e = at + p; i < e; i++) {
            if (codes[i] == Bases.BREAK) {
                return true;
            }
        }
        return false;
    }

    private void ensure(int len) {
        if (sa.length < len) {
            sa = new int[len];
            lcp = new int[len];
            work = new int[len];
        }
    }
}
