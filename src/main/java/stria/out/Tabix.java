package stria.out;

import htsjdk.tribble.bed.BEDCodec;
import htsjdk.tribble.index.IndexFactory;
import htsjdk.tribble.index.tabix.TabixFormat;
import htsjdk.tribble.index.tabix.TabixIndex;
import java.io.IOException;
import java.nio.file.Path;
import stria.StriaException;

/** Writes a tabix (.tbi) index for a BGZF-compressed BED file (tabix: Li 2011), through htsjdk. */
public final class Tabix {
    private Tabix() {
    }

    /**
     * When {@code bedPath} is a BGZF output of {@code outputs}, indexes it once it is complete and commits the
     * index ({@code bedPath.tbi}) with it; does nothing for plain files and for outputs not written as files (standard output, a FIFO, a device).
     */
    public static void indexOnCommit(AtomicOutputs outputs, String bedPath) {
        if (!AtomicOutputs.isBgzf(bedPath) || !outputs.isFile(bedPath)) {
            return;
        }
        Path index = outputs.companion(bedPath, bedPath + ".tbi");
        outputs.afterClose(bedPath, () -> indexBed(outputs.tempPath(bedPath), index, bedPath));
    }

    static void indexBed(Path bgzfBed, Path indexOut, String displayName) {
        try {
            TabixIndex index = IndexFactory.createTabixIndex(bgzfBed.toFile(), new BEDCodec(), TabixFormat.BED, null);
            index.write(indexOut);
        } catch (RuntimeException | IOException ex) {
            throw new StriaException("cannot index " + displayName + ": " + ex.getMessage());
        }
    }
}
