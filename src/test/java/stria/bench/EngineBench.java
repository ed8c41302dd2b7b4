package stria.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import java.util.Locale;
import java.util.SplittableRandom;

import stria.index.LcpArray;
import stria.index.ShallowSuffixArray;
import stria.index.SuffixArray;
import stria.io.Bases;
import stria.repeats.RunFinder;
import stria.repeats.RunList;

/**
 * Throughput of the exact-run engine on one thread: suffix array, LCP array (both methods), run
 * enumeration from the index, and the whole {@link RunFinder#find}, over a fixed invented 16 Mb genome cut
 * into windows.
 *
 * <p>Usage: {@code java -cp target/stria.jar stria.bench.EngineBench [window [rounds [maxPeriod]]]}, window
 * in letters with an optional k or M suffix (default 4M), rounds measured after two warm-up rounds
 * (default 5), maxPeriod default 2000. Reports the median MB/s of the rounds, by thread CPU time where
 * the JVM measures it (other processes on a shared machine then do not count), and by wall clock.
 */
public final class EngineBench {
    private static final int GENOME = 16_000_000;
    private static final long SEED = 0x5EED_57A1AL;

    private EngineBench() {
    }

    public static void main(String[] args) {
        int window = args.length > 0 ? parseSize(args[0]) : 4_000_000;
        int rounds = args.length > 1 ? Integer.parseInt(args[1]) : 5;
        int maxPeriod = args.length > 2 ? Integer.parseInt(args[2]) : 2000;
        if (window < 1 || rounds < 1 || maxPeriod < 1) {
            System.err.println("usage: EngineBench [window >= 1, k/M suffix allowed [rounds >= 1 [maxPeriod >= 1]]]");
            System.exit(2);
        }
        byte[] genome = genome(GENOME, SEED);

        System.out.printf(Locale.ROOT, "genome %d letters, windows of %d, maxPeriod %d, %d rounds after 2 warm-up, "
                + "%d cores, java %s%n", genome.length, window, maxPeriod, rounds,
                Runtime.getRuntime().availableProcessors(), System.getProperty("java.version"));
        String[] stages = {"suffix array (SA-IS)", "LCP (Phi)", "LCP (Kasai)", "shallow SA+LCP (depth 13)",
            "runs from SA+LCP", "RunFinder.find"};
        double[][] mbps = new double[stages.length][rounds];
        long runs = 0;
        SuffixArray sorter = new SuffixArray();
        ShallowSuffixArray shallow = new ShallowSuffixArray();
        RunFinder finder = new RunFinder();
        int[] sa = new int[window];
        int[] lcp = new int[window];
        int[] work = new int[window];
        int[] work2 = new int[window];
        int[] work3 = new int[window];
        RunList out = new RunList(1 << 16);
        ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        boolean cpu = threads.isCurrentThreadCpuTimeSupported();
        double[][] wall = new double[stages.length][rounds];
        for (int round = -2; round < rounds; round++) {
            long[] nanos = new long[stages.length];
            long[] wallNanos = new long[stages.length];
            runs = 0;
            for (int from = 0; from < genome.length; from += window) {
                int len = Math.min(window, genome.length - from);
                for (int s = 0; s < stages.length; s++) {
                    long w0 = System.nanoTime();
                    long c0 = cpu ? threads.getCurrentThreadCpuTime() : 0;
                    switch (s) {
                        case 0 -> sorter.sort(genome, from, len, Bases.BREAK + 1, sa);
                        case 1 -> LcpArray.phi(genome, from, len, sa, lcp, work);
                        case 2 -> LcpArray.kasai(genome, from, len, sa, work, work2);
                        // the index imperfect mode asks for: runs up to the seed period 12
                        case 3 -> shallow.build(genome, from, len, 13, Bases.BREAK + 1, work2, work, work3);
                        case 4 -> {
                            out.clear();
                            finder.runsFromIndex(genome, from, len, sa, lcp, maxPeriod, out);
                        }
                        default -> {
                            out.clear();
                            finder.find(genome, from, len, maxPeriod, out);
                            runs += out.size();
                        }
                    }
                    long c1 = cpu ? threads.getCurrentThreadCpuTime() : 0;
                    long w1 = System.nanoTime();
                    wallNanos[s] += w1 - w0;
                    nanos[s] += cpu ? c1 - c0 : w1 - w0;
                }
            }
            if (round >= 0) {
                for (int s = 0; s < stages.length; s++) {
                    mbps[s][round] = genome.length / 1e6 / (nanos[s] / 1e9);
                    wall[s][round] = genome.length / 1e6 / (wallNanos[s] / 1e9);
                }
            }
        }
        // the machine is shared: thread CPU time leaves out the time other processes hold the core
        System.out.printf(Locale.ROOT, "MB/s by %s; last column by wall clock%n", cpu ? "thread CPU time" : "wall clock");
        System.out.printf(Locale.ROOT, "%-26s %8s %8s %8s %8s%n", "stage", "median", "min", "max", "wall");
        for (int s = 0; s < stages.length; s++) {
            double[] v = mbps[s].clone();
            Arrays.sort(v);
            double[] w = wall[s].clone();
            Arrays.sort(w);
            System.out.printf(Locale.ROOT, "%-26s %8.1f %8.1f %8.1f %8.1f%n", stages[s], v[v.length / 2], v[0],
                    v[v.length - 1], w[w.length / 2]);
        }
        System.out.printf(Locale.ROOT, "runs found: %d%n", runs);
    }

