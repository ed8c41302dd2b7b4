package stria.compare;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.HashMap;
import java.util.Map;
import stria.io.ContigBytes;
import stria.pipeline.Genome;
import stria.pipeline.GenomeScan;
import stria.pipeline.Progress;
import stria.pipeline.ScanOptions;
import stria.pipeline.ScanPlan;
import stria.pipeline.ScanSettings;
import stria.pipeline.Selection;
import stria.score.Locus;
import stria.score.MotifClass;
import stria.score.ScoringModel;

/**
 * Test support: in-memory genomes scanned by the real pipeline, run through the comparison engine in the
 * order it requires.
 */
final class Pairs {
    private Pairs() {
    }

    /** Loci of every contig, by the scan's default settings on one thread. */
    static List<List<Locus>> scan(List<byte[]> seqs) {
        ScanSettings s = new ScanOptions(ScanSettings.Mode.IMPERFECT).threads(1).settings();
        List<String> names = new ArrayList<>();
        Map<String, List<Locus>> byName = new HashMap<>();
        List<List<Locus>> out = new ArrayList<>();
        for (int c = 0; c < seqs.size(); c++) {
            names.add("c" + c);
            List<Locus> l = new ArrayList<>();
            out.add(l);
            byName.put("c" + c, l);
        }
        ScanPlan plan = ScanPlan.of(Genome.of(names, seqs), Selection.wholeGenome());
        new GenomeScan(s, Progress.none()).run(plan, (contig, l) -> byName.get(contig).add(l));
        return out;
    }

    /** The four steps: A's contigs and loci, A counted, B streamed, the results. */
    static Comparison compare(CompareSettings st, List<String> aNames, List<byte[]> a, List<List<Locus>> aLoci,
                              List<String> bNames, List<byte[]> b) {
        Comparison.Builder bd = Comparison.builder(st);
        for (int c = 0; c < a.size(); c++) {
            bd.addContig(aNames.get(c), ContigBytes.of(a.get(c)), aLoci.get(c));
        }
        Comparison cmp = bd.build();
        for (int c = 0; c < a.size(); c++) {
            cmp.countA(c, ContigBytes.of(a.get(c)));
        }
        for (int c = 0; c < b.size(); c++) {
            cmp.streamB(bNames.get(c), b.get(c));
        }
        return cmp;
    }

    static CompareSettings settings() {
        return CompareSettings.defaults(ScanOptions.IMPERFECT_MIN_COPIES);
    }

    /** A locus as the scan would report a pure one. */
    static Locus locus(int start, int end, String motif) {
        int p = motif.length();
        return new Locus(start, end, p, motif, MotifClass.of(motif), (end - start) / (double) p, 1.0, 0, 0, 0,
                ScoringModel.bits(ScoringModel.uniform().match(0) * (end - start)), 0, 1.0);
    }

    /** A contig with its planted loci. */
    record Planted(byte[] seq, List<Locus> loci) {
    }

    /**
     * Random sequence of {@code len} bases with a pure repeat of a random primitive motif (period 1-8,
     * 12-60 bases) about every {@code every} bases; the bases beside each repeat do not continue it, so
     * the loci's ends are exact.
     */
    static Planted planted(Random r, int len, int every) {
        byte[] s = random(r, len);
        List<Locus> ls = new ArrayList<>();
        int at = 300 + r.nextInt(every);
        while (at + 400 < len) {
            int p = 1 + r.nextInt(8);
            byte[] m;
            do {
                m = random(r, p);
            } while (MotifClass.primitiveRoot(m) != p);
            String mo = new String(m, StandardCharsets.US_ASCII);
            int n = Math.max(12, Math.max(2 * p, 12 + r.nextInt(49)));
            System.arraycopy(repeat(mo, n), 0, s, at, n);
            s[at - 1] = differentFrom(mo.charAt(p - 1), s[at - 1]);
            s[at + n] = differentFrom(mo.charAt(n % p), s[at + n]);
            ls.add(locus(at, at + n, mo));
            at += n + every / 2 + r.nextInt(every);
        }
        return new Planted(s, ls);
    }

    static byte differentFrom(char avoid, byte b) {
        return b != avoid ? b : (byte) (avoid == 'A' ? 'C' : 'A');
    }

    static byte[] random(Random r, int n) {
        byte[] b = new byte[n];
        for (int i = 0; i < n; i++) {
            b[i] = (byte) "ACGT".charAt(r.nextInt(4));
        }
        return b;
    }

    static byte[] repeat(String motif, int len) {
        byte[] b = new byte[len];
        for (int i = 0; i < len; i++) {
            b[i] = (byte) motif.charAt(i % motif.length());
        }
        return b;
    }

    static byte[] concat(byte[]... parts) {
        int n = 0;
        for (byte[] p : parts) {
            n += p.length;
        }
        byte[] out = new byte[n];
        int at = 0;
        for (byte[] p : parts) {
            System.arraycopy(p, 0, out, at, p.length);
            at += p.length;
        }
        return out;
    }

    static byte[] reverseComplement(byte[] s) {
        byte[] out = new byte[s.length];
        for (int i = 0; i < s.length; i++) {
            out[s.length - 1 - i] = switch (Character.toUpperCase(s[i])) {
                case 'A' -> (byte) 'T';
                case 'C' -> (byte) 'G';
                case 'G' -> (byte) 'C';
                case 'T' -> (byte) 'A';
                default -> (byte) 'N';
            };
        }
        return out;
    }

    static String text(byte[] s, int from, int to) {
        return new String(s, from, to - from, StandardCharsets.US_ASCII);
    }
}
