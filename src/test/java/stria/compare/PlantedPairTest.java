package stria.compare;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;
import stria.score.Locus;
import stria.sim.AssemblyPairSimulator;
import stria.sim.GenomeSimulator;

/**
 * The targets on a simulated pair: A is a planted genome scanned by the real pipeline, B is A
 * with about 100 loci expanded or contracted by whole copies, background substitutions and small indels,
 * its first contig split, its second reverse-complemented, its last two joined and every contig renamed.
 * <ul>
 *   <li>changed loci found: at least 0.95 of the planted changes inside a scanned locus of the planted
 *       period come out
 *       {@code changed} (or {@code lost}) with the length change right within 10 %;
 *   <li>false changes: at most 1 % of the placed loci with no change of length within 5 bases of them (a
 *       contraction or deletion spans the bases it removes);
 *   <li>placed: at least 0.97 of A's loci, and of the reverse-complemented contig's.
 * </ul>
 */
class PlantedPairTest {
    @Test
    void changesAreFoundAndSizedAndLociPlacedOnEveryLayout() {
        GenomeSimulator.Genome g = GenomeSimulator.generate("--seed", "11", "--size", "3000000", "--contigs", "4",
                "--satellites", "1", "--satellite-length", "60000", "--gaps", "6", "--lower", "12");
        AssemblyPairSimulator.Pair p = AssemblyPairSimulator.make(g, AssemblyPairSimulator.Options.defaults(12));
        List<List<Locus>> aLoci = Pairs.scan(g.sequences());
        Comparison cmp = Pairs.compare(Pairs.settings(), g.names(), g.sequences(), aLoci, p.names(), p.sequences());
        List<ComparedLocus> rows = cmp.results(2);

        Map<String, List<ComparedLocus>> byContig = new HashMap<>();
        for (ComparedLocus r : rows) {
            byContig.computeIfAbsent(r.chrom(), k -> new ArrayList<>()).add(r);
        }
        // every row touched by a change of length (within 5 bases), and the planted changes' verdicts
        Map<ComparedLocus, Integer> touched = new HashMap<>();
        java.util.Set<ComparedLocus> near = new java.util.HashSet<>();
        int planted = 0;
        int notScanned = 0;
        int found = 0;
        int sizedRight = 0;
        List<String> misses = new ArrayList<>();
        for (AssemblyPairSimulator.Change c : p.changes()) {
            List<ComparedLocus> here = byContig.getOrDefault(c.chrom(), List.of());
            List<ComparedLocus> covering = new ArrayList<>();
            // a contraction or deletion takes the bases [editAt, editAt - change) of A
            int lo = c.editAt();
            int hi = c.editAt() + Math.max(0, -c.lengthChange());
            for (ComparedLocus r : here) {
                Locus l = r.locus();
                if (l.start() - 25 <= hi && lo <= l.end() + 25) {
                    near.add(r);
                }
                if (l.start() - 5 <= hi && lo <= l.end() + 5) {
                    touched.merge(r, c.lengthChange(), Integer::sum);
                    // the planted locus as scanned: its period (long units within 5 %) around the edit
                    if (l.start() <= c.editAt() && c.editAt() <= l.end()
                            && Math.abs(l.period() - c.period()) <= Math.max(0, c.period() / 20)) {
                        covering.add(r);
                    }
                }
            }
            if (c.period() == 0) {
                continue;
            }
            planted++;
            if (covering.isEmpty()) {
                notScanned++;
                continue;
            }
            boolean ok = false;
            boolean sized = false;
            for (ComparedLocus r : covering) {
                if (r.status() == Status.CHANGED || r.status() == Status.LOST) {
                    ok = true;
                    sized |= Math.abs(r.lengthChange() - c.lengthChange()) <= 0.1 * Math.abs(c.lengthChange());
                }
            }
            found += ok ? 1 : 0;
            sizedRight += ok && sized ? 1 : 0;
            if (!(ok && sized)) {
                misses.add(c + " -> " + covering);
            }
        }
        int quiet = 0;
        int falseChanges = 0;
        List<String> falses = new ArrayList<>();
        int placed = 0;
        int rcRows = 0;
        int rcPlaced = 0;
        String rcContig = g.names().get(1);
        for (ComparedLocus r : rows) {
            if (r.placed()) {
                placed++;
                if (!touched.containsKey(r)) {
                    quiet++;
                    if (r.status() != Status.SAME) {
                        falseChanges++;
                        falses.add(r.toString());
                    }
                }
                if (!near.contains(r)) {
                    checkFlanks(g, p, r);
                }
            }
            if (r.chrom().equals(rcContig)) {
                rcRows++;
                if (r.placed()) {
                    rcPlaced++;
                    assertThat(r.otherStrand()).isEqualTo('-');
                }
            }
        }
        int eligible = planted - notScanned;
        System.out.printf(Locale.ROOT, "A loci %d, placed %.4f (reverse-complemented contig %d of %d)%n", rows.size(),
                placed / (double) rows.size(), rcPlaced, rcRows);
        System.out.printf(Locale.ROOT, "planted changes %d, in a scanned locus %d, found %.4f, sized within 10%% %.4f%n",
                planted, eligible, found / (double) eligible, sizedRight / (double) eligible);
        System.out.printf(Locale.ROOT, "false changes %d of %d placed loci without a change (%.4f)%n", falseChanges,
                quiet, falseChanges / (double) quiet);
        misses.forEach(s -> System.out.println("miss " + s));
        falses.forEach(s -> System.out.println("false " + s));

        assertThat(planted).isGreaterThanOrEqualTo(95);
        assertThat(eligible).isGreaterThanOrEqualTo(80);
        assertThat(found / (double) eligible).isGreaterThanOrEqualTo(0.95);
        assertThat(sizedRight / (double) eligible).isGreaterThanOrEqualTo(0.95);
        assertThat(falseChanges / (double) quiet).isLessThanOrEqualTo(0.01);
        assertThat(placed / (double) rows.size()).isGreaterThanOrEqualTo(0.97);
        assertThat(rcRows).isGreaterThan(30);
        assertThat(rcPlaced / (double) rcRows).isGreaterThanOrEqualTo(0.97);

        // B's own loci: those with no counterpart are few. B has no planted repeats of its own, but an expanded
        // repeat too short to be called in A, or a background edit, can make one B's scan reports
        List<List<Locus>> bLoci = Pairs.scan(p.sequences());
        int bTotal = 0;
        int fresh = 0;
        for (int c = 0; c < p.names().size(); c++) {
            bTotal += bLoci.get(c).size();
            fresh += cmp.newLoci(p.names().get(c), bLoci.get(c)).size();
        }
        System.out.printf(Locale.ROOT, "B loci %d, new %d%n", bTotal, fresh);
        assertThat(fresh / (double) bTotal).isLessThanOrEqualTo(0.03);
    }

