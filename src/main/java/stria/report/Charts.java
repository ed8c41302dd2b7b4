package stria.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.CategoryLabelPositions;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.labels.StandardCategoryItemLabelGenerator;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.CombinedDomainCategoryPlot;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.PaintScale;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.StackedBarRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.chart.renderer.xy.XYBlockRenderer;
import org.jfree.chart.renderer.xy.XYStepAreaRenderer;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.PaintScaleLegend;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.data.category.DefaultCategoryDataset;
import org.jfree.data.xy.DefaultXYZDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.svg.SVGGraphics2D;
import org.jfree.svg.ViewBox;

/**
 * The report's charts, drawn with JFreeChart into SVG (JFreeSVG) so the page stays one self-contained
 * file that scales without blur. Every chart is sized for a genome of any contig count: per-contig charts
 * show the longest contigs and fold the rest into one "others" entry.
 */
final class Charts {
    static {
        // charts are drawn off screen; a server or CI host has no display
        System.setProperty("java.awt.headless", "true");
        // otherwise rotated labels reach the SVG as glyph outlines: larger, blurry when scaled, not searchable
        org.jfree.chart.text.TextUtils.setUseDrawRotatedStringWorkaround(false);
    }

    /** Colours of the period classes, in PeriodClass order: distinct in hue and lightness, so they survive grey print. */
    static final Color[] CLASS_COLOURS = {
            new Color(0x2f6db5), // homopolymer
            new Color(0xe8833a), // micro
            new Color(0x3c9d6a), // mini
            new Color(0x8a4f9e), // satellite
    };
    static final Color INK = new Color(0x1f2933);
    static final Color MUTED = new Color(0x52606d);
    static final Color GRID = new Color(0xe4e7eb);
    static final Color AXIS = new Color(0x9aa5b1);
    static final Color EMPTY = new Color(0xf3f4f6);

    static final int WIDTH = 1080;
    /** Contigs drawn one by one; the rest are folded into "others". */
    static final int TOP_CONTIGS = 20;

    // unquoted: JFreeSVG writes the family inside a single-quoted style attribute
    private static final String FONT_STACK = "DejaVu Sans, Verdana, Segoe UI, Arial, sans-serif";
    private static final String MONO_STACK = "DejaVu Sans Mono, Menlo, Consolas, monospace";
    private static final Font TICK = new Font(Font.SANS_SERIF, Font.PLAIN, 12);
    private static final Font LABEL = new Font(Font.SANS_SERIF, Font.PLAIN, 13);
    private static final Font SMALL_TITLE = new Font(Font.SANS_SERIF, Font.BOLD, 13);

    private Charts() {
    }

    /** An inline SVG element, scaled by its container (no fixed size), ids prefixed to stay unique in the page. */
    static String svg(JFreeChart chart, int width, int height, String id) {
        SVGGraphics2D g2 = new SVGGraphics2D(width, height);
        g2.setDefsKeyPrefix(id + "-");
        g2.setFontFunction(family -> family.equals(Font.MONOSPACED) ? MONO_STACK : FONT_STACK);
        g2.setGeomDoubleConverter(d -> trim(d));
        g2.setTransformDoubleConverter(d -> trim(d));
        chart.draw(g2, new Rectangle2D.Double(0, 0, width, height));
        return g2.getSVGElement(id, false, new ViewBox(0, 0, width, height), null, null);
    }

    private static String trim(double d) {
        if (d == Math.rint(d)) {
            return Long.toString((long) d);
        }
        String s = String.format(Locale.ROOT, "%.2f", d);
        return s.endsWith("0") ? s.substring(0, s.length() - 1) : s;
    }

    // ---- period distribution ----

    /** Period bins: single periods where loci are many, wider bins above, none straddling a class boundary. */
    static final int[][] PERIOD_BINS = {
            {1, 1}, {2, 2}, {3, 3}, {4, 4}, {5, 5}, {6, 6}, {7, 7}, {8, 8}, {9, 9}, {10, 10}, {11, 20}, {21, 50},
            {51, 99}, {100, 199}, {200, 499}, {500, 999}, {1000, Integer.MAX_VALUE}};

