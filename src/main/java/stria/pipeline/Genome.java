package stria.pipeline;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import stria.StriaException;
import stria.io.ContigInfo;
import stria.io.GenomeReader;

/**
 * The genome of one scan: the contigs of all its inputs, in input order, and where the bases of each come
 * from. Contig names are unique across the inputs, since outputs name loci by contig alone. Closing it
 * closes the files it opened.
 */
public final class Genome implements AutoCloseable {
    private final List<GenomeReader> readers;
    private final List<ContigInfo> contigs;
    private final List<ScanUnit.Source> sources;
    private final Map<String, Integer> index = new HashMap<>();

    private Genome(List<GenomeReader> readers, List<ContigInfo> contigs, List<ScanUnit.Source> sources) {
        this.readers = List.copyOf(readers);
        this.contigs = List.copyOf(contigs);
        this.sources = List.copyOf(sources);
        for (int i = 0; i < contigs.size(); i++) {
            index.put(contigs.get(i).name(), i);
        }
    }

    /**
     * Opens genome files ({@code -} for standard input) in order.
     *
     * @param warn receives one-line warnings of the readers
     * @throws StriaException when a file cannot be read, or a contig name appears in two of them
     */
    public static Genome open(List<String> paths, Consumer<String> warn) {
        List<GenomeReader> readers = new ArrayList<>();
        List<ContigInfo> contigs = new ArrayList<>();
        List<ScanUnit.Source> sources = new ArrayList<>();
        Map<String, String> seen = new HashMap<>();
        try {
            for (String path : paths) {
                GenomeReader r = GenomeReader.open(path, warn);
                readers.add(r);
                for (ContigInfo c : r.contigs()) {
                    String prev = seen.put(c.name(), r.displayName());
                    if (prev != null) {
                        throw new StriaException("contig name " + c.name() + " appears in both " + prev + " and "
                                + r.displayName());
                    }
                    contigs.add(c);
                    sources.add(r::stream);
                }
            }
        } catch (RuntimeException e) {
            closeAll(readers);
            throw e;
        }
        return new Genome(readers, contigs, sources);
    }

    /** A genome held in memory: {@code sequences.get(i)} is the ASCII sequence of {@code names.get(i)}. */
    public static Genome of(List<String> names, List<byte[]> sequences) {
        List<ContigInfo> contigs = new ArrayList<>();
        List<ScanUnit.Source> sources = new ArrayList<>();
        for (int i = 0; i < names.size(); i++) {
            byte[] seq = sequences.get(i);
            contigs.add(new ContigInfo(names.get(i), seq.length));
            sources.add(ScanUnit.Source.of(c -> seq));
        }
        Genome g = new Genome(List.of(), contigs, sources);
        if (g.index.size() != contigs.size()) {
            throw new IllegalArgumentException("contig names repeat: " + names);
        }
        return g;
    }

    /** Every contig, in input order. */
    public List<ContigInfo> contigs() {
        return contigs;
    }

    /** The bases of contig {@code i} (in input order), front to back, checked as they are read. */
    public stria.io.BaseStream stream(int i) {
        return sources.get(i).stream(contigs.get(i), 0);
    }

    /**
     * Reads contig {@code i} whole, as a scan would (an array up to 4 Mb, else a temporary file that is
     * gone when this returns), and hands it to {@code use}, for random access to its bases.
     */
    public void withContig(int i, Consumer<stria.io.ContigBytes> use) {
        ContigInfo c = contigs.get(i);
        try (ContigStore store = ContigStore.open(c, 0, c.length(), stream(i), GenomeScan.IN_MEMORY_MAX,
                Geometry.COMPOSITION_BLOCK)) {
            store.fill(c.length());
            use.accept(store);
        }
    }

    /** The unit that reports the loci starting in {@code [from, to)} of {@code contig}. */
    ScanUnit unit(String contig, int from, int to) {
        Integer i = index.get(contig);
        if (i == null) {
            throw new IllegalArgumentException("no contig " + contig + " in the genome");
        }
        return new ScanUnit(sources.get(i), contigs.get(i), from, to);
    }

    @Override
    public void close() {
        closeAll(readers);
    }

    private static void closeAll(List<GenomeReader> readers) {
        for (GenomeReader r : readers) {
            try {
                r.close();
            } catch (RuntimeException ignored) {
                // closing a reader cannot lose results
            }
        }
    }
}
