package stria.report;

import java.awt.BasicStroke;
import java.awt.Font;
import java.awt.geom.Rectangle2D;
import java.text.DecimalFormat;
import java.text.DecimalFormatSymbols;
import java.text.NumberFormat;
import java.util.Locale;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.CategoryLabelPositions;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.labels.ItemLabelAnchor;
import org.jfree.chart.labels.ItemLabelPosition;
import org.jfree.chart.labels.StandardCategoryItemLabelGenerator;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.CombinedDomainCategoryPlot;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.StackedBarRenderer;
import org.jfree.chart.renderer.xy.StackedXYBarRenderer;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBlockRenderer;
import org.jfree.chart.renderer.xy.XYStepAreaRenderer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.category.DefaultCategoryDataset;
import org.jfree.data.xy.DefaultTableXYDataset;
import org.jfree.data.xy.DefaultXYZDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.svg.SVGGraphics2D;
import org.jfree.svg.ViewBox;

import static stria.report.ChartStyle.CLASS_COLOURS;
import static stria.report.ChartStyle.COUNT_STOPS;
import static stria.report.ChartStyle.DENSITY_STOPS;
import static stria.report.ChartStyle.WIDTH;

/**
 * The report's charts, drawn with JFreeChart into SVG (JFreeSVG) so the page stays one self-contained
 * file that scales without blur: one method per chart, each taking the chart's data (binned and laid out
 * beforehand, see {@link PeriodHistogram} and its siblings) and returning an inline SVG element, with
 * every colour, font and frame from {@link ChartStyle}.
 */
final class Charts {
    static {
        // charts are drawn off screen; a server or CI host has no display
        System.setProperty("java.awt.headless", "true");
        // otherwise rotated labels reach the SVG as glyph outlines: larger, blurry when scaled, not searchable
        org.jfree.chart.text.TextUtils.setUseDrawRotatedStringWorkaround(false);
    }

    private Charts() {
    }

    /** Loci and bases in loci by period, two bar plots over one period axis. */
    static String periods(PeriodHistogram h) {
        DefaultCategoryDataset dl = new DefaultCategoryDataset();
        DefaultCategoryDataset db = new DefaultCategoryDataset();
        for (int b = 0; b < h.size(); b++) {
            dl.addValue(h.loci()[b], "loci", h.labels()[b]);
            db.addValue(h.bases()[b], "bases", h.labels()[b]);
        }
        CombinedDomainCategoryPlot plot = new CombinedDomainCategoryPlot(ChartStyle.categoryAxis("period (bp)"));
        plot.setGap(14);
        plot.add(periodBars(dl, "loci", h.classes()), 1);
        plot.add(periodBars(db, "bases in loci", h.classes()), 1);
        plot.setOrientation(PlotOrientation.VERTICAL);
        return svg(ChartStyle.classChart(plot), 480, "periods");
    }

    private static CategoryPlot periodBars(DefaultCategoryDataset d, String valueLabel, PeriodClass[] classes) {
        BarRenderer br = ChartStyle.classBars(classes);
        br.setMaximumBarWidth(0.06);
        CategoryPlot p = new CategoryPlot(d, null, ChartStyle.valueAxis(valueLabel), br);
        ChartStyle.plot(p);
        return p;
    }

    /** The most frequent motif classes as horizontal bars, each with its count beside it. */
    static String motifs(MotifRanking m) {
        DefaultCategoryDataset d = new DefaultCategoryDataset();
        for (int k = 0; k < m.size(); k++) {
            d.addValue(m.loci()[k], "loci", m.labels()[k]);
        }
        CategoryAxis x = ChartStyle.categoryAxis(null);
        x.setTickLabelFont(ChartStyle.MONO_TICK);
        NumberAxis y = ChartStyle.valueAxis("loci");
        BarRenderer br = ChartStyle.classBars(m.classes());
        br.setMaximumBarWidth(0.7);
        br.setItemMargin(0);
        br.setDefaultItemLabelGenerator(new StandardCategoryItemLabelGenerator("{2}",
                NumberFormat.getIntegerInstance(Locale.ROOT)));
        br.setDefaultItemLabelsVisible(true);
        br.setDefaultPositiveItemLabelPosition(new ItemLabelPosition(ItemLabelAnchor.OUTSIDE3, TextAnchor.CENTER_LEFT));
        br.setItemLabelAnchorOffset(4);
        br.setDefaultItemLabelFont(ChartStyle.TICK);
        br.setDefaultItemLabelPaint(ChartStyle.MUTED);
        y.setUpperMargin(0.12); // room for the count beside the longest bar
        CategoryPlot p = new CategoryPlot(d, x, y, br);
        p.setOrientation(PlotOrientation.HORIZONTAL);
        p.setRangeAxisLocation(AxisLocation.BOTTOM_OR_LEFT);
        ChartStyle.plot(p);
        return svg(ChartStyle.classChart(p), 90 + 24 * Math.max(1, m.size()), "motifs");
    }

