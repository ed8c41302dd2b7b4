package stria.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.statistics.Statistics;
import stria.io.ContigBytes;
import stria.repeats.RunList;
import stria.sim.GenomeSimulator;
import stria.sim.NaiveRuns;

/**
 * The contract the pipeline relies on: pieces of a contig, however cut and whatever stretch of runs is
 * known, give exactly the loci of the whole contig, or ask for more context.
 */
class LocusCallerContractProperties {
    private static final ScoreSettings SETTINGS = new ScoreSettings(1, 100, 2.0, 10, 0.6, 20);

    private static byte[] genome(long seed, int size) {
        // dense planted repeats of periods up to 60, a gap of N and a lower-case stretch
        GenomeSimulator.Genome g = GenomeSimulator.generate("--seed", Long.toString(seed), "--size",
                Integer.toString(size), "--contigs", "1", "--density", "2500", "--max-period", "60",
                "--satellites", "0", "--gaps", "1", "--lower", "1");
        return g.sequences().get(0);
    }

    private static RunList seeds(LocusCaller caller, byte[] seq, int lo, int hi) {
        // what the pipeline hands over: runs of the known stretch only, clipped at its ends
        byte[] part = java.util.Arrays.copyOfRange(seq, lo, hi);
        RunList runs = NaiveRuns.find(part, part.length, LocusCaller.SEED_MAX_PERIOD);
        RunList out = new RunList();
        for (int i = 0; i < runs.size(); i++) {
            int s = runs.start(i) + lo;
            int e = runs.end(i) + lo;
            if (caller.isSeed(s, e, runs.period(i))) {
                out.add(s, e, runs.period(i));
            }
        }
        return out;
    }

    private static List<Locus> restrict(List<Locus> all, int from, int to) {
        List<Locus> out = new ArrayList<>();
        for (Locus l : all) {
            if (l.start() >= from && l.start() < to) {
                out.add(l);
            }
        }
        return out;
    }

    @Property(tries = 60)
    void piecesConcatenateToTheWholeContig(@ForAll long seed, @ForAll @IntRange(min = 0, max = 1000) int c1,
                                           @ForAll @IntRange(min = 0, max = 1000) int c2) {
        byte[] seq = genome(seed, 16000);
        int len = seq.length;
        LocusCaller caller = new LocusCaller(SETTINGS);
        RunList all = seeds(caller, seq, 0, len);
        List<Locus> whole = caller.call(seq, len, all, 0, len, 0, len);
        int a = (int) ((long) Math.min(c1, c2) * len / 1000);
        int b = (int) ((long) Math.max(c1, c2) * len / 1000);
        List<Locus> joined = new ArrayList<>();
        joined.addAll(caller.call(seq, len, all, 0, len, 0, a));
        joined.addAll(caller.call(seq, len, all, 0, len, a, b));
        joined.addAll(caller.call(seq, len, all, 0, len, b, len));
        assertThat(joined).isEqualTo(whole);
        assertThat(whole).isNotEmpty();
    }

    @Property(tries = 80)
    void aKnownStretchGivesTheWholeContigAnswerOrAsksForMore(@ForAll long seed,
                                                             @ForAll @IntRange(min = 0, max = 1000) int f,
                                                             @ForAll @IntRange(min = 1, max = 3000) int width,
                                                             @ForAll @IntRange(min = 0, max = 9000) int left,
                                                             @ForAll @IntRange(min = 0, max = 9000) int right) {
        byte[] seq = genome(seed, 24000);
        int len = seq.length;
        LocusCaller caller = new LocusCaller(SETTINGS);
        List<Locus> whole = caller.call(seq, len, seeds(caller, seq, 0, len), 0, len, 0, len);
        int from = (int) ((long) f * (len - 1) / 1000);
        int to = Math.min(len, from + width);
        int lo = Math.max(0, from - left);
        int hi = Math.min(len, to + right);
        List<Locus> part;
        try {
            part = caller.call(seq, len, seeds(caller, seq, lo, hi), lo, hi, from, to);
        } catch (NeedMoreContextException e) {
            Statistics.label("outcome").collect("more context");
            return;
        }
        Statistics.label("outcome").collect("answered");
        assertThat(part).isEqualTo(restrict(whole, from, to));
    }

