package stria.compare;

import java.util.ArrayList;
import java.util.List;
import stria.report.PeriodClass;

/**
 * Counts of a comparison's rows by status and by period class (the report's classes), as a small table:
 * one row per status and one for all, one column per period class and one for all.
 */
public final class CompareSummary {
    private final long[][] n = new long[Status.values().length][PeriodClass.values().length];

    /** Counts a row by its TSV fields (period in column 4, status in column 11). */
    public void add(String[] f) {
        Status s = Status.valueOf(f[10].toUpperCase(java.util.Locale.ROOT));
        n[s.ordinal()][PeriodClass.of(Integer.parseInt(f[3])).ordinal()]++;
    }

    public long count(Status s) {
        long t = 0;
        for (long x : n[s.ordinal()]) {
            t += x;
        }
        return t;
    }

    /** The table as TSV lines: {@code status p1 p2_6 p7_99 p100 all}. */
    public List<String> lines() {
        List<String> out = new ArrayList<>();
        StringBuilder head = new StringBuilder("status");
        for (PeriodClass p : PeriodClass.values()) {
            head.append('\t').append(p.key());
        }
        out.add(head.append("\tall").toString());
        long[] col = new long[PeriodClass.values().length];
        for (Status s : Status.values()) {
            StringBuilder sb = new StringBuilder(s.word());
            long all = 0;
            for (PeriodClass p : PeriodClass.values()) {
                long x = n[s.ordinal()][p.ordinal()];
                sb.append('\t').append(x);
                all += x;
                col[p.ordinal()] += x;
            }
            out.add(sb.append('\t').append(all).toString());
        }
        StringBuilder sb = new StringBuilder("all");
        long all = 0;
        for (long x : col) {
            sb.append('\t').append(x);
            all += x;
        }
        out.add(sb.append('\t').append(all).toString());
        return out;
    }
}
