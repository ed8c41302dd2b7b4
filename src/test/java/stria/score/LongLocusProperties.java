package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.statistics.Statistics;
import stria.io.Bases;
import stria.io.ContigBytes;
import stria.repeats.RunList;
import stria.sim.NaiveRuns;

/**
 * Long loci with bounded memory: the aligner keeps its traceback one segment at a time and reads its
 * template at a moving offset, and a locus longer than the scoring chunks is solved once for all of them.
 * Both are checked against the plain path: a planted repeat many segments long, with substitutions and
 * insertions or deletions, gives exactly the loci (coordinates, motif, purity, counts, score) of aligners
 * that hold the whole trace, whether the contig is called whole or in chunks (in parallel, sharing the
 * long component or not). An exact homopolymer or dinucleotide array is checked against a direct count:
 * one locus over the planted bases, purity 1 and the score the sum of its match columns.
 */
class LongLocusProperties {
    private static final ScoreSettings SETTINGS = new ScoreSettings(1, 100, 2.0, 10, 0.6, 20);

    /** Random flanks around a repeat of {@code motif} over {@code length} bases with errors. */
    private static byte[] planted(Random r, String motif, int length, int errorsPercent, int flank) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < flank; i++) {
            sb.append("ACGT".charAt(r.nextInt(4)));
        }
        int p = motif.length();
        int j = 0;
        int end = flank + length;
        while (sb.length() < end) {
            int e = r.nextInt(1000);
            char letter = motif.charAt(j % p);
            if (e < 5 * errorsPercent / 3) {
                sb.append("ACGT".charAt(r.nextInt(4))); // insertion
            } else if (e < 10 * errorsPercent / 3) {
                j++; // deletion
            } else if (e < 10 * errorsPercent) {
                sb.append("ACGT".charAt((("ACGT".indexOf(letter)) + 1 + r.nextInt(3)) % 4));
                j++;
            } else {
                sb.append(letter);
                j++;
            }
        }
        for (int i = 0; i < flank; i++) {
            sb.append("ACGT".charAt(r.nextInt(4)));
        }
        return sb.toString().getBytes(java.nio.charset.StandardCharsets.US_ASCII);
    }

    private static RunList seeds(LocusCaller caller, byte[] seq) {
        RunList runs = NaiveRuns.find(seq, seq.length, LocusCaller.SEED_MAX_PERIOD);
        RunList out = new RunList();
        for (int i = 0; i < runs.size(); i++) {
            if (caller.isSeed(runs.start(i), runs.end(i), runs.period(i))) {
                out.add(runs.start(i), runs.end(i), runs.period(i));
            }
        }
        return out;
    }

    /** The contig called in chunks of {@code chunk} bases on two threads, sharing components or not. */
    private static List<Locus> inChunks(LocusCaller caller, byte[] seq, RunList seeds, int chunk, int segment,
                                        boolean share) throws Exception {
        int len = seq.length;
        SharedComponents shared = share ? new SharedComponents() : null;
        ExecutorService pool = Executors.newFixedThreadPool(2);
        try {
            List<Future<List<Locus>>> parts = new ArrayList<>();
            for (int a = 0; a < len; a += chunk) {
                int from = a;
                int to = Math.min(len, a + chunk);
                parts.add(pool.submit(() -> caller.call(new ScoreWorkspace(segment, 8), ContigBytes.of(seq, len),
                        Background.uniform(), seeds, 0, len, from, to, shared)));
            }
            List<Locus> out = new ArrayList<>();
            for (Future<List<Locus>> f : parts) {
                out.addAll(f.get());
            }
            return out;
        } finally {
            pool.shutdownNow();
        }
    }

    @Property(tries = 40)
    void segmentedAndSharedGiveThePlainLoci(@ForAll long seed, @ForAll @IntRange(min = 1, max = 60) int p,
                                            @ForAll @IntRange(min = 0, max = 12) int errorsPercent,
                                            @ForAll @IntRange(min = 2000, max = 12000) int length,
                                            @ForAll @IntRange(min = 16, max = 300) int segment,
                                            @ForAll @IntRange(min = 300, max = 5000) int chunk) throws Exception {
        Random r = new Random(seed);
        StringBuilder motif = new StringBuilder();
        for (int i = 0; i < p; i++) {
            motif.append("ACGT".charAt(r.nextInt(4)));
        }
        byte[] seq = planted(r, motif.toString(), length, errorsPercent, 1500);
        int len = seq.length;
        LocusCaller caller = new LocusCaller(SETTINGS);
        RunList seeds = seeds(caller, seq);
        List<Locus> plain = caller.call(new ScoreWorkspace(), ContigBytes.of(seq, len), Background.uniform(), seeds,
                0, len, 0, len);
        List<Locus> segmented = caller.call(new ScoreWorkspace(segment, 8), ContigBytes.of(seq, len),
                Background.uniform(), seeds, 0, len, 0, len);
        assertThat(segmented).isEqualTo(plain);
        assertThat(inChunks(caller, seq, seeds, chunk, segment, true)).isEqualTo(plain);
        assertThat(inChunks(caller, seq, seeds, chunk, segment, false)).isEqualTo(plain);
        int longest = plain.stream().mapToInt(Locus::length).max().orElse(0);
        Statistics.label("longest locus, in segments").collect(Math.min(10, longest / segment));
        Statistics.label("longest locus, in chunks").collect(Math.min(5, longest / chunk));
    }

    /** Exact arrays against a direct count: one locus, every base matched, the score their match columns. */
    @Example
    void exactArraysAgainstADirectCount() throws Exception {
        for (String unit : new String[] {"A", "AC", "CAG"}) {
            // N on both sides: no repeat spans one, so the locus is exactly the planted bases
            int length = 60_000;
            String ns = "N".repeat(1000);
            byte[] seq = (ns + unit.repeat(length / unit.length() + 1).substring(0, length) + ns)
                    .getBytes(java.nio.charset.StandardCharsets.US_ASCII);
            int len = seq.length;
            LocusCaller caller = new LocusCaller(SETTINGS);
            RunList seeds = seeds(caller, seq);
            List<Locus> loci = inChunks(caller, seq, seeds, 4096, 1000, true);
            assertThat(loci).hasSize(1);
            Locus l = loci.get(0);
            assertThat(l.start()).isEqualTo(1000);
            assertThat(l.end()).isEqualTo(1000 + length);
            assertThat(l.period()).isEqualTo(unit.length());
            assertThat(l.purity()).isEqualTo(1.0);
            assertThat(l.mismatches() + l.insertions() + l.deletions()).isZero();
            int score = 0;
            ScoringModel m = ScoringModel.uniform();
            for (int x = l.start(); x < l.end(); x++) {
                score += m.match(Bases.code(seq[x]));
            }
            assertThat(l.score()).isEqualTo(ScoringModel.bits(score));
            assertThat(loci).isEqualTo(caller.call(seq, len, seeds, 0, len, 0, len));
        }
    }
}
