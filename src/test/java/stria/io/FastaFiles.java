package stria.io;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
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
import java.util.zip.GZIPOutputStream;

import htsjdk.samtools.reference.FastaSequenceIndexCreator;
import htsjdk.samtools.util.BlockCompressedOutputStream;
import htsjdk.samtools.util.GZIIndex;

/** Writes invented genomes in the forms users have them in, and reads them back in one call. */
final class FastaFiles {
    private FastaFiles() {
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
