package org.slopewatch.report;

import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.probability.Recession;

/**
 * The words that stand for a chart where it cannot be seen: its title, its description (read
 * out by a screen reader, kept by a mail client that drops SVG) and each band's tooltip.
 */
final class ChartText {

    private ChartText() {
    }

    static String title(SpreadSection s) {
        return String.format(Locale.ROOT, "%s spread in basis points, %s to %s", s.id(), s.firstDate(), s.lastPlottedDate());
    }

    static String description(SpreadSection s, List<Recession> recessions) {
        StringBuilder b = new StringBuilder();
        b.append(String.format(Locale.ROOT, "%,d values plotted", s.points().size()));
        if (s.points().size() < s.observations()) {
            b.append(String.format(Locale.ROOT, " (each period's lowest and highest of %,d observations)", s.observations()));
        }
        double low = s.points().stream().mapToDouble(ChartPoint::valueBp).min().orElse(Double.NaN);
        double high = s.points().stream().mapToDouble(ChartPoint::valueBp).max().orElse(Double.NaN);
        b.append(String.format(Locale.ROOT, ", from %.1f bp to %.1f bp, with a line at zero. ", low, high));
        if (s.spells().isEmpty()) {
            b.append("No inverted spell. ");
        } else {
            b.append(s.spells().size()).append(s.spells().size() == 1 ? " inverted spell shaded: " : " inverted spells shaded: ")
                    .append(s.spells().stream().map(ChartText::span).collect(Collectors.joining("; "))).append(". ");
        }
        dates(b, s, SpreadState.CONFIRMED, "Confirmed on ");
        dates(b, s, SpreadState.RESTEEPENING, "Re-steepened on ");
        if (!recessions.isEmpty()) {
            b.append(recessions.size()).append(recessions.size() == 1 ? " recession marked along the bottom: " : " recessions marked along the bottom: ")
                    .append(recessions.stream().map(r -> "peak " + r.peak() + " to trough " + r.trough())
                            .collect(Collectors.joining("; "))).append(".");
        }
        return b.toString().strip();
    }

    static String spell(SpellBand b) {
        return "Inverted spell " + b.id() + ": " + span(b) + (b.confirmed() == null ? ", not confirmed" : ", confirmed " + b.confirmed());
    }

    private static String span(SpellBand b) {
        return b.start() + " to " + (b.end() == null ? "the end of the data (still open)" : b.end().toString());
    }

    private static void dates(StringBuilder b, SpreadSection s, SpreadState state, String label) {
        List<String> dates = s.transitions().stream().filter(t -> t.to().equals(state.name())).map(t -> t.date().toString()).toList();
        if (!dates.isEmpty()) {
            b.append(label).append(String.join(", ", dates)).append(". ");
        }
    }
}
