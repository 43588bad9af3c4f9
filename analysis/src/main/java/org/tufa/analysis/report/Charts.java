package org.tufa.analysis.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.Shape;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.awt.image.DataBufferByte;
import java.awt.image.IndexColorModel;
import java.nio.file.Path;
import java.time.ZoneId;
import java.util.List;
import java.util.Locale;
import java.util.TimeZone;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYBoxAnnotation;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.DateAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBarRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.Range;
import org.jfree.data.xy.XYBarDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * The report's charts, drawn by JFreeChart into PNG files: the OPTICS reachability plot, the PCA biplot and the
 * time-series strips of a unit. Builders take plain arrays (prepared by the callers) and return the chart; only
 * {@link #writePng} touches the file system. Runs headless: the AWT headless property is set before any AWT
 * class loads (this class's initialiser runs first on every path that draws).
 */
final class Charts {

    static {
        System.setProperty("java.awt.headless", "true");
    }

    private static final Font TITLE = new Font(Font.SANS_SERIF, Font.BOLD, 13);
    private static final Font AXIS = new Font(Font.SANS_SERIF, Font.PLAIN, 11);
    private static final Font TICKS = new Font(Font.SANS_SERIF, Font.PLAIN, 10);
    /** The biplot frame reaches this multiple of the given extent (room for arrow labels). */
    static final double BIPLOT_MARGIN = 1.25;
    private static final Color GRID = new Color(0xDDDDDD);

    private Charts() {
    }

    /** Makes sure the class (and its headless setting) is initialised before any other AWT use. */
    static void init() {
        // the static initialiser does the work
    }

    /** One bar series per cluster label, for the reachability plot and the scatter. */
    record Group(int label, String name) {
    }

    /**
     * Reachability plot: bars in OPTICS order (one per sample, or per column and cluster when thinned for display,
     * {@link Thinning#reachabilityColumns}), coloured by cluster, noise grey; below the bars, a bracket for each
     * cluster's span of the ordering (the extracted xi clusters).
     *
     * @param bars   the bars; undefined (infinite) heights are drawn at the top of the scale
     * @param labels cluster label of every sample in ordering order (for the brackets)
     * @param groups labels to draw, in legend order
     */
    static JFreeChart reachability(String title, Thinning.Bars bars, int[] labels, List<Group> groups) {
        double top = 0;
        for (double r : bars.height()) {
            if (Double.isFinite(r)) {
                top = Math.max(top, r);
            }
        }
        top = top == 0 ? 1 : top * 1.08;
        XYSeriesCollection data = new XYSeriesCollection();
        XYBarRenderer renderer = new XYBarRenderer(0.0);
        renderer.setBarPainter(new StandardXYBarPainter());
        renderer.setShadowVisible(false);
        // A hairline outline in the bar's own colour closes the sub-pixel gaps between neighbouring bars.
        renderer.setDrawBarOutline(true);
        renderer.setDefaultOutlineStroke(new BasicStroke(0.6f));
        renderer.setAutoPopulateSeriesOutlinePaint(false);
        for (Group g : groups) {
            XYSeries s = new XYSeries(g.name(), false, true);
            for (int i = 0; i < bars.size(); i++) {
                if (bars.label()[i] == g.label()) {
                    double r = bars.height()[i];
                    s.add(bars.x()[i], Double.isFinite(r) ? r : top);
                }
            }
            renderer.setSeriesPaint(data.getSeriesCount(), Palette.cluster(g.label()));
            renderer.setSeriesOutlinePaint(data.getSeriesCount(), Palette.cluster(g.label()));
            data.addSeries(s);
        }
        int n = labels.length;
        NumberAxis x = axis("OPTICS order (position of sample)");
        x.setRange(-0.5, Math.max(1, n) - 0.5);
        NumberAxis y = axis("reachability (standardised PCA-score units)");
        double foot = top * 0.09;
        y.setRange(-foot * (1 + groups.size() * 0.0), top * 1.02);
        XYPlot plot = new XYPlot(new XYBarDataset(data, bars.width()), x, y, renderer);
        style(plot);
        for (Group g : groups) {
            if (g.label() < 0) {
                continue;
            }
            int first = -1;
            int last = -1;
            for (int i = 0; i < labels.length; i++) {
                if (labels[i] == g.label()) {
                    first = first < 0 ? i : first;
                    last = i;
                }
            }
            if (first < 0) {
                continue;
            }
            plot.addAnnotation(new XYBoxAnnotation(first - 0.5, -foot * 0.85, last + 0.5, -foot * 0.25, null, null,
                    Palette.cluster(g.label())));
            XYTextAnnotation t = new XYTextAnnotation("C" + g.label(), (first + last) / 2.0, -foot * 0.55);
            t.setFont(TICKS);
            t.setPaint(g.label() == 0 || g.label() == 3 ? Color.WHITE : Color.BLACK);
            plot.addAnnotation(t);
        }
        plot.addRangeMarker(new ValueMarker(0, Color.GRAY, new BasicStroke(0.8f)));
        return chart(title, plot);
    }

    /** One point layer of the biplot. */
    record Points(Group group, double[] x, double[] y) {
    }

    /**
     * PCA biplot on PC1/PC2: scores coloured by cluster and the given arrows (loadings, shifts). Both axes share the
     * same range so directions read true when the plot is square.
     */
    static JFreeChart biplot(String title, String xLabel, String yLabel, List<Points> layers,
                             List<ArrowAnnotation> arrows, double extent) {
        XYSeriesCollection data = new XYSeriesCollection();
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(false, true);
        Shape dot = new Ellipse2D.Double(-2, -2, 4, 4);
        for (Points p : layers) {
            XYSeries s = new XYSeries(p.group().name(), false, true);
            for (int i = 0; i < p.x().length; i++) {
                s.add(p.x()[i], p.y()[i]);
            }
            int k = data.getSeriesCount();
            Color c = Palette.cluster(p.group().label());
            // Normal points in a light tint of their blue (opaque: alpha blending of thousands of dots is slow).
            r.setSeriesPaint(k, p.group().label() == 0 ? tint(c, 0.55) : c);
            r.setSeriesShape(k, dot);
            data.addSeries(s);
        }
        NumberAxis x = axis(xLabel);
        NumberAxis y = axis(yLabel);
        double e = extent <= 0 ? 1 : extent * BIPLOT_MARGIN;
        x.setRange(new Range(-e, e));
        y.setRange(new Range(-e, e));
        XYPlot plot = new XYPlot(data, x, y, r);
        style(plot);
        plot.setSeriesRenderingOrder(org.jfree.chart.plot.SeriesRenderingOrder.FORWARD);
        plot.addDomainMarker(new ValueMarker(0, Color.GRAY, new BasicStroke(0.6f)));
        plot.addRangeMarker(new ValueMarker(0, Color.GRAY, new BasicStroke(0.6f)));
        for (ArrowAnnotation a : arrows) {
            plot.addAnnotation(a);
        }
        return chart(title, plot);
    }

    /** A line of a strip. */
    record Line(String name, double[] values, Color colour, boolean dashed) {
    }

    /** A strip: a y-axis label and its lines. */
    record Strip(String axisLabel, List<Line> lines) {
    }

    /** A shaded interval (a finding), with a short label. */
    record Shade(long startMillis, long endMillis, Color colour, String label) {
    }

    /**
     * Time-series strips sharing one time axis (in the report's zone), with shaded finding intervals.
     *
     * @param times sample start times, epoch milliseconds
     */
    static JFreeChart strips(String title, long[] times, List<Strip> strips, List<Shade> shades, ZoneId zone) {
        DateAxis time = new DateAxis("time (" + zone.getId() + ")", TimeZone.getTimeZone(zone), Locale.ROOT);
        time.setLabelFont(AXIS);
        time.setTickLabelFont(TICKS);
        CombinedDomainXYPlot combined = new CombinedDomainXYPlot(time);
        combined.setGap(6);
        boolean first = true;
        for (Strip strip : strips) {
            XYSeriesCollection data = new XYSeriesCollection();
            XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
            for (Line line : strip.lines()) {
                XYSeries s = new XYSeries(line.name(), false, true);
                for (int i = 0; i < times.length; i++) {
                    s.add(times[i], line.values()[i]);
                }
                int k = data.getSeriesCount();
                r.setSeriesPaint(k, line.colour());
                r.setSeriesStroke(k, line.dashed() ? new BasicStroke(1.2f, BasicStroke.CAP_BUTT,
                        BasicStroke.JOIN_MITER, 10f, new float[] {5f, 3f}, 0f) : new BasicStroke(1.0f));
                data.addSeries(s);
            }
            NumberAxis y = axis(strip.axisLabel());
            y.setAutoRangeIncludesZero(false);
            XYPlot plot = new XYPlot(data, null, y, r);
            style(plot);
            for (Shade s : shades) {
                IntervalMarker m = new IntervalMarker(s.startMillis(), s.endMillis(), s.colour());
                m.setAlpha(0.45f);
                if (first && s.label() != null) {
                    m.setLabel(s.label());
                    m.setLabelFont(TICKS);
                    m.setLabelAnchor(org.jfree.chart.ui.RectangleAnchor.TOP_LEFT);
                    m.setLabelTextAnchor(TextAnchor.TOP_LEFT);
                }
                plot.addDomainMarker(m, Layer.BACKGROUND);
            }
            combined.add(plot, 1);
            first = false;
        }
        return chart(title, combined);
    }

    /** The colour mixed with white: share 0 = the colour, 1 = white. */
    static Color tint(Color c, double share) {
        return new Color((int) Math.round(c.getRed() + (255 - c.getRed()) * share),
                (int) Math.round(c.getGreen() + (255 - c.getGreen()) * share),
                (int) Math.round(c.getBlue() + (255 - c.getBlue()) * share));
    }

    private static NumberAxis axis(String label) {
        NumberAxis a = new NumberAxis(label);
        a.setLabelFont(AXIS);
        a.setTickLabelFont(TICKS);
        return a;
    }

    private static void style(XYPlot plot) {
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(GRID);
        plot.setRangeGridlinePaint(GRID);
        plot.setOutlinePaint(Color.GRAY);
        plot.setAxisOffset(RectangleInsets.ZERO_INSETS);
    }

    private static JFreeChart chart(String title, org.jfree.chart.plot.Plot plot) {
        JFreeChart chart = new JFreeChart(title, TITLE, plot, true);
        // Crisp (non-antialiased) lines and dots: PNGs a third the size and faster to draw; text stays smooth.
        chart.setAntiAlias(false);
        chart.setTextAntiAlias(true);
        chart.setBackgroundPaint(Color.WHITE);
        LegendTitle legend = chart.getLegend();
        legend.setItemFont(TICKS);
        legend.setPosition(RectangleEdge.BOTTOM);
        return chart;
    }

    /**
     * Draws the chart into a white RGB image and writes it as an 8-bit palette PNG ({@link PaletteImage}: about half
     * the bytes of true colour; {@link PalettePng}: no time stamp, so the same chart gives the same bytes).
     */
    static void writePng(JFreeChart chart, int width, int height, Path file) {
        BufferedImage image = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = image.createGraphics();
        try {
            g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
            chart.draw(g, new Rectangle2D.Double(0, 0, width, height));
        } finally {
            g.dispose();
        }
        BufferedImage palette = PaletteImage.reduce(image);
        IndexColorModel model = (IndexColorModel) palette.getColorModel();
        int colours = model.getMapSize();
        byte[] red = new byte[colours];
        byte[] green = new byte[colours];
        byte[] blue = new byte[colours];
        model.getReds(red);
        model.getGreens(green);
        model.getBlues(blue);
        byte[] indices = ((DataBufferByte) palette.getRaster().getDataBuffer()).getData();
        byte[] png = PalettePng.encode(width, height, indices, red, green, blue);
        org.tufa.common.OutputFiles.write(file, out -> out.write(png));
    }
}