    @Property(tries = 40)
    void enoughContextAlwaysAnswers(@ForAll long seed, @ForAll @IntRange(min = 0, max = 1000) int f) {
        answersWithEnoughContext(seed, f);
    }

    /** Four long loci about a hundred bases apart, one stretch of joined reaches 6 kb long. */
    @Example
    void enoughContextAnswersAcrossAChainOfLoci() {
        answersWithEnoughContext(4004478, 229);
    }

    private static void answersWithEnoughContext(long seed, int f) {
        byte[] seq = genome(seed, 30000);
        int len = seq.length;
        LocusCaller caller = new LocusCaller(SETTINGS);
        int from = (int) ((long) f * (len - 1) / 1000);
        int to = Math.min(len, from + 2000);
        List<Locus> whole = caller.call(seq, len, seeds(caller, seq, 0, len), 0, len, 0, len);
        // planted loci can lie a few dozen bases apart, and the reaches of their seeds then join them into
        // one stretch without a quiet point: follow such chains of loci out from [from, to), then add room
        // for a planted locus (at most 60 x 40 bases) and for the seeds around it
        int join = 2 * QuietPoints.reach(SETTINGS.maxPeriod());
        int a = from;
        int b = to;
        for (boolean grew = true; grew; ) {
            grew = false;
            for (Locus l : whole) {
                if (l.start() < a && l.end() + join > a) {
                    a = l.start();
                    grew = true;
                }
                if (l.end() > b && l.start() - join < b) {
                    b = l.end();
                    grew = true;
                }
            }
        }
        int margin = 3 * caller.minimumContext() + 2 * 2400;
        int lo = Math.max(0, a - margin);
        int hi = Math.min(len, b + margin);
        assertThat(caller.call(seq, len, seeds(caller, seq, lo, hi), lo, hi, from, to))
                .isEqualTo(restrict(whole, from, to));
    }

    /** A contig that is only copied from, never lent as an array, as when it sits in a temporary file. */
    private static ContigBytes copiesOnly(byte[] seq, int[] copied) {
        return new ContigBytes() {
            @Override
            public int length() {
                return seq.length;
            }

            @Override
            public void copy(int from, int to, byte[] dst, int off) {
                copied[0] += to - from;
                System.arraycopy(seq, from, dst, off, to - from);
            }
        };
    }

    /**
     * Solving copies of stretches gives what solving on the whole array gives, the request for more
     * context included.
     */
    @Property(tries = 80)
    void copiesOfStretchesGiveWhatTheArrayGives(@ForAll long seed, @ForAll @IntRange(min = 0, max = 1000) int f,
                                                @ForAll @IntRange(min = 1, max = 3000) int width,
                                                @ForAll @IntRange(min = 0, max = 1000) int left,
                                                @ForAll @IntRange(min = 0, max = 1000) int right) {
        byte[] seq = genome(seed, 40000);
        int len = seq.length;
        LocusCaller caller = new LocusCaller(SETTINGS);
        int from = (int) ((long) f * (len - 1) / 1000);
        int to = Math.min(len, from + width);
        // per mille of the contig on each side: small stretches that ask for more and large ones that answer
        int lo = Math.max(0, from - left * len / 1000);
        int hi = Math.min(len, to + right * len / 1000);
        RunList known = seeds(caller, seq, lo, hi);
        String fromArray;
        try {
            fromArray = caller.call(seq, len, known, lo, hi, from, to).toString();
        } catch (NeedMoreContextException e) {
            fromArray = "more context";
        }
        int[] copied = {0};
        String fromCopies;
        try {
            fromCopies = caller.call(copiesOnly(seq, copied), known, lo, hi, from, to).toString();
        } catch (NeedMoreContextException e) {
            fromCopies = "more context";
        }
        Statistics.label("outcome").collect(fromArray.equals("more context") ? "more context" : "answered");
        assertThat(fromCopies).isEqualTo(fromArray);
        assertThat(copied[0]).isPositive();
    }
}