    /**
     * The 20 bases beside B's repeat are A's, read on the strand B holds the locus on (a few substitutions
     * aside): the flanks are homologous. Checked where no change of length lies within 25 bases.
     */
    private static void checkFlanks(GenomeSimulator.Genome g, AssemblyPairSimulator.Pair p, ComparedLocus r) {
        byte[] a = g.sequences().get(g.names().indexOf(r.chrom()));
        byte[] b = p.sequences().get(p.names().indexOf(r.otherChrom()));
        int f = 20;
        Locus l = r.locus();
        if (l.start() < f || l.end() + f > a.length || r.otherStart() < f || r.otherEnd() + f > b.length) {
            return;
        }
        String aLeft = Pairs.text(a, l.start() - f, l.start()).toUpperCase(Locale.ROOT);
        String aRight = Pairs.text(a, l.end(), l.end() + f).toUpperCase(Locale.ROOT);
        String bBefore = Pairs.text(b, r.otherStart() - f, r.otherStart()).toUpperCase(Locale.ROOT);
        String bAfter = Pairs.text(b, r.otherEnd(), r.otherEnd() + f).toUpperCase(Locale.ROOT);
        if (r.otherStrand() == '-') {
            String t = rc(bAfter);
            bAfter = rc(bBefore);
            bBefore = t;
        }
        assertThat(mismatches(aLeft, bBefore) + mismatches(aRight, bAfter)).as("flanks of %s", r)
                .isLessThanOrEqualTo(3);
    }

    private static String rc(String s) {
        return Pairs.text(Pairs.reverseComplement(s.getBytes(java.nio.charset.StandardCharsets.US_ASCII)), 0, s.length());
    }

    private static int mismatches(String x, String y) {
        int n = 0;
        for (int i = 0; i < x.length(); i++) {
            n += x.charAt(i) == y.charAt(i) ? 0 : 1;
        }
        return n;
    }
}
