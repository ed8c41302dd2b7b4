package stria.io;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Where each record of a genome file lives, in file order, empty records included: name, sequence
 * length, uncompressed offset of the first sequence byte, line number of the header (0 when not
 * known, as when the table comes from a .fai) and the {@link LineLayout}. Primitive arrays: assemblies
 * can have millions of records, so a layout is kept as its two numbers and made again when asked for.
 */
final class RecordTable {
    final List<String> names = new ArrayList<>();
    private long[] lengths = new long[16];
    private long[] offsets = new long[16];
    private long[] headerLines = new long[16];
    private int[] basesPerLine = new int[16];
    private byte[] lineEnds = new byte[16];

    void add(String name, long length, long seqOffset, long headerLine, LineLayout layout) {
        int i = names.size();
        if (i == lengths.length) {
            lengths = Arrays.copyOf(lengths, 2 * i);
            offsets = Arrays.copyOf(offsets, 2 * i);
            headerLines = Arrays.copyOf(headerLines, 2 * i);
            basesPerLine = Arrays.copyOf(basesPerLine, 2 * i);
            lineEnds = Arrays.copyOf(lineEnds, 2 * i);
        }
        names.add(name);
        lengths[i] = length;
        offsets[i] = seqOffset;
        headerLines[i] = headerLine;
        basesPerLine[i] = layout.basesPerLine();
        lineEnds[i] = (byte) layout.lineEnd();
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

    LineLayout layout(int i) {
        return basesPerLine[i] == 0 ? LineLayout.NONE : new LineLayout(basesPerLine[i], lineEnds[i]);
    }
}
