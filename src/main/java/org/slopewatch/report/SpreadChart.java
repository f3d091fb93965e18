package org.slopewatch.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Rectangle;
import java.awt.geom.Line2D;
import java.awt.geom.Rectangle2D;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TimeZone;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.axis.DateAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.svg.SVGGraphics2D;
import org.jfree.svg.ViewBox;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.probability.Recession;
import org.slopewatch.replay.SpreadReport;
import org.slopewatch.text.Html;

/**
 * Draws one spread over time as inline SVG: the value in bp with a zero line, inverted spells
 * shaded, confirmations and re-steepenings marked, and, when dates are given, each recession as a
 * bar along the bottom labelled with its peak month ({@link RecessionBar}).
 * JFreeChart lays the chart out; JFreeSVG turns its drawing into SVG text.
 */
final class SpreadChart {

    static final int WIDTH = 960;
    static final int HEIGHT = 420;

    // Our palette: a dark line over pale bands, each mark distinguishable by shape as well as hue
    // (bands against dashed lines), text dark grey on white well above 4.5:1.
    private static final Color LINE = new Color(0x1f, 0x3a, 0x5f);
    private static final Color ZERO = new Color(0x26, 0x26, 0x26);
    private static final Color SPELL = new Color(0xe3, 0x8b, 0x2c, 90);
    private static final Color CONFIRMED = new Color(0xa3, 0x1f, 0x34);
    private static final Color RESTEEPENED = new Color(0x1d, 0x6e, 0x45);
    private static final Color GRID = new Color(0xdd, 0xe1, 0xe6);
    private static final Color TEXT = new Color(0x33, 0x33, 0x33);
    private static final BasicStroke DASHED = new BasicStroke(1.4f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
            new float[] {5f, 3f}, 0f);

    private SpreadChart() {
    }

    /**
     * The chart as an {@code <svg>} element with a {@code <title>} and {@code <desc>}.
     *
     * @param key unique within the page: prefixes the SVG's internal ids so two charts in one
     *            document never share a clip path
     */
    static String svg(SpreadSection s, List<Recession> recessions, String key) {
        if (s.points().isEmpty()) {
            throw new IllegalArgumentException(s.id() + ": nothing to plot");
        }
        LocalDate first = s.firstDate();
        LocalDate last = s.lastPlottedDate();
        MarkerGroups renderer = new MarkerGroups(s.id() + " in bp");
        XYPlot plot = plot(s, first, last, renderer, recessions);
        for (SpellBand b : s.spells()) {
            LocalDate end = b.end() == null ? last : b.end();
            IntervalMarker m = new IntervalMarker(millis(b.start()), millis(end), SPELL);
            m.setAlpha(1f);
            plot.addDomainMarker(m, Layer.BACKGROUND);
            renderer.tag(m, "spell", data("spell", Long.toString(b.id()), "start", b.start().toString(),
                    "end", b.end() == null ? "open" : b.end().toString()), ChartText.spell(b));
        }
        for (SpreadReport.TransitionRow t : s.transitions()) {
            boolean confirmed = t.to().equals(SpreadState.CONFIRMED.name());
            if (confirmed || t.to().equals(SpreadState.RESTEEPENING.name())) {
                ValueMarker m = new ValueMarker(millis(t.date()), confirmed ? CONFIRMED : RESTEEPENED, DASHED);
                plot.addDomainMarker(m, Layer.FOREGROUND);
                renderer.tag(m, confirmed ? "confirmation" : "resteepening", data("date", t.date().toString(), "spell",
                        Long.toString(t.spell())), (confirmed ? "Confirmed on " : "Re-steepened on ") + t.date());
            }
        }
        // last, so that the peak labels sit on top of the dashed marks
        for (Recession r : recessions) {
            LocalDate from = max(RecessionDates.start(r), first);
            LocalDate to = min(RecessionDates.end(r), last);
            RecessionBar m = new RecessionBar(millis(from), millis(to), r.peak().toString());
            plot.addDomainMarker(m, Layer.FOREGROUND);
            renderer.tag(m, "recession", data("peak", r.peak().toString(), "trough", r.trough().toString()),
                    "Recession: peak " + r.peak() + ", trough " + r.trough());
        }
        ValueMarker zero = new ValueMarker(0, ZERO, new BasicStroke(1.2f));
        plot.addRangeMarker(zero, Layer.FOREGROUND);
        renderer.tag(zero, "zero-line", Map.of(), "zero");

        JFreeChart chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, plot, false);
        chart.setBackgroundPaint(Color.WHITE);
        chart.setPadding(new RectangleInsets(8, 8, 4, 12));
        LegendTitle legend = new LegendTitle(plot);
        legend.setPosition(RectangleEdge.BOTTOM);
        legend.setItemFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
        legend.setItemPaint(TEXT);
        legend.setBackgroundPaint(Color.WHITE);
        chart.addLegend(legend);

