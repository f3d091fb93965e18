package org.slopewatch.alerting;

import java.net.URLEncoder;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertDecision;
import org.slopewatch.rules.AlertTrigger;
import org.slopewatch.rules.ProbabilityMonth;

/**
 * Writes a notice from a rule engine decision and the spread's status: a one-line subject, the
 * rule's message with the evidence behind it, labelled facts, a link to the dashboard and the
 * caution. Plain Java; what a desk reads in every channel comes from here.
 */
final class AlertComposer {

    private final String dashboardUrl;

    AlertComposer(String dashboardUrl) {
        this.dashboardUrl = dashboardUrl.endsWith("/") ? dashboardUrl : dashboardUrl + "/";
    }

    /**
     * @param status the spread's status, or null for a rule about a curve's feed
     */
    Alert compose(AlertDecision d, SpreadStatus status, Instant now) {
        Alert.Kind kind = Alert.Kind.valueOf(d.notice().name());
        String state = status == null ? (d.notice() == AlertDecision.Notice.RESOLVED ? "FRESH" : "STALE") : status.state().name();
        return new Alert(d.id(), d.rule().name(), d.rule().severity(), kind, d.subject(), status == null ? null : status.date(), state,
                subject(d, status, state), text(d, status), facts(d, status), link(d, status), now);
    }

    private static String subject(AlertDecision d, SpreadStatus status, String state) {
        String what = status == null ? d.subject() + " feed" : status.curve() + " " + status.spread();
        return switch (d.notice()) {
            case FIRING -> "[" + d.rule().severity() + "] " + what + " " + state;
            case REPEAT -> "[" + d.rule().severity() + "] " + what + " " + state + " (reminder " + (d.number() - 1) + ")";
            case RESOLVED -> "[RESOLVED] " + what + ": " + d.rule().name() + " no longer holds (now " + state + ")";
        };
    }

    private static String text(AlertDecision d, SpreadStatus status) {
        StringBuilder b = new StringBuilder(d.message()).append("\n\n");
        b.append("Rule ").append(d.rule().name()).append(" (").append(d.rule().severity().name().toLowerCase(Locale.ROOT))
                .append("): ").append(d.why()).append(", episode since ").append(d.since()).append(".\n");
        if (status != null) {
            Spell spell = status.openSpell();
            if (spell != null) {
                b.append(String.format(Locale.ROOT, "Inverted since %s: %d days, deepest %.1f bp on %s", spell.start(),
                        spell.durationDays(), spell.deepestBp(), spell.deepestDate()));
                if (spell.confirmed() != null) {
                    b.append(", confirmed on ").append(spell.confirmed()).append(" by ").append(spell.confirmedBy());
                }
                b.append(".\n");
            }
            if (status.quarterToDateObservations() > 0) {
                b.append(String.format(Locale.ROOT, "Quarter to date: average %.1f bp over %d observations.%n",
                        status.quarterToDateAverageBp(), status.quarterToDateObservations()));
            }
        }
        return b.append('\n').append(Alert.CAUTION).toString();
    }

    private static List<Alert.Fact> facts(AlertDecision d, SpreadStatus status) {
        List<Alert.Fact> facts = new ArrayList<>();
        if (status == null) {
            facts.add(new Alert.Fact("curve", d.subject()));
            facts.add(new Alert.Fact("feed quiet since", String.valueOf(d.since())));
        } else {
            facts.add(new Alert.Fact("spread", status.id()));
            facts.add(new Alert.Fact("state", status.state() + " since " + status.stateSince()));
            facts.add(new Alert.Fact("value", String.format(Locale.ROOT, "%.1f bp on %s", status.valueBp(), status.date())));
            Spell spell = status.openSpell();
            if (spell != null) {
                facts.add(new Alert.Fact("spell start", spell.start().toString()));
                facts.add(new Alert.Fact("days inverted", Long.toString(status.daysInverted())));
            }
            if (status.quarterToDateObservations() > 0) {
                facts.add(new Alert.Fact("quarter-to-date average", String.format(Locale.ROOT, "%.1f bp (%d observations)",
                        status.quarterToDateAverageBp(), status.quarterToDateObservations())));
            }
            String probability = d.condition().values().get("probability");
            if (probability != null) {
                facts.add(new Alert.Fact("recession probability", probability));
            }
        }
        facts.add(new Alert.Fact("rule", d.rule().name() + " (" + trigger(d.rule().when()) + ")"));
        facts.add(new Alert.Fact("notice", d.notice().name().toLowerCase(Locale.ROOT) + " " + d.number()));
        return facts;
    }

    private static String trigger(AlertTrigger when) {
        if (when instanceof AlertTrigger.EntersState e) {
            return "enters " + e.state();
        } else if (when instanceof AlertTrigger.InvertedForDays i) {
            return "inverted for " + i.days() + " days";
        } else if (when instanceof AlertTrigger.ProbabilityAbove p) {
            return String.format(Locale.ROOT, "probability above %.0f%% on the %s", 100 * p.level(),
                    p.month() == ProbabilityMonth.TO_DATE ? "month so far" : "last complete month");
        } else if (when instanceof AlertTrigger.SpreadBelow s) {
            return String.format(Locale.ROOT, "spread below %.1f bp", s.bp());
        }
        return "feed stale";
    }

    private String link(AlertDecision d, SpreadStatus status) {
        return status == null ? dashboardUrl : dashboardUrl + "?spread=" + URLEncoder.encode(status.id(), StandardCharsets.UTF_8);
    }
}
