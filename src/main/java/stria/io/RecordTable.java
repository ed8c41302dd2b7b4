package stria.io;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Where each record of a genome file lives, in file order, empty records included: name, sequence
 * length, uncompressed offset of the first sequence byte, line number of the header (0 when not
 * known, as when the table comes from a .fai) and the line layout when the record has one. Primitive
 * arrays: assemblies can have millions of records.
 *
 * <p>A record has a layout when every line of its sequence but the last holds the same number of bases
 * followed by the same line end (LF or CRLF) and the last holds no more: then base {@code b} lies at
 * {@code offset + b / basesPerLine * (basesPerLine + lineEnd) + b % basesPerLine}, and a stream can
 * start there without reading what comes before.
 */
final class RecordTable {
    final List<String> names = new ArrayList<>();
    private long[] lengths = new long[16];
    private long[] offsets = new long[16];
    private long[] headerLines = new long[16];
    private int[] basesPerLine = new int[16];
    private byte[] lineEnds = new byte[16];

    /**
     * @param basesPerLine bases on each full line, or 0 when the record has no layout
     * @param lineEnd      bytes of each line end, 1 (LF) or 2 (CRLF); ignored without a layout
     */
    void add(String name, long length, long seqOffset, long headerLine, int basesPerLine, int lineEnd) {
        int i = names.size();
        if (i == lengths.length) {
            lengths = Arrays.copyOf(lengths, 2 * i);
            offsets = Arrays.copyOf(offsets, 2 * i);
            headerLines = Arrays.copyOf(headerLines, 2 * i);
            this.basesPerLine = Arrays.copyOf(this.basesPerLine, 2 * i);
            lineEnds = Arrays.copyOf(lineEnds, 2 * i);
        }
        names.add(name);
        lengths[i] = length;
        offsets[i] = seqOffset;
        headerLines[i] = headerLine;
        this.basesPerLine[i] = basesPerLine;
        lineEnds[i] = (byte) lineEnd;
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

    /** Bases on each full line of the record, or 0 when it has no layout. */
    int basesPerLine(int i) {
        return basesPerLine[i];
    }

    /** Bytes of each line end of the record: 1 or 2, when it has a layout. */
    int lineEnd(int i) {
        return lineEnds[i];
    }
}
