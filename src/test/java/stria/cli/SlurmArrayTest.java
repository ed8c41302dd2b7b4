package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import stria.sim.GenomeSimulator;
import stria.testutil.Cli;

/**
 * The job scripts of {@code scripts/slurm/} on a real SLURM cluster (one node, brought up by
 * {@code .ci/slurm-up.sh}): a job array of shards and a merge job chained with afterok give the same data
 * lines as one scan. Skipped without {@code sbatch}, unless tools are required (CI), where that fails.
 */
@Tag("tools")
class SlurmArrayTest {
    private static final long WAIT_MINUTES = 8;

    @TempDir
    Path dir;

    private final String jobName = "stria-test-" + UUID.randomUUID().toString().substring(0, 8);

    @BeforeEach
    void needCluster() {
        Cli.needTool("sbatch");
        Cli.Result r = Cli.exec(dir, null, List.of("sinfo", "-h", "-o", "%a %T"));
        boolean up = r.exit() == 0 && r.out().contains("up");
        if (!up && Cli.requireTools()) {
            throw new AssertionError("sbatch is installed but no cluster answers (run .ci/slurm-up.sh): " + r.err());
        }
        Assumptions.assumeTrue(up, "no SLURM cluster answers");
    }

    @Test
    void arrayOfShardsThenMergeEqualsOneScan() throws IOException {
        Path genome = dir.resolve("genome.fa.gz");
        // ctg01 gets 1.2 Mb, so four shards cut it on the 1 Mb grain; the others are 200 kb each
        int made = new CommandLine(new GenomeSimulator()).execute("--out", genome.toString(), "--truth",
                dir.resolve("truth.tsv").toString(), "--seed", "23", "--size", "1600000", "--contigs", "3",
                "--satellite-length", "60000", "--prefix", "scaf");
        assertThat(made).isZero();

        Cli.Result single = Cli.stria(dir, "scan", "-q", "--threads", "1", "--bed", "single.bed", "--tsv",
                "single.tsv", genome.toString());
        assertThat(single.exit()).as(single.err()).isZero();

        Cli.Result submitted = submit("--shards", "4", "--work", "work", "--bed", "merged.bed.gz", "--tsv",
                "merged.tsv", "--wait", "--", "-q", "--threads", "1", genome.toString());
        assertThat(submitted.exit()).as("%s%s%s", submitted.out(), submitted.err(), logs()).isZero();
        assertThat(submitted.out()).contains("array job").contains("merge job");

        byte[] bed = ShardedScanTest.read(dir.resolve("merged.bed.gz"));
        byte[] tsv = ShardedScanTest.read(dir.resolve("merged.tsv"));
        byte[] singleBed = Files.readAllBytes(dir.resolve("single.bed"));
        assertThat(ShardedScanTest.dataLines(singleBed)).isNotEmpty();
        assertThat(ShardedScanTest.dataSection(bed)).isEqualTo(ShardedScanTest.dataSection(singleBed));
        assertThat(ShardedScanTest.dataSection(tsv))
                .isEqualTo(ShardedScanTest.dataSection(Files.readAllBytes(dir.resolve("single.tsv"))));
        assertThat(dir.resolve("merged.bed.gz.tbi")).exists();
        for (int k = 1; k <= 4; k++) {
            assertThat(dir.resolve("work/shard-" + k + ".bed")).exists();
            assertThat(dir.resolve("work/logs/shard-" + k + ".out")).exists();
        }
    }

