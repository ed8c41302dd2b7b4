package stria.sim;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Random;

/**
 * Makes a second assembly B from a planted genome A, with a table of what differs, for testing a
 * comparison against known truth. Everything follows from one seeded {@link Random}.
 *
 * <p>B differs from A by:
 * <ul>
 *   <li>whole-copy expansions and contractions (1 to {@code maxCopies} copies) in {@code changes} planted
 *       loci: a contraction removes {@code k} periods from inside the locus, an expansion repeats the period
 *       before the edit point {@code k} times, and at least one period is left untouched at each end;
 *   <li>background substitutions at {@code snpRate} per base and small insertions and deletions
 *       (1 to {@code maxIndel} bases) at {@code indelRate}, never within 50 bases of a changed locus;
 *   <li>its layout: the first contig split in two, the second reverse-complemented, the last two (when
 *       there are four or more) joined across 100 N, all contigs renamed and put in a shuffled order.
 * </ul>
 * The table lists every change of length in A's coordinates (substitutions are only counted), and every
 * contig of B as the pieces of A it is made of.
 */
public final class AssemblyPairSimulator {
    /**
     * @param seed      random seed
     * @param changes   planted loci to expand or contract
     * @param maxCopies most copies gained or lost
     * @param snpRate   background substitutions per base
     * @param indelRate background insertions and deletions per base
     * @param maxIndel  longest background insertion or deletion
     */
    public record Options(long seed, int changes, int maxCopies, double snpRate, double indelRate, int maxIndel) {
        public static Options defaults(long seed) {
            return new Options(seed, 100, 8, 0.001, 0.0001, 3);
        }
    }

    /**
     * A change of length, in A's coordinates: {@code expansion} and {@code contraction} of a planted locus
     * {@code [start, end)} at {@code editAt}, or a background {@code insertion} or {@code deletion} at
     * {@code editAt} (period 0).
     */
    public record Change(String kind, String chrom, int start, int end, int period, String motif, int editAt,
                         int lengthChange) {
    }

    /** A stretch {@code [from, to)} of A's contig as it appears in a contig of B, on B's strand {@code strand}. */
    public record Piece(String chrom, int from, int to, char strand) {
    }

    /** B's contigs, each as the pieces of A it holds, in B's order. */
    public record Layout(String name, List<Piece> pieces) {
    }

    public record Pair(List<String> names, List<byte[]> sequences, List<Layout> layout, List<Change> changes,
                       int substitutions) {
    }

    private static final byte[] ACGT = {'A', 'C', 'G', 'T'};

    private AssemblyPairSimulator() {
    }

