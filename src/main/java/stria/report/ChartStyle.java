package stria.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.Paint;
import java.awt.geom.Rectangle2D;
import java.io.Serializable;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.axis.Axis;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.axis.TickUnit;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.Plot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.PaintScale;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.PaintScaleLegend;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.HorizontalAlignment;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;

/**
 * The one look of every chart in the report: colours, fonts, axes, legends, plot and chart frames. The
 * chart methods of {@link Charts} take every part from here, so a change of style is made once.
 */
final class ChartStyle {
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
    /** Fill and outline of a density profile. */
    static final Color PROFILE_FILL = new Color(0xe8833a);
    static final Color PROFILE_LINE = new Color(0xb5521a);
    /** N gaps in the density charts: a neutral grey, unlike any share colour. */
    static final Color GAP = new Color(0x7b8794);

    static final Color[] DENSITY_STOPS = {
            new Color(0xfff4d6), new Color(0xfdd08a), new Color(0xf59e3b), new Color(0xd4581c), new Color(0x8c2a0e),
            new Color(0x4a1206)};
    static final Color[] COUNT_STOPS = {
            new Color(0xdbe9f6), new Color(0x9cc3e4), new Color(0x5a9bd0), new Color(0x2f6db5), new Color(0x1b3f7a),
            new Color(0x0d1f45)};

    /** Width of every chart; heights depend on the chart and what it shows. */
    static final int WIDTH = 1080;

    // unquoted: JFreeSVG writes the family inside a single-quoted style attribute
    static final String FONT_STACK = "DejaVu Sans, Verdana, Segoe UI, Arial, sans-serif";
    static final String MONO_STACK = "DejaVu Sans Mono, Menlo, Consolas, monospace";
    static final Font TICK = new Font(Font.SANS_SERIF, Font.PLAIN, 12);
    /** Tick labels that are sequence (motifs). */
    static final Font MONO_TICK = new Font(Font.MONOSPACED, Font.PLAIN, 12);
    static final Font LABEL = new Font(Font.SANS_SERIF, Font.PLAIN, 13);
    static final Font SMALL_TITLE = new Font(Font.SANS_SERIF, Font.BOLD, 13);

    private ChartStyle() {
    }

    /** A chart around {@code plot}, in the report's frame; legends are added by the caller. */
    static JFreeChart chart(Plot plot) {
        JFreeChart chart = new JFreeChart(null, null, plot, false);
        chart.setBackgroundPaint(Color.WHITE);
        chart.setBorderVisible(false);
        chart.setPadding(new RectangleInsets(6, 6, 6, 6));
        chart.setAntiAlias(true);
        chart.setTextAntiAlias(true);
        return chart;
    }

    /** A chart with the legend of the period classes above it. */
    static JFreeChart classChart(Plot plot) {
        JFreeChart chart = chart(plot);
        chart.addLegend(classLegend());
        return chart;
    }

    static void plot(Plot p) {
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

    static CategoryAxis categoryAxis(String label) {
        CategoryAxis a = lettered(new CategoryAxis(label));
        a.setAxisLinePaint(AXIS);
        a.setTickMarksVisible(false);
        a.setCategoryMargin(0.2);
        a.setMaximumCategoryLabelWidthRatio(1.4f);
        a.setLowerMargin(0.01);
        a.setUpperMargin(0.01);
        return a;
    }

    static NumberAxis valueAxis(String label) {
        NumberAxis a = lettered(new SpaciousAxis(label));
        a.setAxisLineVisible(false);
        a.setTickMarkPaint(AXIS);
        a.setNumberFormatOverride(Fmt.axis(false));
        a.setStandardTickUnits(NumberAxis.createStandardTickUnits());
        return a;
    }

    /** An axis over log10 of a value, one tick per power of ten, labelled with the value. */
    static NumberAxis log10Axis(String label, double from, double to) {
        NumberAxis a = valueAxis(label);
        a.setNumberFormatOverride(Fmt.axis(true));
        a.setTickUnit(new NumberTickUnit(1, Fmt.axis(true)));
        a.setRange(from, to);
        return a;
    }

    /** The fonts and colours of an axis label and its tick labels. */
    private static <A extends Axis> A lettered(A a) {
        a.setLabelFont(LABEL);
        a.setLabelPaint(MUTED);
        a.setTickLabelFont(TICK);
        a.setTickLabelPaint(INK);
        return a;
    }

    /** Bars filled by the period class of their category: {@code classes[column]}. */
    static BarRenderer classBars(PeriodClass[] classes) {
        BarRenderer br = new BarRenderer() {
            private static final long serialVersionUID = 1L;

            @Override
            public Paint getItemPaint(int row, int column) {
                return CLASS_COLOURS[classes[column].ordinal()];
            }
        };
        flatBars(br);
        return br;
    }

    static void flatBars(BarRenderer br) {
        br.setBarPainter(new StandardBarPainter());
        br.setShadowVisible(false);
        br.setDrawBarOutline(false);
    }

    static LegendTitle classLegend() {
        LegendTitle legend = new LegendTitle(() -> {
            LegendItemCollection items = new LegendItemCollection();
            for (PeriodClass pc : PeriodClass.values()) {
                LegendItem item = new LegendItem(pc.label() + " (" + pc.range() + ")", CLASS_COLOURS[pc.ordinal()]);
                item.setShape(new Rectangle2D.Double(-6, -6, 12, 12));
                item.setLabelFont(TICK);
                item.setLabelPaint(INK);
                items.add(item);
            }
            return items;
        });
        legend.setPosition(RectangleEdge.TOP);
        legend.setHorizontalAlignment(HorizontalAlignment.LEFT);
        legend.setFrame(BlockBorder.NONE);
        legend.setBackgroundPaint(Color.WHITE);
        legend.setItemFont(TICK);
        legend.setItemPaint(INK);
        legend.setMargin(new RectangleInsets(2, 6, 6, 2));
        return legend;
    }

    /** The colour scale beside a heat map; {@code log10} when the values are log10 of counts. */
    static PaintScaleLegend scaleLegend(Ramp scale, String label, boolean log10) {
        NumberAxis a = lettered(new SpaciousAxis(label));
        a.setRange(scale.getLowerBound(), scale.getUpperBound());
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

    /** The title of one small chart among several, left aligned. */
    static TextTitle smallTitle(String text) {
        TextTitle title = new TextTitle(text, SMALL_TITLE);
        title.setPaint(INK);
        title.setHorizontalAlignment(HorizontalAlignment.LEFT);
        title.setPadding(new RectangleInsets(4, 8, 6, 4));
        return title;
    }

    /** A linear colour ramp through evenly spaced stops; values outside the bounds take the end colours. */
    static final class Ramp implements PaintScale, Serializable {
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

    /** A number axis that leaves room between tick labels; the library's default packs them edge to edge. */
    static final class SpaciousAxis extends NumberAxis {
        private static final long serialVersionUID = 1L;

        SpaciousAxis(String label) {
            super(label);
        }

        @Override
        protected double estimateMaximumTickLabelHeight(Graphics2D g2) {
            return 2.0 * super.estimateMaximumTickLabelHeight(g2);
        }

        @Override
        protected double estimateMaximumTickLabelWidth(Graphics2D g2, TickUnit unit) {
            return 1.8 * super.estimateMaximumTickLabelWidth(g2, unit) + 12;
        }
    }
}
