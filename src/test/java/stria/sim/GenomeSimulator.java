package stria.sim;

import htsjdk.samtools.util.BlockCompressedOutputStream;
import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * Writes an invented genome with planted tandem repeats and the table of what was planted. Everything
 * comes from one {@link Random} with a fixed seed, so the same options give the same bytes on every
 * machine ({@link Random}'s generator is specified by the JDK, unlike faster ones).
 *
 * <p>The background is uniform random DNA. Into it go ordinary loci (homopolymers, micro- and
 * minisatellites and longer units), compound loci (two different motifs back to back), satellite arrays
 * (units of a few hundred to a couple of thousand bases, hundreds of kilobases long), runs of N and
 * lower-case (soft-masked) stretches. Each planted copy is degraded by substitutions and one- or
 * two-base insertions and deletions at a rate drawn per locus; the truth table records the identity that
 * was actually realised, counted the way purity is (agreeing columns over alignment columns).
 */
@Command(name = "GenomeSimulator", mixinStandardHelpOptions = true,
        description = "Writes an invented genome with planted tandem repeats and a truth table (TSV).")
public final class GenomeSimulator implements Callable<Integer> {

    @Option(names = "--out", required = true, description = "FASTA output; gzip (BGZF) when the name ends with .gz")
    Path out;

    @Option(names = "--truth", required = true, description = "truth table output (TSV)")
    Path truth;

    @Option(names = "--seed", defaultValue = "1", description = "random seed (default: ${DEFAULT-VALUE})")
    long seed;

    @Option(names = "--size", defaultValue = "2000000", description = "total bases (default: ${DEFAULT-VALUE})")
    long size;

    @Option(names = "--contigs", defaultValue = "3", description = "number of contigs (default: ${DEFAULT-VALUE})")
    int contigs;

    @Option(names = "--major", defaultValue = "0.75",
            description = "share of the total in the first contig; the rest is split evenly (default: ${DEFAULT-VALUE})")
    double major;

    @Option(names = "--prefix", defaultValue = "ctg", description = "contig name prefix (default: ${DEFAULT-VALUE})")
    String prefix;

    @Option(names = "--organism", defaultValue = "Fabulosa inventa",
            description = "invented organism named in the FASTA descriptions (default: ${DEFAULT-VALUE})")
    String organism;

    @Option(names = "--density", defaultValue = "150",
            description = "ordinary planted loci per megabase (default: ${DEFAULT-VALUE})")
    double density;

    @Option(names = "--min-period", defaultValue = "1", description = "smallest planted period (default: ${DEFAULT-VALUE})")
    int minPeriod;

    @Option(names = "--max-period", defaultValue = "500", description = "largest planted period of ordinary loci (default: ${DEFAULT-VALUE})")
    int maxPeriod;

    @Option(names = "--min-copies", defaultValue = "3", description = "fewest copies of an ordinary locus (default: ${DEFAULT-VALUE})")
    double minCopies;

    @Option(names = "--max-copies", defaultValue = "40", description = "most copies of an ordinary locus (default: ${DEFAULT-VALUE})")
    double maxCopies;

    @Option(names = "--min-identity", defaultValue = "0.80", description = "lowest identity drawn (default: ${DEFAULT-VALUE})")
    double minIdentity;

    @Option(names = "--max-identity", defaultValue = "1.0", description = "highest identity drawn (default: ${DEFAULT-VALUE})")
    double maxIdentity;

    @Option(names = "--compound", defaultValue = "0.1",
            description = "chance that an ordinary locus is followed directly by a second motif (default: ${DEFAULT-VALUE})")
    double compound;

    @Option(names = "--satellites", defaultValue = "1", description = "satellite arrays, placed in the first contig (default: ${DEFAULT-VALUE})")
    int satellites;

    @Option(names = "--satellite-length", defaultValue = "200000", description = "bases per satellite array (default: ${DEFAULT-VALUE})")
    int satelliteLength;

    @Option(names = "--satellite-unit", defaultValue = "100-2000", description = "range of satellite unit lengths (default: ${DEFAULT-VALUE})")
    String satelliteUnit;

    @Option(names = "--gaps", defaultValue = "4", description = "runs of N over the whole genome (default: ${DEFAULT-VALUE})")
    int gaps;

    @Option(names = "--lower", defaultValue = "8", description = "lower-case (soft-masked) stretches over the whole genome (default: ${DEFAULT-VALUE})")
    int lower;

    @Option(names = "--line-width", defaultValue = "60", description = "FASTA line width (default: ${DEFAULT-VALUE})")
    int lineWidth;

    private static final byte[] ACGT = {'A', 'C', 'G', 'T'};

    /** One planted locus as written to the truth table. */
    public record Planted(String contig, int start, int end, int period, String motif, double copies,
                          double identity, String kind) {
    }

    private Random rnd;
    private final List<Planted> planted = new ArrayList<>();

    public static void main(String[] args) {
        System.exit(new CommandLine(new GenomeSimulator()).execute(args));
    }

    @Override
    public Integer call() throws IOException {
        if (contigs < 1 || size < contigs * 1000L || major <= 0 || major > 1) {
            throw new CommandLine.ParameterException(new CommandLine(this),
                    "need --contigs >= 1, --size >= 1000 per contig and 0 < --major <= 1");
        }
        rnd = new Random(seed);
        long[] sizes = contigSizes();
        int[] gapsPer = spread(gaps, sizes);
        int[] lowerPer = spread(lower, sizes);
        try (OutputStream os = open(out)) {
            for (int c = 0; c < contigs; c++) {
                String name = String.format(Locale.ROOT, "%s%02d", prefix, c + 1);
                byte[] seq = contig(name, (int) sizes[c], c == 0 ? satellites : 0, gapsPer[c], lowerPer[c]);
                String header = ">" + name + " " + organism + " (invented organism), simulated contig " + (c + 1)
                        + " of " + contigs + ", seed " + seed + "\n";
                os.write(header.getBytes(StandardCharsets.US_ASCII));
                for (int i = 0; i < seq.length; i += lineWidth) {
                    os.write(seq, i, Math.min(lineWidth, seq.length - i));
                    os.write('\n');
                }
            }
        }
        writeTruth(truth, planted);
        return 0;
    }

    /** Generates the genome in memory without writing; used by tests and the benchmark. */
    public static Genome generate(String... args) {
        GenomeSimulator sim = new GenomeSimulator();
        new CommandLine(sim).parseArgs(withDummyPaths(args));
        sim.rnd = new Random(sim.seed);
        long[] sizes = sim.contigSizes();
        int[] gapsPer = sim.spread(sim.gaps, sizes);
        int[] lowerPer = sim.spread(sim.lower, sizes);
        List<String> names = new ArrayList<>();
        List<byte[]> seqs = new ArrayList<>();
        for (int c = 0; c < sim.contigs; c++) {
            String name = String.format(Locale.ROOT, "%s%02d", sim.prefix, c + 1);
            names.add(name);
            seqs.add(sim.contig(name, (int) sizes[c], c == 0 ? sim.satellites : 0, gapsPer[c], lowerPer[c]));
        }
        return new Genome(names, seqs, List.copyOf(sim.planted));
    }

    /** An in-memory genome: contig names, sequences (ASCII) and the planted loci. */
    public record Genome(List<String> names, List<byte[]> sequences, List<Planted> truth) {
    }

    private static String[] withDummyPaths(String[] args) {
        String[] a = java.util.Arrays.copyOf(args, args.length + 4);
        a[args.length] = "--out";
        a[args.length + 1] = "unused.fa";
        a[args.length + 2] = "--truth";
        a[args.length + 3] = "unused.tsv";
        return a;
    }

    static void writeTruth(Path path, List<Planted> rows) throws IOException {
        try (PrintWriter w = new PrintWriter(Files.newBufferedWriter(path, StandardCharsets.US_ASCII))) {
            w.print("contig\tstart\tend\tperiod\tmotif\tcopies\tidentity\tkind\n");
            for (Planted p : rows) {
                w.print(String.format(Locale.ROOT, "%s\t%d\t%d\t%d\t%s\t%.2f\t%.4f\t%s\n", p.contig(), p.start(),
                        p.end(), p.period(), p.motif(), p.copies(), p.identity(), p.kind()));
            }
        }
    }

    private static OutputStream open(Path path) throws IOException {
        OutputStream raw = new BufferedOutputStream(Files.newOutputStream(path), 1 << 16);
        if (path.getFileName().toString().endsWith(".gz")) {
            // BGZF is gzip that can also be indexed for random access (faidx), at no cost to plain readers
            return new BlockCompressedOutputStream(raw, (Path) null);
        }
        return raw;
    }

    private long[] contigSizes() {
        long[] s = new long[contigs];
        if (contigs == 1) {
            s[0] = size;
            return s;
        }
        s[0] = Math.round(size * major);
        long rest = size - s[0];
        long left = rest;
        for (int c = 1; c < contigs; c++) {
            // uneven but deterministic: each later contig gets 0.6-1.4 times its even share
            long share = c == contigs - 1 ? left : Math.round(rest / (double) (contigs - 1) * (0.6 + 0.8 * rnd.nextDouble()));
            share = Math.min(share, left - 1000L * (contigs - 1 - c));
            s[c] = share;
            left -= share;
        }
        return s;
    }

    private int[] spread(int count, long[] sizes) {
        int[] per = new int[sizes.length];
        long total = 0;
        for (long s : sizes) {
            total += s;
        }
        for (int i = 0; i < count; i++) {
            long x = (long) (rnd.nextDouble() * total);
            int c = 0;
            while (c < sizes.length - 1 && x >= sizes[c]) {
                x -= sizes[c];
                c++;
            }
            per[c]++;
        }
        return per;
    }

    private byte[] contig(String name, int len, int sats, int nGaps, int nLower) {
        byte[] seq = new byte[len];
        // specials (satellites and gaps) are scheduled first so ordinary loci fill around them
        int nSpecial = sats + nGaps;
        int[] specialAt = new int[nSpecial];
        for (int i = 0; i < nSpecial; i++) {
            specialAt[i] = rnd.nextInt(len);
        }
        java.util.Arrays.sort(specialAt);
        boolean[] isSat = new boolean[nSpecial];
        for (int i = 0; i < sats; i++) {
            isSat[rnd.nextInt(nSpecial)] = true;
        }
        int next = 0;
        double meanGap = 1e6 / Math.max(density, 1e-9);
        int pos = 0;
        while (pos < len) {
            int bg = 20 + (int) (-Math.log(1 - rnd.nextDouble()) * meanGap);
            bg = Math.min(bg, len - pos);
            fillRandom(seq, pos, bg);
            pos += bg;
            if (pos >= len) {
                break;
            }
            if (next < nSpecial && pos >= specialAt[next]) {
                pos = isSat[next] ? satellite(name, seq, pos) : gap(seq, pos);
                next++;
                continue;
            }
            pos = ordinary(name, seq, pos);
        }
        for (int i = 0; i < nLower; i++) {
            int l = 200 + rnd.nextInt(4800);
            int s = rnd.nextInt(Math.max(1, len - l));
            for (int j = s; j < Math.min(len, s + l); j++) {
                if (seq[j] != 'N') {
                    seq[j] = (byte) Character.toLowerCase(seq[j]);
                }
            }
        }
        return seq;
    }

    private void fillRandom(byte[] seq, int from, int n) {
        for (int i = from; i < from + n; i++) {
            seq[i] = ACGT[rnd.nextInt(4)];
        }
    }

    private int gap(byte[] seq, int pos) {
        int l = Math.min(100 + rnd.nextInt(1900), seq.length - pos);
        java.util.Arrays.fill(seq, pos, pos + l, (byte) 'N');
        return pos + l;
    }

    private int satellite(String name, byte[] seq, int pos) {
        String[] r = satelliteUnit.split("-");
        int lo = Integer.parseInt(r[0].trim());
        int hi = Integer.parseInt(r[r.length - 1].trim());
        int unit = lo + rnd.nextInt(hi - lo + 1);
        double identity = 0.92 + 0.07 * rnd.nextDouble();
        int want = Math.min(satelliteLength, seq.length - pos);
        if (want < 3 * unit) {
            return pos;
        }
        return plant(name, seq, pos, randomMotif(unit), want / (double) unit, identity, "satellite");
    }

    private int ordinary(String name, byte[] seq, int pos) {
        int period = drawPeriod();
        double copies = drawCopies(period);
        double identity = minIdentity + (maxIdentity - minIdentity) * rnd.nextDouble();
        String motif = randomMotif(period);
        String kind = kindOf(period);
        int end = plant(name, seq, pos, motif, copies, identity, kind);
        if (rnd.nextDouble() < compound && end < seq.length) {
            // a second motif of the same period differing in one phase, like (CA)n(GA)m, or a fresh motif
            String second = period > 1 && rnd.nextBoolean() ? changeOne(motif) : randomMotif(drawPeriod());
            double id2 = minIdentity + (maxIdentity - minIdentity) * rnd.nextDouble();
            end = plant(name, seq, end, second, drawCopies(second.length()), id2, "compound");
        }
        return end;
    }

    private int drawPeriod() {
        double u = rnd.nextDouble();
        int lo;
        int hi;
        if (u < 0.15) {
            lo = 1;
            hi = 1;
        } else if (u < 0.60) {
            lo = 2;
            hi = 6;
        } else if (u < 0.85) {
            lo = 7;
            hi = 99;
        } else {
            lo = 100;
            hi = Math.max(100, maxPeriod);
        }
        lo = Math.max(lo, minPeriod);
        hi = Math.min(hi, maxPeriod);
        if (lo > hi) {
            lo = minPeriod;
            hi = maxPeriod;
        }
        return lo + rnd.nextInt(hi - lo + 1);
    }

    private double drawCopies(int period) {
        double lo = minCopies;
        double hi = maxCopies;
        if (period == 1) {
            lo = Math.max(lo, 6);
        } else if (period >= 100) {
            hi = Math.min(hi, Math.max(lo, 10));
        }
        // two decimals so the table states the planted copy number exactly
        return Math.round((lo + (hi - lo) * rnd.nextDouble()) * 100) / 100.0;
    }

    private static String kindOf(int period) {
        if (period == 1) {
            return "homopolymer";
        }
        if (period <= 6) {
            return "microsatellite";
        }
        if (period <= 100) {
            return "minisatellite";
        }
        return "long";
    }

    private String randomMotif(int period) {
        byte[] m = new byte[period];
        do {
            for (int i = 0; i < period; i++) {
                m[i] = ACGT[rnd.nextInt(4)];
            }
        } while (!primitive(m));
        return new String(m, StandardCharsets.US_ASCII);
    }

    private String changeOne(String motif) {
        byte[] m = motif.getBytes(StandardCharsets.US_ASCII);
        do {
            int i = rnd.nextInt(m.length);
            byte old = m[i];
            do {
                m[i] = ACGT[rnd.nextInt(4)];
            } while (m[i] == old);
        } while (!primitive(m));
        return new String(m, StandardCharsets.US_ASCII);
    }

    /** Whether no proper divisor d of the length makes the motif a repetition of its first d letters. */
    static boolean primitive(byte[] m) {
        return stria.score.MotifClass.primitiveRoot(m) == m.length;
    }

    /**
     * Writes {@code copies} copies of the motif at {@code pos}, degraded at rate 1 - identity (four fifths
     * substitutions, the rest one- or two-base insertions and deletions), and records it. The first and
     * last motif-length stretch stay intact so that the planted boundaries are where the table says.
     */
    private int plant(String name, byte[] seq, int pos, String motif, double copies, double identity, String kind) {
        int period = motif.length();
        int templateLen = Math.max(period, (int) Math.round(copies * period));
        if (pos + templateLen + templateLen / 8 + 8 > seq.length) {
            return pos;
        }
        double rate = 1 - identity;
        int w = pos;
        int subs = 0;
        int ins = 0;
        int dels = 0;
        int guard = Math.min(period, templateLen / 4);
        for (int t = 0; t < templateLen && w < seq.length; t++) {
            byte b = (byte) motif.charAt(t % period);
            boolean edge = t < guard || t >= templateLen - guard;
            double u = edge ? 1 : rnd.nextDouble();
            if (u < rate * 0.8) {
                byte s;
                do {
                    s = ACGT[rnd.nextInt(4)];
                } while (s == b);
                seq[w++] = s;
                subs++;
            } else if (u < rate * 0.9) {
                int k = rnd.nextInt(3) == 0 ? 2 : 1;
                dels += Math.min(k, templateLen - t);
                t += k - 1;
            } else if (u < rate) {
                int k = rnd.nextInt(3) == 0 ? 2 : 1;
                for (int j = 0; j < k && w < seq.length; j++) {
                    seq[w++] = ACGT[rnd.nextInt(4)];
                    ins++;
                }
                if (w < seq.length) {
                    seq[w++] = b;
                }
            } else {
                seq[w++] = b;
            }
        }
        int len = w - pos;
        double realised = (templateLen - subs - dels) / (double) (templateLen + ins);
        planted.add(new Planted(name, pos, w, period, motif, len / (double) period, realised, kind));
        return w;
    }
}
