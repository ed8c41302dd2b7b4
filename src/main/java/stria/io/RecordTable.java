package stria.io;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Where each record of a genome file lives, in file order, empty records included: name, sequence
 * length, uncompressed offset of the first sequence byte and line number of the header (0 when not
 * known, as when the table comes from a .fai). Primitive arrays: assemblies can have millions of records.
 */
final class RecordTable {
    final List<String> names = new ArrayList<>();
    private long[] lengths = new long[16];
    private long[] offsets = new long[16];
    private long[] headerLines = new long[16];

    void add(String name, long length, long seqOffset, long headerLine) {
        int i = names.size();
        if (i == lengths.length) {
            lengths = Arrays.copyOf(lengths, 2 * i);
            offsets = Arrays.copyOf(offsets, 2 * i);
            headerLines = Arrays.copyOf(headerLines, 2 * i);
        }
        names.add(name);
        lengths[i] = length;
        offsets[i] = seqOffset;
        headerLines[i] = headerLine;
    }

    int size() {
        return names.size();
    }

    long length(int i) {
        return lengths[i];
    }

    long offset(int i) {
        return offsets[i];
    }

    long headerLine(int i) {
        return headerLines[i];
    }
}
