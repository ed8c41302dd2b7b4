package stria.report;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import stria.StriaException;
import stria.out.ResultInput;

/**
 * The loci whose repeat changed most between two assemblies, from a compare result (TSV: {@code #} lines,
 * a column row, one row per locus). Columns are found by name, so the result may carry more of them:
 * {@link #COLUMNS} must be there. A row whose {@code length_change} is not a number (a locus not found in
 * the other assembly) is not ranked. Ranked by the size of the change, larger first; ties in file order.
 */
record ChangedLoci(String file, List<Map<String, String>> rows, long ranked) {
    static final String[] COLUMNS = {"chrom", "start", "end", "period", "motif_class", "other_chrom", "other_start",
        "other_end", "other_strand", "length_change", "status"};

    static ChangedLoci read(String path, int n) {
        List<Map<String, String>> best = new ArrayList<>();
        List<Long> size = new ArrayList<>();
        long ranked = 0;
        try (ResultInput in = ResultInput.open(path, StandardCharsets.UTF_8)) {
            String line;
            String[] names = null;
            Map<String, Integer> col = new HashMap<>();
            long lineNo = 0;
            while ((line = in.readLine()) != null) {
                lineNo++;
                if (line.startsWith("#") || line.isEmpty()) {
                    continue;
                }
                String[] f = line.split("\t", -1);
                if (names == null) {
                    names = f;
                    for (int i = 0; i < f.length; i++) {
                        col.put(f[i], i);
                    }
                    for (String c : COLUMNS) {
                        if (!col.containsKey(c)) {
                            throw new StriaException(path + ": not a compare result: no column " + c
                                    + " in its column row (line " + lineNo + ")");
                        }
                    }
                    continue;
                }
                if (f.length != names.length) {
                    throw new StriaException(path + " line " + lineNo + ": " + f.length + " fields, the column row "
                            + "has " + names.length);
                }
                long change;
                try {
                    change = Long.parseLong(f[col.get("length_change")]);
                } catch (NumberFormatException e) {
                    continue;
                }
                ranked++;
                long mag = Math.abs(change);
                int at = best.size();
                while (at > 0 && size.get(at - 1) < mag) {
                    at--;
                }
                if (at < n) {
                    Map<String, String> row = new HashMap<>();
                    for (String c : COLUMNS) {
                        row.put(c, f[col.get(c)]);
                    }
                    best.add(at, row);
                    size.add(at, mag);
                    if (best.size() > n) {
                        best.remove(n);
                        size.remove(n);
                    }
                }
            }
            if (names == null) {
                throw new StriaException(path + ": not a compare result: no column row");
            }
        }
        return new ChangedLoci(path, List.copyOf(best), ranked);
    }
}
