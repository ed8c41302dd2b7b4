package stria.io;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import java.util.function.Function;

import htsjdk.samtools.util.BlockCompressedInputStream;
import htsjdk.samtools.util.GZIIndex;
import stria.StriaException;

/**
 * A genome file (FASTA: plain, gzip or BGZF, or standard input) as a list of contigs whose bases are
 * read as streams ({@link #stream}), front to back in pieces of any size, from the first base or from any
 * base of the record. The reader holds no sequence: per record only where it starts and its line layout,
 * so a chromosome costs the caller's buffers and nothing more. {@link #sequence} loads one contig whole,
 * for callers that want an array (tests, small inputs).
 *
 * <p>Decompression and the index formats come from htsjdk. The records themselves are parsed here,
 * byte by byte, because the FASTA readers of the library hold whole sequences and grow their buffers
 * while reading (a large chromosome would need three times its size) and do not report where a bad
 * letter is.
 *
 * <p>Everything is checked when the file is opened (a pre-pass, or the .fai when one matches the file),
 * which gives every name and length before any base is read; every byte is checked again as a stream
 * reads it. All problems surface as {@link StriaException} with the file named. Reads are serialised
 * ({@link #sequence} and every read of a {@link #stream} hold this reader's lock): one file is read by one
 * cursor, and the scan reads it from one thread, one stretch after the other.
 */
public final class GenomeReader implements AutoCloseable {
    private final String display;
    private final Path path;
    private final Path spooled;
    private final InputCursor cursor;
    private final RecordTable table;
    /** Table slot of each contig, by name (names are unique within a file). */
    private final Map<String, Integer> record;
    private final List<ContigInfo> contigs;
    /** Whether the table, line layouts included, comes from a .fai rather than from reading the file. */
    private final boolean fromIndex;
    private final Function<String, String> mismatch;

    private GenomeReader(String display, Path path, Path spooled, InputCursor cursor, RecordTable table,
                         boolean fromIndex, Consumer<String> warn) {
        this.display = display;
        this.path = path;
        this.spooled = spooled;
        this.cursor = cursor;
        this.table = table;
        this.fromIndex = fromIndex;
        this.mismatch = fromIndex
                ? detail -> display + ".fai does not match " + display + " (" + detail
                        + "); rebuild it (samtools faidx) or delete it"
                : detail -> display + " changed while being read (" + detail + ")";
        Map<String, Long> seen = new HashMap<>();
        List<ContigInfo> list = new ArrayList<>();
        Map<String, Integer> rec = new HashMap<>();
        int empty = 0;
        String firstEmpty = null;
        for (int i = 0; i < table.size(); i++) {
            String name = table.names.get(i);
            Long before = seen.putIfAbsent(name, table.headerLine(i));
            if (before != null) {
                throw new StriaException(display + ": duplicate record name " + name
                        + (before > 0 ? " (lines " + before + " and " + table.headerLine(i) + ")" : ""));
            }
            long length = table.length(i);
            if (length == 0) {
                if (empty++ == 0) {
                    firstEmpty = name;
                }
                continue;
            }
            if (length > Integer.MAX_VALUE - 8) {
                throw new StriaException(display + ": record " + name + " has " + length
                        + " bases; records longer than 2,147,483,639 bases are not supported");
            }
            rec.put(name, i);
            list.add(new ContigInfo(name, (int) length));
        }
        if (list.isEmpty()) {
            throw new StriaException(display + ": no record has any sequence");
        }
        if (empty > 0) {
            warn.accept(display + ": skipped " + (empty == 1 ? "1 record" : empty + " records")
                    + " with no sequence (" + (empty == 1 ? "" : "first: ") + firstEmpty + ")");
        }
        this.record = rec;
        this.contigs = Collections.unmodifiableList(list);
    }

