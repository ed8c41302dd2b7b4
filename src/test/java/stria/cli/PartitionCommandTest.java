package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

class PartitionCommandTest {
    @TempDir
    Path dir;

    @Test
    void printsOneLinePerShardWithOneBasedInclusivePieces() throws IOException {
        Path one = fasta("one.fa", ">big invented\n" + "ACGT".repeat(625) + "\n>small\n" + "A".repeat(1000) + "\n");
        Path two = fasta("two.fa", ">tiny\nACGTACGTAC\n");

        Result r = run("--shards", "4", "--grain", "1000", one.toString(), two.toString());

        assertThat(r.code).isZero();
        assertThat(r.out.lines().toList()).containsExactly(
                "#shard\tof\tbases\tpieces",
                "1\t4\t1000\tbig:1-1000",
                "2\t4\t1000\tbig:1001-2000",
                "3\t4\t500\tbig:2001-2500",
                "4\t4\t1010\tsmall:1-1000 tiny:1-10");
    }

    @Test
    void moreShardsThanPiecesPrintsEmptyShards() throws IOException {
        Path g = fasta("g.fa", ">only\nACGTACGTAC\n");

        Result r = run("--shards", "3", g.toString());

        List<String> lines = r.out.lines().toList();
        assertThat(lines).hasSize(4);
        assertThat(lines).filteredOn(l -> l.endsWith("\t0\t-")).hasSize(2);
        assertThat(lines).filteredOn(l -> l.endsWith("\t3\t10\tonly:1-10")).hasSize(1);
    }

    @Test
    void aShardCountBelowOneIsAUsageError() throws IOException {
        Path g = fasta("g.fa", ">only\nACGT\n");
        assertThat(run("--shards", "0", g.toString()).code).isEqualTo(2);
        assertThat(run("--shards", "2", "--grain", "0", g.toString()).code).isEqualTo(2);
    }

    private Path fasta(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text, StandardCharsets.US_ASCII);
        return p;
    }

    private record Result(int code, String out) {
    }

    private static Result run(String... args) {
        ByteArrayOutputStream captured = new ByteArrayOutputStream();
        PrintStream old = System.out;
        PrintStream oldErr = System.err;
        System.setOut(new PrintStream(captured, true, StandardCharsets.UTF_8));
        System.setErr(new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8));
        try {
            int code = new CommandLine(new PartitionCommand()).execute(args);
            return new Result(code, captured.toString(StandardCharsets.UTF_8));
        } finally {
            System.setOut(old);
            System.setErr(oldErr);
        }
    }
}
