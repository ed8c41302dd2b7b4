package stria.pipeline;

import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Progress on stderr: bases done of total, rate and time left. Redrawn in place on a terminal; one line every
 * ten seconds otherwise (only when asked for with --progress).
 */
public final class Progress implements AutoCloseable {
    private final AtomicLong done = new AtomicLong();
    private final long total;
    private final boolean enabled;
    private final boolean terminal;
    private final PrintStream err;
    private final long startNanos = System.nanoTime();
    private Thread ticker;
    private volatile boolean closed;

    public Progress(long total, boolean enabled, PrintStream err) {
        this.total = Math.max(1, total);
        this.enabled = enabled;
        this.terminal = stderrIsTerminal();
        this.err = err;
        if (enabled) {
            ticker = new Thread(this::tick, "stria-progress");
            ticker.setDaemon(true);
            ticker.start();
        }
    }

    /** Progress that is counted and never shown (for scans run as a library call). */
    public static Progress none() {
        return new Progress(1, false, System.err);
    }

    /** Whether standard error is a terminal (Linux: the descriptor points at a tty device). */
    public static boolean stderrIsTerminal() {
        try {
            String target = Files.readSymbolicLink(Path.of("/proc/self/fd/2")).toString();
            return target.startsWith("/dev/pts/") || target.startsWith("/dev/tty");
        } catch (Exception e) {
            return false;
        }
    }

    public void add(long bases) {
        done.addAndGet(bases);
    }

    private void tick() {
        long every = terminal ? 1000 : 10_000;
        try {
            while (!closed) {
                Thread.sleep(every);
                if (!closed) {
                    print(false);
                }
            }
        } catch (InterruptedException ignored) {
            // finished
        }
    }

    private synchronized void print(boolean last) {
        long d = Math.min(done.get(), total);
        double secs = Math.max(1e-3, (System.nanoTime() - startNanos) / 1e9);
        double rate = d / secs;
        String left = last ? "done" : d > 0 ? formatDuration((total - d) / rate) + " left" : "starting";
        String line = String.format(java.util.Locale.ROOT, "stria: %.1f of %.1f Mb (%d%%), %.2f Mb/s, %s",
                d / 1e6, total / 1e6, (int) (100 * d / total), rate / 1e6, left);
        if (terminal) {
            err.print("\r" + line + "   " + (last ? "\n" : ""));
        } else {
            err.println(line);
        }
        err.flush();
    }

    static String formatDuration(double secs) {
        long s = Math.round(secs);
        if (s >= 3600) {
            return (s / 3600) + "h" + String.format(java.util.Locale.ROOT, "%02dm", (s % 3600) / 60);
        }
        if (s >= 60) {
            return (s / 60) + "m" + String.format(java.util.Locale.ROOT, "%02ds", s % 60);
        }
        return s + "s";
    }

    @Override
    public void close() {
        if (closed) {
            return;
        }
        closed = true;
        if (ticker != null) {
            ticker.interrupt();
            print(true);
        }
    }
}
