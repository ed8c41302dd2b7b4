package stria.io;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;

import htsjdk.samtools.util.BlockCompressedInputStream;

/**
 * How a file is stored: plain, gzip or BGZF. Decided from its first bytes, never from its name; genome files
 * and result files are told apart the same way.
 */
public enum Compression {
    PLAIN("plain text"), GZIP("gzip"), BGZF("BGZF");

    final String label;

    Compression(String label) {
        this.label = label;
    }

    /**
     * The name of a compression stria does not read, from the magic bytes of the file, or null. Naming it
     * turns "binary data" into a message that says what to do.
     */
    static String foreign(Path path) throws IOException {
        byte[] head = new byte[6];
        int n;
        try (InputStream in = Files.newInputStream(path)) {
            n = in.readNBytes(head, 0, head.length);
        }
        String h = new String(head, 0, n, java.nio.charset.StandardCharsets.ISO_8859_1);
        if (h.startsWith("BZh")) {
            return "bzip2";
        }
        if (h.startsWith("\u00fd7zXZ\u0000")) {
            return "xz";
        }
        if (h.startsWith("\u0028\u00b5\u002f\u00fd")) {
            return "zstd";
        }
        if (h.startsWith("PK\u0003\u0004")) {
            return "zip";
        }
        return null;
    }

    static Compression detect(Path path) throws IOException {
        try (BufferedInputStream in = new BufferedInputStream(Files.newInputStream(path), 1 << 16)) {
            return of(in);
        }
    }

    /** The compression of what {@code in} holds, read from its first bytes; {@code in} is left where it was. */
    public static Compression of(BufferedInputStream in) throws IOException {
        in.mark(64);
        int b0 = in.read();
        int b1 = in.read();
        in.reset();
        if (b0 != 0x1f || b1 != 0x8b) {
            return PLAIN;
        }
        // a BGZF file is also a valid multi-member gzip file; only the extra field tells them apart
        return BlockCompressedInputStream.isValidFile(in) ? BGZF : GZIP;
    }
}
