package stria.io;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;

import htsjdk.samtools.util.BlockCompressedInputStream;

/** How a genome file is stored. Decided from its first bytes, never from its name. */
enum Compression {
    PLAIN("plain text"), GZIP("gzip"), BGZF("BGZF");

    final String label;

    Compression(String label) {
        this.label = label;
    }

    static Compression detect(Path path) throws IOException {
        try (InputStream in = new BufferedInputStream(Files.newInputStream(path), 1 << 16)) {
            in.mark(64);
            int b0 = in.read();
            int b1 = in.read();
            if (b0 != 0x1f || b1 != 0x8b) {
                return PLAIN;
            }
            in.reset();
            // a BGZF file is also a valid multi-member gzip file; only the extra field tells them apart
            return BlockCompressedInputStream.isValidFile(in) ? BGZF : GZIP;
        }
    }
}
