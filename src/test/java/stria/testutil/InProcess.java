package stria.testutil;

import java.io.PrintWriter;
import java.io.StringWriter;
import picocli.CommandLine;
import stria.cli.Main;

/**
 * Runs the command line in this JVM, through the same {@link Main#commandLine} the launcher uses, with its
 * messages captured: for tests that run the real command many times. Paths should be absolute (the working
 * directory is the test's).
 */
public final class InProcess {
    private InProcess() {
    }

    public record Result(int exit, String err) {
        /** The messages as lines, without a trailing empty one. */
        public long errLines() {
            return err.strip().lines().count();
        }
    }

    public static Result stria(String... args) {
        StringWriter err = new StringWriter();
        CommandLine cl = Main.commandLine();
        cl.setErr(new PrintWriter(err, true));
        cl.setOut(new PrintWriter(new StringWriter(), true));
        int exit = cl.execute(args);
        return new Result(exit, err.toString());
    }
}
