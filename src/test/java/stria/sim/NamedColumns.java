package stria.sim;

import htsjdk.samtools.util.IOUtil;
import java.io.BufferedReader;
import java.io.IOException;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;

/**
 * Reads a tab-separated table by column name: '#' lines and empty lines are skipped, the first other
 * line names the columns, every later one is a row. Plain or gzip, as htsjdk opens it.
 */
final class NamedColumns {
    /** Turns one row into a value; {@code col} maps a column name to its index in {@code f}. */
    interface Row {
        void accept(Map<String, Integer> col, String[] f);
    }

    private NamedColumns() {
    }

    /**
     * Reads {@code path}, failing with the file and line when a column is missing or a row is not
     * readable, and returns the columns of the header row (none for an empty file).
     */
    static Map<String, Integer> read(Path path, String[] required, Row row) throws IOException {
        try (BufferedReader r = IOUtil.openFileForBufferedReading(path)) {
            Map<String, Integer> col = null;
            String line;
            int no = 0;
            while ((line = r.readLine()) != null) {
                no++;
                if (line.isEmpty() || line.startsWith("#")) {
                    continue;
                }
                String[] f = line.split("\t", -1);
                if (col == null) {
                    col = new HashMap<>();
                    for (int i = 0; i < f.length; i++) {
                        col.put(f[i], i);
                    }
                    for (String need : required) {
                        if (!col.containsKey(need)) {
                            throw new IOException(path + ": no column " + need + " in the header row");
                        }
                    }
                    continue;
                }
                try {
                    row.accept(col, f);
                } catch (RuntimeException e) {
                    throw new IOException(path + " line " + no + ": not a row of the table: " + line, e);
                }
            }
            return col == null ? Map.of() : col;
        }
    }
}
