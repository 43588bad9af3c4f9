package org.tufa.analysis.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.Stroke;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import org.jfree.chart.annotations.AbstractXYAnnotation;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.PlotRenderingInfo;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.ui.RectangleEdge;

/**
 * An arrow between two data points with a head at the end and an optional label beyond the head, for biplot
 * loadings and cluster shifts. JFreeChart's own pointer annotation points at a spot from a fixed screen angle,
 * which cannot express a vector from one data point to another; this annotation does, in the library's API.
 */
final class ArrowAnnotation extends AbstractXYAnnotation {

    private static final long serialVersionUID = 1L;
    private static final Color HALO = new Color(255, 255, 255, 200);
    private static final Font LABEL_FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 10);

    private final double x0;
    private final double y0;
    private final double x1;
    private final double y1;
    private final Color colour;
    private final boolean dashed;
    private final float width;
    private final String label;

    ArrowAnnotation(double x0, double y0, double x1, double y1, Color colour, boolean dashed, float width,
                    String label) {
        this.x0 = x0;
        this.y0 = y0;
        this.x1 = x1;
        this.y1 = y1;
        this.colour = colour;
        this.dashed = dashed;
        this.width = width;
        this.label = label;
    }

    @Override
    public void draw(Graphics2D g2, XYPlot plot, Rectangle2D area, ValueAxis domainAxis, ValueAxis rangeAxis,
                     int rendererIndex, PlotRenderingInfo info) {
        PlotOrientation o = plot.getOrientation();
        RectangleEdge de = Plot2D.domainEdge(plot, o);
        RectangleEdge re = Plot2D.rangeEdge(plot, o);
        double sx0 = domainAxis.valueToJava2D(x0, area, de);
        double sy0 = rangeAxis.valueToJava2D(y0, area, re);
        double sx1 = domainAxis.valueToJava2D(x1, area, de);
        double sy1 = rangeAxis.valueToJava2D(y1, area, re);
        double len = Math.hypot(sx1 - sx0, sy1 - sy0);
        Stroke old = g2.getStroke();
        if (width >= 1.5f) {
            // A white halo keeps a thick arrow visible over points of its own colour.
            g2.setPaint(HALO);
            g2.setStroke(new BasicStroke(width + 2.5f));
            g2.draw(new Line2D.Double(sx0, sy0, sx1, sy1));
        }
        g2.setPaint(colour);
        g2.setStroke(dashed ? new BasicStroke(width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                new float[] {6f, 4f}, 0f) : new BasicStroke(width));
        g2.draw(new Line2D.Double(sx0, sy0, sx1, sy1));
        g2.setStroke(old);
        if (len > 1) {
            double ux = (sx1 - sx0) / len;
            double uy = (sy1 - sy0) / len;
            double head = Math.min(9, len * 0.5);
            Path2D.Double tip = new Path2D.Double();
            tip.moveTo(sx1, sy1);
            tip.lineTo(sx1 - head * ux + head * 0.45 * uy, sy1 - head * uy - head * 0.45 * ux);
            tip.lineTo(sx1 - head * ux - head * 0.45 * uy, sy1 - head * uy + head * 0.45 * ux);
            tip.closePath();
            g2.fill(tip);
            if (label != null && !label.isEmpty()) {
                g2.setFont(LABEL_FONT);
                double w = g2.getFontMetrics().stringWidth(label);
                double tx = sx1 + ux * 6 - (ux < -0.3 ? w : ux > 0.3 ? 0 : w / 2);
                double ty = sy1 + uy * 8 + (uy > 0.3 ? 8 : uy < -0.3 ? 0 : 4);
                var fm = g2.getFontMetrics();
                g2.setPaint(HALO);
                g2.fill(new Rectangle2D.Double(tx - 1, ty - fm.getAscent(), w + 2, fm.getAscent() + fm.getDescent()));
                g2.setPaint(colour);
                g2.drawString(label, (float) tx, (float) ty);
            }
        }
    }

    /** Edge helpers (kept apart so the draw method reads as geometry). */
    private static final class Plot2D {
        static RectangleEdge domainEdge(XYPlot plot, PlotOrientation o) {
            return org.jfree.chart.plot.Plot.resolveDomainAxisLocation(plot.getDomainAxisLocation(), o);
        }

        static RectangleEdge rangeEdge(XYPlot plot, PlotOrientation o) {
            return org.jfree.chart.plot.Plot.resolveRangeAxisLocation(plot.getRangeAxisLocation(), o);
        }
    }

    @Override
    public boolean equals(Object obj) {
        return obj == this;
    }

    @Override
    public int hashCode() {
        return System.identityHashCode(this);
    }
}
