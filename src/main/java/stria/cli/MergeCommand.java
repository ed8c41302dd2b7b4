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
import picocli.CommandLine.ParameterException;
import stria.StriaException;
import stria.compare.CompareMerge;
import stria.compare.CompareWriter;
import stria.out.AtomicOutputs;
import stria.out.ResultFormat;
import stria.out.Tabix;
import stria.shard.ShardMerge;

/**
 * {@code stria merge}: joins the results of all shards of a split scan into the result one scan of the whole
 * genome would have written. Refuses sets that are incomplete or do not belong together.
 */
@Command(name = "merge",
        description = {"Join the results of the shards of one split scan (scan --shard K/N) into one result, or "
                + "the parts of one split comparison (compare --shard K/N, with --tsv).",
                "Files may be given in any order, plain, gzip or BGZF; the set must hold every shard 1..N exactly "
                        + "once, all from the same input and settings.",
                "Each shard or part must end with the closing #end line scan --shard (compare --shard) writes last, "
                        + "and agree with it (a shard "
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

        @Option(names = "--gff", paramLabel = "OUT",
                description = "merge GFF3 results into OUT (.gz: BGZF with a tabix index; -: standard output)")
        String gff;

        @Option(names = "--catalog", paramLabel = "OUT",
                description = "merge STR catalogues into OUT (.gz: BGZF; -: standard output)")
        String catalog;
    }

    @ArgGroup(exclusive = true, multiplicity = "1")
    Target target;

    @Option(names = "--a-bed", paramLabel = "OUT", description = "comparisons only: also write BED of the changed "
            + "loci in A's coordinates, as compare --a-bed")
    String aBed;

    @Option(names = "--b-bed", paramLabel = "OUT", description = "comparisons only: also write BED of the changed "
            + "loci in B's coordinates, as compare --b-bed")
    String bBed;

    @Option(names = "--summary", paramLabel = "OUT", description = "comparisons only: also write the counts by "
            + "status and period class, as compare --summary")
    String summary;

    @Parameters(arity = "1..*", paramLabel = "FILE", description = "results of the shards of one run")
    List<String> files = new ArrayList<>();

    @Mixin(name = CommonOptions.NAME)
    CommonOptions common;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        if (!files.isEmpty() && CompareMerge.isComparison(files.get(0))) {
            return mergeComparison();
        }
        if (aBed != null || bBed != null || summary != null) {
            throw new ParameterException(spec.commandLine(), "--a-bed, --b-bed and --summary are for the parts of a "
                    + "comparison; " + files.get(0) + " is a scan result");
        }
        ResultFormat format = target.bed != null ? ResultFormat.BED : target.tsv != null ? ResultFormat.TSV
                : target.gff != null ? ResultFormat.GFF : ResultFormat.CATALOG;
        String out = switch (format) {
            case BED -> target.bed;
            case TSV -> target.tsv;
            case GFF -> target.gff;
            case CATALOG -> target.catalog;
        };
        try (AtomicOutputs outputs = new AtomicOutputs(files)) {
            OutputStream stream = outputs.open(out);
            ShardMerge merge = ShardMerge.check(files, format);
            String command = commandLine();
            if (format == ResultFormat.BED) {
                Tabix.indexOnCommit(outputs, out);
            } else if (format == ResultFormat.GFF) {
                Tabix.indexGffOnCommit(outputs, out);
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

    /** The parts of a split comparison, into the TSV (and BEDs and summary) of an unsplit one. */
    private int mergeComparison() {
        if (target.tsv == null) {
            throw new ParameterException(spec.commandLine(), "the parts of a comparison merge with --tsv OUT");
        }
        List<String> outs = java.util.Arrays.asList(target.tsv, aBed, bBed, summary);
        CompareMerge merge = CompareMerge.check(files);
        try (AtomicOutputs outputs = new AtomicOutputs(files)) {
            OutputStream tsv = outputs.open(target.tsv);
            OutputStream a = aBed == null ? null : outputs.open(aBed);
            OutputStream b = bBed == null ? null : outputs.open(bBed);
            OutputStream sum = summary == null ? null : outputs.open(summary);
            for (String bed : new String[] {aBed, bBed}) {
                if (bed != null) {
                    Tabix.indexOnCommit(outputs, bed);
                }
            }
            CompareWriter w = new CompareWriter(merge.header(commandLine()), merge.otherContigs(), tsv, target.tsv, a, b);
            merge.rows(w);
            w.finish();
            try {
                if (sum != null) {
                    for (String l : w.summary().lines()) {
                        sum.write((l + "\n").getBytes(java.nio.charset.StandardCharsets.UTF_8));
                    }
                }
                for (OutputStream o : new OutputStream[] {tsv, a, b, sum}) {
                    if (o != null) {
                        o.flush();
                    }
                }
            } catch (IOException e) {
                throw StriaException.io("cannot write " + target.tsv, e);
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
