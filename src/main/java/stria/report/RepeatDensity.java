package stria.report;

import java.util.ArrayList;
import java.util.List;

/**
 * The share of bases in repeats in bins of equal length along the {@link DrawnContigs}: one bin length for
 * all, about a 300th of the longest, rounded to 1, 2 or 5 times a power of ten (at least 10). A bin holds
 * the bases of the union of loci over the bases scanned in it; NaN where it holds no scanned base.
 *
 * @param names    the contigs, longest first
 * @param lengths  their lengths
 * @param bin      bin length in bases
 * @param percent  per contig, per bin: percent of the scanned bases in repeats, or NaN
 * @param scaleMax top of the colour scale: the 99th percentile of the bins, rounded up to a nice number, at
 *                 least 1 and at most 100, so a few satellite-filled bins do not wash out the rest
 * @param unit     bases per unit of the shared position axis (1, 1e3 or 1e6), by the longest contig
 * @param unitName bp, kb or Mb
 * @param gaps     per contig drawn, its N gaps inside the scanned spans ({@link Gaps}; empty when unknown) as
 *                 flattened {@code [start, end)} pairs; their bases are not counted as scanned, and the charts
 *                 draw them
 */
record RepeatDensity(List<String> names, long[] lengths, long bin, double[][] percent, double scaleMax,
                     double unit, String unitName, long[][] gaps) {

    /**
     * One contig's bins as a step profile: a point at every bin start (in units of {@code unitName}) and one
     * at the contig's end repeating the last bin; {@code yMax} tops the percent axis.
     */
    record Profile(String name, long length, long bin, double[] x, double[] percent, String unitName, double yMax) {
    }

    /** The bins of all contigs as cells of a heat map: x at the bin start (in units), y the contig's row. */
    record Cells(String[] names, double[] x, double[] row, double[] percent) {
    }

    private static final int LONGEST_NAME = 22;

    static RepeatDensity of(ResultSet r) {
        return of(r, Gaps.unknown(r.header().contigs().size()));
    }

    static RepeatDensity of(ResultSet r, Gaps gapsOf) {
        List<Integer> top = DrawnContigs.of(r);
        List<String> names = new ArrayList<>();
        long[] lengths = new long[top.size()];
        long longest = 1;
        for (int t = 0; t < top.size(); t++) {
            names.add(r.header().contigs().get(top.get(t)).name());
            lengths[t] = r.header().contigs().get(top.get(t)).length();
            longest = Math.max(longest, lengths[t]);
        }
        long bin = niceBin(longest / 300.0);
        double[][] pct = new double[top.size()][];
        long[][] gaps = new long[top.size()][];
        List<Double> all = new ArrayList<>();
        for (int t = 0; t < top.size(); t++) {
            int c = top.get(t);
            long len = lengths[t];
            int nb = (int) ((len + bin - 1) / bin);
            double[] scanned = new double[nb];
            long[] spans = r.scanned().get(c);
            for (int i = 0; i < spans.length; i += 2) {
                addSpan(scanned, bin, spans[i], spans[i + 1]);
            }
            gaps[t] = clip(gapsOf.of(c), spans);
            double[] gapBases = new double[nb];
            for (int i = 0; i < gaps[t].length; i += 2) {
                addSpan(gapBases, bin, gaps[t][i], gaps[t][i + 1]);
            }
            for (int b = 0; b < nb; b++) {
                scanned[b] -= gapBases[b];
            }
            double[] cov = new double[nb];
            ContigLoci l = r.loci().get(c);
            // loci are sorted by start: one sweep gives the union
            long cs = -1, ce = -1;
            for (int i = 0; i < l.size(); i++) {
                if (cs < 0 || l.start(i) > ce) {
                    if (cs >= 0) {
                        addSpan(cov, bin, cs, ce);
                    }
                    cs = l.start(i);
                    ce = l.end(i);
                } else {
                    ce = Math.max(ce, l.end(i));
                }
            }
            if (cs >= 0) {
                addSpan(cov, bin, cs, ce);
            }
            pct[t] = new double[nb];
            for (int b = 0; b < nb; b++) {
                pct[t][b] = scanned[b] > 0 ? 100 * Math.min(cov[b], scanned[b]) / scanned[b] : Double.NaN;
                if (scanned[b] > 0) {
                    all.add(pct[t][b]);
                }
            }
        }
        double max = 1;
        if (!all.isEmpty()) {
            all.sort(null);
            max = Math.max(1, all.get((int) Math.floor(0.99 * (all.size() - 1))));
        }
        max = niceCeil(max);
        double unit = unitOf(longest);
        return new RepeatDensity(List.copyOf(names), lengths, bin, pct, Math.min(100, max), unit, unitName(unit),
                gaps);
    }

    /** The parts of the sorted spans {@code g} inside the sorted, disjoint spans {@code within}. */
    static long[] clip(long[] g, long[] within) {
        long[] out = new long[g.length + within.length];
        int n = 0;
        for (int i = 0; i < g.length; i += 2) {
            for (int k = 0; k < within.length; k += 2) {
                long lo = Math.max(g[i], within[k]);
                long hi = Math.min(g[i + 1], within[k + 1]);
                if (lo < hi) {
                    if (n + 2 > out.length) {
                        out = java.util.Arrays.copyOf(out, 2 * out.length + 2);
                    }
                    out[n++] = lo;
                    out[n++] = hi;
                }
            }
        }
        return java.util.Arrays.copyOf(out, n);
    }

    /**
     * The gaps of contig {@code t} to draw, in units of {@code u}: neighbours closer than a tenth of a bin
     * joined and at most {@code max} kept (the longest), so a scaffold of thousands of gaps stays drawable.
     */
    double[] drawnGaps(int t, double u, int max) {
        long[] g = gaps[t];
        List<long[]> joined = new ArrayList<>();
        for (int i = 0; i < g.length; i += 2) {
            if (!joined.isEmpty() && g[i] - joined.get(joined.size() - 1)[1] < Math.max(1, bin / 10)) {
                joined.get(joined.size() - 1)[1] = g[i + 1];
            } else {
                joined.add(new long[] {g[i], g[i + 1]});
            }
        }
        if (joined.size() > max) {
            joined.sort((a, b) -> Long.compare(b[1] - b[0], a[1] - a[0]));
            joined = new ArrayList<>(joined.subList(0, max));
            joined.sort((a, b) -> Long.compare(a[0], b[0]));
        }
        double[] out = new double[2 * joined.size()];
        for (int i = 0; i < joined.size(); i++) {
            out[2 * i] = joined.get(i)[0] / u;
            out[2 * i + 1] = joined.get(i)[1] / u;
        }
        return out;
    }

    /** Whether any drawn contig has a gap. */
    boolean hasGaps() {
        for (long[] g : gaps) {
            if (g.length > 0) {
                return true;
            }
        }
        return false;
    }

    /** The profile of contig {@code t}: its own position unit, and a percent axis up to a nice number above its bins. */
    Profile profile(int t) {
        long length = lengths[t];
        // each profile has its own axis, so each contig gets the unit that suits its own length
        double u = unitOf(length);
        double[] p = percent[t];
        double[] x = new double[p.length + 1];
        double[] y = new double[p.length + 1];
        for (int b = 0; b < p.length; b++) {
            x[b] = b * bin / u;
            y[b] = p[b];
        }
        x[p.length] = Math.min(length, (long) p.length * bin) / u;
        y[p.length] = p.length == 0 ? Double.NaN : p[p.length - 1];
        double top = 0;
        for (double v : p) {
            if (!Double.isNaN(v)) {
                top = Math.max(top, v);
            }
        }
        return new Profile(names.get(t), length, bin, x, y, unitName(u),
                Math.min(100, niceCeil(Math.max(1, top))));
    }

    /** Every bin that holds scanned bases, contig after contig. */
    Cells cells() {
        int cells = 0;
        for (double[] p : percent) {
            for (double v : p) {
                if (!Double.isNaN(v)) {
                    cells++;
                }
            }
        }
        double[] x = new double[cells];
        double[] row = new double[cells];
        double[] z = new double[cells];
        String[] shortNames = new String[names.size()];
        int k = 0;
        for (int t = 0; t < names.size(); t++) {
            shortNames[t] = Fmt.ellipsize(names.get(t), LONGEST_NAME);
            for (int b = 0; b < percent[t].length; b++) {
                double v = percent[t][b];
                if (!Double.isNaN(v)) {
                    x[k] = b * bin / unit;
                    row[k] = t;
                    z[k] = v;
                    k++;
                }
            }
        }
        return new Cells(shortNames, x, row, z);
    }

    /** Contigs drawn. */
    int size() {
        return names.size();
    }

    private static void addSpan(double[] bins, long bin, long s, long e) {
        int bs = (int) (s / bin);
        int be = (int) ((e - 1) / bin);
        for (int b = bs; b <= be && b < bins.length; b++) {
            long lo = Math.max(s, b * bin);
            long hi = Math.min(e, (b + 1) * bin);
            bins[b] += hi - lo;
        }
    }

    static double unitOf(long length) {
        return length >= 1_000_000 ? 1e6 : length >= 1_000 ? 1e3 : 1;
    }

    private static String unitName(double unit) {
        return unit == 1e6 ? "Mb" : unit == 1e3 ? "kb" : "bp";
    }

    /** The smallest of 1, 2 and 5 times a power of ten that is at least {@code raw} and at least 10. */
    static long niceBin(double raw) {
        long p = 1;
        while (true) {
            for (long m : new long[] {1, 2, 5}) {
                if (m * p >= raw && m * p >= 10) {
                    return m * p;
                }
            }
            p *= 10;
        }
    }

    /** The smallest of 1, 2, 2.5 and 5 times a power of ten that is at least {@code v} (positive). */
    static double niceCeil(double v) {
        double p = Math.pow(10, Math.floor(Math.log10(v)));
        for (double m : new double[] {1, 2, 2.5, 5, 10}) {
            if (m * p >= v - 1e-9) {
                return m * p;
            }
        }
        return 10 * p;
    }
}