    /** The share of each contig in repeats, stacked by period class. */
    static String contigShares(ContigShares s) {
        DefaultCategoryDataset d = new DefaultCategoryDataset();
        for (PeriodClass pc : PeriodClass.values()) {
            for (int i = 0; i < s.size(); i++) {
                d.addValue(s.percent()[pc.ordinal()][i], pc.label(), s.labels().get(i));
            }
        }
        CategoryAxis x = ChartStyle.categoryAxis(null);
        if (s.size() > 8) {
            x.setCategoryLabelPositions(CategoryLabelPositions.UP_45);
        }
        x.setMaximumCategoryLabelLines(2);
        NumberAxis y = ChartStyle.valueAxis("% of bases scanned");
        StackedBarRenderer br = new StackedBarRenderer();
        ChartStyle.flatBars(br);
        br.setMaximumBarWidth(0.08);
        for (PeriodClass pc : PeriodClass.values()) {
            br.setSeriesPaint(pc.ordinal(), CLASS_COLOURS[pc.ordinal()]);
        }
        CategoryPlot p = new CategoryPlot(d, x, y, br);
        ChartStyle.plot(p);
        return svg(ChartStyle.classChart(p), s.drawn() > 8 ? 460 : 360, "shares");
    }

    /** Gaps drawn per contig at most: the longest, so a scaffold of thousands of gaps stays drawable. */
    static final int MAX_GAPS_DRAWN = 500;

    /** A filled profile of one contig: reads better than a strip when only a few contigs exist. */
    static String densityProfile(RepeatDensity d, int t) {
        RepeatDensity.Profile pr = d.profile(t);
        XYSeries s = new XYSeries(pr.name(), false, true);
        for (int b = 0; b < pr.x().length; b++) {
            double v = pr.percent()[b];
            s.add(pr.x()[b], Double.isNaN(v) ? null : v);
        }
        NumberAxis x = ChartStyle.valueAxis("position (" + pr.unitName() + ")");
        x.setLowerMargin(0);
        x.setUpperMargin(0);
        NumberAxis y = ChartStyle.valueAxis("% in repeats");
        y.setRange(0, pr.yMax());
        XYStepAreaRenderer ar = new XYStepAreaRenderer(XYStepAreaRenderer.AREA_AND_SHAPES);
        ar.setShapesVisible(false);
        ar.setOutline(true);
        ar.setSeriesPaint(0, ChartStyle.PROFILE_FILL);
        ar.setSeriesOutlinePaint(0, ChartStyle.PROFILE_LINE);
        ar.setDefaultOutlineStroke(new BasicStroke(1f));
        XYPlot plot = new XYPlot(new XYSeriesCollection(s), x, y, ar);
        ChartStyle.plot(plot);
        double[] gaps = d.drawnGaps(t, RepeatDensity.unitOf(pr.length()), MAX_GAPS_DRAWN);
        for (int i = 0; i < gaps.length; i += 2) {
            org.jfree.chart.plot.IntervalMarker m = new org.jfree.chart.plot.IntervalMarker(gaps[i], gaps[i + 1],
                    ChartStyle.GAP);
            m.setAlpha(0.55f);
            plot.addDomainMarker(m, org.jfree.chart.ui.Layer.FOREGROUND);
        }
        JFreeChart chart = ChartStyle.chart(plot);
        chart.setTitle(ChartStyle.smallTitle(pr.name() + "  \u00b7  " + Fmt.bases(pr.length()) + "  \u00b7  bins of "
                + Fmt.bases(pr.bin())));
        return svg(chart, 260, "density" + t);
    }

    /** Heat strips, one row per contig: for many contigs, where separate profiles would not fit. */
    static String densityStrips(RepeatDensity d) {
        RepeatDensity.Cells c = d.cells();
        DefaultXYZDataset ds = new DefaultXYZDataset();
        ds.addSeries("density", new double[][] {c.x(), c.row(), c.percent()});
        NumberAxis x = ChartStyle.valueAxis("position (" + d.unitName() + ")");
        x.setAutoRangeIncludesZero(true);
        x.setLowerMargin(0);
        x.setUpperMargin(0.01);
        int rows = d.size();
        SymbolAxis y = new SymbolAxis(null, c.names());
        y.setGridBandsVisible(false);
        y.setInverted(true); // longest contig on top
        y.setTickLabelFont(ChartStyle.TICK);
        y.setTickLabelPaint(ChartStyle.INK);
        y.setAxisLinePaint(ChartStyle.AXIS);
        y.setTickMarksVisible(false);
        y.setRange(-0.6, rows - 0.4);
        XYBlockRenderer br = new XYBlockRenderer();
        br.setBlockWidth(d.bin() / d.unit());
        br.setBlockHeight(0.78);
        br.setBlockAnchor(RectangleAnchor.LEFT);
        br.setPaintScale(new ChartStyle.Ramp(0, d.scaleMax(), DENSITY_STOPS));
        XYPlot p = new XYPlot(ds, x, y, br);
        ChartStyle.plot(p);
        p.setRangeGridlinesVisible(false);
        for (int t = 0; t < rows; t++) {
            double[] gaps = d.drawnGaps(t, d.unit(), MAX_GAPS_DRAWN);
            for (int i = 0; i < gaps.length; i += 2) {
                p.addAnnotation(new org.jfree.chart.annotations.XYBoxAnnotation(gaps[i], t - 0.39, gaps[i + 1],
                        t + 0.39, null, null, ChartStyle.GAP));
            }
        }
        JFreeChart chart = ChartStyle.chart(p);
        chart.addSubtitle(ChartStyle.scaleLegend(new ChartStyle.Ramp(0, d.scaleMax(), DENSITY_STOPS),
                "% of bin in repeats", false));
        return svg(chart, 110 + 26 * rows, "density");
    }

