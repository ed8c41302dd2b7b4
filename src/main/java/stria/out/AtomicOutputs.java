package stria.out;

import htsjdk.samtools.util.BlockCompressedOutputStream;
import java.io.BufferedOutputStream;
import java.io.FilterOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import stria.StriaException;

/**
 * The output files of one command, written all-or-nothing. Each file is written under a temporary name in
 * its own directory and renamed into place only by {@link #commit()}; {@link #close()} without a commit,
 * an exception, SIGINT or SIGTERM removes every temporary file, so a failed or interrupted run leaves no
 * partial output and an existing file at an output path is left as it was.
 *
 * <p>A path of {@code -} means standard output, which is never closed. A path ending in {@code .gz} is
 * written as BGZF (block gzip), the compression tabix and {@code samtools faidx} can index.
 */
public final class AtomicOutputs implements AutoCloseable {
    private static final Set<Path> LIVE_TEMPS = new LinkedHashSet<>();
    private static final java.util.concurrent.atomic.AtomicInteger SERIAL = new java.util.concurrent.atomic.AtomicInteger();

    static {
        Runtime.getRuntime().addShutdownHook(new Thread(AtomicOutputs::deleteLiveTemps, "stria-cleanup"));
    }

    private final List<Entry> entries = new ArrayList<>();
    private boolean committed;

    private static final class Entry {
        final Path target;
        final Path temp;
        OutputStream stream;
        Runnable afterClose; // e.g. index building on the finished temporary file
        final List<Entry> companions = new ArrayList<>();

        Entry(Path target, Path temp) {
            this.target = target;
            this.temp = temp;
        }
    }

    /** Whether a path names a BGZF output. */
    public static boolean isBgzf(String path) {
        return path.endsWith(".gz") || path.endsWith(".bgz");
    }

    /**
     * Opens an output. {@code -} gives standard output; other paths give a buffered stream on a temporary
     * file beside the target (BGZF-compressed when the name ends in .gz).
     */
    public OutputStream open(String path) {
        if (path.equals("-")) {
            return new FilterOutputStream(new BufferedOutputStream(System.out, 1 << 16)) {
                @Override
                public void write(byte[] b, int off, int len) throws IOException {
                    out.write(b, off, len);
                }

                @Override
                public void close() throws IOException {
                    flush();
                }
            };
        }
        Entry e = newEntry(Path.of(path));
        try {
            OutputStream raw = new BufferedOutputStream(Files.newOutputStream(e.temp), 1 << 16);
            e.stream = isBgzf(path) ? new BlockCompressedOutputStream(raw, (Path) null) : raw;
        } catch (IOException ex) {
            throw StriaException.io("cannot write " + path, ex);
        }
        return e.stream;
    }

    /**
     * Reserves a companion file (an index) for an output opened before: returns the temporary path to write
     * it to; it is renamed to {@code target} together with the main output.
     */
    public Path companion(String mainPath, String target) {
        Entry main = find(Path.of(mainPath));
        Entry c = newEntry(Path.of(target));
        entries.remove(c);
        main.companions.add(c);
        return c.temp;
    }

    /** Runs {@code action} after the output has been closed, before it is renamed (used for indexes). */
    public void afterClose(String path, Runnable action) {
        find(Path.of(path)).afterClose = action;
    }

    /** The temporary file an output is being written to (for post-close actions such as indexing). */
    public Path tempPath(String path) {
        return find(Path.of(path)).temp;
    }

    /** Closes every output, runs the post-close actions and renames all temporary files into place. */
    public void commit() {
        for (Entry e : entries) {
            closeQuietly(e, true);
        }
        for (Entry e : entries) {
            if (e.afterClose != null) {
                e.afterClose.run();
            }
        }
        for (Entry e : entries) {
            move(e);
            for (Entry c : e.companions) {
                move(c);
            }
        }
        committed = true;
        synchronized (LIVE_TEMPS) {
            for (Entry e : entries) {
                LIVE_TEMPS.remove(e.temp);
                e.companions.forEach(c -> LIVE_TEMPS.remove(c.temp));
            }
        }
    }

