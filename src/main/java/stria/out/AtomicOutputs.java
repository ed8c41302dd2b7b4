package stria.out;

import htsjdk.samtools.util.BlockCompressedOutputStream;
import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import stria.StriaException;

/**
 * The output files of one command, written all-or-nothing, and the one registry of its outputs. Each file is
 * written under a temporary name in its own directory and renamed into place only by {@link #commit()};
 * {@link #close()} without a commit, an exception, SIGINT or SIGTERM removes every temporary file, so a
 * failed or interrupted run leaves no partial output and an existing file at an output path is left as it
 * was.
 *
 * <p>Every output a command opens here (and every companion such as a {@code .tbi}) is checked against the
 * others and against the command's inputs and their index files, by file identity rather than spelling
 * ({@code o.bed}, {@code ./o.bed}, {@code d/../o.bed}, a symbolic or hard link): a new output gets the checks
 * without a line of its own.
 *
 * <p>A path of {@code -} (or {@code /dev/stdout}) means standard output, which is never closed and whose
 * write errors are reported ({@link StandardOutput}). An existing path that is not a regular file (a FIFO, a
 * device such as {@code /dev/null}) or lies under {@code /dev} or {@code /proc} is written straight to:
 * renaming a file over it would replace the node its reader waits on. A path ending in {@code .gz} is
 * written as BGZF (block gzip), the compression tabix and {@code samtools faidx} can index.
 */
public final class AtomicOutputs implements AutoCloseable {
    private static final Set<Path> LIVE_TEMPS = new LinkedHashSet<>();
    private static final java.util.concurrent.atomic.AtomicInteger SERIAL = new java.util.concurrent.atomic.AtomicInteger();

    static {
        Runtime.getRuntime().addShutdownHook(new Thread(AtomicOutputs::deleteLiveTemps, "stria-cleanup"));
    }

    /** Index files a tool keeps beside an input: writing one of these would corrupt the input's reading. */
    private static final List<String> INPUT_COMPANIONS = List.of("", ".fai", ".gzi", ".tbi", ".csi");
    private static final Set<String> STDOUT_SPELLINGS = Set.of("-", "/dev/stdout", "/dev/fd/1", "/proc/self/fd/1");

    private final List<Entry> entries = new ArrayList<>();
    /** Every output and companion path named so far, as typed, with the input paths checked against. */
    private final List<String> named = new ArrayList<>();
    private final List<String> inputs;
    private String stdout;
    private boolean committed;

    /** Outputs checked against each other only. */
    public AtomicOutputs() {
        this(List.of());
    }

    /**
     * Outputs checked against each other and against {@code inputs} (files read by the command, {@code -}
     * for standard input) and the index files beside them ({@code .fai}, {@code .gzi}, {@code .tbi}).
     */
    public AtomicOutputs(List<String> inputs) {
        this.inputs = List.copyOf(inputs);
    }

    private static final class Entry {
        final Path target;
        final Path temp;
        OutputStream stream;
        Runnable afterClose; // e.g. index building on the finished temporary file
        final List<Entry> companions = new ArrayList<>();

        /** {@code temp} null: written straight to {@code target} (a FIFO, a device). */
        Entry(Path target, Path temp) {
            this.target = target;
            this.temp = temp;
        }
    }

    /** Whether a path names standard output. */
    public static boolean isStdout(String path) {
        return STDOUT_SPELLINGS.contains(path);
    }

    /** How messages name an output: the path as typed, or "standard output". */
    public static String displayName(String path) {
        return isStdout(path) ? StandardOutput.NAME : path;
    }

    /** Whether a path names a BGZF output. */
    public static boolean isBgzf(String path) {
        return path.endsWith(".gz") || path.endsWith(".bgz");
    }

    /**
     * Opens an output. {@code -} gives standard output; other paths give a buffered stream on a temporary
     * file beside the target (BGZF-compressed when the name ends in .gz), or on the target itself when it is
     * a FIFO or a device.
     *
     * @throws StriaException when the path names an input, its index, or an output opened before
     */
    public OutputStream open(String path) {
        if (isStdout(path)) {
            if (stdout != null) {
                throw new StriaException("outputs " + stdout + " and " + path + " both write to standard output:"
                        + " name a file for one of them");
            }
            stdout = path;
            return StandardOutput.open();
        }
        Entry e = newEntry(path);
        try {
            OutputStream raw = new BufferedOutputStream(e.temp == null
                    ? Files.newOutputStream(e.target, StandardOpenOption.WRITE)
                    : Files.newOutputStream(e.temp), 1 << 16);
            e.stream = isBgzf(path) ? new BlockCompressedOutputStream(raw, (Path) null) : raw;
        } catch (IOException ex) {
            throw StriaException.io("cannot write " + path, ex);
        }
        return e.stream;
    }

