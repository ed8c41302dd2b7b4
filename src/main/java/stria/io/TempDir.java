package stria.io;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;

/** Where temporary files go: {@code $TMPDIR} when set, as clusters point it at node-local scratch. */
public final class TempDir {
    private static final Object LOCK = new Object();
    private static boolean closing;

    static {
        Runtime.getRuntime().addShutdownHook(new Thread(() -> {
            synchronized (LOCK) {
                closing = true;
            }
        }, "stria-scratch-guard"));
    }

    private TempDir() {
    }

    /** {@code $TMPDIR} if it names a directory, else the JVM's temporary directory (which ignores it). */
    public static Path directory() {
        String env = System.getenv("TMPDIR");
        return env != null && !env.isEmpty() && Files.isDirectory(Path.of(env)) ? Path.of(env)
                : Path.of(System.getProperty("java.io.tmpdir"));
    }

    /**
     * A new scratch file in {@code dir}, open for reading and writing and already unlinked, so that it
     * disappears with the channel or the process, however that ends. Creating and unlinking happen under
     * one lock that the shutdown sequence also takes: a thread still running while the JVM stops can never
     * leave a file behind.
     */
    public static FileChannel scratch(Path dir, String prefix) throws IOException {
        synchronized (LOCK) {
            if (closing) {
                throw new IOException("the process is stopping");
            }
            Path file = Files.createTempFile(dir, prefix, ".tmp");
            try {
                return FileChannel.open(file, StandardOpenOption.READ, StandardOpenOption.WRITE,
                        StandardOpenOption.DELETE_ON_CLOSE);
            } finally {
                Files.deleteIfExists(file);
            }
        }
    }
}
