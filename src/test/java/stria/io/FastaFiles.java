package stria.io;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.function.Function;
import java.util.zip.GZIPOutputStream;

import htsjdk.samtools.reference.FastaSequenceIndexCreator;
import htsjdk.samtools.util.BlockCompressedOutputStream;
import htsjdk.samtools.util.GZIIndex;

/** Writes invented genomes in the forms users have them in, and reads them back in one call. */
final class FastaFiles {
    private FastaFiles() {
    }

    /** How a genome reaches the reader; the forms with a .fai are read without a pre-pass. */
    enum Form {
        PLAIN, PLAIN_FAI, GZIP, BGZF, BGZF_FAI, BGZF_GZI, BGZF_FAI_GZI, STDIN;

        boolean fai() {
            return this == PLAIN_FAI || this == BGZF_FAI || this == BGZF_FAI_GZI;
        }
    }

    /**
     * The scratch directory of a test class: files in it get numbered names, so that every try of a
     * property has its own; {@link #delete} removes it all after the class.
     */
    static final class Scratch {
        private final Path dir;
        private int counter;

        Scratch(String prefix) {
            try {
                dir = Files.createTempDirectory(prefix);
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        }

        /** A new name in the directory: {@code stem}, a number and {@code suffix}. */
        Path file(String stem, String suffix) {
            return dir.resolve(stem + (counter++) + suffix);
        }

        /** {@link FastaFiles#store} under a new name. */
        Path store(byte[] text, Form form) {
            return FastaFiles.store(file("g", ""), text, form);
        }

        void delete() {
            deleteTree(dir);
        }
    }

