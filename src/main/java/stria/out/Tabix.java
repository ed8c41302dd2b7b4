package stria.out;

import htsjdk.samtools.util.BlockCompressedInputStream;
import htsjdk.tribble.index.IndexFactory;
import htsjdk.tribble.index.tabix.TabixFormat;
import htsjdk.tribble.index.tabix.TabixIndex;
import htsjdk.tribble.bed.BEDCodec;
import java.io.IOException;
import java.nio.file.Path;
import stria.StriaException;

/** Writes a tabix (.tbi) index for a BGZF-compressed BED file (tabix: Li 2011), through htsjdk. */
public final class Tabix {
    private Tabix() {
    }

    public static void indexBed(Path bgzfBed, Path indexOut, String displayName) {
        try {
            TabixIndex index = IndexFactory.createTabixIndex(bgzfBed.toFile(), new BEDCodec(), TabixFormat.BED, null);
            index.write(indexOut);
        } catch (RuntimeException | IOException ex) {
            throw new StriaException("cannot index " + displayName + ": " + ex.getMessage());
        }
    }

    /** Whether a file starts with a BGZF block (so it is block-gzipped, not plain gzip). */
    public static boolean isBgzf(Path p) {
        try (var in = java.nio.file.Files.newInputStream(p)) {
            return BlockCompressedInputStream.isValidFile(new java.io.BufferedInputStream(in));
        } catch (IOException ex) {
            return false;
        }
    }
}