        SVGGraphics2D g = new SVGGraphics2D(WIDTH, HEIGHT);
        g.setDefsKeyPrefix(key + "-");
        chart.draw(g, new Rectangle(0, 0, WIDTH, HEIGHT));
        String svg = g.getSVGElement(null, false, new ViewBox(0, 0, WIDTH, HEIGHT), null, null);
        return withTitle(svg, key, ChartText.title(s), ChartText.description(s, recessions));
    }

    private static XYPlot plot(SpreadSection s, LocalDate first, LocalDate last, MarkerGroups renderer, List<Recession> recessions) {
        XYSeries series = new XYSeries(s.id(), false, true);
        for (ChartPoint p : s.points()) {
            series.add(millis(p.date()), p.valueBp());
        }
        DateAxis x = new DateAxis(null, TimeZone.getTimeZone(ZoneOffset.UTC), Locale.ROOT);
        // one date alone would make an empty axis: give it a month either side
        LocalDate from = first.equals(last) ? first.minusDays(15) : first;
        LocalDate to = first.equals(last) ? last.plusDays(15) : last;
        x.setRange(millis(from), millis(to));
        NumberAxis y = new NumberAxis("spread (bp)");
        y.setAutoRangeIncludesZero(true);
        if (!recessions.isEmpty()) {
            // room below the lowest value for the recession bars, also when that value is zero
            y.setAutoRangeStickyZero(false);
            y.setLowerMargin(RecessionBar.STRIP_SHARE);
        }
        for (var axis : List.of(x, y)) {
            axis.setTickLabelPaint(TEXT);
            axis.setLabelPaint(TEXT);
            axis.setTickLabelFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
            axis.setLabelFont(new Font(Font.SANS_SERIF, Font.PLAIN, 13));
        }
        renderer.setSeriesPaint(0, LINE);
        renderer.setSeriesStroke(0, new BasicStroke(1.6f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
        XYPlot plot = new XYPlot(new XYSeriesCollection(series), x, y, renderer);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(GRID);
        plot.setRangeGridlinePaint(GRID);
        plot.setOutlinePaint(GRID);
        plot.setFixedLegendItems(legend(s, recessions));
        return plot;
    }

    /** The legend names only what this chart shows. */
    private static LegendItemCollection legend(SpreadSection s, List<Recession> recessions) {
        LegendItemCollection items = new LegendItemCollection();
        Line2D line = new Line2D.Double(-9, 0, 9, 0);
        Rectangle2D box = new Rectangle2D.Double(-7, -6, 14, 12);
        items.add(new LegendItem(s.id() + " (bp)", null, null, null, line, new BasicStroke(2f), LINE));
        items.add(new LegendItem("inverted spell", null, null, null, box, SPELL));
        if (s.transitions().stream().anyMatch(t -> t.to().equals(SpreadState.CONFIRMED.name()))) {
            items.add(new LegendItem("confirmed", null, null, null, line, DASHED, CONFIRMED));
        }
        if (s.transitions().stream().anyMatch(t -> t.to().equals(SpreadState.RESTEEPENING.name()))) {
            items.add(new LegendItem("re-steepened", null, null, null, line, DASHED, RESTEEPENED));
        }
        if (!recessions.isEmpty()) {
            items.add(new LegendItem("recession: month after the peak through the trough, labelled with the peak", null, null,
                    null, new Rectangle2D.Double(-8, -2.5, 16, RecessionBar.BAR_HEIGHT), RecessionBar.COLOUR));
        }
        return items;
    }

    /** Adds {@code role="img"}, a title and a description to JFreeSVG's {@code <svg>} element. */
    static String withTitle(String svg, String key, String title, String description) {
        if (!svg.startsWith("<svg")) {
            throw new IllegalStateException("expected an <svg> element from JFreeSVG");
        }
        int close = svg.indexOf('>');
        return svg.substring(0, close) + " class=\"chart\" role=\"img\" aria-labelledby=\"" + key + "-title " + key + "-desc\">"
                + "<title id=\"" + key + "-title\">" + Html.escape(title) + "</title>"
                + "<desc id=\"" + key + "-desc\">" + Html.escape(description) + "</desc>"
                + svg.substring(close + 1);
    }

    private static Map<String, String> data(String... keysAndValues) {
        Map<String, String> m = new LinkedHashMap<>();
        for (int i = 0; i < keysAndValues.length; i += 2) {
            m.put(keysAndValues[i], keysAndValues[i + 1]);
        }
        return m;
    }

    private static double millis(LocalDate d) {
        return d.toEpochDay() * 86_400_000.0;
    }

    private static LocalDate max(LocalDate a, LocalDate b) {
        return a.isAfter(b) ? a : b;
    }

    private static LocalDate min(LocalDate a, LocalDate b) {
        return a.isBefore(b) ? a : b;
    }
}