    /**
     * Opens a FASTA file, plain, gzip or BGZF; {@code "-"} reads standard input, which is first copied to
     * a temporary file (deleted on close and at exit) so that it can be read twice.
     *
     * @param warn receives one-line warnings, such as records skipped for having no sequence
     * @throws StriaException with a one-line message naming the file on anything wrong with it
     */
    public static GenomeReader open(String pathOrDash, Consumer<String> warn) {
        boolean stdin = "-".equals(pathOrDash);
        String display = stdin ? "<stdin>" : pathOrDash;
        Path path = stdin ? null : pathOf(pathOrDash);
        // a pipe (process substitution, a fifo) can be read only once, like standard input
        boolean pipe = stdin || (Files.exists(path) && !Files.isDirectory(path) && !Files.isRegularFile(path));
        Path spooled = pipe ? spool(path, display) : null;
        if (pipe) {
            path = spooled;
        }
        InputCursor cursor = null;
        try {
            checkFile(path, display);
            Compression kind;
            try {
                String foreign = Compression.foreign(path);
                if (foreign != null) {
                    throw new StriaException(display + ": " + foreign + "-compressed; stria reads plain, gzip and BGZF"
                            + " FASTA: decompress it first" + (foreign.equals("zip") ? "" : " (" + foreign + " -dc)"));
                }
                kind = Compression.detect(path);
            } catch (IOException e) {
                throw new StriaException(display + ": cannot read (" + InputCursor.oneLine(e) + ")", e);
            }
            GZIIndex gzi = null;
            if (kind == Compression.BGZF) {
                checkTermination(path, display, warn);
                Path gziPath = IndexFiles.gziOf(path);
                if (!pipe && Files.isRegularFile(gziPath)) {
                    gzi = IndexFiles.loadGzi(path, gziPath, display);
                }
            }
            cursor = new InputCursor(path, kind, gzi, display);
            Path fai = IndexFiles.faiOf(path);
            boolean useFai = !pipe && kind != Compression.GZIP && Files.isRegularFile(fai);
            RecordTable table = useFai ? IndexFiles.fromFai(fai, cursor, display) : FastaPrePass.scan(cursor, display);
            return new GenomeReader(display, path, spooled, cursor, table, useFai, warn);
        } catch (RuntimeException e) {
            if (cursor != null) {
                cursor.close();
            }
            deleteQuietly(spooled);
            throw e;
        }
    }

    /** The file as the user named it, or {@code <stdin>}: the form every message uses. */
    public String displayName() {
        return display;
    }

    /** Every record that has sequence, in file order. */
    public List<ContigInfo> contigs() {
        return contigs;
    }

    /**
     * The whole sequence of a contig: its bytes as in the file without line ends, case kept. Cheapest in
     * file order; any order works.
     *
     * @throws StriaException when a byte is not an IUPAC nucleotide letter, naming record, line and letter,
     *                        or when the record does not end, or its lines do not break, where the .fai or
     *                        the pre-pass says
     */
    public synchronized byte[] sequence(ContigInfo c) {
        BaseStream bases = stream(c);
        byte[] out = new byte[c.length()];
        bases.read(out, 0, out.length);
        return out;
    }

    /**
     * The bases of a contig as a stream read in pieces; see {@link BaseStream}. It holds only its place in
     * the file, so a chromosome read this way costs the caller's buffers and nothing more. Streams of the
     * same file, and {@link #sequence}, may be used in turns (each stream keeps its own place); calls are
     * serialised on this reader. Going back in a gzip file, or in a BGZF file without .gzi, decompresses
     * again from the start, so there streams are cheapest read one after the other.
     *
     * <p>When the record's lines all hold the same number of bases (the last no more), as the .fai or the
     * pre-pass says, every line end read must be where that layout puts it; a file that does not keep to
     * it is refused like any other mismatch.
     */
    public BaseStream stream(ContigInfo c) {
        return record(c);
    }