    static String binLabel(int[] b) {
        if (b[0] == b[1]) {
            return Integer.toString(b[0]);
        }
        return b[1] == Integer.MAX_VALUE ? "\u2265" + b[0] : b[0] + "\u2013" + b[1];
    }

    static JFreeChart periods(ResultSet r) {
        long[] loci = new long[PERIOD_BINS.length];
        long[] bases = new long[PERIOD_BINS.length];
        int last = 9; // periods 1-10 are always drawn, so an empty micro class shows as empty, not as missing
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                int b = periodBin(l.period(i));
                loci[b]++;
                bases[b] += l.end(i) - l.start(i);
                last = Math.max(last, b);
            }
        }
        DefaultCategoryDataset dl = new DefaultCategoryDataset();
        DefaultCategoryDataset db = new DefaultCategoryDataset();
        PeriodClass[] cls = new PeriodClass[last + 1];
        for (int b = 0; b <= last; b++) {
            String label = binLabel(PERIOD_BINS[b]);
            dl.addValue(loci[b], "loci", label);
            db.addValue(bases[b], "bases", label);
            cls[b] = PeriodClass.of(PERIOD_BINS[b][0]);
        }
        CategoryAxis x = categoryAxis("period (bp)");
        CombinedDomainCategoryPlot plot = new CombinedDomainCategoryPlot(x);
        plot.setGap(14);
        plot.add(barPlot(dl, "loci", cls), 1);
        plot.add(barPlot(db, "bases in loci", cls), 1);
        plot.setOrientation(PlotOrientation.VERTICAL);
        JFreeChart chart = new JFreeChart(null, null, plot, false);
        chart.addLegend(classLegend());
        return style(chart);
    }

    static int periodBin(int period) {
        for (int b = 0; b < PERIOD_BINS.length; b++) {
            if (period <= PERIOD_BINS[b][1]) {
                return b;
            }
        }
        return PERIOD_BINS.length - 1;
    }

    private static CategoryPlot barPlot(DefaultCategoryDataset d, String valueLabel, PeriodClass[] cls) {
        NumberAxis y = valueAxis(valueLabel);
        BarRenderer br = new BarRenderer() {
            private static final long serialVersionUID = 1L;

            @Override
            public Paint getItemPaint(int row, int column) {
                return CLASS_COLOURS[cls[column].ordinal()];
            }
        };
        flatBars(br);
        br.setMaximumBarWidth(0.06);
        CategoryPlot p = new CategoryPlot(d, null, y, br);
        stylePlot(p);
        return p;
    }

    // ---- motif classes ----

    static final int TOP_MOTIFS = 20;

    static JFreeChart motifs(ResultSet r) {
        int n = r.motifClasses().size();
        long[] loci = new long[n];
        long[] bases = new long[n];
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                loci[l.motifClass(i)]++;
                bases[l.motifClass(i)] += l.end(i) - l.start(i);
            }
        }
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, Comparator.<Integer>comparingLong(i -> -loci[i]).thenComparingLong(i -> -bases[i])
                .thenComparing(i -> r.motifClasses().get(i)));
        int shown = Math.min(TOP_MOTIFS, n);
        DefaultCategoryDataset d = new DefaultCategoryDataset();
        PeriodClass[] cls = new PeriodClass[shown];
        List<String> used = new ArrayList<>();
        for (int k = 0; k < shown; k++) {
            String motif = r.motifClasses().get(order[k]);
            String label = motif.length() <= 14 ? motif
                    : motif.substring(0, 10) + "\u2026 (" + motif.length() + " bp)";
            while (used.contains(label)) {
                label = label + " ";
            }
            used.add(label);
            d.addValue(loci[order[k]], "loci", label);
            cls[k] = PeriodClass.of(motif.length());
        }
        CategoryAxis x = categoryAxis(null);
        x.setTickLabelFont(new Font(Font.MONOSPACED, Font.PLAIN, 12));
        NumberAxis y = valueAxis("loci");
        BarRenderer br = new BarRenderer() {
            private static final long serialVersionUID = 1L;

            @Override
            public Paint getItemPaint(int row, int column) {
                return CLASS_COLOURS[cls[column].ordinal()];
            }
        };
        flatBars(br);
        br.setMaximumBarWidth(0.7);
        br.setItemMargin(0);
        br.setDefaultItemLabelGenerator(new StandardCategoryItemLabelGenerator("{2}",
                java.text.NumberFormat.getIntegerInstance(Locale.ROOT)));
        br.setDefaultItemLabelsVisible(true);
        br.setDefaultPositiveItemLabelPosition(new org.jfree.chart.labels.ItemLabelPosition(
                org.jfree.chart.labels.ItemLabelAnchor.OUTSIDE3, org.jfree.chart.ui.TextAnchor.CENTER_LEFT));
        br.setItemLabelAnchorOffset(4);
        br.setDefaultItemLabelFont(TICK);
        br.setDefaultItemLabelPaint(MUTED);
        y.setUpperMargin(0.12); // room for the count beside the longest bar
        CategoryPlot p = new CategoryPlot(d, x, y, br);
        p.setOrientation(PlotOrientation.HORIZONTAL);
        p.setRangeAxisLocation(AxisLocation.BOTTOM_OR_LEFT);
        stylePlot(p);
        JFreeChart chart = new JFreeChart(null, null, p, false);
        chart.addLegend(classLegend());
        return style(chart);
    }

    static int motifsHeight(ResultSet r) {
        return 90 + 24 * Math.max(1, Math.min(TOP_MOTIFS, r.motifClasses().size()));
    }

    // ---- share of each contig in repeats ----

    /** Indices of the contigs drawn one by one: the longest scanned ones, in decreasing length. */
    static List<Integer> topContigs(ResultSet r, int max) {
        List<Integer> idx = new ArrayList<>();
        for (int c = 0; c < r.header().contigs().size(); c++) {
            if (r.scannedBases(c) > 0) {
                idx.add(c);
            }
        }
        idx.sort(Comparator.<Integer>comparingLong(c -> -r.scannedBases(c)).thenComparingInt(c -> c));
        return idx.size() <= max ? idx : idx.subList(0, max);
    }

    static JFreeChart contigShares(ResultSet r, Summary s) {
        List<Integer> top = topContigs(r, TOP_CONTIGS);
        DefaultCategoryDataset d = new DefaultCategoryDataset();
        List<Summary.Row> rows = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        for (int c : top) {
            rows.add(s.contigs().get(c));
            labels.add(Fmt.ellipsize(s.contigs().get(c).name(), 22));
        }
        int others = 0;
        long[] oBases = new long[PeriodClass.values().length];
        long oScanned = 0;
        java.util.Set<Integer> topSet = new java.util.HashSet<>(top);
        for (int c = 0; c < s.contigs().size(); c++) {
            Summary.Row row = s.contigs().get(c);
            if (!topSet.contains(c) && row.scanned() > 0) {
                others++;
                oScanned += row.scanned();
                for (int k = 0; k < oBases.length; k++) {
                    oBases[k] += row.classBases()[k];
                }
            }
        }
        if (others > 0) {
            rows.add(new Summary.Row("others", oScanned, 0, 0, new long[oBases.length], oBases));
            labels.add("others (" + others + ")");
        }
        if (rows.size() > 1) {
            rows.add(s.genome());
            labels.add("genome");
        }
        for (PeriodClass pc : PeriodClass.values()) {
            for (int i = 0; i < rows.size(); i++) {
                d.addValue(100 * rows.get(i).classShare(pc), pc.label(), uniq(labels, i));
            }
        }
        CategoryAxis x = categoryAxis(null);
        if (rows.size() > 8) {
            x.setCategoryLabelPositions(CategoryLabelPositions.UP_45);
        }
        x.setMaximumCategoryLabelLines(2);
        NumberAxis y = valueAxis("% of bases scanned");
        StackedBarRenderer br = new StackedBarRenderer();
        flatBars(br);
        br.setMaximumBarWidth(0.08);
        for (PeriodClass pc : PeriodClass.values()) {
            br.setSeriesPaint(pc.ordinal(), CLASS_COLOURS[pc.ordinal()]);
        }
        CategoryPlot p = new CategoryPlot(d, x, y, br);
        stylePlot(p);
        JFreeChart chart = new JFreeChart(null, null, p, false);
        chart.addLegend(classLegend());
        return style(chart);
    }

    private static String uniq(List<String> labels, int i) {
        String l = labels.get(i);
        for (int j = 0; j < i; j++) {
            if (labels.get(j).equals(l)) {
                return l + " ".repeat(i - j);
            }
        }
        return l;
    }

    static int contigSharesHeight(ResultSet r) {
        return topContigs(r, TOP_CONTIGS).size() > 8 ? 460 : 360;
    }

    // ---- repeat density along contigs ----

    /** Repeat density in bins along the drawn contigs; NaN where a bin holds no scanned base. */
    record Density(List<Integer> contigs, long bin, double[][] percent, double scaleMax, double unit, String unitName) {
    }

    static Density density(ResultSet r) {
        List<Integer> top = topContigs(r, TOP_CONTIGS);
        long longest = 1;
        for (int c : top) {
            longest = Math.max(longest, r.header().contigs().get(c).length());
        }
        long bin = niceBin(longest / 300.0);
        double[][] pct = new double[top.size()][];
        List<Double> all = new ArrayList<>();
        for (int t = 0; t < top.size(); t++) {
            int c = top.get(t);
            long len = r.header().contigs().get(c).length();
            int nb = (int) ((len + bin - 1) / bin);
            double[] scanned = new double[nb];
            long[] spans = r.scanned().get(c);
            for (int i = 0; i < spans.length; i += 2) {
                addSpan(scanned, bin, spans[i], spans[i + 1]);
            }
            double[] cov = new double[nb];
            ContigLoci l = r.loci().get(c);
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
        // the top of the colour scale sits at the 99th percentile, so a few satellite-filled bins do not
        // wash out the rest of the genome
        double max = 1;
        if (!all.isEmpty()) {
            all.sort(null);
            max = Math.max(1, all.get((int) Math.floor(0.99 * (all.size() - 1))));
        }
        max = niceCeil(max);
        double unit = longest >= 1_000_000 ? 1e6 : longest >= 1_000 ? 1e3 : 1;
        String unitName = unit == 1e6 ? "Mb" : unit == 1e3 ? "kb" : "bp";
        return new Density(top, bin, pct, Math.min(100, max), unit, unitName);
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

    static double niceCeil(double v) {
        double p = Math.pow(10, Math.floor(Math.log10(v)));
        for (double m : new double[] {1, 2, 2.5, 5, 10}) {
            if (m * p >= v - 1e-9) {
                return m * p;
            }
        }
        return 10 * p;
    }

    /** Heat strips, one row per contig: for many contigs, where separate line charts would not fit. */
    static JFreeChart densityStrips(ResultSet r, Density d) {
        int rows = d.contigs().size();
        int cells = 0;
        for (double[] p : d.percent()) {
            for (double v : p) {
                if (!Double.isNaN(v)) {
                    cells++;
                }
            }
        }
        double[][] xyz = new double[3][cells];
        int k = 0;
        String[] names = new String[rows];
        for (int t = 0; t < rows; t++) {
            names[t] = Fmt.ellipsize(r.header().contigs().get(d.contigs().get(t)).name(), 22);
            for (int b = 0; b < d.percent()[t].length; b++) {
                double v = d.percent()[t][b];
                if (!Double.isNaN(v)) {
                    xyz[0][k] = b * d.bin() / d.unit();
                    xyz[1][k] = t;
                    xyz[2][k] = v;
                    k++;
                }
            }
        }
        DefaultXYZDataset ds = new DefaultXYZDataset();
        ds.addSeries("density", xyz);
        NumberAxis x = valueAxis("position (" + d.unitName() + ")");
        x.setAutoRangeIncludesZero(true);
        x.setLowerMargin(0);
        x.setUpperMargin(0.01);
        SymbolAxis y = new SymbolAxis(null, names);
        y.setGridBandsVisible(false);
        y.setInverted(true); // longest contig on top
        y.setTickLabelFont(TICK);
        y.setTickLabelPaint(INK);
        y.setAxisLinePaint(AXIS);
        y.setTickMarksVisible(false);
        y.setRange(-0.6, rows - 0.4);
        XYBlockRenderer br = new XYBlockRenderer();
        br.setBlockWidth(d.bin() / d.unit());
        br.setBlockHeight(0.78);
        br.setBlockAnchor(RectangleAnchor.LEFT);
        br.setPaintScale(new Ramp(0, d.scaleMax(), DENSITY_STOPS));
        XYPlot p = new XYPlot(ds, x, y, br);
        stylePlot(p);
        p.setRangeGridlinesVisible(false);
        JFreeChart chart = new JFreeChart(null, null, p, false);
        chart.addSubtitle(scaleLegend(new Ramp(0, d.scaleMax(), DENSITY_STOPS), "% of bin in repeats", false));
        return style(chart);
    }

    static int densityStripsHeight(Density d) {
        return 110 + 26 * d.contigs().size();
    }

    /** A filled profile of one contig: reads better than a strip when only a few contigs exist. */
    static JFreeChart densityProfile(ResultSet r, Density d, int t) {
        var contig = r.header().contigs().get(d.contigs().get(t));
        // each profile has its own axis, so each contig gets the unit that suits its own length
        double unit = contig.length() >= 1_000_000 ? 1e6 : contig.length() >= 1_000 ? 1e3 : 1;
        String unitName = unit == 1e6 ? "Mb" : unit == 1e3 ? "kb" : "bp";
        XYSeries s = new XYSeries(contig.name(), false, true);
        double[] p = d.percent()[t];
        for (int b = 0; b < p.length; b++) {
            s.add(b * d.bin() / unit, Double.isNaN(p[b]) ? null : p[b]);
        }
        s.add(Math.min(contig.length(), (long) p.length * d.bin()) / unit,
                p.length == 0 || Double.isNaN(p[p.length - 1]) ? null : p[p.length - 1]);
        NumberAxis x = valueAxis("position (" + unitName + ")");
        x.setLowerMargin(0);
        x.setUpperMargin(0);
        NumberAxis y = valueAxis("% in repeats");
        double top = 0;
        for (double v : p) {
            if (!Double.isNaN(v)) {
                top = Math.max(top, v);
            }
        }
        y.setRange(0, Math.min(100, niceCeil(Math.max(1, top))));
        XYStepAreaRenderer ar = new XYStepAreaRenderer(XYStepAreaRenderer.AREA_AND_SHAPES);
        ar.setShapesVisible(false);
        ar.setOutline(true);
        ar.setSeriesPaint(0, new Color(0xe8833a));
        ar.setSeriesOutlinePaint(0, new Color(0xb5521a));
        ar.setDefaultOutlineStroke(new BasicStroke(1f));
        XYPlot plot = new XYPlot(new XYSeriesCollection(s), x, y, ar);
        stylePlot(plot);
        JFreeChart chart = new JFreeChart(null, null, plot, false);
        org.jfree.chart.title.TextTitle title = new org.jfree.chart.title.TextTitle(
                contig.name() + "  \u00b7  " + Fmt.bases(contig.length()) + "  \u00b7  bins of " + Fmt.bases(d.bin()),
                SMALL_TITLE);
        title.setPaint(INK);
        title.setHorizontalAlignment(org.jfree.chart.ui.HorizontalAlignment.LEFT);
        title.setPadding(new RectangleInsets(4, 8, 6, 4));
        chart.setTitle(title);
        return style(chart);
    }

    // ---- length against purity ----

    /** Loci counted in bins of log10(length) and purity; a scatter of a million points would be unreadable. */
    static JFreeChart lengthPurity(ResultSet r) {
        int minLen = Integer.MAX_VALUE, maxLen = 1;
        float minPurity = 1;
        long total = 0;
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                int len = l.end(i) - l.start(i);
                minLen = Math.min(minLen, len);
                maxLen = Math.max(maxLen, len);
                minPurity = Math.min(minPurity, l.purity(i));
                total++;
            }
        }
        if (total == 0) {
            minLen = 10;
            maxLen = 100;
            minPurity = 0.8f;
        }
        double x0 = Math.floor(Math.log10(minLen));
        double x1 = Math.max(x0 + 1, Math.ceil(Math.log10(maxLen) * 10) / 10 + 0.05);
        // a cell is at least one base wide at the short end, else short loci leave empty stripes between
        // the integer lengths
        double dx = Math.max((x1 - x0) / 48, Math.log10(1 + 1 / Math.pow(10, x0)));
        int nx = (int) Math.ceil((x1 - x0) / dx - 1e-9);
        double y0 = Math.max(0, Math.floor(minPurity * 20) / 20);
        double dy = (1 - y0) <= 0.3 ? 0.01 : 0.02;
        int ny = (int) Math.round((1 - y0) / dy) + 1; // the top bin holds purity 1 exactly
        long[][] n = new long[nx][ny];
        long maxCount = 1;
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                int bx = (int) Math.min(nx - 1, Math.max(0, (Math.log10(l.end(i) - l.start(i)) - x0) / dx));
                int by = (int) Math.min(ny - 1, Math.max(0, Math.floor((l.purity(i) - y0) / dy + 1e-6)));
                maxCount = Math.max(maxCount, ++n[bx][by]);
            }
        }
        int cells = 0;
        for (long[] col : n) {
            for (long v : col) {
                cells += v > 0 ? 1 : 0;
            }
        }
        double[][] xyz = new double[3][cells];
        int k = 0;
        for (int bx = 0; bx < nx; bx++) {
            for (int by = 0; by < ny; by++) {
                if (n[bx][by] > 0) {
                    xyz[0][k] = x0 + bx * dx;
                    xyz[1][k] = y0 + by * dy;
                    xyz[2][k] = Math.log10(n[bx][by]);
                    k++;
                }
            }
        }
        DefaultXYZDataset ds = new DefaultXYZDataset();
        ds.addSeries("loci", xyz);
        NumberAxis x = valueAxis("locus length (bp, log scale)");
        x.setNumberFormatOverride(Fmt.axis(true));
        x.setTickUnit(new NumberTickUnit(1, Fmt.axis(true)));
        x.setRange(x0, x1);
        NumberAxis y = valueAxis("purity");
        y.setRange(y0, 1 + dy);
        y.setNumberFormatOverride(new java.text.DecimalFormat("0.00",
                java.text.DecimalFormatSymbols.getInstance(Locale.ROOT)));
        XYBlockRenderer br = new XYBlockRenderer();
        br.setBlockWidth(dx);
        br.setBlockHeight(dy);
        br.setBlockAnchor(RectangleAnchor.BOTTOM_LEFT);
        double zMax = Math.max(1, Math.log10(maxCount));
        br.setPaintScale(new Ramp(0, zMax, COUNT_STOPS));
        XYPlot p = new XYPlot(ds, x, y, br);
        stylePlot(p);
        JFreeChart chart = new JFreeChart(null, null, p, false);
        chart.addSubtitle(scaleLegend(new Ramp(0, zMax, COUNT_STOPS), "loci per cell", true));
        return style(chart);
    }

    /** Whether every locus has purity 1 (exact runs): then purity carries no information to plot. */
    static boolean allExact(ResultSet r) {
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                if (l.purity(i) < 1) {
                    return false;
                }
            }
        }
        return true;
    }

    /** Loci by length in bins of equal width on a log scale, coloured by period class and stacked. */
    static JFreeChart lengths(ResultSet r) {
        int minLen = Integer.MAX_VALUE, maxLen = 1;
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                minLen = Math.min(minLen, l.end(i) - l.start(i));
                maxLen = Math.max(maxLen, l.end(i) - l.start(i));
            }
        }
        if (minLen == Integer.MAX_VALUE) {
            minLen = 10;
        }
        double x0 = Math.floor(Math.log10(minLen));
        double x1 = Math.max(x0 + 1, Math.ceil(Math.log10(maxLen) * 10) / 10 + 0.05);
        double dx = Math.max((x1 - x0) / 48, Math.log10(1 + 1 / Math.pow(10, x0)));
        int nx = (int) Math.ceil((x1 - x0) / dx - 1e-9);
        int k = PeriodClass.values().length;
        long[][] n = new long[k][nx];
        for (ContigLoci l : r.loci()) {
            for (int i = 0; i < l.size(); i++) {
                int bx = (int) Math.min(nx - 1, Math.max(0, (Math.log10(l.end(i) - l.start(i)) - x0) / dx));
                n[PeriodClass.of(l.period(i)).ordinal()][bx]++;
            }
        }
        org.jfree.data.xy.DefaultTableXYDataset ds = new org.jfree.data.xy.DefaultTableXYDataset();
        for (PeriodClass pc : PeriodClass.values()) {
            XYSeries s = new XYSeries(pc.label(), false, false);
            for (int b = 0; b < nx; b++) {
                s.add(x0 + (b + 0.5) * dx, n[pc.ordinal()][b]);
            }
            ds.addSeries(s);
        }
        ds.setIntervalWidth(dx);
        NumberAxis x = valueAxis("locus length (bp, log scale)");
        x.setNumberFormatOverride(Fmt.axis(true));
        x.setTickUnit(new NumberTickUnit(1, Fmt.axis(true)));
        x.setRange(x0, x1);
        NumberAxis y = valueAxis("loci");
        org.jfree.chart.renderer.xy.StackedXYBarRenderer br = new org.jfree.chart.renderer.xy.StackedXYBarRenderer(0.08);
        br.setBarPainter(new org.jfree.chart.renderer.xy.StandardXYBarPainter());
        br.setShadowVisible(false);
        br.setDrawBarOutline(false);
        for (PeriodClass pc : PeriodClass.values()) {
            br.setSeriesPaint(pc.ordinal(), CLASS_COLOURS[pc.ordinal()]);
        }
        XYPlot p = new XYPlot(ds, x, y, br);
        stylePlot(p);
        JFreeChart chart = new JFreeChart(null, null, p, false);
        chart.addLegend(classLegend());
        return style(chart);
    }

    // ---- colour scales ----

    static final Color[] DENSITY_STOPS = {
            new Color(0xfff4d6), new Color(0xfdd08a), new Color(0xf59e3b), new Color(0xd4581c), new Color(0x8c2a0e),
            new Color(0x4a1206)};
    static final Color[] COUNT_STOPS = {
            new Color(0xdbe9f6), new Color(0x9cc3e4), new Color(0x5a9bd0), new Color(0x2f6db5), new Color(0x1b3f7a),
            new Color(0x0d1f45)};

    /** A linear colour ramp through evenly spaced stops; values outside the bounds take the end colours. */
    static final class Ramp implements PaintScale, java.io.Serializable {
        private static final long serialVersionUID = 1L;
        private final double lo;
        private final double hi;
        private final Color[] stops;

        Ramp(double lo, double hi, Color[] stops) {
            this.lo = lo;
            this.hi = hi;
            this.stops = stops;
        }

        @Override
        public double getLowerBound() {
            return lo;
        }

        @Override
        public double getUpperBound() {
            return hi;
        }

        @Override
        public Paint getPaint(double v) {
            double f = hi == lo ? 1 : (v - lo) / (hi - lo);
            f = Math.max(0, Math.min(1, f)) * (stops.length - 1);
            int i = Math.min(stops.length - 2, (int) Math.floor(f));
            double t = f - i;
            Color a = stops[i], b = stops[i + 1];
            return new Color(mix(a.getRed(), b.getRed(), t), mix(a.getGreen(), b.getGreen(), t),
                    mix(a.getBlue(), b.getBlue(), t));
        }

        private static int mix(int a, int b, double t) {
            return (int) Math.round(a + (b - a) * t);
        }
    }

    private static PaintScaleLegend scaleLegend(Ramp scale, String label, boolean log10) {
        NumberAxis a = new SpaciousAxis(label);
        a.setRange(scale.getLowerBound(), scale.getUpperBound());
        a.setLabelFont(LABEL);
        a.setLabelPaint(MUTED);
        a.setTickLabelFont(TICK);
        a.setTickLabelPaint(INK);
        a.setAxisLinePaint(AXIS);
        a.setTickMarkPaint(AXIS);
        if (log10) {
            a.setTickUnit(new NumberTickUnit(1, Fmt.axis(true)));
        } else {
            a.setNumberFormatOverride(Fmt.axis(false));
        }
        PaintScaleLegend l = new PaintScaleLegend(scale, a);
        l.setPosition(RectangleEdge.RIGHT);
        l.setAxisLocation(AxisLocation.BOTTOM_OR_RIGHT);
        l.setStripWidth(14);
        l.setSubdivisionCount(64);
        l.setStripOutlineVisible(false);
        l.setMargin(new RectangleInsets(12, 16, 40, 4));
        l.setBackgroundPaint(Color.WHITE);
        return l;
    }

    // ---- shared styling ----

    private static LegendTitle classLegend() {
        LegendTitle legend = new LegendTitle(() -> {
            org.jfree.chart.LegendItemCollection items = new org.jfree.chart.LegendItemCollection();
            for (PeriodClass pc : PeriodClass.values()) {
                org.jfree.chart.LegendItem item = new org.jfree.chart.LegendItem(
                        pc.label() + " (" + pc.range() + ")", CLASS_COLOURS[pc.ordinal()]);
                item.setShape(new Rectangle2D.Double(-6, -6, 12, 12));
                item.setLabelFont(TICK);
                item.setLabelPaint(INK);
                items.add(item);
            }
            return items;
        });
        legend.setPosition(RectangleEdge.TOP);
        legend.setHorizontalAlignment(org.jfree.chart.ui.HorizontalAlignment.LEFT);
        legend.setFrame(BlockBorder.NONE);
        legend.setBackgroundPaint(Color.WHITE);
        legend.setItemFont(TICK);
        legend.setItemPaint(INK);
        legend.setMargin(new RectangleInsets(2, 6, 6, 2));
        return legend;
    }

    private static CategoryAxis categoryAxis(String label) {
        CategoryAxis a = new CategoryAxis(label);
        a.setLabelFont(LABEL);
        a.setLabelPaint(MUTED);
        a.setTickLabelFont(TICK);
        a.setTickLabelPaint(INK);
        a.setAxisLinePaint(AXIS);
        a.setTickMarksVisible(false);
        a.setCategoryMargin(0.2);
        a.setMaximumCategoryLabelWidthRatio(1.4f);
        a.setLowerMargin(0.01);
        a.setUpperMargin(0.01);
        return a;
    }

    /** A number axis that leaves room between tick labels; the library's default packs them edge to edge. */
    static final class SpaciousAxis extends NumberAxis {
        private static final long serialVersionUID = 1L;

        SpaciousAxis(String label) {
            super(label);
        }

        @Override
        protected double estimateMaximumTickLabelHeight(java.awt.Graphics2D g2) {
            return 2.0 * super.estimateMaximumTickLabelHeight(g2);
        }

        @Override
        protected double estimateMaximumTickLabelWidth(java.awt.Graphics2D g2, org.jfree.chart.axis.TickUnit unit) {
            return 1.8 * super.estimateMaximumTickLabelWidth(g2, unit) + 12;
        }
    }

    private static NumberAxis valueAxis(String label) {
        NumberAxis a = new SpaciousAxis(label);
        a.setLabelFont(LABEL);
        a.setLabelPaint(MUTED);
        a.setTickLabelFont(TICK);
        a.setTickLabelPaint(INK);
        a.setAxisLineVisible(false);
        a.setTickMarkPaint(AXIS);
        a.setNumberFormatOverride(Fmt.axis(false));
        a.setStandardTickUnits(NumberAxis.createStandardTickUnits());
        return a;
    }

    private static void flatBars(BarRenderer br) {
        br.setBarPainter(new StandardBarPainter());
        br.setShadowVisible(false);
        br.setDrawBarOutline(false);
    }

    private static void stylePlot(org.jfree.chart.plot.Plot p) {
        p.setBackgroundPaint(Color.WHITE);
        p.setOutlineVisible(false);
        p.setInsets(new RectangleInsets(6, 4, 4, 10));
        if (p instanceof CategoryPlot cp) {
            cp.setRangeGridlinePaint(GRID);
            cp.setRangeGridlineStroke(new BasicStroke(1f));
            cp.setDomainGridlinesVisible(false);
            cp.setAxisOffset(RectangleInsets.ZERO_INSETS);
        } else if (p instanceof XYPlot xp) {
            xp.setRangeGridlinePaint(GRID);
            xp.setDomainGridlinePaint(GRID);
            xp.setRangeGridlineStroke(new BasicStroke(1f));
            xp.setDomainGridlineStroke(new BasicStroke(1f));
            xp.setAxisOffset(new RectangleInsets(2, 2, 2, 2));
        }
    }

    private static JFreeChart style(JFreeChart chart) {
        chart.setBackgroundPaint(Color.WHITE);
        chart.setBorderVisible(false);
        chart.setPadding(new RectangleInsets(6, 6, 6, 6));
        chart.setAntiAlias(true);
        chart.setTextAntiAlias(true);
        return chart;
    }
}