    @Test
    void aFailedShardCancelsTheMergeAndTheHelperSaysWhich() throws IOException {
        Path genome = dir.resolve("tiny.fa");
        Files.writeString(genome, ">a invented\n" + "ACGT".repeat(300) + "CACACACACACACACACACA\n",
                StandardCharsets.US_ASCII);
        // shard 2 of 3 fails on purpose, through a launcher that refuses that one task
        Path script = dir.resolve("flaky-stria");
        Files.writeString(script, "#!/usr/bin/env bash\n"
                + "if [ \"$1\" = scan ] && [ \"$3\" = 2/3 ]; then echo 'invented failure' >&2; exit 1; fi\n"
                + "exec " + Cli.projectDir().resolve("scripts/stria") + " \"$@\"\n");
        assertThat(script.toFile().setExecutable(true)).isTrue();

        Cli.Result r = submitWith(Map.of("STRIA", script.toString()), "--shards", "3", "--work", "work", "--bed",
                "never.bed", "--wait", "--", "-q", "--exact", genome.toString());

        assertThat(r.exit()).as(r.out() + r.err()).isNotZero();
        assertThat(r.err()).contains("failed shards: 2");
        assertThat(dir.resolve("never.bed")).doesNotExist();
    }

    @Test
    void aListOfGenomesGetsOneArrayAndOneMergeEach() throws IOException, InterruptedException {
        List<String> list = new ArrayList<>(List.of("# invented genomes, one a line"));
        for (String name : List.of("alpha", "beta")) {
            Path fa = dir.resolve(name + ".fa.gz");
            int made = new CommandLine(new GenomeSimulator()).execute("--out", fa.toString(), "--truth",
                    dir.resolve(name + ".truth.tsv").toString(), "--seed", String.valueOf(name.length()), "--size",
                    "300000", "--contigs", "2", "--satellites", "0", "--prefix", name);
            assertThat(made).isZero();
            list.add(name + " " + fa);
        }
        Files.write(dir.resolve("genomes.txt"), list);

        List<String> cmd = List.of(Cli.projectDir().resolve("scripts/slurm/submit-genomes.sh").toString(),
                "genomes.txt", "--out", "results", "--work", "work", "--shard-bases", "200000", "--formats", "bed,tsv",
                "--sbatch", "--job-name=" + jobName, "--", "-q", "--threads", "1");
        Cli.Result r = Cli.exec(dir, null, cmd);
        assertThat(r.exit()).as(r.out() + r.err()).isZero();
        assertThat(r.out()).contains("== alpha").contains("== beta").contains("2 shards").contains("submitted 2");

        long deadline = System.nanoTime() + TimeUnit.MINUTES.toNanos(WAIT_MINUTES);
        while (!Cli.exec(dir, null, List.of("squeue", "-h", "--name=" + jobName)).out().isBlank()) {
            if (System.nanoTime() > deadline) {
                Cli.exec(dir, null, List.of("scancel", "--name=" + jobName));
                throw new AssertionError("jobs not done within " + WAIT_MINUTES + " minutes; cancelled " + jobName);
            }
            Thread.sleep(2000);
        }
        for (String name : List.of("alpha", "beta")) {
            Cli.Result single = Cli.stria(dir, "scan", "-q", "--threads", "1", "--bed", name + ".bed", "--tsv",
                    name + ".tsv", dir.resolve(name + ".fa.gz").toString());
            assertThat(single.exit()).as(single.err()).isZero();
            assertThat(ShardedScanTest.dataSection(ShardedScanTest.read(dir.resolve("results/" + name + ".bed.gz"))))
                    .as(name).isEqualTo(ShardedScanTest.dataSection(Files.readAllBytes(dir.resolve(name + ".bed"))));
            assertThat(ShardedScanTest.dataSection(ShardedScanTest.read(dir.resolve("results/" + name + ".tsv.gz"))))
                    .as(name).isEqualTo(ShardedScanTest.dataSection(Files.readAllBytes(dir.resolve(name + ".tsv"))));
            assertThat(dir.resolve("results/" + name + ".bed.gz.tbi")).exists();
        }
    }

    private Cli.Result submit(String... args) {
        return submitWith(Map.of(), args);
    }

