package org.slopewatch.report;

import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.XYPlot;

/**
 * A recession as our charts mark it: a thin bar along the bottom of the plot, from the month
 * after the peak through the trough, with the peak month written above it. The spread keeps the
 * whole height of the plot to itself, and the peak, the date the lead times are counted to, can be
 * read off the chart without a table. The plot's lower margin keeps the line clear of the strip
 * ({@link #STRIP_SHARE}).
 */
final class RecessionBar extends IntervalMarker {

    private static final long serialVersionUID = 1L;

    /** Our recession hue: a deep violet, far from the spell's orange and the marks' red and green. */
    static final Color COLOUR = new Color(0x6a, 0x3d, 0x9a);
    /** The labels' ink: the same violet, darker, well above 4.5:1 on white. */
    private static final Color INK = new Color(0x4b, 0x2a, 0x6e);
    private static final Color HALO = new Color(255, 255, 255, 215);
    /** The share of the value axis below the lowest value kept free for the bars and their labels. */
    static final double STRIP_SHARE = 0.14;
    static final double BAR_HEIGHT = 5;
    private static final Font LABEL = new Font(Font.SANS_SERIF, Font.PLAIN, 11);
    private static final double GAP = 6;

    private final String label;

    RecessionBar(double startMillis, double endMillis, String label) {
        super(startMillis, endMillis, COLOUR);
        this.label = label;
    }

    /**
     * Labels of recessions close together go on a second row rather than over each other. One
     * instance serves one drawing, whose bars come in date order.
     */
    static final class LabelRows {
        private final double[] rightEdge = {Double.NEGATIVE_INFINITY, Double.NEGATIVE_INFINITY};

        /** The row (0 just above the bars, 1 above it) whose last label ends before {@code x}. */
        int place(double x, double width) {
            int row = x > rightEdge[0] + GAP ? 0 : x > rightEdge[1] + GAP ? 1 : 0;
            rightEdge[row] = x + width;
            return row;
        }
    }

    void draw(Graphics2D g2, XYPlot plot, ValueAxis axis, Rectangle2D area, LabelRows rows) {
        double x0 = axis.valueToJava2D(getStartValue(), area, plot.getDomainAxisEdge());
        double x1 = axis.valueToJava2D(getEndValue(), area, plot.getDomainAxisEdge());
        double left = Math.min(x0, x1);
        double width = Math.max(Math.abs(x1 - x0), 1.5); // a recession of a month or two still shows
        double top = area.getMaxY() - BAR_HEIGHT - 2;
        g2.setPaint(COLOUR);
        g2.fill(new Rectangle2D.Double(left, top, width, BAR_HEIGHT));
        g2.setFont(LABEL);
        FontMetrics metrics = g2.getFontMetrics();
        int row = rows.place(left, metrics.stringWidth(label));
        float baseline = (float) (top - 3 - row * (metrics.getAscent() + 2));
        // a white ground under the label keeps it legible where it crosses a spell or a dashed mark
        g2.setPaint(HALO);
        g2.fill(new Rectangle2D.Double(left - 1, baseline - metrics.getAscent(), metrics.stringWidth(label) + 2, metrics.getAscent() + 2));
        g2.setPaint(INK);
        g2.drawString(label, (float) left, baseline);
    }
}
