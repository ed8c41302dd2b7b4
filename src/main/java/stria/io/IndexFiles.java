package stria.io;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;

import htsjdk.samtools.SAMException;
import htsjdk.samtools.reference.FastaSequenceIndex;
import htsjdk.samtools.reference.FastaSequenceIndexEntry;
import htsjdk.samtools.util.BlockCompressedInputStream;
import htsjdk.samtools.util.GZIIndex;
import stria.StriaException;

/**
 * The .fai and .gzi files next to a genome, trusted only after checking that they describe it. A stale
 * index is refused rather than ignored: it means the file was replaced, and the user should know.
 * The checks touch a few bytes per record and per sampled block, not the whole file.
 */
final class IndexFiles {
    /** Blocks of a .gzi compared with the file; a foreign or stale index fails on the first few. */
    private static final int GZI_SAMPLES = 64;

    private IndexFiles() {
    }

    static Path faiOf(Path fasta) {
        return fasta.resolveSibling(fasta.getFileName() + ".fai");
    }

    static Path gziOf(Path fasta) {
        return fasta.resolveSibling(fasta.getFileName() + ".gzi");
    }

    /** Loads a .gzi and checks a sample of its blocks against the BGZF file. */
    static GZIIndex loadGzi(Path bgzf, Path gziPath, String display) {
        String what = display + ".gzi";
        GZIIndex gzi;
        try {
            gzi = GZIIndex.loadIndex(gziPath);
        } catch (IOException | RuntimeException e) {
            throw new StriaException(what + " is not a readable .gzi index (" + InputCursor.oneLine(e) + ")", e);
        }
        List<GZIIndex.IndexEntry> entries = gzi.getIndexEntries();
        try (BlockCompressedInputStream in = new BlockCompressedInputStream(bgzf)) {
            int n = entries.size();
            // block k starts at entry k - 1 (the first block, at offset 0, is implicit) and ends at entry k
            for (int s = 0; n > 0 && s <= GZI_SAMPLES; s++) {
                int k = (int) ((long) (n - 1) * s / GZI_SAMPLES);
                long compressed = k == 0 ? 0 : entries.get(k - 1).getCompressedOffset();
                long start = k == 0 ? 0 : entries.get(k - 1).getUncompressedOffset();
                long end = entries.get(k).getUncompressedOffset();
                in.seek(compressed << 16);
                if (in.available() != end - start) {
                    throw new StriaException(what + " does not match " + display + " (block at offset " + compressed
                            + "); rebuild it (bgzip -r) or delete it");
                }
            }
        } catch (IOException | SAMException | IllegalArgumentException e) {
            throw new StriaException(what + " does not match " + display + " (" + InputCursor.oneLine(e)
                    + "); rebuild it (bgzip -r) or delete it", e);
        }
        return gzi;
    }

    /**
     * Reads a .fai and checks it against the file: each header line must be where the index puts it
     * and carry the indexed name, each sequence must end where its length and line layout say, and
     * the file must end after the last record.
     */
    static RecordTable fromFai(Path faiPath, InputCursor in, String display) {
        String what = display + ".fai";
        FastaSequenceIndex fai;
        try {
            fai = new FastaSequenceIndex(faiPath);
        } catch (RuntimeException e) {
            throw new StriaException(what + " is not a readable .fai index (" + InputCursor.oneLine(e) + ")", e);
        }
        RecordTable table = new RecordTable();
        long next = 0;
        for (FastaSequenceIndexEntry e : fai) {
            String problem = checkEntry(e, next, in);
            if (problem != null) {
                throw new StriaException(what + " does not match " + display + " (record " + e.getContig() + ": "
                        + problem + "); rebuild it (samtools faidx) or delete it");
            }
            table.add(e.getContig(), e.getSize(), e.getLocation(), 0);
            next = e.getSize() == 0 ? e.getLocation() : lastBase(e) + 1;
        }
        if (table.size() == 0 || !skipLineEnds(in, next) || in.peek() >= 0) {
            throw new StriaException(what + " does not match " + display
                    + " (the file has more records than the index); rebuild it (samtools faidx) or delete it");
        }
        return table;
    }

    private static long lastBase(FastaSequenceIndexEntry e) {
        long k = e.getSize() - 1;
        return e.getLocation() + k / e.getBasesPerLine() * e.getBytesPerLine() + k % e.getBasesPerLine();
    }

    /** Why an entry does not describe the record found after {@code from}, or null when it does. */
    private static String checkEntry(FastaSequenceIndexEntry e, long from, InputCursor in) {
        if (!skipLineEnds(in, from) || in.peek() != '>') {
            return "no header line where one should start";
        }
        in.pos++;
        byte[] want = e.getContig().getBytes(StandardCharsets.UTF_8);
        for (byte w : want) {
            if (in.peek() != (w & 0xFF)) {
                return "the header line has another name";
            }
            in.pos++;
        }
        int c = in.peek();
        if (c != ' ' && c != '\t' && c != '\r' && c != '\n' && c >= 0) {
            return "the header line has another name";
        }
        for (long n = 0; c >= 0 && c != '\n'; n++) {
            if (n > FastaSyntax.MAX_NAME) {
                return "header line too long";
            }
            in.pos++;
            c = in.peek();
        }
        long afterHeader = in.position() + (c < 0 ? 0 : 1);
        if (afterHeader != e.getLocation()) {
            return "sequence offset " + e.getLocation() + " but the header line ends at " + afterHeader;
        }
        if (e.getSize() == 0) {
            return null;
        }
        int terminator = e.getBytesPerLine() - e.getBasesPerLine();
        if (e.getBasesPerLine() < 1 || terminator < 1 || terminator > 2) {
            return "impossible line layout";
        }
        if (!in.moveTo(lastBase(e))) {
            return "the file ends before the last base";
        }
        c = in.peek();
        if (c == '\r' || c == '\n' || c == '>' || c < 0) {
            return "length " + e.getSize() + " does not fit the lines in the file";
        }
        in.pos++;
        c = in.peek();
        if (c != '\r' && c != '\n' && c >= 0) {
            return "the record is longer than " + e.getSize() + " bases";
        }
        return null;
    }

    private static boolean skipLineEnds(InputCursor in, long from) {
        if (!in.moveTo(from)) {
            return false;
        }
        for (int c = in.peek(); c == '\r' || c == '\n'; c = in.peek()) {
            in.pos++;
        }
        return true;
    }
}
