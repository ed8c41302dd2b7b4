package stria.out;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.List;
import stria.StriaException;
import stria.score.Locus;

/**
 * Writes loci as BED and/or TSV, contig by contig, through {@link AtomicOutputs}. Lines are gathered in a
 * buffer and written in large blocks.
 */
public final class ResultWriter {
    private final OutputStream bed;
    private final OutputStream tsv;
    private final String bedName;
    private final String tsvName;
    private final StringBuilder bedBuf = new StringBuilder(1 << 16);
    private final StringBuilder tsvBuf = new StringBuilder(1 << 16);
    private long loci;

    /** Either stream may be null when that format is not wanted. */
    public ResultWriter(OutputStream bed, String bedName, OutputStream tsv, String tsvName) {
        this.bed = bed;
        this.tsv = tsv;
        this.bedName = bedName;
        this.tsvName = tsvName;
    }

    public void header(List<String> lines) {
        StringBuilder sb = new StringBuilder();
        for (String l : lines) {
            sb.append(l).append('\n');
        }
        String head = sb.toString();
        if (bed != null) {
            write(bed, bedName, new StringBuilder(head));
        }
        if (tsv != null) {
            write(tsv, tsvName, new StringBuilder(head).append(LocusFormat.TSV_HEADER).append('\n'));
        }
    }

    public void locus(String chrom, Locus l) {
        loci++;
        if (bed != null) {
            LocusFormat.bed(bedBuf, chrom, l);
            if (bedBuf.length() > (1 << 16)) {
                write(bed, bedName, bedBuf);
            }
        }
        if (tsv != null) {
            LocusFormat.tsv(tsvBuf, chrom, l);
            if (tsvBuf.length() > (1 << 16)) {
                write(tsv, tsvName, tsvBuf);
            }
        }
    }

    public long loci() {
        return loci;
    }

    public void flush() {
        if (bed != null) {
            write(bed, bedName, bedBuf);
            flush(bed, bedName);
        }
        if (tsv != null) {
            write(tsv, tsvName, tsvBuf);
            flush(tsv, tsvName);
        }
    }

    private static void write(OutputStream out, String name, StringBuilder sb) {
        try {
            out.write(sb.toString().getBytes(StandardCharsets.UTF_8));
        } catch (IOException e) {
            throw new StriaException("cannot write " + name + ": " + AtomicOutputs.describe(e));
        } catch (UncheckedIOException e) {
            throw new StriaException("cannot write " + name + ": " + AtomicOutputs.describe(e.getCause()));
        } catch (htsjdk.samtools.util.RuntimeIOException e) {
            throw new StriaException("cannot write " + name + ": " + AtomicOutputs.describe(
                    e.getCause() instanceof IOException io ? io : new IOException(e.getMessage())));
        }
        sb.setLength(0);
    }

    private static void flush(OutputStream out, String name) {
        try {
            out.flush();
        } catch (IOException e) {
            throw new StriaException("cannot write " + name + ": " + AtomicOutputs.describe(e));
        } catch (htsjdk.samtools.util.RuntimeIOException e) {
            throw new StriaException("cannot write " + name + ": " + AtomicOutputs.describe(
                    e.getCause() instanceof IOException io ? io : new IOException(e.getMessage())));
        }
    }
}
