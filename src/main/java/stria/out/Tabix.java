package stria.out;

import htsjdk.samtools.util.BlockCompressedInputStream;
import htsjdk.tribble.SimpleFeature;
import htsjdk.tribble.bed.BEDCodec;
import htsjdk.tribble.index.Index;
import htsjdk.tribble.index.IndexFactory;
import htsjdk.tribble.index.tabix.TabixFormat;
import htsjdk.tribble.index.tabix.TabixIndex;
import htsjdk.tribble.index.tabix.TabixIndexCreator;
import java.io.IOException;
import java.nio.file.Path;
import stria.StriaException;

/** Writes a tabix (.tbi) index for a BGZF-compressed BED or GFF3 file (tabix: Li 2011), through htsjdk. */
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

    /** As {@link #indexOnCommit} for a BGZF GFF3 output ({@code .gff.gz}). */
    public static void indexGffOnCommit(AtomicOutputs outputs, String gffPath) {
        if (gffPath.equals("-") || !AtomicOutputs.isBgzf(gffPath)) {
            return;
        }
        Path index = outputs.companion(gffPath, gffPath + ".tbi");
        outputs.afterClose(gffPath, () -> indexGff(outputs.tempPath(gffPath), index, gffPath));
    }

    /**
     * Indexes GFF3 lines by column 1 and the 1-based columns 4 and 5 (the preset tabix uses for GFF). The
     * library's GFF3 codec cannot feed its index factory, so the lines are read here with their virtual
     * offsets and handed to the library's index builder.
     */
    static void indexGff(Path bgzfGff, Path indexOut, String displayName) {
        try (BlockCompressedInputStream in = new BlockCompressedInputStream(bgzfGff.toFile())) {
            TabixIndexCreator creator = new TabixIndexCreator(TabixFormat.GFF);
            long at = in.getFilePointer();
            String line;
            while ((line = in.readLine()) != null) {
                if (!line.isEmpty() && line.charAt(0) != '#') {
                    String[] f = line.split("\t", 6);
                    creator.addFeature(new SimpleFeature(f[0], Integer.parseInt(f[3]), Integer.parseInt(f[4])), at);
                }
                at = in.getFilePointer();
            }
            Index index = creator.finalizeIndex(at);
            index.write(indexOut);
        } catch (RuntimeException | IOException ex) {
            throw new StriaException("cannot index " + displayName + ": " + ex.getMessage());
        }
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
