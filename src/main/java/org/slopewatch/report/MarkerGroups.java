package org.slopewatch.report;

import java.awt.Graphics2D;
import java.awt.Shape;
import java.awt.geom.Rectangle2D;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.Map;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.Marker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.svg.SVGHints;

/**
 * A line renderer that wraps each tagged marker, and the spread's line, in its own SVG group
 * ({@code <g class="spell" …><title>…</title>…</g>}). In the page a reader hovering a band sees
 * what it is, a screen reader finds a title, and a test can count spells and recessions in the
 * drawing itself instead of trusting a caption.
 */
final class MarkerGroups extends XYLineAndShapeRenderer {

    private static final long serialVersionUID = 1L;

    /** A marker's group attributes and its title. */
    private record Tag(Map<String, String> attributes, String title) {
    }

    private final transient Map<Marker, Tag> tags = new IdentityHashMap<>();
    private final transient RecessionBar.LabelRows recessionLabels = new RecessionBar.LabelRows();
    private final String lineTitle;

    MarkerGroups(String lineTitle) {
        super(true, false);
        this.lineTitle = lineTitle;
        setDrawSeriesLineAsPath(true);
    }

    /** Groups the marker under {@code class="cssClass"} with the given data attributes and title. */
    void tag(Marker marker, String cssClass, Map<String, String> data, String title) {
        Map<String, String> attributes = new LinkedHashMap<>();
        attributes.put("class", cssClass);
        data.forEach((k, v) -> attributes.put("data-" + k, v));
        tags.put(marker, new Tag(attributes, title));
    }

    @Override
    public void drawDomainMarker(Graphics2D g2, XYPlot plot, ValueAxis axis, Marker marker, Rectangle2D area) {
        Tag tag = tags.get(marker);
        begin(g2, tag);
        if (marker instanceof RecessionBar bar) {
            bar.draw(g2, plot, axis, area, recessionLabels);
        } else {
            super.drawDomainMarker(g2, plot, axis, marker, area);
        }
        end(g2, tag);
    }

    @Override
    public void drawRangeMarker(Graphics2D g2, XYPlot plot, ValueAxis axis, Marker marker, Rectangle2D area) {
        Tag tag = tags.get(marker);
        begin(g2, tag);
        super.drawRangeMarker(g2, plot, axis, marker, area);
        end(g2, tag);
    }

    @Override
    protected void drawFirstPassShape(Graphics2D g2, int pass, int series, int item, Shape shape) {
        Tag tag = new Tag(Map.of("class", "spread-line"), lineTitle);
        begin(g2, tag);
        super.drawFirstPassShape(g2, pass, series, item, shape);
        end(g2, tag);
    }

    private static void begin(Graphics2D g2, Tag tag) {
        if (tag != null) {
            g2.setRenderingHint(SVGHints.KEY_BEGIN_GROUP, tag.attributes());
            g2.setRenderingHint(SVGHints.KEY_ELEMENT_TITLE, tag.title());
        }
    }

    private static void end(Graphics2D g2, Tag tag) {
        if (tag != null) {
            g2.setRenderingHint(SVGHints.KEY_END_GROUP, "end");
        }
    }
}
