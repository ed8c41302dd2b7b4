package stria.out;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import stria.out.MaskedFastaWriter.Mode;

class MaskedFastaWriterTest {

    /** A contig with mixed-case input and a set of possibly overlapping, nested or empty intervals. */
    record Case(byte[] seq, int[] starts, int[] ends, int width) {
    }

    @Provide
    Arbitrary<Case> cases() {
        Arbitrary<Integer> lengths = Arbitraries.integers().between(0, 400);
        Arbitrary<Long> seeds = Arbitraries.longs();
        Arbitrary<Integer> widths = Arbitraries.integers().between(1, 80);
        return Combinators.combine(lengths, seeds, widths).as((n, seed, w) -> {
            Random r = new Random(seed);
            byte[] alphabet = "ACGTNacgtnRy".getBytes(StandardCharsets.US_ASCII);
            byte[] seq = new byte[n];
            for (int i = 0; i < n; i++) {
                seq[i] = alphabet[r.nextInt(alphabet.length)];
            }
            int k = n == 0 ? 0 : r.nextInt(12);
            int[][] iv = new int[k][];
            for (int j = 0; j < k; j++) {
                int a = r.nextInt(n + 1);
                int b = a + r.nextInt(n - a + 1);
                iv[j] = new int[] {a, b};
            }
            Arrays.sort(iv, (x, y) -> Integer.compare(x[0], y[0]));
            int[] s = new int[k];
            int[] e = new int[k];
            for (int j = 0; j < k; j++) {
                s[j] = iv[j][0];
                e[j] = iv[j][1];
            }
            return new Case(seq, s, e, w);
        });
    }

    @Property(tries = 300)
    void everyModeMasksExactlyTheIntervals(@ForAll("cases") Case c) {
        for (Mode mode : Mode.values()) {
            String fasta = write(mode, c.width(), "ctg", c.seq(), c.starts(), c.ends());
            String got = sequenceOf(fasta, c.width());
            boolean[] inRepeat = new boolean[c.seq().length];
            for (int j = 0; j < c.starts().length; j++) {
                for (int i = c.starts()[j]; i < c.ends()[j]; i++) {
                    inRepeat[i] = true;
                }
            }
            assertThat(got).hasSize(c.seq().length);
            for (int i = 0; i < c.seq().length; i++) {
                char in = (char) c.seq()[i];
                char expected = switch (mode) {
                    case SOFT -> inRepeat[i] ? Character.toLowerCase(in) : Character.toUpperCase(in);
                    case SOFT_KEEP -> inRepeat[i] ? Character.toLowerCase(in) : in;
                    case HARD -> inRepeat[i] ? 'N' : in;
                };
                assertThat(got.charAt(i)).as("%s at %d", mode, i).isEqualTo(expected);
            }
        }
    }

    @Test
    void recordsKeepNamesAndOrderAndLinesHaveFixedWidth() {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        MaskedFastaWriter w = new MaskedFastaWriter(bytes, Mode.SOFT, 4);
        w.writeContig("chrB", "acgtACGTac".getBytes(StandardCharsets.US_ASCII), 10, new int[] {2}, new int[] {5}, 1);
        w.writeContig("empty", new byte[0], 0, new int[0], new int[0], 0);
        w.writeContig("chrA", "GGGG".getBytes(StandardCharsets.US_ASCII), 4, new int[0], new int[0], 0);
        w.close();
        assertThat(bytes.toString(StandardCharsets.US_ASCII))
                .isEqualTo(">chrB\nACgt\naCGT\nAC\n>empty\n>chrA\nGGGG\n");
    }

    @Test
    void onlyTheGivenLengthOfTheBufferIsWritten() {
        byte[] seq = "ACGTACGTxxxx".getBytes(StandardCharsets.US_ASCII);
        String fasta = write(Mode.SOFT, 60, "c", Arrays.copyOf(seq, seq.length), new int[] {0}, new int[] {2}, 8);
        assertThat(fasta).isEqualTo(">c\nacGTACGT\n");
    }

    @Test
    void rejectsIntervalsOutsideTheContigOrUnsorted() {
        MaskedFastaWriter w = new MaskedFastaWriter(new ByteArrayOutputStream(), Mode.SOFT);
        byte[] seq = new byte[10];
        Arrays.fill(seq, (byte) 'A');
        assertThatThrownBy(() -> w.writeContig("c", seq, 10, new int[] {5}, new int[] {11}, 1))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("outside");
        assertThatThrownBy(() -> w.writeContig("c", seq, 10, new int[] {5, 2}, new int[] {6, 3}, 2))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("not sorted");
    }