    /** Loci counted in cells of length and purity, the colour on a log scale of the count. */
    static String lengthPurity(LengthPurityGrid g) {
        LengthPurityGrid.Cells c = g.cells();
        DefaultXYZDataset ds = new DefaultXYZDataset();
        ds.addSeries("loci", new double[][] {c.x(), c.y(), c.log10Count()});
        LengthBins lb = g.lengths();
        NumberAxis x = ChartStyle.log10Axis("locus length (bp, log scale)", lb.x0(), lb.x1());
        NumberAxis y = ChartStyle.valueAxis("purity");
        y.setRange(g.y0(), 1 + g.dy());
        y.setNumberFormatOverride(new DecimalFormat("0.00", DecimalFormatSymbols.getInstance(Locale.ROOT)));
        XYBlockRenderer br = new XYBlockRenderer();
        br.setBlockWidth(lb.dx());
        br.setBlockHeight(g.dy());
        br.setBlockAnchor(RectangleAnchor.BOTTOM_LEFT);
        br.setPaintScale(new ChartStyle.Ramp(0, g.zMax(), COUNT_STOPS));
        XYPlot p = new XYPlot(ds, x, y, br);
        ChartStyle.plot(p);
        JFreeChart chart = ChartStyle.chart(p);
        chart.addSubtitle(ChartStyle.scaleLegend(new ChartStyle.Ramp(0, g.zMax(), COUNT_STOPS), "loci per cell", true));
        return svg(chart, 440, "purity");
    }

    /** Loci by length, stacked by period class. */
    static String lengths(LengthHistogram h) {
        LengthBins lb = h.bins();
        DefaultTableXYDataset ds = new DefaultTableXYDataset();
        for (PeriodClass pc : PeriodClass.values()) {
            XYSeries s = new XYSeries(pc.label(), false, false);
            for (int b = 0; b < lb.count(); b++) {
                s.add(lb.middle(b), h.loci()[pc.ordinal()][b]);
            }
            ds.addSeries(s);
        }
        ds.setIntervalWidth(lb.dx());
        NumberAxis x = ChartStyle.log10Axis("locus length (bp, log scale)", lb.x0(), lb.x1());
        NumberAxis y = ChartStyle.valueAxis("loci");
        StackedXYBarRenderer br = new StackedXYBarRenderer(0.08);
        br.setBarPainter(new StandardXYBarPainter());
        br.setShadowVisible(false);
        br.setDrawBarOutline(false);
        for (PeriodClass pc : PeriodClass.values()) {
            br.setSeriesPaint(pc.ordinal(), CLASS_COLOURS[pc.ordinal()]);
        }
        XYPlot p = new XYPlot(ds, x, y, br);
        ChartStyle.plot(p);
        return svg(ChartStyle.classChart(p), 400, "lengths");
    }

    /** An inline SVG element, scaled by its container (no fixed size), ids prefixed to stay unique in the page. */
    private static String svg(JFreeChart chart, int height, String id) {
        SVGGraphics2D g2 = new SVGGraphics2D(WIDTH, height);
        g2.setDefsKeyPrefix(id + "-");
        g2.setFontFunction(family -> family.equals(Font.MONOSPACED) ? ChartStyle.MONO_STACK : ChartStyle.FONT_STACK);
        g2.setGeomDoubleConverter(Charts::trim);
        g2.setTransformDoubleConverter(Charts::trim);
        chart.draw(g2, new Rectangle2D.Double(0, 0, WIDTH, height));
        return g2.getSVGElement(id, false, new ViewBox(0, 0, WIDTH, height), null, null);
    }

    /** Coordinates with at most two decimals, no trailing zero: the SVG stays small. */
    private static String trim(double d) {
        if (d == Math.rint(d)) {
            return Long.toString((long) d);
        }
        String s = String.format(Locale.ROOT, "%.2f", d);
        return s.endsWith("0") ? s.substring(0, s.length() - 1) : s;
    }
}
