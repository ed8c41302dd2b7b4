package stria.io;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;

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
        } catch (StriaException e) {
            throw e;
        } catch (IOException | RuntimeException e) {
            // the library's decompressor fails on damaged blocks with index and argument errors too
            throw new StriaException(what + " does not match " + display + " (" + InputCursor.oneLine(e)
                    + "); rebuild it (bgzip -r) or delete it", e);
        }
        return gzi;
    }

    /**
     * Reads a .fai and checks it against the file: each header line must be where the index puts it
     * and carry the indexed name, each sequence must end where its length and line layout say, and
     * the file must end after the last record. The line layouts are kept in the table as the index
     * gives them; the lines between a record's first and last byte are not looked at here.
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
            String problem = null;
            while (problem == null) {
                if (!atHeader(skipLineEnds(in, next), in)) {
                    problem = "no header line where one should start";
                    break;
                }
                String name = readHeader(in, display);
                if (name.equals(e.getContig())) {
                    problem = checkEntry(e, in);
                    break;
                }
                // samtools leaves records without sequence out of a .fai
                Landing after = skipLineEnds(in, in.position());
                if (!atHeader(after, in) && !(after != Landing.PAST_END && in.peek() < 0)) {
                    problem = "the header line has another name";
                    break;
                }
                table.add(name, 0, in.position(), 0, LineLayout.NONE);
                next = in.position();
            }
            if (problem != null) {
                throw new StriaException(what + " does not match " + display + " (record " + e.getContig() + ": "
                        + problem + "); rebuild it (samtools faidx) or delete it");
            }
            // the layout is a claim: a stream entering the record in the middle checks it where it lands
            LineLayout layout = e.getSize() > 0 ? layoutOf(e) : LineLayout.NONE;
            table.add(e.getContig(), e.getSize(), e.getLocation(), 0, layout);
            next = e.getSize() == 0 ? e.getLocation() : lastBase(e, layout) + 1;
        }
        Landing end = skipLineEnds(in, next);
        while (atHeader(end, in)) {
            String name = readHeader(in, display);
            table.add(name, 0, in.position(), 0, LineLayout.NONE);
            end = skipLineEnds(in, in.position());
        }
        if (table.size() == 0 || end == Landing.PAST_END || in.peek() >= 0) {
            throw new StriaException(what + " does not match " + display
                    + " (the file has more records than the index); rebuild it (samtools faidx) or delete it");
        }
        return table;
    }

    /** Reads a header line from its '>' to past its line end and returns the record name. */
    private static String readHeader(InputCursor in, String display) {
        long start = in.position();
        in.pos++;
        java.io.ByteArrayOutputStream name = new java.io.ByteArrayOutputStream();
        boolean inName = true;
        int c = in.peek();
        boolean cr = false;
        while (c >= 0 && c != '\n') {
            // the pre-pass refuses these header lines; an index must not make such a file acceptable
            if (FastaSyntax.isControl(c)) {
                throw new StriaException(display + ": " + FastaSyntax.describe(c) + " in the header line at offset "
                        + start + "; binary data, not a FASTA file");
            }
            if (cr) {
                throw new StriaException(display + ": header line at offset " + start + ": " + FastaSyntax.LONE_CR);
            }
            cr = c == '\r';
            inName = inName && c != ' ' && c != '\t' && c != '\r';
            if (inName) {
                name.write(c);
                if (name.size() > FastaSyntax.MAX_NAME) {
                    throw new StriaException(display + ": header line at offset " + start + ": record name longer than "
                            + FastaSyntax.MAX_NAME + " bytes; this is not a FASTA file");
                }
            }
            in.pos++;
            c = in.peek();
        }
        if (c == '\n') {
            in.pos++;
        }
        if (name.size() == 0) {
            throw new StriaException(display + ": header line at offset " + start + " has no record name after '>'");
        }
        String text = FastaSyntax.name(name);
        if (text == null) {
            throw new StriaException(display + ": header line at offset " + start + ": " + FastaSyntax.NOT_UTF8);
        }
        return text;
    }

    /** The layout an entry claims, or null when it is impossible. */
    private static LineLayout layoutOf(FastaSequenceIndexEntry e) {
        return LineLayout.fromIndex(e.getBasesPerLine(), e.getBytesPerLine());
    }

    private static long lastBase(FastaSequenceIndexEntry e, LineLayout layout) {
        return e.getLocation() + layout.offset(e.getSize() - 1);
    }

    /** Why an entry does not describe the record whose header line was just read, or null when it does. */
    private static String checkEntry(FastaSequenceIndexEntry e, InputCursor in) {
        long afterHeader = in.position();
        if (afterHeader != e.getLocation()) {
            return "sequence offset " + e.getLocation() + " but the header line ends at " + afterHeader;
        }
        if (e.getSize() == 0) {
            return null;
        }
        LineLayout layout = layoutOf(e);
        if (layout == null) {
            return "impossible line layout";
        }
        if (!in.moveTo(lastBase(e, layout))) {
            return "the file ends before the last base";
        }
        int c = in.peek();
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

    /**
     * Moves to {@code from} and past any line ends there, as the pre-pass would read them: a '>' opens a
     * record only at the start of a line, so the answer says whether the cursor ends up at one.
     */
    private static Landing skipLineEnds(InputCursor in, long from) {
        boolean lineStart = from == 0;
        if (from > 0) {
            if (!in.moveTo(from - 1)) {
                return Landing.PAST_END;
            }
            lineStart = in.peek() == '\n';
        }
        if (!in.moveTo(from)) {
            return Landing.PAST_END;
        }
        for (int c = in.peek(); c == '\r' || c == '\n'; c = in.peek()) {
            lineStart = c == '\n';
            in.pos++;
        }
        return lineStart ? Landing.LINE_START : Landing.MID_LINE;
    }

    private enum Landing { PAST_END, LINE_START, MID_LINE }

    private static boolean atHeader(Landing l, InputCursor in) {
        return l == Landing.LINE_START && in.peek() == '>';
    }
}
