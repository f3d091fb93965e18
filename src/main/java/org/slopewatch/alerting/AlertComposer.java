package org.slopewatch.alerting;

import java.net.URLEncoder;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.probability.LiveProbability;
import org.slopewatch.probability.ProbabilityText;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertDecision;
import org.slopewatch.rules.AlertTrigger;
import org.slopewatch.rules.SpreadText;
import org.slopewatch.rules.ProbabilityMonth;

/**
 * Writes a notice from a rule engine decision and the spread's status: a one-line subject, a body
 * of its own for each kind of notice ({@link NoticeText}), labelled facts, a link to the spread on
 * the dashboard and the caution. Every figure comes from the one {@link SpreadStatus} the decision
 * was made on, so that subject, body and facts agree with each other and with the API. Plain Java;
 * what a desk reads in every channel comes from here.
 */
final class AlertComposer {

    private final String dashboardUrl;

    AlertComposer(String dashboardUrl) {
        this.dashboardUrl = dashboardUrl.endsWith("/") ? dashboardUrl : dashboardUrl + "/";
    }

    /**
     * @param status      the spread's status, or null for a rule about a curve's feed
     * @param probability the spread's recession probability under the policy's model, or null without one
     */
    Alert compose(AlertDecision d, SpreadStatus status, LiveProbability probability, Instant now) {
        Alert.Kind kind = d.notice();
        String state = status == null ? (kind == Alert.Kind.CLOSING ? "FRESH" : "STALE") : status.state().name();
        NoticeText text = new NoticeText(d, status, probability);
        return new Alert(d.id(), d.rule().name(), d.rule().severity(), kind, d.subject(), status == null ? null : status.date(), state,
                text.subject(), text.body() + "\n\n" + Alert.CAUTION, facts(d, status, probability), link(d, status), now);
    }

    private static List<Alert.Fact> facts(AlertDecision d, SpreadStatus status, LiveProbability probability) {
        List<Alert.Fact> facts = new ArrayList<>();
        if (status == null) {
            facts.add(new Alert.Fact("curve", d.subject()));
            facts.add(new Alert.Fact("feed quiet since", String.valueOf(d.since())));
        } else {
            facts.add(new Alert.Fact("spread", status.id()));
            facts.add(new Alert.Fact("state", SpreadText.state(status.state()) + " since " + status.stateSince()));
            facts.add(new Alert.Fact("value", SpreadText.bp(status.valueBp()) + " on " + status.date()));
            Spell spell = status.openSpell();
            if (spell != null) {
                facts.add(new Alert.Fact("spell start", spell.start().toString()));
                facts.add(new Alert.Fact("days inverted", status.invertedSince() == null ? "0 (not below the entry threshold)"
                        : status.daysInverted() + " (without a break since " + status.invertedSince() + ")"));
                facts.add(new Alert.Fact("deepest", SpreadText.bp(spell.deepestBp()) + " on " + spell.deepestDate()));
                if (spell.confirmed() != null) {
                    facts.add(new Alert.Fact("confirmed", spell.confirmed() + " by " + spell.confirmedBy()));
                }
            } else if (status.endedSpell() != null && status.endedSpell().end().equals(status.stateSince())) {
                // the spell whose end brought the spread to its present state
                Spell ended = status.endedSpell();
                facts.add(new Alert.Fact("spell", ended.start() + " to " + ended.end() + ", " + SpreadText.days(ended.durationDays())
                        + (ended.confirmed() == null ? ", unconfirmed" : ", confirmed on " + ended.confirmed())));
            }
            if (status.quarterToDateObservations() > 0) {
                facts.add(new Alert.Fact("quarter-to-date average", String.format(Locale.ROOT, "%s (%d observations)",
                        SpreadText.bp(status.quarterToDateAverageBp()), status.quarterToDateObservations())));
            }
            if (probability != null) {
                facts.add(new Alert.Fact("recession probability", ProbabilityText.sentence(status.spread(), probability)));
            }
        }
        facts.add(new Alert.Fact("rule", d.rule().name() + " (" + trigger(d.rule().when()) + ")"));
        facts.add(new Alert.Fact("notice", d.notice().words() + ", number " + d.number() + " of the episode since " + d.since()));
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

    /**
     * The dashboard opened on the notice's spread: {@code ?spread=} makes the page scroll to the
     * spread's card and mark it, and the fragment names the card ({@code spread-} and the id with
     * every character outside letters, digits, {@code _} and {@code -} written as {@code -}, as
     * the page makes it).
     */
    private String link(AlertDecision d, SpreadStatus status) {
        if (status == null) {
            return dashboardUrl;
        }
        return dashboardUrl + "?spread=" + URLEncoder.encode(status.id(), StandardCharsets.UTF_8) + "#spread-"
                + status.id().replaceAll("[^A-Za-z0-9_-]", "-");
    }
}
