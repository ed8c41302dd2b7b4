package stria.report;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import stria.StriaException;
import stria.io.BaseStream;
import stria.io.ContigInfo;
import stria.io.GenomeReader;
import stria.out.ResultHeader;

/**
 * The N gaps of a genome: per contig (in the result header's order) the runs of {@code N} or {@code n} as
 * sorted, disjoint {@code [start, end)} pairs flattened into one array. Shares in repeats are counted over
 * the sequenced bases, the bases scanned minus these; no repeat spans an N, so the loci lie outside them.
 * {@link #known()} is false when no genome was given, and then every contig has no gaps.
 */
public final class Gaps {
    private static final int PIECE = 1 << 20;

    private final List<long[]> spans;
    private final boolean known;

    private Gaps(List<long[]> spans, boolean known) {
        this.spans = spans;
        this.known = known;
    }

    /** No genome given: gaps unknown, counted as none. */
    public static Gaps unknown(int contigs) {
        List<long[]> s = new ArrayList<>();
        for (int i = 0; i < contigs; i++) {
            s.add(new long[0]);
        }
        return new Gaps(s, false);
    }

    public static Gaps of(List<long[]> spans) {
        return new Gaps(List.copyOf(spans), true);
    }

    /**
     * Reads the N runs of {@code fasta}, which must be the genome the results were made from (the same
     * contig names and lengths, as the {@code #input} fingerprint says).
     */
    public static Gaps read(String fasta, ResultHeader header) {
        try (GenomeReader g = GenomeReader.open(fasta, m -> System.err.println("stria: warning: " + m))) {
            if (!ResultHeader.fingerprint(g.contigs()).equals(header.fingerprint())) {
                throw new StriaException(fasta + " is not the genome of these results: its contigs (fingerprint "
                        + ResultHeader.fingerprint(g.contigs()) + ") differ from theirs (" + header.fingerprint() + ")");
            }
            List<long[]> spans = new ArrayList<>();
            byte[] buf = new byte[PIECE];
            for (ContigInfo c : g.contigs()) {
                BaseStream in = g.stream(c);
                long[] runs = new long[16];
                int n = 0;
                long runStart = -1;
                for (int at = 0; at < c.length(); at += PIECE) {
                    int len = Math.min(PIECE, c.length() - at);
                    in.read(buf, 0, len);
                    for (int i = 0; i < len; i++) {
                        boolean gap = buf[i] == 'N' || buf[i] == 'n';
                        if (gap && runStart < 0) {
                            runStart = at + i;
                        } else if (!gap && runStart >= 0) {
                            if (n + 2 > runs.length) {
                                runs = Arrays.copyOf(runs, 2 * runs.length);
                            }
                            runs[n++] = runStart;
                            runs[n++] = at + i;
                            runStart = -1;
                        }
                    }
                }
                if (runStart >= 0) {
                    if (n + 2 > runs.length) {
                        runs = Arrays.copyOf(runs, 2 * runs.length);
                    }
                    runs[n++] = runStart;
                    runs[n++] = c.length();
                }
                spans.add(Arrays.copyOf(runs, n));
            }
            return of(spans);
        }
    }

    public boolean known() {
        return known;
    }

    /** The gaps of contig {@code c}. */
    public long[] of(int c) {
        return spans.get(c);
    }

    /** Gap bases of contig {@code c} inside the sorted, disjoint spans {@code within}. */
    public long inside(int c, long[] within) {
        long[] g = spans.get(c);
        long t = 0;
        int j = 0;
        for (int i = 0; i < within.length; i += 2) {
            while (j < g.length && g[j + 1] <= within[i]) {
                j += 2;
            }
            for (int k = j; k < g.length && g[k] < within[i + 1]; k += 2) {
                t += Math.min(g[k + 1], within[i + 1]) - Math.max(g[k], within[i]);
            }
        }
        return t;
    }

    /** Gap bases in all contigs inside their scanned spans. */
    public long total(ResultSet r) {
        long t = 0;
        for (int c = 0; c < spans.size(); c++) {
            t += inside(c, r.scanned().get(c));
        }
        return t;
    }
}
