package stria.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.function.Consumer;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import stria.StriaException;
import stria.compare.CompareHeader;
import stria.compare.CompareSettings;
import stria.compare.CompareWriter;
import stria.compare.GenomeComparison;
import stria.compare.ScanResults;
import stria.out.AtomicOutputs;
import stria.out.ResultHeader;
import stria.out.Tabix;
import stria.pipeline.Genome;
import stria.pipeline.Progress;
import stria.pipeline.ScanSettings;
import stria.score.Locus;
import stria.shard.ShardId;

/**
 * {@code stria compare}: scans two assemblies with the same settings (or reads their scan results back)
 * and writes, for every locus of A, what B has in its place ({@link GenomeComparison}).
 */
@Command(name = "compare",
        description = {
            "Compares the tandem repeats of two assemblies or haplotypes: which loci of A have another length in B.",
            "",
            "Both genomes are scanned with the same settings (the scan options below, as for 'stria scan'). Each "
                + "locus of A is found in B by the sequence beside it, not by coordinates, so B's contigs may be "
                + "renamed, split, joined, reverse-complemented or shifted; B's repeat is measured from B's own bases "
                + "there.",
            "",
            "The TSV has one row per locus of A, in A's order, then one per locus of B with no counterpart in A. "
                + "Its first columns: chrom start end period motif_class other_chrom other_start other_end "
                + "other_strand length_change status (then motif, length and other_length, copies and "
                + "other_copies, purity and other_purity, note); '.' marks an absent value. Coordinates are "
                + "0-based, end exclusive, B's on B's + strand. Status: same (B's repeat has A's length), changed "
                + "(another length; length_change is B minus A), lost (nothing, or less than --min-copies copies, "
                + "left), new (a locus of B without counterpart), unplaced (no pair of anchors unique in A and B "
                + "found; the note says why).",
            "",
            "A summary by status and period class goes to standard error (or --summary).",
            ""},
        footer = {"",
            "Results are research-grade. Repeat-expansion loci matter clinically: a comparison is not a "
                + "diagnosis; defer to validated assays, licensed practice and local rules.",
            "",
            "Exit status: 0 success, 1 bad input or I/O error, 2 usage error."})