    @Test
    void samtoolsIndexesTheBgzfOutputAndReturnsTheMaskedBases(@TempDir Path dir) throws Exception {
        stria.testutil.Cli.needTool("samtools");

        Random r = new Random(20261202L);
        List<byte[]> seqs = new ArrayList<>();
        List<int[][]> ivs = new ArrayList<>();
        String[] names = {"ctg", "second", "third"};
        int[] lengths = {5000, 123, 70001};
        for (int n : lengths) {
            byte[] s = new byte[n];
            for (int i = 0; i < n; i++) {
                s[i] = (byte) "ACGTacgt".charAt(r.nextInt(8));
            }
            seqs.add(s);
            int k = n / 50;
            int[] st = new int[k];
            int[] en = new int[k];
            int pos = 0;
            for (int j = 0; j < k; j++) {
                pos = Math.min(n - 1, pos + r.nextInt(60));
                st[j] = pos;
                en[j] = Math.min(n, pos + 1 + r.nextInt(40));
            }
            ivs.add(new int[][] {st, en});
        }
        Path out = dir.resolve("masked.fa.gz");
        try (AtomicOutputs outs = new AtomicOutputs()) {
            OutputStream os = outs.open(out.toString());
            MaskedFastaWriter w = new MaskedFastaWriter(os, Mode.SOFT);
            for (int c = 0; c < names.length; c++) {
                w.writeContig(names[c], seqs.get(c), lengths[c], ivs.get(c)[0], ivs.get(c)[1], ivs.get(c)[0].length);
            }
            w.close();
            outs.commit();
        }
        assertThat(run(dir, "samtools", "faidx", out.toString())).isEqualTo("");
        assertThat(dir.resolve("masked.fa.gz.fai")).exists();
        assertThat(dir.resolve("masked.fa.gz.gzi")).exists();

        // 1-based inclusive region ctg:100-200 is 0-based [99, 200)
        String expected = brute(seqs.get(0), ivs.get(0)[0], ivs.get(0)[1]).substring(99, 200);
        String got = run(dir, "samtools", "faidx", out.toString(), "ctg:100-200");
        assertThat(got.lines().skip(1).reduce("", String::concat)).isEqualTo(expected);

        String far = brute(seqs.get(2), ivs.get(2)[0], ivs.get(2)[1]).substring(65000, 65120);
        String got2 = run(dir, "samtools", "faidx", out.toString(), "third:65001-65120");
        assertThat(got2.lines().skip(1).reduce("", String::concat)).isEqualTo(far);
    }

    private static String brute(byte[] seq, int[] s, int[] e) {
        char[] c = new String(seq, StandardCharsets.US_ASCII).toUpperCase().toCharArray();
        for (int j = 0; j < s.length; j++) {
            for (int i = s[j]; i < e[j]; i++) {
                c[i] = Character.toLowerCase(c[i]);
            }
        }
        return new String(c);
    }

    private static String write(Mode mode, int width, String name, byte[] seq, int[] s, int[] e) {
        return write(mode, width, name, seq, s, e, seq.length);
    }

    private static String write(Mode mode, int width, String name, byte[] seq, int[] s, int[] e, int length) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        MaskedFastaWriter w = new MaskedFastaWriter(bytes, mode, width);
        w.writeContig(name, seq, length, s, e, s.length);
        w.close();
        return bytes.toString(StandardCharsets.US_ASCII);
    }

    /** The sequence of a one-record FASTA, checking that every line but the last has the given width. */
    private static String sequenceOf(String fasta, int width) {
        String[] lines = fasta.split("\n", -1);
        assertThat(lines[0]).isEqualTo(">ctg");
        assertThat(lines[lines.length - 1]).as("ends with a newline").isEmpty();
        StringBuilder sb = new StringBuilder();
        for (int i = 1; i < lines.length - 1; i++) {
            if (i < lines.length - 2) {
                assertThat(lines[i]).hasSize(width);
            } else {
                assertThat(lines[i].length()).isBetween(1, width);
            }
            sb.append(lines[i]);
        }
        return sb.toString();
    }

    private static String run(Path dir, String... cmd) throws IOException, InterruptedException {
        Process p = new ProcessBuilder(cmd).directory(dir.toFile()).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.US_ASCII);
        assertThat(p.waitFor(60, TimeUnit.SECONDS)).isTrue();
        assertThat(p.exitValue()).as("%s: %s", String.join(" ", cmd), out).isZero();
        return out;
    }
}
