package stria.cli;

import java.io.PrintWriter;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import stria.StriaException;

/** Entry point: parses the command line once and maps failures to exit codes (1 input/IO, 2 usage). */
@Command(name = "stria", mixinStandardHelpOptions = true, versionProvider = Main.Version.class,
        description = {
            "Finds the tandem repeats of assembled genomes, from homopolymers and microsatellites to satellite "
                + "arrays, perfect and imperfect, and writes them as BED and TSV.",
            "",
            "Results are research-grade. Repeat-expansion loci matter clinically: stria is not a diagnostic "
                + "test; defer to validated assays, licensed practice and local rules."},
        subcommands = {ScanCommand.class, CompareCommand.class, MergeCommand.class, PartitionCommand.class,
            ReportCommand.class, ShowCommand.class,
            CommandLine.HelpCommand.class})
public final class Main implements Runnable {
    public static final String VERSION = versionString();
    private static final String OUT_OF_MEMORY =
            "stria: out of memory; give the JVM more with STRIA_JAVA_OPTS=-Xmx..., or fewer --threads";

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    static {
        // the report draws charts with AWT classes; no display is ever needed
        System.setProperty("java.awt.headless", "true");
        // htsjdk's own notices (e.g. about stream types while indexing) are not for our users' stderr
        htsjdk.samtools.util.Log.setGlobalLogLevel(htsjdk.samtools.util.Log.LogLevel.ERROR);
    }

    public static void main(String[] args) {
        // a process of its own: stdout failures can be told by their cause (see StandardOutput)
        stria.out.StandardOutput.useDescriptor();
        System.exit(run(args));
    }

    /** Runs the command line and returns the exit code (used by tests too). */
    public static int run(String... args) {
        CommandLine cl = commandLine();
        try {
            int code = cl.execute(args);
            if (code == 0 && System.out.checkError()) {
                // help, version or any text that went through System.out, whose errors it keeps to itself
                System.err.println("stria: cannot write standard output (closed, full or its reader gone)");
                return 1;
            }
            return code;
        } catch (OutOfMemoryError e) {
            // thrown on the main thread it passes the execution handler, which sees only exceptions
            System.err.println(OUT_OF_MEMORY);
            return 1;
        }
    }

    public static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        cl.setExecutionExceptionHandler(Main::onError);
        cl.setParameterExceptionHandler(Main::onUsageError);
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        // every decimal option of every command, present and future: finite numbers only
        cl.registerConverter(Double.class, new FiniteNumber());
        cl.registerConverter(double.class, new FiniteNumber());
        cl.setUsageHelpLongOptionsMaxWidth(28);
        return cl;
    }

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "missing command: choose one of "
                + String.join(", ", spec.subcommands().keySet()));
    }

    /** A usage error: the message, the synopsis of the command, and where to read more (exit 2). */
    private static int onUsageError(CommandLine.ParameterException ex, String[] args) {
        CommandLine cmd = ex.getCommandLine();
        PrintWriter err = cmd.getErr();
        err.println("stria: " + ex.getMessage());
        CommandLine.UnmatchedArgumentException.printSuggestions(ex, err);
        err.print(cmd.getHelp().fullSynopsis());
        err.println("Try '" + cmd.getCommandSpec().qualifiedName() + " --help' for more information.");
        err.flush();
        return cmd.getCommandSpec().exitCodeOnInvalidInput();
    }

    private static int onError(Exception ex, CommandLine cl, CommandLine.ParseResult parsed) {
        boolean debug = Boolean.getBoolean("stria.debug") || CommonOptions.debug(cl);
        PrintWriter err = cl.getErr();
        if (ex instanceof StriaException) {
            err.println("stria: " + oneLine(ex.getMessage()));
        } else if (ex instanceof java.io.UncheckedIOException || ex instanceof htsjdk.samtools.util.RuntimeIOException) {
            err.println("stria: I/O error: " + StriaException.describe(ex));
        } else if (ex.getCause() instanceof OutOfMemoryError) {
            err.println(OUT_OF_MEMORY);
        } else {
            err.println("stria: internal error: " + oneLine(ex.toString()) + (debug ? "" : " (run with --debug for details)"));
        }
        if (debug) {
            ex.printStackTrace(err);
        }
        err.flush();
        return 1;
    }

    /** A message is one line even when a name in it holds a line break (a file name may). */
    static String oneLine(String message) {
        return message == null ? "" : message.replace("\r", "\\r").replace("\n", "\\n");
    }

    private static String versionString() {
        String v = Main.class.getPackage().getImplementationVersion();
        return v == null ? "0.1.0-dev" : v;
    }

    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"stria " + VERSION, "Java " + System.getProperty("java.version")};
        }
    }
}
