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
import org.slopewatch.probability.LiveProbability;
import org.slopewatch.probability.ProbabilityText;

/**
 * Reads each rule's condition off the monitor's current state: one condition per rule and
 * spread (or per rule and curve for feed rules). A probability rule holds only once a
 * probability is known for the spread, from the month its trigger names: the last complete
 * month unless the policy asks for the month so far ({@link ProbabilityMonth}).
 */
public final class AlertConditions {

    private AlertConditions() {
    }

    /**
     * @param staleCurves curve → whether its feed is stale, and since when (market date of the last quote)
     * @param models      the policy's probability models, which give each spread's probability
     */
    public static List<AlertCondition> of(List<AlertRule> rules, List<SpreadStatus> spreads, Map<String, LocalDate> staleCurves,
                                          ProbabilityModels models) {
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
                LiveProbability probability = models.read(rule.when(), s).orElse(null);
                LocalDate since = since(rule.when(), s, probability);
                out.add(new AlertCondition(rule.name(), s.id(), since != null, since, () -> values(s, probability)));
            }
        }
        return out;
    }

    /** The market date the condition started to hold, or null when it does not hold. */
    private static LocalDate since(AlertTrigger when, SpreadStatus s, LiveProbability probability) {
        Spell spell = s.openSpell();
        if (when instanceof AlertTrigger.EntersState e) {
            return s.state() == e.state() && s.stateSince() != null ? s.stateSince() : null;
        } else if (when instanceof AlertTrigger.InvertedForDays d) {
            return spell != null && spell.durationDays() >= d.days() ? spell.start() : null;
        } else if (when instanceof AlertTrigger.SpreadBelow b) {
            return Double.isFinite(s.valueBp()) && Resolution.BASIS_POINTS.below(s.valueBp(), b.bp()) ? s.date() : null;
        } else if (when instanceof AlertTrigger.ProbabilityAbove p) {
            return probability != null && Resolution.PROBABILITY.above(probability.probability(), p.level()) ? s.date() : null;
        }
        return null;
    }

    private static Map<String, String> values(SpreadStatus s, LiveProbability probability) {
        Map<String, String> v = new HashMap<>();
        v.put("curve", s.curve());
        v.put("spread", s.spread());
        v.put("state", s.state().name());
        v.put("value", Double.isFinite(s.valueBp()) ? String.format(Locale.ROOT, "%.1f", s.valueBp()) : "-");
        v.put("days", Long.toString(s.daysInverted()));
        v.put("date", String.valueOf(s.date()));
        Spell spell = s.openSpell();
        v.put("reason", spell == null ? SpreadText.state(s.state()) + " since " + s.stateSince()
                : SpreadText.run(s) + "; " + SpreadText.spellDetail(spell));
        if (probability != null) {
            // e.g. "24 % from the 2026-02 average (complete month, 20 observations)": never without its month
            v.put("probability", ProbabilityText.percent(probability.probability()) + " from the " + probability.month() + " average "
                    + ProbabilityText.month(probability));
        }
        return v;
    }
}
