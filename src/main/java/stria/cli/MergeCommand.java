package stria.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import stria.StriaException;
import stria.out.AtomicOutputs;
import stria.out.ResultFormat;
import stria.out.Tabix;
import stria.shard.ShardMerge;

/**
 * {@code stria merge}: joins the results of all shards of a split scan into the result one scan of the whole
 * genome would have written. Refuses sets that are incomplete or do not belong together.
 */
@Command(name = "merge",
        description = {"Join the results of the shards of one split scan (scan --shard K/N) into one result.",
                "Files may be given in any order, plain, gzip or BGZF; the set must hold every shard 1..N exactly "
                        + "once, all from the same input and settings.",
                "Each shard must end with the closing #end line scan --shard writes last, and agree with it (a shard "
                        + "cut short, emptied or edited is refused, by name); all are checked before anything is "
                        + "written.",
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

    @Mixin(name = CommonOptions.NAME)
    CommonOptions common;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        ResultFormat format = target.bed != null ? ResultFormat.BED : ResultFormat.TSV;
        String out = format == ResultFormat.BED ? target.bed : target.tsv;
        try (AtomicOutputs outputs = new AtomicOutputs(files)) {
            OutputStream stream = outputs.open(out);
            ShardMerge merge = ShardMerge.check(files, format);
            String command = commandLine();
            if (format == ResultFormat.BED) {
                Tabix.indexOnCommit(outputs, out);
            }
            merge.writeTo(stream, command);
            try {
                stream.flush();
            } catch (IOException e) {
                throw StriaException.io("cannot write " + out, e);
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
