package stria.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.testutil.Cli;

/**
 * A full disk while writing, outputs or the temporary copy of a long contig: the real command on a tiny
 * tmpfs (root only; CI runs as root) must say so in one line, exit 1, and leave neither output nor
 * temporary files behind.
 */
class DiskFullTest {
    @TempDir
    Path dir;

    @Tag("slow")
    @Test
    void aFullDiskIsReportedAndLeavesNothingBehind() throws IOException {
        Path mnt = Files.createDirectory(dir.resolve("tiny"));
        Cli.Result mount = Cli.exec(dir, null, List.of("mount", "-t", "tmpfs", "-o", "size=256k", "tmpfs",
                mnt.toString()));
        if (mount.exit() != 0) {
            if (Cli.requireTools()) {
                throw new AssertionError("cannot mount a tmpfs for the disk-full test: " + mount.err());
            }
            Assumptions.assumeTrue(false, "needs root to mount a small tmpfs");
        }
        try {
            for (String[] outputs : new String[][] {
                {"--bed", mnt.resolve("out.bed").toString()},
                {"--tsv", mnt.resolve("out.tsv").toString(), "--bed", mnt.resolve("out.bed.gz").toString()}}) {
                String[] args = Stream.concat(Stream.of("scan", "--exact", "--min-length", "2"),
                        Stream.concat(Stream.of(outputs), Stream.of(ScanCommandTest.DEMO.toString())))
                        .toArray(String[]::new);
                Cli.Result r = Cli.stria(dir, args);
                assertThat(r.exit()).as(r.err()).isEqualTo(1);
                assertThat(r.err().strip().lines().count()).as(r.err()).isEqualTo(1);
                assertThat(r.err()).contains("no space left on device").contains(mnt.toString());
                try (Stream<Path> left = Files.list(mnt)) {
                    assertThat(left.toList()).as("files left on the full disk").isEmpty();
                }
            }
            // the temporary copy of a contig longer than 4 Mb, with TMPDIR on the full disk
            Path longContig = dir.resolve("long.fa");
            Random rnd = new Random(7);
            StringBuilder fa = new StringBuilder(">long\n");
            for (int i = 0; i < 5_000_000; i++) {
                fa.append("ACGT".charAt(rnd.nextInt(4)));
                if (i % 80 == 79) {
                    fa.append('\n');
                }
            }
            Files.writeString(longContig, fa.append('\n'));
            Cli.Result r = Cli.exec(dir, null, List.of("env", "TMPDIR=" + mnt,
                    Cli.projectDir().resolve("scripts/stria").toString(), "scan", "--bed",
                    dir.resolve("spooled.bed").toString(), longContig.toString()));
            assertThat(r.exit()).as(r.err()).isEqualTo(1);
            assertThat(r.err().strip().lines().count()).as(r.err()).isEqualTo(1);
            assertThat(r.err()).containsIgnoringCase("no space left on device").contains(mnt.toString())
                    .contains("TMPDIR");
            assertThat(dir.resolve("spooled.bed")).doesNotExist();
            try (Stream<Path> left = Files.list(mnt)) {
                assertThat(left.toList()).as("files left in TMPDIR").isEmpty();
            }
        } finally {
            Cli.exec(dir, null, List.of("umount", mnt.toString()));
        }
    }
}
