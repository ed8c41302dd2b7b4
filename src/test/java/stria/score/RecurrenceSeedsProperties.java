package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import stria.io.Bases;
import stria.repeats.RunList;

/**
 * Recurrence seeds against their definition computed directly: the previous occurrence of each word by a
 * scan backwards, agreement counted afresh over every window, the quick test on the bases beside the word
 * wherever a window does not continue the one before at the same distance. Between two bounds that need
 * no state at all: every seed agrees over its full window, and every position that agrees over its full
 * window and beside its word is a seed. On planted repeats at 85 to 95 % identity the seeds cover the
 * repeat at its period; random sequence gives almost none.
 */
class RecurrenceSeedsProperties {

    /** A random sequence with planted imperfect repeats, some lower case, some N. */
    private static byte[] planted(Random r, int length) {
        StringBuilder sb = new StringBuilder();
        while (sb.length() < length) {
            int kind = r.nextInt(3);
            if (kind == 0) {
                int p = RecurrenceSeeds.MIN_PERIOD + r.nextInt(60);
                String unit = random(r, p);
                int copies = 2 + r.nextInt(8);
                int errors = 5 + r.nextInt(11);
                for (int i = 0; i < p * copies; i++) {
                    char c = unit.charAt(i % p);
                    int e = r.nextInt(100);
                    if (e < errors / 3) {
                        continue;
                    }
                    sb.append(e < errors ? "ACGT".charAt(r.nextInt(4)) : c);
                }
            } else if (kind == 1) {
                sb.append(random(r, r.nextInt(200)));
            } else if (r.nextInt(8) == 0) {
                sb.append("NNNN");
            } else {
                sb.append(random(r, r.nextInt(40)).toLowerCase());
            }
        }
        return sb.substring(0, length).getBytes(StandardCharsets.US_ASCII);
    }