    /**
     * The bases {@code [from, length)} of a contig as a stream; see {@link #stream(ContigInfo)}, which this
     * is for {@code from == 0}. Whenever {@link #sequence} succeeds, the stream gives exactly its bases
     * from {@code from} on.
     *
     * <p>When the record has a line layout, the stream starts at {@code from} directly: in a plain file,
     * or BGZF with a .gzi, only the bytes from about there on are read. The line end before the line of
     * {@code from} must be exactly the layout's. A layout taken from a .fai is only a claim, so there one
     * whole line next to {@code from} (that of {@code from}, or the one before when that is the last) is
     * read as well, and the stream is refused unless it is exactly as the index says. A record whose lines
     * are not all alike, and one the .fai puts on a single line, is read from its start and the bases
     * before {@code from} are dropped, without keeping them.
     *
     * <p>Started in the middle, the stream does not read the lines before those it checks: damage there
     * (a bad letter, a line of another length, a CR among the bases) is not reported, and the bases given
     * are those at the places the layout gives. Loading the whole contig reports it.
     *
     * @throws IllegalArgumentException when {@code from} is negative or past the length
     * @throws StriaException            as the reads of a stream do; a problem in what is read to start
     *                                   the stream is reported here
     */
    public BaseStream stream(ContigInfo c, int from) {
        RecordStream in = record(c);
        if (from < 0 || from > c.length()) {
            throw new IllegalArgumentException("cannot start contig " + c.name() + " of " + c.length() + " bases at "
                    + from);
        }
        in.enter(from, !fromIndex);
        return in;
    }

    private RecordStream record(ContigInfo c) {
        Integer i = record.get(c.name());
        if (i == null || table.length(i) != c.length()) {
            throw new IllegalArgumentException("contig " + c + " is not from " + display);
        }
        return new RecordStream(this, cursor, display, c.name(), c.length(), table.offset(i), table.headerLine(i),
                table.layout(i), mismatch);
    }

    @Override
    public void close() {
        cursor.close();
        deleteQuietly(spooled);
    }

    /** For tests: the file actually read (the spooled copy for standard input). */
    Path path() {
        return path;
    }

    private static Path pathOf(String text) {
        if (text == null || text.isEmpty()) {
            throw new StriaException("no genome file given");
        }
        try {
            return Path.of(text);
        } catch (InvalidPathException e) {
            throw new StriaException(text + ": not a valid file name", e);
        }
    }

    private static void checkFile(Path path, String display) {
        if (Files.isDirectory(path)) {
            throw new StriaException(display + ": is a directory, not a FASTA file");
        }
        if (!Files.exists(path)) {
            throw new StriaException(display + ": no such file");
        }
        if (!Files.isReadable(path)) {
            throw new StriaException(display + ": cannot read (permission denied)");
        }
        try {
            if (Files.size(path) == 0) {
                throw new StriaException(display + ": file is empty");
            }
        } catch (IOException e) {
            throw new StriaException(display + ": cannot read (" + InputCursor.oneLine(e) + ")", e);
        }
    }

    private static void checkTermination(Path path, String display, Consumer<String> warn) {
        BlockCompressedInputStream.FileTermination end;
        try {
            end = BlockCompressedInputStream.checkTermination(path);
        } catch (IOException | RuntimeException e) {
            throw new StriaException(display + ": truncated or corrupt BGZF data (" + InputCursor.oneLine(e) + ")", e);
        }
        switch (end) {
            case DEFECTIVE -> throw new StriaException(display + ": truncated or corrupt BGZF data (the last block is incomplete)");
            case HAS_HEALTHY_LAST_BLOCK -> warn.accept(display + ": BGZF file has no end-of-file marker; it may be truncated");
            default -> { }
        }
    }

    /** Copies standard input ({@code source == null}) or a pipe to a temporary file deleted at exit. */
    private static Path spool(Path source, String display) {
        Path tmp = null;
        try {
            tmp = Files.createTempFile(TempDir.directory(), "stria-input-", ".fa");
            tmp.toFile().deleteOnExit();
            if (source == null) {
                Files.copy(System.in, tmp, StandardCopyOption.REPLACE_EXISTING);
            } else {
                try (InputStream in = Files.newInputStream(source)) {
                    Files.copy(in, tmp, StandardCopyOption.REPLACE_EXISTING);
                }
            }
            return tmp;
        } catch (IOException e) {
            deleteQuietly(tmp);
            throw new StriaException(display + ": cannot copy the input to a temporary file " + tmp + " ("
                    + InputCursor.oneLine(e) + "); set TMPDIR to a directory with more room", e);
        }
    }

    private static void deleteQuietly(Path p) {
        if (p != null) {
            try {
                Files.deleteIfExists(p);
            } catch (IOException e) {
                // deleteOnExit still covers it
            }
        }
    }
}
