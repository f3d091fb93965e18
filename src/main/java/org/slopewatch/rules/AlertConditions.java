package org.slopewatch.rules;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.slopewatch.curve.Resolution;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpreadStatus;

/**
 * Reads each rule's condition off the monitor's current state: one condition per rule and
 * spread (or per rule and curve for feed rules). A probability rule holds only once a
 * probability is known for the spread.
 */
public final class AlertConditions {

    private AlertConditions() {
    }

    /**
     * @param staleCurves   curve → whether its feed is stale, and since when (market date of the last quote)
     * @param probabilities spread id → the latest model probability (0..1); absent when not known
     */
    public static List<AlertCondition> of(List<AlertRule> rules, List<SpreadStatus> spreads, Map<String, LocalDate> staleCurves,
                                          Map<String, Double> probabilities) {
        List<AlertCondition> out = new ArrayList<>();
        for (AlertRule rule : rules) {
            if (rule.when() instanceof AlertTrigger.FeedStale) {
                staleCurves.forEach((curve, lastDate) -> out.add(new AlertCondition(rule.name(), curve, lastDate != null, lastDate,
                        Map.of("curve", curve, "spread", "-", "state", "stale", "value", "-", "reason", "no quotes recently",
                                "days", "-", "date", String.valueOf(lastDate)))));
                continue;
            }
            for (SpreadStatus s : spreads) {
                if (!rule.spreads().isEmpty() && !rule.spreads().contains(s.spread())) {
                    continue;
                }
                LocalDate since = since(rule.when(), s, probabilities.get(s.id()));
                out.add(new AlertCondition(rule.name(), s.id(), since != null, since, values(s, probabilities.get(s.id()))));
            }
        }
        return out;
    }

    /** The market date the condition started to hold, or null when it does not hold. */
    private static LocalDate since(AlertTrigger when, SpreadStatus s, Double probability) {
        Spell spell = s.openSpell();
        if (when instanceof AlertTrigger.EntersState e) {
            return s.state() == e.state() && s.stateSince() != null ? s.stateSince() : null;
        } else if (when instanceof AlertTrigger.InvertedForDays d) {
            return spell != null && spell.durationDays() >= d.days() ? spell.start() : null;
        } else if (when instanceof AlertTrigger.SpreadBelow b) {
            return Double.isFinite(s.valueBp()) && Resolution.BASIS_POINTS.below(s.valueBp(), b.bp()) ? s.date() : null;
        } else if (when instanceof AlertTrigger.ProbabilityAbove p) {
            return probability != null && Resolution.PROBABILITY.above(probability, p.level()) ? s.date() : null;
        }
        return null;
    }

    private static Map<String, String> values(SpreadStatus s, Double probability) {
        Map<String, String> v = new HashMap<>();
        v.put("curve", s.curve());
        v.put("spread", s.spread());
        v.put("state", s.state().name());
        v.put("value", Double.isFinite(s.valueBp()) ? String.format(Locale.ROOT, "%.1f", s.valueBp()) : "-");
        v.put("days", Long.toString(s.daysInverted()));
        v.put("date", String.valueOf(s.date()));
        Spell spell = s.openSpell();
        v.put("reason", spell == null ? "state " + s.state() + " since " + s.stateSince()
                : String.format(Locale.ROOT, "inverted since %s (%d days), deepest %.1f bp%s", spell.start(), spell.durationDays(),
                        spell.deepestBp(), spell.confirmed() == null ? "" : ", confirmed on " + spell.confirmed() + " by " + spell.confirmedBy()));
        if (probability != null) {
            v.put("probability", String.format(Locale.ROOT, "%.0f%%", 100 * probability));
        }
        return v;
    }
}
