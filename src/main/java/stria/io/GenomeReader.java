package stria.io;

import htsjdk.samtools.reference.FastaSequenceFile;
import htsjdk.samtools.reference.ReferenceSequence;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import stria.StriaException;

/** Temporary minimal reader (to be replaced by the full one). */
public final class GenomeReader implements AutoCloseable {
    private final Path path;
    private final String display;
    private List<ContigInfo> contigs;
    private final List<byte[]> seqs = new ArrayList<>();

    private GenomeReader(Path path, String display) {
        this.path = path;
        this.display = display;
    }

    public static GenomeReader open(String pathOrDash, Consumer<String> warn) {
        Path p = Path.of(pathOrDash);
        if (!Files.isReadable(p)) {
            throw new StriaException("cannot read " + pathOrDash + ": no such file");
        }
        return new GenomeReader(p, pathOrDash);
    }

    public String displayName() {
        return display;
    }

    public List<ContigInfo> contigs() {
        if (contigs == null) {
            contigs = new ArrayList<>();
            try (FastaSequenceFile f = new FastaSequenceFile(path, true)) {
                ReferenceSequence r;
                while ((r = f.nextSequence()) != null) {
                    if (r.length() > 0) {
                        contigs.add(new ContigInfo(contigs.size(), r.getName(), r.length()));
                        seqs.add(r.getBases());
                    }
                }
            }
        }
        return contigs;
    }

    public byte[] sequence(ContigInfo c) {
        contigs();
        return seqs.get(c.index());
    }

    @Override
    public void close() {
    }
}
