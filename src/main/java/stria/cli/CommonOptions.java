package stria.cli;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * The options every command shares, mixed in as {@code common}: help, version and {@code --debug}, which
 * {@link Main} reads when a command fails.
 */
@Command(mixinStandardHelpOptions = true, versionProvider = Main.Version.class, sortOptions = false,
        usageHelpAutoWidth = true)
final class CommonOptions {
    static final String NAME = "common";

    @Option(names = "--debug", description = "Print stack traces of errors.")
    boolean debug;

    /** Whether the command that {@code cl} runs was given {@code --debug}. */
    static boolean debug(CommandLine cl) {
        return cl.getMixins().get(NAME) instanceof CommonOptions c && c.debug;
    }
}
