package stria.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import stria.StriaException;
import stria.out.AtomicOutputs;
import stria.out.Tabix;
import stria.shard.ShardMerge;

/**
 * {@code stria merge}: joins the results of all shards of a split scan into the result one scan of the whole
 * genome would have written. Refuses sets that are incomplete or do not belong together.
 */
@Command(name = "merge", sortOptions = false, usageHelpAutoWidth = true, mixinStandardHelpOptions = true,
        versionProvider = Main.Version.class,
        description = {"Join the results of the shards of one split scan (scan --shard K/N) into one result.",
                "Files may be given in any order, plain, gzip or BGZF; the set must hold every shard 1..N exactly "
                        + "once, all from the same input and settings.",
                ""},
        footer = {"", "Exit status: 0 success, 1 incomplete or mismatched shard set or I/O error, 2 usage error."})
public final class MergeCommand implements Callable<Integer> {

    static final class Target {
        @Option(names = "--bed", paramLabel = "OUT",
                description = "merge BED results into OUT (.gz: BGZF with a tabix index; -: standard output)")
        String bed;

        @Option(names = "--tsv", paramLabel = "OUT",
                description = "merge TSV results into OUT (.gz: BGZF; -: standard output)")
        String tsv;
    }

    @ArgGroup(exclusive = true, multiplicity = "1")
    Target target;

    @Parameters(arity = "1..*", paramLabel = "FILE", description = "results of the shards of one run")
    List<String> files = new ArrayList<>();

    @Option(names = "--debug", description = "print stack traces of errors")
    boolean debug;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        ShardMerge.Format format = target.bed != null ? ShardMerge.Format.BED : ShardMerge.Format.TSV;
        String out = format == ShardMerge.Format.BED ? target.bed : target.tsv;
        for (String f : files) {
            if (!out.equals("-") && Path.of(f).toAbsolutePath().normalize()
                    .equals(Path.of(out).toAbsolutePath().normalize())) {
                throw new StriaException("output " + out + " is also one of the inputs");
            }
        }
        ShardMerge merge = ShardMerge.check(files, format);
        String command = commandLine();
        try (AtomicOutputs outputs = new AtomicOutputs()) {
            OutputStream stream = outputs.open(out);
            if (format == ShardMerge.Format.BED && !out.equals("-") && AtomicOutputs.isBgzf(out)) {
                Path index = outputs.companion(out, out + ".tbi");
                outputs.afterClose(out, () -> Tabix.indexBed(outputs.tempPath(out), index, out));
            }
            merge.writeTo(stream, command);
            try {
                stream.flush();
            } catch (IOException e) {
                throw new StriaException("cannot write " + out + ": " + AtomicOutputs.describe(e));
            }
            outputs.commit();
        }
        return 0;
    }

    private String commandLine() {
        List<String> typed = spec.commandLine().getParseResult().originalArgs();
        String text = String.join(" ", typed);
        return !typed.isEmpty() && typed.get(0).equals("merge") ? text : "merge " + text;
    }
}