    /**
     * Whether {@code path}, opened before, is written to a temporary file renamed into place on commit (false
     * for standard output, FIFOs and devices: nothing can be built beside them, such as an index).
     */
    public boolean isFile(String path) {
        if (isStdout(path)) {
            return false;
        }
        return find(Path.of(path)).temp != null;
    }

    /**
     * Reserves a companion file (an index) for an output opened before: returns the temporary path to write
     * it to; it is renamed to {@code target} together with the main output.
     */
    public Path companion(String mainPath, String target) {
        Entry main = find(Path.of(mainPath));
        Entry c = newEntry(target);
        if (c.temp == null) {
            throw new StriaException("cannot write " + target + ": it is not a regular file");
        }
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
            if (e.temp != null) {
                move(e);
            }
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
            if (e.temp != null) {
                deleteQuietly(e.temp);
            }
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

    private Entry newEntry(String path) {
        Path target = Path.of(path);
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        if (dir == null || !Files.isDirectory(dir)) {
            throw new StriaException("cannot write " + target + ": directory " + dir + " does not exist");
        }
        if (Files.isDirectory(abs)) {
            throw new StriaException("cannot write " + target + ": it is a directory");
        }
        for (String in : inputs) {
            if (in.equals("-")) {
                continue;
            }
            for (String suffix : INPUT_COMPANIONS) {
                if (sameFile(path, in + suffix)) {
                    throw new StriaException("output " + path + " is " + (suffix.isEmpty() ? "the input " + in
                            : "the index " + in + suffix + " of an input") + ": choose another output name");
                }
            }
        }
        for (String other : named) {
            if (sameFile(path, other)) {
                throw new StriaException(other.equals(path) ? "output " + path + " is named twice"
                        : "outputs " + other + " and " + path + " are one file: choose another name for one");
            }
        }
        named.add(path);
        Entry e;
        if (writtenInPlace(abs)) {
            e = new Entry(abs, null);
        } else {
            // the name keeps its extension: readers such as the tabix indexer choose the decompression by it
            Path temp = dir.resolve(".stria-tmp-" + ProcessHandle.current().pid() + "-" + SERIAL.incrementAndGet()
                    + "-" + abs.getFileName());
            synchronized (LIVE_TEMPS) {
                LIVE_TEMPS.add(temp);
            }
            e = new Entry(abs, temp);
        }
        entries.add(e);
        return e;
    }

    /**
     * A FIFO, a device or a node of {@code /dev} or {@code /proc} (such as {@code /dev/fd/3}) is written to
     * where it is: a rename would put a regular file in its place.
     */
    private static boolean writtenInPlace(Path abs) {
        Path norm = abs.normalize();
        if (norm.startsWith("/dev") || norm.startsWith("/proc")) {
            return true;
        }
        if (!Files.exists(abs)) {
            return false;
        }
        if (!Files.isRegularFile(abs)) {
            return true;
        }
        try {
            Path real = abs.toRealPath();
            return real.startsWith("/dev") || real.startsWith("/proc");
        } catch (IOException ex) {
            return false;
        }
    }

    /**
     * Whether two paths name one file: the same absolute path once {@code .} and {@code ..} are resolved
     * against the real directory (so {@code d/../o} through a symbolic link {@code d} counts), or, when both
     * exist, the same file by identity (hard and symbolic links).
     */
    static boolean sameFile(String a, String b) {
        Path pa = Path.of(a);
        Path pb = Path.of(b);
        if (canonical(pa).equals(canonical(pb))) {
            return true;
        }
        try {
            return Files.exists(pa) && Files.exists(pb) && Files.isSameFile(pa, pb);
        } catch (IOException ex) {
            return false; // cannot tell: the path comparison stands
        }
    }

    /** The path with its directory resolved through links, the last name kept (the file may not exist yet). */
    private static Path canonical(Path p) {
        Path abs = p.toAbsolutePath();
        Path name = abs.normalize().getFileName();
        Path dir = abs.getParent();
        if (name == null || dir == null) {
            return abs.normalize();
        }
        try {
            // a "d/.." must be taken after d's link is followed, as the kernel does
            return dir.toRealPath().resolve(abs.getFileName()).normalize();
        } catch (IOException ex) {
            return abs.normalize();
        }
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
     * {@link #AtomicOutputs(List)} does this for every output it opens; this is for a check before any work.
     *
     * @throws StriaException naming the output and the input
     */
    public static void refuseInputs(List<String> outputs, List<String> inputs) {
        List<String> outs = new ArrayList<>();
        for (String o : outputs) {
            if (o != null && !isStdout(o)) {
                outs.add(o);
                outs.add(o + ".tbi");
            }
        }
        for (String in : inputs) {
            if (in.equals("-")) {
                continue;
            }
            for (String o : outs) {
                for (String suffix : INPUT_COMPANIONS) {
                    if (sameFile(o, in + suffix)) {
                        throw new StriaException("output " + o + " is " + (suffix.isEmpty() ? "the input " + in
                                : "the index " + in + suffix + " of an input") + ": choose another output name");
                    }
                }
            }
        }
    }
}