    private static String random(Random r, int n) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < n; i++) {
            sb.append("ACGT".charAt(r.nextInt(4)));
        }
        return sb.toString();
    }

    private static boolean isBase(byte b) {
        int c = Bases.code(b);
        return c >= 0 && c <= 3;
    }

    private static int agrees(byte[] seq, int x, int d) {
        return isBase(seq[x]) && Bases.code(seq[x]) == Bases.code(seq[x - d]) ? 1 : 0;
    }

    private static int agreement(byte[] seq, int x0, int x1, int d) {
        int n = 0;
        for (int x = x0; x < x1; x++) {
            n += agrees(seq, x, d);
        }
        return n;
    }

    private static int quick(byte[] seq, int start, int d, int length) {
        return agreement(seq, Math.max(d, start - 8), start, d)
                + agreement(seq, start + RecurrenceSeeds.K, Math.min(length, start + RecurrenceSeeds.K + 8), d);
    }

    /** Distance to the previous occurrence in [from, start) of the word at start, or -1. */
    private static int previous(byte[] seq, int from, int start) {
        for (int s = start - 1; s >= from; s--) {
            boolean same = true;
            for (int k = 0; k < RecurrenceSeeds.K && same; k++) {
                same = isBase(seq[s + k]) && Bases.code(seq[s + k]) == Bases.code(seq[start + k]);
            }
            if (same) {
                return start - s;
            }
        }
        return -1;
    }

    private static boolean wordIsBases(byte[] seq, int start) {
        for (int k = 0; k < RecurrenceSeeds.K; k++) {
            if (!isBase(seq[start + k])) {
                return false;
            }
        }
        return true;
    }

    /** Seed positions as {start, d}, by the definition; {@code bound} 0: exact, 1: lower bound, 2: upper. */
    private static List<int[]> direct(byte[] seq, int length, int from, int to, int maxPeriod, int bound) {
        List<int[]> out = new ArrayList<>();
        if (maxPeriod < RecurrenceSeeds.MIN_PERIOD) {
            return out;
        }
        int maxD = Math.min(maxPeriod, RecurrenceSeeds.MAX_DISTANCE);
        int half = RecurrenceSeeds.WINDOW / 2;
        int wd = -1;
        int wx0 = 0;
        int wx1 = 0;
        for (int start = from; start + RecurrenceSeeds.K <= to; start++) {
            if (!wordIsBases(seq, start)) {
                continue;
            }
            int d = previous(seq, from, start);
            if (d < RecurrenceSeeds.MIN_PERIOD || d > maxD) {
                continue;
            }
            int x0 = Math.max(start - half, d);
            int x1 = Math.min(start + half, length);
            if (x1 - x0 < RecurrenceSeeds.AGREE) {
                continue;
            }
            boolean quickOk = quick(seq, start, d, length) >= RecurrenceSeeds.QUICK;
            boolean full = agreement(seq, x0, x1, d) >= RecurrenceSeeds.AGREE;
            if (bound == 0) {
                boolean continues = d == wd && x0 >= wx0 && x0 <= wx1;
                if (!continues && !quickOk) {
                    continue;
                }
                wd = d;
                wx0 = x0;
                wx1 = x1;
            } else if (bound == 1 && !quickOk) {
                continue;
            }
            if (full) {
                out.add(new int[] {start, d});
            }
        }
        return out;
    }

    /** Seed positions of one distance at consecutive starts, as reported: [first - d, last + K), period d. */
    private static RunList blocks(List<int[]> seeds) {
        RunList out = new RunList();
        int i = 0;
        while (i < seeds.size()) {
            int j = i;
            while (j + 1 < seeds.size() && seeds.get(j + 1)[1] == seeds.get(i)[1]
                    && seeds.get(j + 1)[0] == seeds.get(j)[0] + 1) {
                j++;
            }
            int d = seeds.get(i)[1];
            out.add(seeds.get(i)[0] - d, seeds.get(j)[0] + RecurrenceSeeds.K, d);
            i = j + 1;
        }
        return out;
    }

    private static List<int[]> positions(RunList blocks) {
        List<int[]> out = new ArrayList<>();
        for (int b = 0; b < blocks.size(); b++) {
            int d = blocks.period(b);
            for (int s = blocks.start(b) + d; s + RecurrenceSeeds.K <= blocks.end(b); s++) {
                out.add(new int[] {s, d});
            }
        }
        return out;
    }

    private static List<String> keys(List<int[]> seeds) {
        return seeds.stream().map(s -> s[0] + "@" + s[1]).toList();
    }

    @Property(tries = 150)
    void seedsMatchTheirDefinition(@ForAll long seed, @ForAll @IntRange(min = 200, max = 3000) int length,
                                   @ForAll @IntRange(min = 1, max = 400) int maxPeriod) {
        Random r = new Random(seed);
        byte[] seq = planted(r, length);
        int from = r.nextInt(length / 4);
        int to = length - r.nextInt(length / 4);
        RunList got = new RunList();
        new RecurrenceSeeds().find(seq, length, from, to, maxPeriod, got);

        RunList want = blocks(direct(seq, length, from, to, maxPeriod, 0));
        assertThat(got.size()).isEqualTo(want.size());
        for (int i = 0; i < got.size(); i++) {
            assertThat(new int[] {got.start(i), got.end(i), got.period(i)})
                    .containsExactly(want.start(i), want.end(i), want.period(i));
        }
        List<String> found = keys(positions(got));
        assertThat(found).containsAll(keys(direct(seq, length, from, to, maxPeriod, 1)));
        assertThat(keys(direct(seq, length, from, to, maxPeriod, 2))).containsAll(found);
    }

    @Property(tries = 100)
    void plantedRepeatsAreSeededAtTheirPeriod(@ForAll long seed, @ForAll @IntRange(min = 7, max = 80) int p,
                                              @ForAll @IntRange(min = 5, max = 15) int errorsPercent) {
        Random r = new Random(seed);
        String unit = random(r, p);
        StringBuilder mid = new StringBuilder();
        int copies = Math.max(6, 400 / p);
        for (int i = 0; i < p * copies; i++) {
            mid.append(r.nextInt(100) < errorsPercent ? "ACGT".charAt(r.nextInt(4)) : unit.charAt(i % p));
        }
        int flank = 300;
        byte[] seq = (random(r, flank) + mid + random(r, flank)).getBytes(StandardCharsets.US_ASCII);
        RunList got = new RunList();
        new RecurrenceSeeds().find(seq, seq.length, 0, seq.length, 2000, got);
        // bases of the repeat inside a seed of period p, a base or two off, or a multiple of it
        boolean[] covered = new boolean[seq.length];
        for (int i = 0; i < got.size(); i++) {
            int d = got.period(i);
            int m = Math.max(1, Math.round(d / (float) p));
            if (Math.abs(d - m * p) <= 2) {
                for (int x = got.start(i); x < got.end(i); x++) {
                    covered[x] = true;
                }
            }
        }
        int hit = 0;
        for (int x = flank; x < flank + mid.length(); x++) {
            hit += covered[x] ? 1 : 0;
        }
        assertThat(hit).isGreaterThanOrEqualTo(mid.length() / 2);
    }

    /**
     * Chance agreement of 32 in 64 at a quarter each is rare: measured, 4 to 12 seeds per 200 kb of random
     * sequence (20 sequences, mean 8). 30 lies far out in the Poisson tail of that, while a threshold four
     * lower gives about 90. The definition test reads the thresholds from the class; this one holds the
     * rate they give.
     */
    @Property(tries = 5)
    void randomSequenceGivesAlmostNoSeeds(@ForAll long seed) {
        byte[] seq = random(new Random(seed), 200_000).getBytes(StandardCharsets.US_ASCII);
        RunList got = new RunList();
        new RecurrenceSeeds().find(seq, seq.length, 0, seq.length, 2000, got);
        assertThat(got.size()).isLessThanOrEqualTo(30);
    }
}