    /** Removes a scratch directory of a test class and everything in it. */
    static void deleteTree(Path dir) {
        try (java.util.stream.Stream<Path> s = Files.walk(dir)) {
            s.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    /** Bases as text, for comparisons that print readably. */
    static String text(byte[] b, int off, int n) {
        return new String(b, off, n, StandardCharsets.ISO_8859_1);
    }

    /**
     * Writes the text in a form, named {@code stem} with ".fa" or ".fa.gz" added, with the indexes the form
     * has; for {@link Form#STDIN} the file holds what standard input will carry.
     */
    static Path store(Path stem, byte[] text, Form form) {
        boolean compressed = form != Form.PLAIN && form != Form.PLAIN_FAI && form != Form.STDIN;
        Path p = stem.resolveSibling(stem.getFileName() + (compressed ? ".fa.gz" : ".fa"));
        switch (form) {
            case GZIP -> write(p, gzip(text));
            case BGZF, BGZF_FAI, BGZF_GZI, BGZF_FAI_GZI -> writeBgzf(p, text);
            default -> write(p, text);
        }
        if (form.fai()) {
            faidxLikeSamtools(p, text);
        }
        if (form == Form.BGZF_GZI || form == Form.BGZF_FAI_GZI) {
            gzindex(p);
        }
        return p;
    }

    /** Opens a stored genome, through standard input for {@link Form#STDIN}, and applies {@code use}. */
    static <T> T withReader(Path p, Form form, Function<GenomeReader, T> use) {
        if (form != Form.STDIN) {
            try (GenomeReader r = GenomeReader.open(p.toString(), w -> { })) {
                return use.apply(r);
            }
        }
        InputStream saved = System.in;
        try {
            System.setIn(new ByteArrayInputStream(Files.readAllBytes(p)));
            try (GenomeReader r = GenomeReader.open("-", w -> { })) {
                return use.apply(r);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } finally {
            System.setIn(saved);
        }
    }

    /**
     * The next piece size: often 1, often about a line (so that pieces start and end on both sides of
     * line ends), sometimes anything up to what is left.
     */
    static int piece(Random rnd, int lineWidth, int left) {
        int n = switch (rnd.nextInt(4)) {
            case 0 -> 1;
            case 1, 2 -> 1 + rnd.nextInt(2 * lineWidth + 3);
            default -> 1 + rnd.nextInt(left);
        };
        return Math.min(n, left);
    }

    /** A record of an invented genome. */
    record Rec(String name, String description, String seq) {
    }

    /** Random letters, mostly ACGT with some N and other IUPAC codes. */
    static String letters(Random rnd, int n) {
        String pool = "ACGTACGTACGTACGTACGTACGTACGTNRYSWKMBDHV";
        StringBuilder sb = new StringBuilder(n);
        for (int i = 0; i < n; i++) {
            sb.append(pool.charAt(rnd.nextInt(pool.length())));
        }
        return sb.toString();
    }

    /** The genome most tests start from: four records of different sizes. */
    /**
     * Records "first" ({@code firstLength} random bases) and "second" (1,300,000): together larger than the
     * reader's buffer, so reading the first record again goes back to the file.
     */
    static List<Rec> twoLongRecords(Random rnd, int firstLength) {
        return List.of(new Rec("first", "", letters(rnd, firstLength)), new Rec("second", "", letters(rnd, 1_300_000)));
    }

    static List<Rec> sample() {
        Random rnd = new Random(7);
        return List.of(new Rec("ctg1", "first invented contig", letters(rnd, 250)),
                new Rec("ctg2", "", letters(rnd, 61)),
                new Rec("ctg_3.x", "len=1", letters(rnd, 1)),
                new Rec("ctg4", "", letters(rnd, 1000)));
    }

    /** FASTA text with a fixed line width (0 = each sequence on one line) and a line end. */
    static String format(List<Rec> recs, int width, String eol, boolean finalEol) {
        StringBuilder sb = new StringBuilder();
        for (Rec r : recs) {
            sb.append('>').append(r.name());
            if (!r.description().isEmpty()) {
                sb.append(' ').append(r.description());
            }
            sb.append(eol);
            String s = r.seq();
            int w = width == 0 ? Math.max(1, s.length()) : width;
            for (int i = 0; i < s.length(); i += w) {
                sb.append(s, i, Math.min(s.length(), i + w)).append(eol);
            }
        }
        if (!finalEol && sb.toString().endsWith(eol)) {
            sb.setLength(sb.length() - eol.length());
        }
        return sb.toString();
    }

    static String format(List<Rec> recs) {
        return format(recs, 60, "\n", true);
    }

    static byte[] bytes(String s) {
        return s.getBytes(StandardCharsets.ISO_8859_1);
    }

    static byte[] gzip(byte[] data) {
        ByteArrayOutputStream bos = new ByteArrayOutputStream();
        try (OutputStream out = new GZIPOutputStream(bos)) {
            out.write(data);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return bos.toByteArray();
    }

    static Path write(Path file, byte[] data) {
        try {
            Files.write(file, data);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return file;
    }

    static Path writeBgzf(Path file, byte[] data) {
        try (BlockCompressedOutputStream out = new BlockCompressedOutputStream(file.toFile())) {
            out.write(data);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return file;
    }

    /** BGZF bytes in memory, many small blocks so that indexes have entries worth checking. */
    static byte[] bgzf(byte[] data, Path scratch) {
        writeBgzf(scratch, data);
        try {
            return Files.readAllBytes(scratch);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static void faidx(Path fasta) {
        try {
            FastaSequenceIndexCreator.create(fasta, true);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * Writes a .fai for {@code text} the way samtools does: records without sequence are left out, line
     * widths are taken from each record's first line. Needed where htsjdk's indexer refuses the input.
     */
    static void faidxLikeSamtools(Path fasta, byte[] text) {
        StringBuilder fai = new StringBuilder();
        int i = 0;
        while (i < text.length) {
            int eol = indexOf(text, (byte) '\n', i);
            if (text[i] != '>') {
                i = eol + 1;
                continue;
            }
            int nameEnd = i + 1;
            while (nameEnd < eol && text[nameEnd] != ' ' && text[nameEnd] != '\t' && text[nameEnd] != '\r') {
                nameEnd++;
            }
            String name = new String(text, i + 1, nameEnd - i - 1, StandardCharsets.ISO_8859_1);
            long offset = Math.min(eol + 1, text.length);
            long length = 0;
            int bpl = -1;
            int bytesPerLine = -1;
            i = eol + 1;
            while (i < text.length && text[i] != '>') {
                int end = indexOf(text, (byte) '\n', i);
                int letters = end - i - (end > i && text[end - 1] == '\r' ? 1 : 0);
                if (bpl < 0) {
                    bpl = letters;
                    bytesPerLine = end < text.length ? end + 1 - i : letters + 1;
                }
                length += letters;
                i = end + 1;
            }
            if (length > 0) {
                fai.append(name).append('\t').append(length).append('\t').append(offset).append('\t').append(bpl)
                        .append('\t').append(bytesPerLine).append('\n');
            }
        }
        write(fasta.resolveSibling(fasta.getFileName() + ".fai"), bytes(fai.toString()));
    }

    private static int indexOf(byte[] a, byte b, int from) {
        for (int i = from; i < a.length; i++) {
            if (a[i] == b) {
                return i;
            }
        }
        return a.length;
    }

    static void gzindex(Path bgzf) {
        try {
            GZIIndex.createIndex(bgzf, true);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** Every contig of a file, name to sequence, read in file order. */
    static Map<String, String> read(Path file, List<String> warnings) {
        return read(file.toString(), warnings);
    }

    static Map<String, String> read(String pathOrDash, List<String> warnings) {
        Map<String, String> out = new LinkedHashMap<>();
        try (GenomeReader r = GenomeReader.open(pathOrDash, warnings::add)) {
            for (ContigInfo c : r.contigs()) {
                byte[] s = r.sequence(c);
                if (s.length != c.length()) {
                    throw new AssertionError("length " + s.length + " != " + c.length());
                }
                out.put(c.name(), new String(s, StandardCharsets.ISO_8859_1));
            }
        }
        return out;
    }

    static Map<String, String> read(Path file) {
        return read(file, new ArrayList<>());
    }

    static Map<String, String> expected(List<Rec> recs) {
        Map<String, String> m = new LinkedHashMap<>();
        for (Rec r : recs) {
            if (!r.seq().isEmpty()) {
                m.put(r.name(), r.seq());
            }
        }
        return m;
    }
}