    public static Pair make(GenomeSimulator.Genome a, Options o) {
        Random rnd = new Random(o.seed());
        List<GenomeSimulator.Planted> chosen = choose(a, o, rnd);
        List<Change> changes = new ArrayList<>();
        List<byte[]> edited = new ArrayList<>();
        List<int[]> aToB = new ArrayList<>();
        int[] subs = {0};
        for (int c = 0; c < a.names().size(); c++) {
            String name = a.names().get(c);
            List<GenomeSimulator.Planted> here = new ArrayList<>();
            for (GenomeSimulator.Planted p : chosen) {
                if (p.contig().equals(name)) {
                    here.add(p);
                }
            }
            int[] map = new int[a.sequences().get(c).length + 1];
            edited.add(edit(name, a.sequences().get(c), here, o, rnd, changes, map, subs));
            aToB.add(map);
        }
        // layout: pieces of A per B contig, before renaming
        List<List<Piece>> pieces = new ArrayList<>();
        List<byte[]> seqs = new ArrayList<>();
        int n = a.names().size();
        for (int c = 0; c < n; c++) {
            String name = a.names().get(c);
            byte[] s = edited.get(c);
            int len = a.sequences().get(c).length;
            if (c == 0) {
                int cut = cutPoint(a, name, len / 2);
                int b = aToB.get(0)[cut];
                pieces.add(List.of(new Piece(name, 0, cut, '+')));
                seqs.add(Arrays.copyOfRange(s, 0, b));
                pieces.add(List.of(new Piece(name, cut, len, '+')));
                seqs.add(Arrays.copyOfRange(s, b, s.length));
            } else if (c == 1) {
                pieces.add(List.of(new Piece(name, 0, len, '-')));
                seqs.add(reverseComplement(s));
            } else if (c == n - 2 && n >= 4) {
                String next = a.names().get(c + 1);
                byte[] gap = new byte[100];
                Arrays.fill(gap, (byte) 'N');
                byte[] t = edited.get(c + 1);
                byte[] j = new byte[s.length + gap.length + t.length];
                System.arraycopy(s, 0, j, 0, s.length);
                System.arraycopy(gap, 0, j, s.length, gap.length);
                System.arraycopy(t, 0, j, s.length + gap.length, t.length);
                pieces.add(List.of(new Piece(name, 0, len, '+'),
                        new Piece(next, 0, a.sequences().get(c + 1).length, '+')));
                seqs.add(j);
                c++;
            } else {
                pieces.add(List.of(new Piece(name, 0, len, '+')));
                seqs.add(s);
            }
        }
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < seqs.size(); i++) {
            order.add(i);
        }
        Collections.shuffle(order, rnd);
        List<String> names = new ArrayList<>();
        List<byte[]> outSeqs = new ArrayList<>();
        List<Layout> layout = new ArrayList<>();
        for (int i = 0; i < order.size(); i++) {
            String nm = String.format(Locale.ROOT, "hap2_scaffold%02d", i + 1);
            names.add(nm);
            outSeqs.add(seqs.get(order.get(i)));
            layout.add(new Layout(nm, pieces.get(order.get(i))));
        }
        changes.sort((x, y) -> x.chrom().equals(y.chrom()) ? Integer.compare(x.editAt(), y.editAt())
                : Integer.compare(a.names().indexOf(x.chrom()), a.names().indexOf(y.chrom())));
        return new Pair(names, outSeqs, layout, changes, subs[0]);
    }

    /** Planted loci to change: not satellites, five copies or more, apart from each other and the ends. */
    private static List<GenomeSimulator.Planted> choose(GenomeSimulator.Genome a, Options o, Random rnd) {
        List<GenomeSimulator.Planted> ok = new ArrayList<>();
        for (GenomeSimulator.Planted p : a.truth()) {
            int len = a.sequences().get(a.names().indexOf(p.contig())).length;
            if (!p.kind().equals("satellite") && p.copies() >= 5 && p.start() > 2000 && p.end() < len - 2000) {
                ok.add(p);
            }
        }
        Collections.shuffle(ok, rnd);
        List<GenomeSimulator.Planted> chosen = new ArrayList<>();
        for (GenomeSimulator.Planted p : ok) {
            if (chosen.size() == o.changes()) {
                break;
            }
            boolean apart = true;
            for (GenomeSimulator.Planted q : chosen) {
                if (q.contig().equals(p.contig()) && q.start() < p.end() + 300 && p.start() < q.end() + 300) {
                    apart = false;
                    break;
                }
            }
            if (apart) {
                chosen.add(p);
            }
        }
        return chosen;
    }

    /** A position near {@code at} outside every planted locus, at least 2 kb away from one. */
    private static int cutPoint(GenomeSimulator.Genome a, String name, int at) {
        int x = at;
        boolean moved = true;
        while (moved) {
            moved = false;
            for (GenomeSimulator.Planted p : a.truth()) {
                if (p.contig().equals(name) && p.start() - 2000 < x && x < p.end() + 2000) {
                    x = p.end() + 2000;
                    moved = true;
                }
            }
        }
        return x;
    }

    /**
     * A's contig with substitutions applied, then the changes of length; {@code map[x]} is where A's base x
     * (or the end, x = length) lands in B.
     */
    private static byte[] edit(String name, byte[] a, List<GenomeSimulator.Planted> here, Options o, Random rnd,
                               List<Change> changes, int[] map, int[] subs) {
        byte[] s = a.clone();
        for (int i = 0; i < s.length; i++) {
            if (s[i] != 'N' && rnd.nextDouble() < o.snpRate()) {
                byte old = (byte) Character.toUpperCase(s[i]);
                byte b;
                do {
                    b = ACGT[rnd.nextInt(4)];
                } while (b == old);
                s[i] = b;
                subs[0]++;
            }
        }
        // edits as (position, bases deleted, bases inserted, row), sorted and apart
        List<Object[]> edits = new ArrayList<>();
        int[] keepOut = new int[2 * here.size()];
        for (int k = 0; k < here.size(); k++) {
            GenomeSimulator.Planted p = here.get(k);
            int per = p.period();
            int whole = (p.end() - p.start()) / per;
            int copies = 1 + rnd.nextInt(o.maxCopies());
            boolean contract = rnd.nextBoolean() && whole - 3 >= 1;
            if (contract) {
                copies = Math.min(copies, whole - 3);
                int u = 1 + rnd.nextInt(whole - copies - 1);
                int at = p.start() + u * per;
                Change c = new Change("contraction", name, p.start(), p.end(), per, p.motif(), at, -copies * per);
                edits.add(new Object[] {at, copies * per, new byte[0], c});
                changes.add(c);
            } else {
                int u = 1 + rnd.nextInt(whole - 1);
                int at = p.start() + u * per;
                byte[] ins = new byte[copies * per];
                for (int i = 0; i < ins.length; i++) {
                    ins[i] = s[at - per + i % per];
                }
                Change c = new Change("expansion", name, p.start(), p.end(), per, p.motif(), at, copies * per);
                edits.add(new Object[] {at, 0, ins, c});
                changes.add(c);
            }
            keepOut[2 * k] = p.start() - 50;
            keepOut[2 * k + 1] = p.end() + 50;
        }
        for (int i = 0; i < s.length; i++) {
            if (rnd.nextDouble() >= o.indelRate()) {
                continue;
            }
            int len = 1 + rnd.nextInt(o.maxIndel());
            boolean near = false;
            for (int k = 0; k < here.size(); k++) {
                if (i + len > keepOut[2 * k] && i < keepOut[2 * k + 1]) {
                    near = true;
                }
            }
            if (near || i + len >= s.length) {
                continue;
            }
            if (rnd.nextBoolean()) {
                byte[] ins = new byte[len];
                for (int j = 0; j < len; j++) {
                    ins[j] = ACGT[rnd.nextInt(4)];
                }
                Change c = new Change("insertion", name, i, i, 0, ".", i, len);
                edits.add(new Object[] {i, 0, ins, c});
                changes.add(c);
            } else {
                Change c = new Change("deletion", name, i, i + len, 0, ".", i, -len);
                edits.add(new Object[] {i, len, new byte[0], c});
                changes.add(c);
            }
        }
        edits.sort((x, y) -> Integer.compare((int) x[0], (int) y[0]));
        byte[] out = new byte[s.length + 64 * 1024];
        int w = 0;
        int r = 0;
        for (Object[] e : edits) {
            int at = (int) e[0];
            int del = (int) e[1];
            byte[] ins = (byte[]) e[2];
            if (at < r) {
                // overlaps the edit before: dropped, and so is its row
                changes.remove(e[3]);
                continue;
            }
            while (r < at) {
                map[r] = w;
                out = put(out, w++, s[r++]);
            }
            for (byte b : ins) {
                out = put(out, w++, b);
            }
            for (int j = 0; j < del; j++) {
                map[r++] = w;
            }
        }
        while (r < s.length) {
            map[r] = w;
            out = put(out, w++, s[r++]);
        }
        map[s.length] = w;
        return Arrays.copyOf(out, w);
    }

    private static byte[] put(byte[] out, int w, byte b) {
        if (w == out.length) {
            out = Arrays.copyOf(out, out.length * 2);
        }
        out[w] = b;
        return out;
    }

    static byte[] reverseComplement(byte[] s) {
        byte[] out = new byte[s.length];
        for (int i = 0; i < s.length; i++) {
            byte b = s[s.length - 1 - i];
            out[i] = switch (b) {
                case 'A' -> (byte) 'T';
                case 'C' -> (byte) 'G';
                case 'G' -> (byte) 'C';
                case 'T' -> (byte) 'A';
                case 'a' -> (byte) 't';
                case 'c' -> (byte) 'g';
                case 'g' -> (byte) 'c';
                case 't' -> (byte) 'a';
                default -> b;
            };
        }
        return out;
    }

    /** Writes B as FASTA (60 bases a line) and the truth table. */
    public static void write(Pair p, Path fasta, Path truth) throws IOException {
        try (OutputStream os = new BufferedOutputStream(Files.newOutputStream(fasta), 1 << 16)) {
            for (int c = 0; c < p.names().size(); c++) {
                os.write((">" + p.names().get(c) + " second assembly (simulated)\n").getBytes(StandardCharsets.US_ASCII));
                byte[] s = p.sequences().get(c);
                for (int i = 0; i < s.length; i += 60) {
                    os.write(s, i, Math.min(60, s.length - i));
                    os.write('\n');
                }
            }
        }
        try (PrintWriter w = new PrintWriter(Files.newBufferedWriter(truth, StandardCharsets.US_ASCII))) {
            w.print("#substitutions: " + p.substitutions() + "\n");
            for (Layout l : p.layout()) {
                StringBuilder sb = new StringBuilder("#contig: ").append(l.name());
                for (Piece x : l.pieces()) {
                    sb.append('\t').append(x.chrom()).append(':').append(x.from()).append('-').append(x.to())
                            .append(x.strand());
                }
                w.print(sb.append('\n'));
            }
            w.print("kind\tchrom\tstart\tend\tperiod\tmotif\tedit_at\tlength_change\n");
            for (Change c : p.changes()) {
                w.print(String.format(Locale.ROOT, "%s\t%s\t%d\t%d\t%d\t%s\t%d\t%d\n", c.kind(), c.chrom(), c.start(),
                        c.end(), c.period(), c.motif(), c.editAt(), c.lengthChange()));
            }
        }
    }
}
