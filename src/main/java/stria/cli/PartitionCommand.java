package stria.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import stria.StriaException;
import stria.io.ContigInfo;
import stria.io.GenomeReader;
import stria.io.Region;
import stria.out.AtomicOutputs;
import stria.pipeline.Geometry;
import stria.shard.Partition;
import stria.shard.Shard;

/**
 * {@code stria partition}: shows how {@code scan --shard K/N} would split the input, so that N can be chosen
 * before a job array is submitted. The partition depends only on the names and lengths of the contigs.
 */
@Command(name = "partition",
        description = {"Show the pieces of the genome each shard of a split scan (scan --shard K/N) covers.",
                "One line per shard: shard, number of shards, bases, pieces as contig:start-end (1-based, "
                        + "inclusive; '-' for a shard with nothing to scan)."})
public final class PartitionCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Option(names = "--shards", paramLabel = "N", required = true, description = "number of shards")
    int shards;

    @Option(names = "--grain", paramLabel = "BASES", defaultValue = "" + Geometry.SHARD_GRAIN,
            description = "cut contigs only at multiples of BASES (default: ${DEFAULT-VALUE})")
    int grain;

    @Parameters(arity = "1..*", paramLabel = "FASTA", description = "genome files, in the order given to scan")
    List<String> inputs = new ArrayList<>();

    @Mixin(name = CommonOptions.NAME)
    CommonOptions common;

    @Override
    public Integer call() {
        if (shards < 1) {
            throw new ParameterException(spec.commandLine(), "--shards must be at least 1, not " + shards);
        }
        if (grain < 1) {
            throw new ParameterException(spec.commandLine(), "--grain must be at least 1, not " + grain);
        }
        List<ContigInfo> genome = new ArrayList<>();
        for (String in : inputs) {
            try (GenomeReader r = GenomeReader.open(in, w -> System.err.println("stria: warning: " + w))) {
                genome.addAll(r.contigs());
            }
        }
        try (AtomicOutputs outs = new AtomicOutputs(inputs)) {
            print(Partition.of(genome, shards, grain), outs.open("-"));
            outs.commit();
        }
        return 0;
    }

    static void print(List<Shard> shards, OutputStream out) {
        StringBuilder sb = new StringBuilder("#shard\tof\tbases\tpieces\n");
        for (Shard s : shards) {
            sb.append(s.id().k()).append('\t').append(s.id().n()).append('\t').append(s.bases()).append('\t');
            if (s.pieces().isEmpty()) {
                sb.append('-');
            }
            for (int i = 0; i < s.pieces().size(); i++) {
                Region p = s.pieces().get(i);
                sb.append(i == 0 ? "" : " ").append(p.toText());
            }
            sb.append('\n');
        }
        try {
            out.write(sb.toString().getBytes(StandardCharsets.UTF_8));
            out.flush();
        } catch (IOException e) {
            throw StriaException.io("cannot write " + AtomicOutputs.displayName("-"), e);
        }
    }
}
