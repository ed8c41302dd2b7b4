package stria.score;

import java.util.Arrays;

/**
 * A locus aligned, for a person to read, against its consensus repeated from phase 0 at its first base:
 * wraparound dynamic programming (Fischetti, Landau, Sellers &amp; Schmidt 1993), global over the locus, free
 * in the phase it ends at, with the scores of {@link WrapAligner} and a full traceback. The scan's own
 * alignment is banded and extends outwards from seeds; this one sees the locus whole, so its counts can
 * differ from the scan's figures by a few columns.
 *
 * <p>The alignment is a list of columns: the base of the locus (or {@code '-'} where a consensus letter is
 * deleted) and the phase of the consensus letter it is aligned with ({@code -1} for an inserted base).
 *
 * @param bases  per column the locus base as in the file, or {@code '-'}
 * @param phases per column the consensus phase, or -1 for an insertion
 */
public record CopyAlignment(byte[] bases, int[] phases) {
    /** Largest matrix drawn: a locus of {@code n} bases and period {@code p} needs {@code (n + 1) p} cells. */
    public static final long MAX_CELLS = 20_000_000;

    private static final byte DIAG = 0, INS = 1, DEL = 2;

    /** The alignment of {@code text[from, to)} against {@code motif} (upper case), or null when too large. */
    public static CopyAlignment of(byte[] text, int from, int to, String motif) {
        int n = to - from;
        int p = motif.length();
        if ((long) (n + 1) * p > MAX_CELLS) {
            return null;
        }
        byte[] m = new byte[p];
        for (int j = 0; j < p; j++) {
            m[j] = (byte) Character.toUpperCase(motif.charAt(j));
        }
        int[] prev = new int[p];
        int[] cur = new int[p];
        byte[] trace = new byte[(n + 1) * p];
        Arrays.fill(prev, Integer.MIN_VALUE / 4);
        prev[0] = 0;
        // the scan's own scores, against a background of even composition
        ScoringModel model = ScoringModel.uniform();
        for (int s = 1; s < p; s++) {
            prev[s] = prev[s - 1] + model.deletion();
            trace[s] = DEL;
        }
        for (int i = 1; i <= n; i++) {
            int c = Character.toUpperCase(text[from + i - 1]);
            int row = i * p;
            for (int s = 0; s < p; s++) {
                int before = s == 0 ? p - 1 : s - 1;
                int code = "ACGT".indexOf(c);
                int diag = prev[before] + (code < 0 ? model.substitution(0)
                        : c == m[before] ? model.match(code) : model.substitution(code));
                int ins = prev[s] + model.insertion();
                if (diag >= ins) {
                    cur[s] = diag;
                    trace[row + s] = DIAG;
                } else {
                    cur[s] = ins;
                    trace[row + s] = INS;
                }
            }
            // deletions run around the cycle; two rounds reach every state, a whole round never pays
            for (int k = 1; k < 2 * p; k++) {
                int s = k % p;
                int before = s == 0 ? p - 1 : s - 1;
                int del = cur[before] + model.deletion();
                if (del > cur[s]) {
                    cur[s] = del;
                    trace[row + s] = DEL;
                }
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        int end = 0;
        for (int s = 1; s < p; s++) {
            if (prev[s] > prev[end]) {
                end = s;
            }
        }
        // walked back from the end, so the columns come out last first
        byte[] bases = new byte[n + p + 16];
        int[] phases = new int[bases.length];
        int k = 0;
        int i = n, s = end;
        while (i > 0 || s != 0) {
            if (k == bases.length) {
                bases = Arrays.copyOf(bases, 2 * k);
                phases = Arrays.copyOf(phases, 2 * k);
            }
            byte op = trace[i * p + s];
            int before = s == 0 ? p - 1 : s - 1;
            if (i > 0 && op == DIAG) {
                bases[k] = text[from + i - 1];
                phases[k] = before;
                i--;
                s = before;
            } else if (i > 0 && op == INS) {
                bases[k] = text[from + i - 1];
                phases[k] = -1;
                i--;
            } else {
                bases[k] = '-';
                phases[k] = before;
                s = before;
            }
            k++;
        }
        byte[] b = new byte[k];
        int[] ph = new int[k];
        for (int j = 0; j < k; j++) {
            b[j] = bases[k - 1 - j];
            ph[j] = phases[k - 1 - j];
        }
        return new CopyAlignment(b, ph);
    }

    /** Columns of the alignment. */
    public int size() {
        return bases.length;
    }

    /** Whether column {@code k} is a base equal to its consensus letter. */
    public boolean matches(int k, String motif) {
        return phases[k] >= 0 && bases[k] != '-'
                && Character.toUpperCase(bases[k]) == Character.toUpperCase(motif.charAt(phases[k]));
    }
}
