package stria.testutil;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;

/**
 * Runs the real command ({@code scripts/stria}) and outside tools in tests. The launcher is pointed at the
 * test class path through {@code STRIA_CLASSPATH}, so tests need no packaged jar.
 */
public final class Cli {
    private Cli() {
    }

    public record Result(int exit, String out, String err) {
        public List<String> dataLines() {
            List<String> l = new ArrayList<>();
            for (String s : out.split("\n")) {
                if (!s.isEmpty() && !s.startsWith("#")) {
                    l.add(s);
                }
            }
            return l;
        }
    }

    public static Path projectDir() {
        String p = System.getProperty("stria.projectDir");
        return Path.of(p == null ? "." : p).toAbsolutePath().normalize();
    }

    /** Whether tests must fail instead of skipping when an outside tool is missing (CI). */
    public static boolean requireTools() {
        return Boolean.getBoolean("stria.requireTools") || "true".equalsIgnoreCase(System.getenv("CI"));
    }

    public static boolean onPath(String tool) {
        for (String dir : System.getenv().getOrDefault("PATH", "").split(File.pathSeparator)) {
            if (Files.isExecutable(Path.of(dir, tool))) {
                return true;
            }
        }
        return false;
    }

    /** Skips the test when a tool is missing, or fails it when tools are required. */
    public static void needTool(String tool) {
        if (!onPath(tool)) {
            if (requireTools()) {
                throw new AssertionError(tool + " is required (CI) but not on PATH");
            }
            Assumptions.assumeTrue(false, tool + " not installed");
        }
    }

    /** Runs {@code scripts/stria args...} in {@code dir}. */
    public static Result stria(Path dir, String... args) {
        List<String> cmd = new ArrayList<>();
        cmd.add(projectDir().resolve("scripts/stria").toString());
        cmd.addAll(Arrays.asList(args));
        return exec(dir, null, cmd);
    }

    /** Runs {@code scripts/stria args...} with standard input from a file. */
    public static Result striaWithInput(Path dir, Path stdin, String... args) {
        List<String> cmd = new ArrayList<>();
        cmd.add(projectDir().resolve("scripts/stria").toString());
        cmd.addAll(Arrays.asList(args));
        return exec(dir, stdin, cmd);
    }

    public static Result exec(Path dir, Path stdin, List<String> cmd) {
        try {
            ProcessBuilder pb = new ProcessBuilder(cmd).directory(dir.toFile());
            Map<String, String> env = pb.environment();
            env.put("STRIA_CLASSPATH", System.getProperty("java.class.path"));
            Path out = Files.createTempFile("stria-out", ".txt");
            Path err = Files.createTempFile("stria-err", ".txt");
            pb.redirectOutput(out.toFile()).redirectError(err.toFile());
            if (stdin != null) {
                pb.redirectInput(stdin.toFile());
            }
            Process p = pb.start();
            if (!p.waitFor(15, TimeUnit.MINUTES)) {
                p.destroyForcibly();
                throw new AssertionError("timed out: " + cmd);
            }
            Result r = new Result(p.exitValue(), Files.readString(out, StandardCharsets.UTF_8),
                    Files.readString(err, StandardCharsets.UTF_8));
            Files.delete(out);
            Files.delete(err);
            return r;
        } catch (IOException e) {
            throw new AssertionError(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError(e);
        }
    }

    /** Runs an outside tool and returns its standard output; fails the test on a non-zero exit. */
    public static String tool(Path dir, String... cmd) {
        Result r = exec(dir, null, Arrays.asList(cmd));
        assertThat(r.exit()).as("%s failed: %s", String.join(" ", cmd), r.err()).isZero();
        return r.out();
    }
}
