package stria.bench;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;
import stria.io.ContigInfo;
import stria.io.GenomeReader;

/**
 * Writes a near-identical copy of a genome for the comparison benchmark: every contig with background
 * substitutions (0.1 %) and small insertions and deletions (0.01 %, 1-3 bases), N kept, from a fixed seed
 * (as {@link CompareBench} makes its second genome).
 *
 * <p>Usage: {@code java -cp target/stria-tools.jar:target/stria.jar stria.bench.MutateFasta IN.fa OUT.fa}
 */
public final class MutateFasta {
    private MutateFasta() {
    }

    public static void main(String[] args) throws IOException {
        if (args.length != 2) {
            System.err.println("usage: MutateFasta IN.fa OUT.fa");
            System.exit(2);
        }
        try (GenomeReader r = GenomeReader.open(args[0], System.err::println);
             OutputStream os = new BufferedOutputStream(Files.newOutputStream(Path.of(args[1])), 1 << 16)) {
            int i = 0;
            for (ContigInfo c : r.contigs()) {
                byte[] s = CompareBench.mutate(r.sequence(c), new SplittableRandom(0x5EED_C0DEL + i++));
                os.write((">" + c.name() + " mutated copy\n").getBytes());
                for (int at = 0; at < s.length; at += 60) {
                    os.write(s, at, Math.min(60, s.length - at));
                    os.write('\n');
                }
            }
        }
    }
}