public final class CompareCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Parameters(index = "0", paramLabel = "A", description = "The first assembly (FASTA, plain, gzip or BGZF). "
            + "Both are read more than once: files, not standard input.")
    String a;

    @Parameters(index = "1", paramLabel = "B", description = "The second assembly; may be the same file as A.")
    String b;

    @CommandLine.Mixin
    ScanSettingOptions scanOptions = new ScanSettingOptions();

    @Option(names = {"-o", "--tsv"}, paramLabel = "FILE", description = "Write the comparison here (default: "
            + "standard output; .gz gives BGZF).")
    String tsv = "-";

    @Option(names = "--a-bed", paramLabel = "FILE", description = "Also write BED of the changed and lost loci "
            + "in A's coordinates (BED6+3: chrom start end motif_class 0 . period length_change status; .gz "
            + "gives BGZF with a tabix index).")
    String aBed;

    @Option(names = "--b-bed", paramLabel = "FILE", description = "Also write BED of the changed loci in B's "
            + "coordinates, sorted by B's contigs (strand: how B holds the locus relative to A).")
    String bBed;

    @Option(names = "--summary", paramLabel = "FILE", description = "Write the counts by status and period class "
            + "here (TSV) instead of standard error.")
    String summary;

    @Option(names = "--a-result", paramLabel = "TSV", description = "Take A's loci from this result of 'stria "
            + "scan --tsv' instead of scanning A; refused unless it is a whole-genome result of A with the same "
            + "settings.")
    String aResult;

    @Option(names = "--b-result", paramLabel = "TSV", description = "Likewise for B.")
    String bResult;

    @Option(names = "--shard", paramLabel = "K/N", converter = ScanCommand.ShardIdConverter.class,
            description = "Compare only part K of N of A's loci (equal parts in A's order, for cluster job "
                    + "arrays; join the parts with 'stria merge'). Needs --a-result and --b-result: scan first, "
                    + "with 'scan --shard' and 'merge' if need be.")
    ShardId shard;

    @Option(names = "--progress", description = "Report scan progress on stderr even when it is not a terminal.")
    boolean progress;

    @Option(names = {"-q", "--quiet"}, description = "No progress, summary or warnings on stderr.")
    boolean quiet;

    @CommandLine.Mixin(name = CommonOptions.NAME)
    CommonOptions common;

    @Override
    public Integer call() {
        ScanSettings settings = scanOptions.settings(spec.commandLine());
        require(!a.equals("-") && !b.equals("-"), "compare reads A and B more than once: give files, not "
                + "standard input (-)");
        require(shard == null || (aResult != null && bResult != null), "--shard needs --a-result and --b-result");
        require(shard == null || (aBed == null && bBed == null && summary == null), "--shard writes a part of a "
                + "comparison: write --a-bed, --b-bed and --summary when merging the parts");
        List<String> outs = Arrays.asList(tsv, aBed, bBed, summary);
        int toStdout = 0;
        for (String o : outs) {
            toStdout += "-".equals(o) ? 1 : 0;
        }
        require(toStdout <= 1, "only one output can go to standard output");
        List<String> inputs = new ArrayList<>(List.of(a, b));
        if (aResult != null) {
            inputs.add(aResult);
        }
        if (bResult != null) {
            inputs.add(bResult);
        }
        AtomicOutputs.refuseInputs(outs, inputs);
        CompareSettings cs = CompareSettings.defaults(settings.filters().minCopies());
        Consumer<String> warn = quiet ? m -> { } : m -> System.err.println("stria: warning: " + m);
        boolean showProgress = !quiet && (progress || Progress.stderrIsTerminal());
        try (Genome ga = Genome.open(List.of(a), warn); Genome gb = Genome.open(List.of(b), warn);
             AtomicOutputs outputs = new AtomicOutputs()) {
            List<List<Locus>> aLoci = aResult == null ? null
                    : ScanResults.read(aResult, a, ga.contigs(), settings.describe());
            List<List<Locus>> bLoci = bResult == null ? null
                    : ScanResults.read(bResult, b, gb.contigs(), settings.describe());
            ResultHeader ah = new ResultHeader(Main.VERSION, commandText(), settings.describe() + " " + cs.describe(),
                    ga.contigs(), shard == null ? null : shard.toString(), List.of());
            List<String> header = new CompareHeader(ah, gb.contigs()).lines();
            OutputStream tsvOut = outputs.open(tsv);
            OutputStream aOut = aBed == null ? null : outputs.open(aBed);
            OutputStream bOut = bBed == null ? null : outputs.open(bBed);
            if (aBed != null) {
                Tabix.indexOnCommit(outputs, aBed);
            }
            if (bBed != null) {
                Tabix.indexOnCommit(outputs, bBed);
            }
            OutputStream sumOut = summary == null ? null : outputs.open(summary);
            CompareWriter w = new CompareWriter(header, gb.contigs(), tsvOut, tsv, aOut, bOut);
            if (shard != null) {
                w.sealed();
            }
            GenomeComparison.run(ga, gb, aLoci, bLoci, settings, cs, shard, showProgress, w);
            w.finish();
            List<String> table = w.summary().lines();
            if (sumOut != null) {
                write(sumOut, summary, table);
            } else if (!quiet && shard == null) {
                PrintStream err = System.err;
                err.println("stria: compare summary (rows by status and period class):");
                table.forEach(l -> err.println("  " + l.replace('\t', ' ')));
            }
            flush(tsvOut, tsv);
            for (OutputStream o : new OutputStream[] {aOut, bOut, sumOut}) {
                if (o != null) {
                    flush(o, "output");
                }
            }
            outputs.commit();
        }
        return 0;
    }

    private static void write(OutputStream out, String name, List<String> lines) {
        try {
            for (String l : lines) {
                out.write(l.getBytes(StandardCharsets.UTF_8));
                out.write('\n');
            }
        } catch (IOException e) {
            throw StriaException.io("cannot write " + name, e);
        }
    }

    private static void flush(OutputStream out, String name) {
        try {
            out.flush();
        } catch (IOException e) {
            throw StriaException.io("cannot write " + name, e);
        }
    }

    private void require(boolean ok, String message) {
        if (!ok) {
            throw new CommandLine.ParameterException(spec.commandLine(), message);
        }
    }

    private String commandText() {
        return String.join(" ", spec.commandLine().getParseResult().originalArgs());
    }
}
