package stria.compare;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.function.Consumer;
import stria.StriaException;
import stria.io.ContigInfo;
import stria.out.ResultSeal;

/**
 * Writes a comparison's rows as they come: the TSV (header lines, column row, one line a row), and
 * optionally BED of the changed loci on A's side (in row order, which is A's) and on B's (sorted when the
 * last row is in), and counts them for the summary. Streams are the caller's (atomic outputs). A part of a
 * split comparison ({@link #sealed}) ends its TSV with the closing line of {@link ResultSeal}, so that
 * {@code merge} can tell a complete part from one cut short.
 */
public final class CompareWriter implements Consumer<ComparedLocus> {
    private final OutputStream tsv;
    private final String tsvName;
    private final OutputStream aBed;
    private final OutputStream bBed;
    private final ChangedBed.BSide bSide;
    private final CompareSummary summary = new CompareSummary();
    private final StringBuilder sb = new StringBuilder(256);
    private ResultSeal seal;

    /**
     * @param aBed A's BED of changed loci, or null
     * @param bBed B's, or null
     */
    public CompareWriter(List<String> header, List<ContigInfo> bContigs, OutputStream tsv, String tsvName,
                         OutputStream aBed, OutputStream bBed) {
        this.tsv = tsv;
        this.tsvName = tsvName;
        this.aBed = aBed;
        this.bBed = bBed;
        this.bSide = bBed == null ? null : new ChangedBed.BSide(bContigs);
        for (String l : header) {
            line(tsv, l);
            if (aBed != null) {
                line(aBed, l);
            }
            if (bBed != null) {
                line(bBed, l);
            }
        }
        line(tsv, CompareRow.HEADER);
    }

    /** Makes the TSV end with a closing line over its rows (a part of a split comparison). */
    public CompareWriter sealed() {
        seal = new ResultSeal();
        return this;
    }

    @Override
    public void accept(ComparedLocus r) {
        sb.setLength(0);
        CompareRow.tsv(sb, r);
        row(sb.substring(0, sb.length() - 1));
    }

    /** A row as its TSV text (without line end), as {@code merge} copies it. */
    public void row(String row) {
        line(tsv, row);
        if (seal != null) {
            byte[] b = (row + "\n").getBytes(StandardCharsets.UTF_8);
            seal.data(b, 0, b.length, 1);
        }
        String[] f = row.split("\t", -1);
        summary.add(f);
        if (aBed != null) {
            String l = ChangedBed.aLine(f);
            if (l != null) {
                line(aBed, l);
            }
        }
        if (bSide != null) {
            bSide.add(f);
        }
    }

    /** Writes what waits for the last row (B's BED, the TSV's closing line). */
    public void finish() {
        if (seal != null) {
            line(tsv, seal.closingLine());
            seal = null;
        }
        if (bSide != null) {
            for (String l : bSide.sorted()) {
                line(bBed, l);
            }
        }
    }

    public CompareSummary summary() {
        return summary;
    }

    private void line(OutputStream out, String l) {
        try {
            out.write(l.getBytes(StandardCharsets.UTF_8));
            out.write('\n');
        } catch (IOException e) {
            throw StriaException.io("cannot write " + (out == tsv ? tsvName : "BED of changed loci"), e);
        }
    }
}
