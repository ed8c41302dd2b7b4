package stria.testutil;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Random;

/** A small invented FASTA with a few planted repeats, for command tests that run many times. */
public final class SmallGenome {
    private SmallGenome() {
    }

    /** Two contigs of random bases with exact and imperfect repeats of periods 1 to 7 planted in them. */
    public static Path write(Path file, long seed) throws IOException {
        Random r = new Random(seed);
        StringBuilder fa = new StringBuilder();
        String[] motifs = {"A", "CA", "GAT", "TTAGG", "ACGTTGA"};
        for (int c = 1; c <= 2; c++) {
            StringBuilder s = new StringBuilder();
            for (int piece = 0; piece < 12; piece++) {
                for (int i = 0; i < 200; i++) {
                    s.append("ACGT".charAt(r.nextInt(4)));
                }
                String m = motifs[r.nextInt(motifs.length)];
                for (int copy = 0; copy < 8 + r.nextInt(10); copy++) {
                    for (int k = 0; k < m.length(); k++) {
                        s.append(r.nextInt(25) == 0 ? "ACGT".charAt(r.nextInt(4)) : m.charAt(k));
                    }
                }
            }
            fa.append(">ctg").append(c).append('\n');
            for (int i = 0; i < s.length(); i += 60) {
                fa.append(s, i, Math.min(s.length(), i + 60)).append('\n');
            }
        }
        Files.writeString(file, fa);
        return file;
    }
}