    private static int parseSize(String s) {
        String t = s.trim().toUpperCase(Locale.ROOT);
        int mult = 1;
        if (t.endsWith("K")) {
            mult = 1000;
            t = t.substring(0, t.length() - 1);
        } else if (t.endsWith("M")) {
            mult = 1_000_000;
            t = t.substring(0, t.length() - 1);
        }
        return Math.toIntExact((long) (Double.parseDouble(t) * mult));
    }

    /**
     * Invented genome as codes: uniform random background, a planted repeat every few kb (periods 1..500,
     * mostly short, exact or with substitutions, insertions and deletions), a 300 kb satellite array of a 171-letter
     * unit with a 12-unit higher-order pattern, and two assembly gaps of BREAK.
     */
    static byte[] genome(int n, long seed) {
        SplittableRandom rnd = new SplittableRandom(seed);
        byte[] g = new byte[n];
        for (int i = 0; i < n; i++) {
            g[i] = (byte) rnd.nextInt(4);
        }
        for (int at = 1000; at < n - 6000; at += 1000 + rnd.nextInt(4000)) {
            int r = rnd.nextInt(100);
            int p = r < 50 ? 1 + rnd.nextInt(6) : r < 85 ? 7 + rnd.nextInt(54) : 61 + rnd.nextInt(440);
            int length = Math.min(5000, p * (2 + rnd.nextInt(p < 10 ? 30 : 8)));
            double error = rnd.nextInt(3) == 0 ? 0 : rnd.nextDouble() * 0.1;
            plant(g, at, length, p, error, rnd);
        }
        int satStart = n / 2;
        byte[] unit = new byte[171];
        for (int i = 0; i < unit.length; i++) {
            unit[i] = (byte) rnd.nextInt(4);
        }
        byte[][] hor = new byte[12][];
        for (int h = 0; h < hor.length; h++) {
            hor[h] = unit.clone();
            for (int k = 0; k < 30; k++) {
                hor[h][rnd.nextInt(unit.length)] = (byte) rnd.nextInt(4);
            }
        }
        for (int i = 0, u = 0; i < 300_000; u++) {
            byte[] copy = hor[u % hor.length];
            for (int k = 0; k < copy.length && i < 300_000; k++, i++) {
                g[satStart + i] = rnd.nextInt(100) == 0 ? (byte) rnd.nextInt(4) : copy[k];
            }
        }
        Arrays.fill(g, n / 4, n / 4 + 50_000, Bases.BREAK);
        Arrays.fill(g, 3 * (n / 4), 3 * (n / 4) + 10_000, Bases.BREAK);
        return g;
    }

    private static void plant(byte[] g, int at, int length, int p, double error, SplittableRandom rnd) {
        byte[] motif = new byte[p];
        for (int i = 0; i < p; i++) {
            motif[i] = (byte) rnd.nextInt(4);
        }
        int phase = 0;
        for (int i = 0; i < length; i++) {
            int kind = error > 0 && rnd.nextDouble() < error ? rnd.nextInt(3) : -1;
            if (kind == 0) {
                g[at + i] = (byte) rnd.nextInt(4);
                phase++;
            } else if (kind == 1) {
                g[at + i] = (byte) rnd.nextInt(4);
            } else {
                if (kind == 2) {
                    phase++;
                }
                g[at + i] = motif[phase % p];
                phase++;
            }
        }
    }
}