    /** Removes temporary files unless {@link #commit()} succeeded. */
    @Override
    public void close() {
        if (committed) {
            return;
        }
        for (Entry e : entries) {
            closeQuietly(e, false);
            deleteQuietly(e.temp);
            for (Entry c : e.companions) {
                deleteQuietly(c.temp);
            }
        }
        synchronized (LIVE_TEMPS) {
            for (Entry e : entries) {
                LIVE_TEMPS.remove(e.temp);
                e.companions.forEach(c -> LIVE_TEMPS.remove(c.temp));
            }
        }
    }

    private Entry newEntry(Path target) {
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        if (dir == null || !Files.isDirectory(dir)) {
            throw new StriaException("cannot write " + target + ": directory " + dir + " does not exist");
        }
        if (Files.isDirectory(abs)) {
            throw new StriaException("cannot write " + target + ": it is a directory");
        }
        for (Entry e : entries) {
            if (e.target.equals(abs)) {
                throw new StriaException("output " + target + " is named twice");
            }
        }
        // the name keeps its extension: readers such as the tabix indexer choose the decompression by it
        Path temp = dir.resolve(".stria-tmp-" + ProcessHandle.current().pid() + "-" + SERIAL.incrementAndGet() + "-"
                + abs.getFileName());
        synchronized (LIVE_TEMPS) {
            LIVE_TEMPS.add(temp);
        }
        Entry e = new Entry(abs, temp);
        entries.add(e);
        return e;
    }

    private Entry find(Path target) {
        Path abs = target.toAbsolutePath();
        for (Entry e : entries) {
            if (e.target.equals(abs)) {
                return e;
            }
        }
        throw new IllegalStateException("not an open output: " + target);
    }

    private static void closeQuietly(Entry e, boolean report) {
        if (e.stream == null) {
            return;
        }
        try {
            e.stream.close();
        } catch (IOException | htsjdk.samtools.util.RuntimeIOException ex) {
            if (report) {
                throw StriaException.io("cannot write " + e.target, ex);
            }
        } finally {
            e.stream = null;
        }
    }

    private static void move(Entry e) {
        try {
            try {
                Files.move(e.temp, e.target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException ex) {
                Files.move(e.temp, e.target, StandardCopyOption.REPLACE_EXISTING);
            }
        } catch (IOException ex) {
            throw StriaException.io("cannot write " + e.target, ex);
        }
    }

    private static void deleteQuietly(Path p) {
        try {
            Files.deleteIfExists(p);
        } catch (IOException ignored) {
            // best effort: the process is failing already
        }
    }

    private static void deleteLiveTemps() {
        List<Path> left;
        synchronized (LIVE_TEMPS) {
            left = new ArrayList<>(LIVE_TEMPS);
        }
        left.forEach(AtomicOutputs::deleteQuietly);
    }

    /**
     * Refuses output paths that name an input (or would, as the index written beside a BGZF output): writing
     * there would destroy the genome or result being read. Standard streams ({@code -}) are never compared.
     *
     * @throws StriaException naming the output and the input
     */
    public static void refuseInputs(List<String> outputs, List<String> inputs) {
        List<String> outs = new ArrayList<>();
        for (String o : outputs) {
            if (o != null && !o.equals("-")) {
                outs.add(o);
                outs.add(o + ".tbi");
            }
        }
        for (String in : inputs) {
            if (in.equals("-")) {
                continue;
            }
            Path ip = Path.of(in);
            for (String o : outs) {
                Path op = Path.of(o);
                boolean same = op.toAbsolutePath().normalize().equals(ip.toAbsolutePath().normalize());
                try {
                    same = same || (Files.exists(op) && Files.isSameFile(op, ip));
                } catch (IOException ignored) {
                    // cannot tell: the path comparison stands
                }
                if (same) {
                    throw new StriaException("output " + o + " is the input " + in + ": choose another output name");
                }
            }
        }
    }
}