    @Test
    void comparisonScansBothSplitsComparesAndMergesAsOneRun() throws IOException {
        Path a = dir.resolve("a.fa.gz");
        int made = new CommandLine(new GenomeSimulator()).execute("--out", a.toString(), "--truth",
                dir.resolve("a.truth.tsv").toString(), "--seed", "31", "--size", "1300000", "--contigs", "3",
                "--satellites", "0", "--prefix", "asm");
        assertThat(made).isZero();
        Path b = dir.resolve("b.fa");
        stria.sim.AssemblyPairSimulator.write(stria.sim.AssemblyPairSimulator.make(GenomeSimulator.generate("--seed",
                "31", "--size", "1300000", "--contigs", "3", "--satellites", "0", "--prefix", "asm"),
                stria.sim.AssemblyPairSimulator.Options.defaults(3)), b, dir.resolve("b.truth.tsv"));
        Cli.Result single = Cli.stria(dir, "compare", "-q", "--threads", "1", "--tsv", "single.tsv", "--a-bed",
                "single.a.bed", a.toString(), b.toString());
        assertThat(single.exit()).as(single.err()).isZero();

        List<String> cmd = List.of(Cli.projectDir().resolve("scripts/slurm/submit-compare.sh").toString(),
                "--shards", "3", "--scan-shards", "2", "--work", "work", "--tsv", "merged.tsv", "--a-bed", "merged.a.bed",
                "--sbatch", "--job-name=" + jobName, "--wait", "--", "-q", "--threads", "1", a.toString(), b.toString());
        Cli.Result r = Cli.exec(dir, null, cmd);
        assertThat(r.exit()).as("%s%s%s", r.out(), r.err(), logs()).isZero();
        assertThat(r.out()).contains("scan of a").contains("scan of b").contains("3 parts");
        assertThat(ShardedScanTest.dataSection(Files.readAllBytes(dir.resolve("merged.tsv"))))
                .isEqualTo(ShardedScanTest.dataSection(Files.readAllBytes(dir.resolve("single.tsv"))));
        assertThat(ShardedScanTest.dataSection(Files.readAllBytes(dir.resolve("merged.a.bed"))))
                .isEqualTo(ShardedScanTest.dataSection(Files.readAllBytes(dir.resolve("single.a.bed"))));
    }

    /** Runs submit-genome.sh with a bounded wait; on timeout the test's jobs are cancelled by name. */
    private Cli.Result submitWith(Map<String, String> env, String... args) {
        List<String> cmd = new ArrayList<>();
        cmd.add(Cli.projectDir().resolve("scripts/slurm/submit-genome.sh").toString());
        cmd.add("--sbatch");
        cmd.add("--job-name=" + jobName);
        cmd.addAll(List.of(args));
        try {
            ProcessBuilder pb = new ProcessBuilder(cmd).directory(dir.toFile());
            pb.environment().put("STRIA_CLASSPATH", System.getProperty("java.class.path"));
            pb.environment().putAll(env);
            Path out = dir.resolve("submit.out");
            Path err = dir.resolve("submit.err");
            pb.redirectOutput(out.toFile()).redirectError(err.toFile());
            Process p = pb.start();
            if (!p.waitFor(WAIT_MINUTES, TimeUnit.MINUTES)) {
                p.destroyForcibly();
                Cli.exec(dir, null, List.of("scancel", "--name=" + jobName));
                throw new AssertionError("jobs not done within " + WAIT_MINUTES + " minutes; cancelled " + jobName
                        + logs());
            }
            return new Cli.Result(p.exitValue(), Files.readString(out), Files.readString(err));
        } catch (IOException e) {
            throw new AssertionError(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            Cli.exec(dir, null, List.of("scancel", "--name=" + jobName));
            throw new AssertionError(e);
        }
    }

    private String logs() {
        StringBuilder sb = new StringBuilder();
        Path logs = dir.resolve("work/logs");
        if (Files.isDirectory(logs)) {
            try (var files = Files.list(logs)) {
                for (Path p : files.sorted().toList()) {
                    sb.append("\n--- ").append(p.getFileName()).append('\n').append(Files.readString(p));
                }
            } catch (IOException e) {
                sb.append("\n(cannot read logs: ").append(e.getMessage()).append(')');
            }
        }
        return sb.toString();
    }
}
