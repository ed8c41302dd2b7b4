package stria.sim;

import htsjdk.samtools.reference.FastaReferenceWriter;
import htsjdk.samtools.reference.FastaReferenceWriterBuilder;
import htsjdk.samtools.util.BlockCompressedOutputStream;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * Writes an invented genome of satellite arrays in random background, and the table of what was planted.
 * One {@link Random} with a fixed seed drives everything, so the same options give the same bytes.
 *
 * <p>The model of one array. A unit of {@code u} bases (150-250) and a block of {@code k} units (1-16).
 * The k units of the block descend from one ancestral unit, each mutated on its own, so that two units of
 * the block differ by the within-block divergence (15-30 %); the block's copies along the array descend
 * from the block, each mutated on its own, so that two copies differ by the between-copy divergence
 * (0.5-3 % for higher-order arrays). With k = 1 the array is plain (monomeric): its one unit is the block
 * and two copies differ by 8-25 %. Mutation events are substitutions (85 %) and insertions or deletions
 * of one or two bases (7.5 % each). A divergence is the expected number of differing positions
 * (substituted, inserted or deleted bases) per position between two sister copies; the per-copy event rate
 * is solved from it ({@link #rateFor}). Array lengths are drawn log-uniformly (40 kb - 3 Mb by default).
 *
 * <p>Interruptions. A share of the arrays is interrupted once by 3-6 kb of unrelated random sequence,
 * inserted between two block copies somewhere in the middle half of the array; the array goes on after it
 * with the same block. A scan is expected to report such an array as two loci whose boundary is the
 * interruption, so the truth has one row per expected locus: an interrupted array has two rows (pieces
 * {@code 1/2} and {@code 2/2}, ending and starting at the interruption), and both name the interruption as
 * {@code start-end} in the {@code interruption} column; an uninterrupted array has one row ({@code 1/1}) and
 * {@code -} there.
 *
 * <p>Contigs: arrays are dealt to the contigs in turn, with 20-200 kb of random background before, between
 * and after them. Coordinates in the truth are 0-based, end exclusive.
 */
@Command(name = "SatelliteArrays", mixinStandardHelpOptions = true,
        description = "Writes an invented genome of satellite arrays (plain and higher-order) and their truth table (TSV).")
public final class SatelliteArrays implements Callable<Integer> {
    /** Shares of the mutation events; insertions take the rest. */
    static final double SUBSTITUTION = 0.85;
    static final double DELETION = 0.075;
    /** Mean length of an inserted or deleted stretch: 1 base two times in three, else 2. */
    static final double INDEL_MEAN = 4.0 / 3;

    @Option(names = "--out", required = true,
            description = "FASTA output: BGZF when the name ends with .gz, else plain with a .fai index")
    Path out;

    @Option(names = "--truth", required = true, description = "truth table output (TSV)")
    Path truth;

    @Option(names = "--seed", defaultValue = "1", description = "random seed (default: ${DEFAULT-VALUE})")
    long seed;

    @Option(names = "--arrays", defaultValue = "40", description = "number of arrays (default: ${DEFAULT-VALUE})")
    int arrays;

    @Option(names = "--contigs", defaultValue = "4", description = "number of contigs (default: ${DEFAULT-VALUE})")
    int contigs;

    @Option(names = "--lengths", defaultValue = "40000-3000000", converter = Range.Parser.class,
            description = "array lengths, drawn log-uniformly, interruption not counted (default: ${DEFAULT-VALUE})")
    Range lengths;

    @Option(names = "--units", defaultValue = "150-250", converter = Range.Parser.class,
            description = "unit lengths (default: ${DEFAULT-VALUE})")
    Range units;

    @Option(names = "--block-units", defaultValue = "2-16", converter = Range.Parser.class,
            description = "units per block of a higher-order array (default: ${DEFAULT-VALUE})")
    Range blockUnits;

    @Option(names = "--plain", defaultValue = "0.3",
            description = "share of plain arrays, one unit per block (default: ${DEFAULT-VALUE})")
    double plain;

    @Option(names = "--within", defaultValue = "0.15-0.30", converter = Range.Parser.class,
            description = "divergence between the units of a block (default: ${DEFAULT-VALUE})")
    Range within;

    @Option(names = "--between", defaultValue = "0.005-0.03", converter = Range.Parser.class,
            description = "divergence between block copies of a higher-order array (default: ${DEFAULT-VALUE})")
    Range between;

    @Option(names = "--plain-between", defaultValue = "0.08-0.25", converter = Range.Parser.class,
            description = "divergence between the units of a plain array (default: ${DEFAULT-VALUE})")
    Range plainBetween;

    @Option(names = "--interrupted", defaultValue = "0.25",
            description = "share of arrays interrupted by unrelated sequence (default: ${DEFAULT-VALUE})")
    double interrupted;

    @Option(names = "--interruption", defaultValue = "3000-6000", converter = Range.Parser.class,
            description = "length of an interruption (default: ${DEFAULT-VALUE})")
    Range interruption;

    @Option(names = "--spacing", defaultValue = "20000-200000", converter = Range.Parser.class,
            description = "random background before, between and after arrays (default: ${DEFAULT-VALUE})")
    Range spacing;

    @Option(names = "--line-width", defaultValue = "60", description = "FASTA line width (default: ${DEFAULT-VALUE})")
    int lineWidth;

    @Spec
    CommandSpec spec;

    private static final byte[] ACGT = {'A', 'C', 'G', 'T'};

    /** A closed range of numbers given as {@code LO-HI} or a single value. */
    public record Range(double lo, double hi) {
        public static Range parse(String s) {
            String[] f = s.trim().split("-");
            if (f.length < 1 || f.length > 2) {
                throw new IllegalArgumentException("not LO-HI: " + s);
            }
            double lo = Double.parseDouble(f[0].trim());
            double hi = f.length == 2 ? Double.parseDouble(f[1].trim()) : lo;
            if (!(lo <= hi)) {
                throw new IllegalArgumentException("LO above HI: " + s);
            }
            return new Range(lo, hi);
        }

        double draw(Random rnd) {
            return lo + (hi - lo) * rnd.nextDouble();
        }

        int drawInt(Random rnd) {
            int a = (int) Math.round(lo);
            return a + rnd.nextInt((int) Math.round(hi) - a + 1);
        }

        @Override
        public String toString() {
            return lo == hi ? fmt(lo) : fmt(lo) + "-" + fmt(hi);
        }

        private static String fmt(double x) {
            return x == Math.rint(x) ? Long.toString((long) x) : Double.toString(x);
        }

        /** picocli converter. */
        public static final class Parser implements CommandLine.ITypeConverter<Range> {
            @Override
            public Range convert(String value) {
                try {
                    return parse(value);
                } catch (IllegalArgumentException e) {
                    throw new CommandLine.TypeConversionException(e.getMessage());
                }
            }
        }
    }

    /**
     * One planted array with what the tests need to measure it back: the ancestral unit, the units of the
     * block, and where every block copy starts. The interruption is {@code [gapStart, gapEnd)}, both -1
     * when there is none. Coordinates are 0-based, end exclusive.
     */
    public record Array(String id, String contig, int start, int end, int unit, double divWithin,
                        double divBetween, int gapStart, int gapEnd, byte[] ancestor, byte[][] units,
                        int[] copyStarts) {
        public int blockUnits() {
            return units.length;
        }

        public int blockLength() {
            int n = 0;
            for (byte[] u : units) {
                n += u.length;
            }
            return n;
        }

        public boolean interrupted() {
            return gapStart >= 0;
        }

        /** The rows a scan is expected to match: one, or two with the interruption as their boundary. */
        public List<TruthRow> rows() {
            double w = units.length == 1 ? Double.NaN : divWithin;
            if (!interrupted()) {
                return List.of(new TruthRow(id, 1, 1, contig, start, end, unit, units.length, blockLength(), w,
                        divBetween, -1, -1));
            }
            return List.of(
                    new TruthRow(id, 1, 2, contig, start, gapStart, unit, units.length, blockLength(), w, divBetween,
                            gapStart, gapEnd),
                    new TruthRow(id, 2, 2, contig, gapEnd, end, unit, units.length, blockLength(), w, divBetween,
                            gapStart, gapEnd));
        }
    }

    /**
     * One row of the truth table: an expected locus. {@code divWithin} is NaN for plain arrays; the
     * interruption is -1, -1 for arrays without one.
     */
    public record TruthRow(String array, int piece, int pieces, String contig, int start, int end, int unit,
                           int blockUnits, int blockLength, double divWithin, double divBetween, int gapStart,
                           int gapEnd) {
        public static final String HEADER = "array\tpiece\tcontig\tstart\tend\tlength\tunit\tblock_units"
                + "\tblock_length\tdiv_within\tdiv_between\tinterruption";

        public int length() {
            return end - start;
        }

        public boolean higherOrder() {
            return blockUnits > 1;
        }

        public boolean interrupted() {
            return gapStart >= 0;
        }

        String line() {
            return String.format(Locale.ROOT, "%s\t%d/%d\t%s\t%d\t%d\t%d\t%d\t%d\t%d\t%s\t%.4f\t%s", array, piece, pieces,
                    contig, start, end, length(), unit, blockUnits, blockLength,
                    Double.isNaN(divWithin) ? "-" : String.format(Locale.ROOT, "%.4f", divWithin), divBetween,
                    interrupted() ? gapStart + "-" + gapEnd : "-");
        }
    }

    /** An in-memory genome: contig names, sequences (upper-case ASCII) and the planted arrays in genome order. */
    public record Genome(List<String> names, List<byte[]> sequences, List<Array> arrays) {
        public List<TruthRow> truth() {
            List<TruthRow> rows = new ArrayList<>();
            for (Array a : arrays) {
                rows.addAll(a.rows());
            }
            return rows;
        }
    }

    public static void main(String[] args) {
        System.exit(new CommandLine(new SatelliteArrays()).execute(args));
    }

    @Override
    public Integer call() throws IOException {
        Genome g = build(spec.commandLine());
        Path dir = out.toAbsolutePath().getParent();
        // everything is written into a scratch directory beside the output and moved into place when whole
        Path scratch = Files.createTempDirectory(dir, ".satellites-");
        try {
            String name = out.getFileName().toString();
            Path fa = scratch.resolve(name);
            // htsjdk 4.2.0's writer, given a .gz name, writes a .gzi with a leading (0, 0) entry that its own
            // reader refuses, and fails without it: BGZF goes through a stream of our own, without indexes
            // (samtools faidx makes both); plain FASTA gets its .fai
            boolean bgzf = name.endsWith(".gz");
            FastaReferenceWriterBuilder b = new FastaReferenceWriterBuilder().setBasesPerLine(lineWidth);
            if (bgzf) {
                b.setFastaOutput(new BlockCompressedOutputStream(Files.newOutputStream(fa), fa));
            } else {
                b.setFastaFile(fa).setMakeDictOutput(false).setMakeGziOutput(false);
            }
            try (FastaReferenceWriter w = b.build()) {
                for (int c = 0; c < g.names().size(); c++) {
                    w.startSequence(g.names().get(c), "invented satellite-array genome, contig " + (c + 1) + " of "
                            + g.names().size() + ", seed " + seed);
                    w.appendBases(g.sequences().get(c));
                }
            }
            writeTruth(scratch.resolve("truth.tsv"), g.truth());
            Files.move(scratch.resolve("truth.tsv"), truth, StandardCopyOption.REPLACE_EXISTING);
            try (Stream<Path> files = Files.list(scratch)) {
                for (Path p : files.toList()) {
                    // the .fai carries the FASTA's name plus a suffix, so it lands beside it
                    Files.move(p, dir.resolve(p.getFileName()), StandardCopyOption.REPLACE_EXISTING);
                }
            }
        } finally {
            try (Stream<Path> files = Files.list(scratch)) {
                for (Path p : files.toList()) {
                    Files.deleteIfExists(p);
                }
            }
            Files.deleteIfExists(scratch);
        }
        return 0;
    }

    /** Generates the genome in memory without writing; for tests. Takes the command's options. */
    public static Genome generate(String... args) {
        SatelliteArrays sim = new SatelliteArrays();
        CommandLine cl = new CommandLine(sim);
        String[] a = Arrays.copyOf(args, args.length + 4);
        a[args.length] = "--out";
        a[args.length + 1] = "unused.fa";
        a[args.length + 2] = "--truth";
        a[args.length + 3] = "unused.tsv";
        cl.parseArgs(a);
        return sim.build(cl);
    }

    private Genome build(CommandLine cl) {
        if (arrays < 1 || contigs < 1 || lengths.lo() < 1 || units.lo() < 2 || blockUnits.lo() < 2
                || plain < 0 || plain > 1 || interrupted < 0 || interrupted > 1 || interruption.lo() < 1
                || spacing.lo() < 1 || lineWidth < 1 || within.hi() >= 0.7 || between.hi() >= 0.7
                || plainBetween.hi() >= 0.7) {
            throw new CommandLine.ParameterException(cl, "need --arrays, --contigs, --line-width >= 1, --units from 2, "
                    + "--block-units from 2, lengths >= 1, shares in [0, 1] and divergences below 0.7");
        }
        Random rnd = new Random(seed);
        List<Plan> plans = new ArrayList<>();
        for (int i = 0; i < arrays; i++) {
            plans.add(drawPlan(rnd));
        }
        List<String> names = new ArrayList<>();
        List<byte[]> seqs = new ArrayList<>();
        List<Array> planted = new ArrayList<>();
        for (int c = 0; c < contigs; c++) {
            String name = String.format(Locale.ROOT, "sat%02d", c + 1);
            names.add(name);
            Bases seq = new Bases(1 << 20);
            seq.random(rnd, spacing.drawInt(rnd));
            for (int i = c; i < plans.size(); i += contigs) {
                String id = String.format(Locale.ROOT, "array%02d", planted.size() + 1);
                planted.add(plant(seq, name, id, plans.get(i), rnd));
                seq.random(rnd, spacing.drawInt(rnd));
            }
            seqs.add(seq.toArray());
        }
        return new Genome(List.copyOf(names), List.copyOf(seqs), List.copyOf(planted));
    }

    /** What is drawn for an array before its bases. */
    private record Plan(int unit, int k, double divWithin, double divBetween, int length, boolean interrupted) {
    }

    private Plan drawPlan(Random rnd) {
        int u = units.drawInt(rnd);
        boolean isPlain = rnd.nextDouble() < plain;
        int k = isPlain ? 1 : blockUnits.drawInt(rnd);
        // four decimals, so that the table states the divergence the bases were made with
        double w = isPlain ? Double.NaN : Math.round(within.draw(rnd) * 1e4) / 1e4;
        double b = Math.round((isPlain ? plainBetween : between).draw(rnd) * 1e4) / 1e4;
        int len = (int) Math.round(Math.exp(Math.log(lengths.lo()) + (Math.log(lengths.hi()) - Math.log(lengths.lo()))
                * rnd.nextDouble()));
        return new Plan(u, k, w, b, len, rnd.nextDouble() < interrupted);
    }

    private Array plant(Bases seq, String contig, String id, Plan p, Random rnd) {
        byte[] ancestor = randomBases(rnd, p.unit());
        byte[][] blockUnitsOf = new byte[p.k()][];
        if (p.k() == 1) {
            blockUnitsOf[0] = ancestor;
        } else {
            double r = rateFor(p.divWithin());
            for (int j = 0; j < p.k(); j++) {
                blockUnitsOf[j] = mutate(ancestor, r, rnd);
            }
        }
        Bases blockSeq = new Bases(p.unit() * p.k() + 16);
        for (byte[] u : blockUnitsOf) {
            blockSeq.add(u, u.length);
        }
        byte[] block = blockSeq.toArray();
        double r = rateFor(p.divBetween());
        // the interruption goes after the copy that crosses this many array bases
        int breakAfter = p.interrupted() ? (int) (p.length() * (0.25 + 0.5 * rnd.nextDouble())) : Integer.MAX_VALUE;
        int start = seq.size();
        int written = 0;
        int gapStart = -1;
        int gapEnd = -1;
        Ints copies = new Ints();
        while (written < p.length()) {
            copies.add(seq.size());
            byte[] copy = mutate(block, r, rnd);
            int n = Math.min(copy.length, p.length() - written);
            seq.add(copy, n);
            written += n;
            if (gapStart < 0 && written >= breakAfter && written < p.length()) {
                gapStart = seq.size();
                seq.random(rnd, interruption.drawInt(rnd));
                gapEnd = seq.size();
            }
        }
        return new Array(id, contig, start, seq.size(), p.unit(), p.divWithin(), p.divBetween(), gapStart, gapEnd,
                ancestor, blockUnitsOf, copies.toArray());
    }

    /**
     * The per-copy event rate r at which two sister copies are expected to differ at a share {@code d} of
     * positions: substitutions (rate s = 0.85 r in each copy) leave a position equal when neither copy
     * changed it or both changed it to the same base, 1 - (1 - s)^2 - s^2 / 3; each copy adds its inserted
     * and deleted bases, 0.15 r x 4/3. Solved by bisection (the expression grows with r on [0, 0.75]).
     */
    static double rateFor(double d) {
        double lo = 0;
        double hi = 0.75;
        for (int i = 0; i < 60; i++) {
            double mid = (lo + hi) / 2;
            if (expectedDivergence(mid) < d) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return (lo + hi) / 2;
    }

    static double expectedDivergence(double r) {
        double s = SUBSTITUTION * r;
        return 1 - (1 - s) * (1 - s) - s * s / 3 + 2 * (1 - SUBSTITUTION) * r * INDEL_MEAN;
    }

    /** A copy of {@code t} with events at rate r per base of t. */
    static byte[] mutate(byte[] t, double r, Random rnd) {
        Bases out = new Bases(t.length + t.length / 4 + 8);
        for (int i = 0; i < t.length; i++) {
            double x = rnd.nextDouble();
            if (x >= r) {
                out.add(t[i]);
                continue;
            }
            double e = x / r;
            if (e < SUBSTITUTION) {
                byte b;
                do {
                    b = ACGT[rnd.nextInt(4)];
                } while (b == t[i]);
                out.add(b);
            } else {
                int n = rnd.nextInt(3) == 0 ? 2 : 1;
                if (e < SUBSTITUTION + DELETION) {
                    i += n - 1;
                } else {
                    out.random(rnd, n);
                    out.add(t[i]);
                }
            }
        }
        return out.toArray();
    }

    private static byte[] randomBases(Random rnd, int n) {
        Bases b = new Bases(n);
        b.random(rnd, n);
        return b.toArray();
    }

    /** A growing byte array of bases. */
    private static final class Bases {
        private byte[] a;
        private int n;

        Bases(int capacity) {
            a = new byte[Math.max(16, capacity)];
        }

        int size() {
            return n;
        }

        void add(byte b) {
            room(1);
            a[n++] = b;
        }

        void add(byte[] src, int len) {
            room(len);
            System.arraycopy(src, 0, a, n, len);
            n += len;
        }

        void random(Random rnd, int len) {
            room(len);
            for (int i = 0; i < len; i++) {
                a[n++] = ACGT[rnd.nextInt(4)];
            }
        }

        byte[] toArray() {
            return Arrays.copyOf(a, n);
        }

        private void room(int more) {
            if (n + more > a.length) {
                a = Arrays.copyOf(a, Math.max(n + more, a.length * 2));
            }
        }
    }

    /** A growing int array. */
    private static final class Ints {
        private int[] a = new int[64];
        private int n;

        void add(int x) {
            if (n == a.length) {
                a = Arrays.copyOf(a, n * 2);
            }
            a[n++] = x;
        }

        int[] toArray() {
            return Arrays.copyOf(a, n);
        }
    }

    static void writeTruth(Path path, List<TruthRow> rows) throws IOException {
        try (PrintWriter w = new PrintWriter(Files.newBufferedWriter(path, StandardCharsets.US_ASCII))) {
            w.print(TruthRow.HEADER + "\n");
            for (TruthRow r : rows) {
                w.print(r.line() + "\n");
            }
        }
    }

    /** Reads a truth table written by this class, by column name; gzip is fine. */
    public static List<TruthRow> readTruth(Path path) throws IOException {
        List<TruthRow> rows = new ArrayList<>();
        NamedColumns.read(path, TruthRow.HEADER.split("\t"), (col, f) -> {
            String[] piece = f[col.get("piece")].split("/");
            String w = f[col.get("div_within")];
            String gap = f[col.get("interruption")];
            int gs = -1;
            int ge = -1;
            if (!gap.equals("-")) {
                String[] g = gap.split("-");
                gs = Integer.parseInt(g[0]);
                ge = Integer.parseInt(g[1]);
            }
            rows.add(new TruthRow(f[col.get("array")], Integer.parseInt(piece[0]), Integer.parseInt(piece[1]),
                    f[col.get("contig")], Integer.parseInt(f[col.get("start")]), Integer.parseInt(f[col.get("end")]),
                    Integer.parseInt(f[col.get("unit")]), Integer.parseInt(f[col.get("block_units")]),
                    Integer.parseInt(f[col.get("block_length")]), w.equals("-") ? Double.NaN : Double.parseDouble(w),
                    Double.parseDouble(f[col.get("div_between")]), gs, ge));
        });
        return rows;
    }
}
