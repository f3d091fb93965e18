package org.slopewatch.alerting;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.probability.LiveProbability;
import org.slopewatch.probability.ProbabilityText;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertDecision;
import org.slopewatch.rules.AlertTrigger;
import org.slopewatch.rules.SpreadText;

/**
 * What one notice says, in words of its own for each kind: the opening notice says what happened
 * (in the rule's message first), a standing notice that it still holds, a closing notice that it no
 * longer does and how it ended. The subject says what happened and then the kind and severity in
 * words, e.g. {@code GOVT-A:10Y-3M confirmed inverted at -23.4 bp — opening notice, critical}.
 *
 * <p>The opening notice of a confirmed inversion also says what a confirmed inversion has meant and
 * what it does not say, and a notice of a re-steepening what that has meant; both as slopewatch's
 * own replay of the reference data shows it, no more.
 */
final class NoticeText {

    /**
     * What a confirmed inversion has meant and what it does not say: timing rather than depth,
     * false alarms, the central bank's balance sheet. The figures are slopewatch's own replay of the
     * reference data ({@code src/test/resources/reference}: U.S. monthly yields 1953–1999, 10Y−1Y,
     * a calendar quarter averaging below zero, NBER peaks), checked by {@code NoticeHistoryTest}.
     */
    static final String CONFIRMED_MEANING = "What a confirmed inversion has meant: on the reference history slopewatch replays (U.S. "
            + "monthly yields 1953\u20131999, 10-year minus 1-year), 11 inversions were confirmed; 7 came 4 to 17 months before a "
            + "business-cycle peak, 3 only once the recession had begun, and 1 (1966) was a false alarm. It speaks to timing, not "
            + "depth: how deep or how long an inversion is has not told how severe a recession would be. False alarms happen. "
            + "Central-bank balance-sheet policy (bond purchases and their unwinding) can hold term spreads down or up for reasons "
            + "of its own.";

    /**
     * What the end of a confirmed inversion has meant, no more than the same replay shows: of the
     * re-steepenings with a peak to measure against, most came after it.
     */
    static final String RESTEEPENING_MEANING = "On the same reference history, of the 10 confirmed inversions with a business-cycle "
            + "peak to measure against, 7 re-steepened after the peak, once the recession had begun, and 3 before it (1 to 15 "
            + "months ahead): a re-steepening has more often come with a recession under way than ahead of one.";

    private final AlertDecision d;
    private final SpreadStatus s;
    private final LiveProbability probability;

    /**
     * @param status      the spread's status, or null for a rule about a curve's feed
     * @param probability the spread's recession probability under the policy's model, or null
     */
    NoticeText(AlertDecision decision, SpreadStatus status, LiveProbability probability) {
        this.d = decision;
        this.s = status;
        this.probability = probability;
    }

    /** What happened, then the kind and the severity in words. */
    String subject() {
        return what() + " \u2014 " + d.notice().words() + ", " + d.rule().severity().name().toLowerCase(Locale.ROOT);
    }

    private String what() {
        if (s == null) {
            return switch (d.notice()) {
                case OPENING -> d.subject() + " feed quiet since " + d.since();
                case STANDING -> d.subject() + " feed still quiet since " + d.since();
                case CLOSING -> d.subject() + " feed quoting again";
            };
        }
        String value = SpreadText.bp(s.valueBp());
        return switch (d.notice()) {
            case OPENING -> s.id() + " " + condition() + " at " + value;
            case STANDING -> s.id() + " still " + condition() + " at " + value;
            case CLOSING -> s.id() + " no longer " + condition() + ": " + SpreadText.state(s.state()) + " at " + value;
        };
    }

    /** What the rule watches for, in words that follow the spread's id. */
    private String condition() {
        AlertTrigger when = d.rule().when();
        if (when instanceof AlertTrigger.EntersState e) {
            return SpreadText.state(e.state());
        } else if (when instanceof AlertTrigger.InvertedForDays i) {
            return "inverted for at least " + SpreadText.days(i.days());
        } else if (when instanceof AlertTrigger.SpreadBelow b) {
            return "below " + SpreadText.bp(b.bp());
        } else if (when instanceof AlertTrigger.ProbabilityAbove p) {
            return String.format(Locale.ROOT, "with a recession probability above %.0f%%", 100 * p.level());
        }
        return "stale";
    }

    /** The body without the caution: paragraphs separated by a blank line. */
    String body() {
        List<String> paragraphs = new ArrayList<>();
        switch (d.notice()) {
            case OPENING -> opening(paragraphs);
            case STANDING -> standing(paragraphs);
            case CLOSING -> closing(paragraphs);
        }
        paragraphs.add("Rule " + d.rule().name() + " (" + d.rule().severity().name().toLowerCase(Locale.ROOT) + "): " + d.why()
                + "; episode since " + d.since() + ", " + d.notice().words() + " number " + d.number() + ".");
        return String.join("\n\n", paragraphs);
    }

    private void opening(List<String> out) {
        out.add(d.message());
        if (s == null) {
            out.add("No quotes for " + d.subject() + " since " + d.since() + ": the monitor is not seeing this curve's market.");
            return;
        }
        out.add(numbers());
        if (d.rule().when() instanceof AlertTrigger.EntersState e && e.state() == SpreadState.CONFIRMED) {
            out.add(CONFIRMED_MEANING);
            if (probability != null) {
                out.add(probabilityText());
            }
        } else if (d.rule().when() instanceof AlertTrigger.EntersState e && e.state() == SpreadState.RESTEEPENING) {
            out.add(RESTEEPENING_MEANING);
        }
    }

    private void standing(List<String> out) {
        String every = d.rule().standingEvery().isZero() ? "" : ", every " + interval();
        if (s == null) {
            out.add("Still no quotes for " + d.subject() + " since " + d.since() + ". Standing notices follow" + every
                    + " until quotes arrive or someone acknowledges the alert.");
            return;
        }
        out.add(s.id() + " is still " + condition() + ": " + SpreadText.bp(s.valueBp()) + " on " + s.date() + ". Standing notices follow"
                + every + " until the condition ends or someone acknowledges the alert.");
        out.add(numbers());
    }

    private void closing(List<String> out) {
        if (s == null) {
            out.add("Quotes for " + d.subject() + " arrive again; the feed had been quiet since " + d.since() + ".");
            return;
        }
        out.add(s.id() + " is no longer " + condition() + " (rule " + d.rule().name() + ", since " + d.since() + ").");
        out.add(numbers());
        Spell ended = endedNow();
        if (ended != null && ended.wasConfirmed() && s.state() == SpreadState.RESTEEPENING) {
            out.add(RESTEEPENING_MEANING);
        }
    }

    /** The spell whose end brought the spread to its present state, or null when its state has another cause. */
    private Spell endedNow() {
        Spell ended = s.endedSpell();
        return s.openSpell() == null && ended != null && ended.end() != null && ended.end().equals(s.stateSince()) ? ended : null;
    }

    /** The spread's figures: value, state, the spell and its days inverted, the quarter so far. */
    private String numbers() {
        StringBuilder b = new StringBuilder();
        b.append(s.id()).append(" stood at ").append(SpreadText.bp(s.valueBp())).append(" on ").append(s.date()).append(", ")
                .append(SpreadText.state(s.state())).append(" since ").append(s.stateSince()).append('.');
        Spell spell = s.openSpell();
        Spell ended = endedNow();
        if (spell != null) {
            b.append(' ').append(capitalised(SpreadText.run(s))).append("; ").append(SpreadText.spellDetail(spell)).append('.');
        } else if (ended != null) {
            b.append(" The ").append(ended.wasConfirmed() ? "confirmed" : "unconfirmed").append(" spell that began on ").append(ended.start())
                    .append(" ended on ").append(ended.end()).append(" after ").append(SpreadText.days(ended.durationDays())).append("; ")
                    .append(SpreadText.spellDetail(ended)).append('.');
        }
        if (s.quarterToDateObservations() > 0) {
            b.append(String.format(Locale.ROOT, " Quarter to date: average %s over %d observations.", SpreadText.bp(s.quarterToDateAverageBp()),
                    s.quarterToDateObservations()));
        }
        return b.toString();
    }

    private String probabilityText() {
        return ProbabilityText.sentence(s.spread(), probability) + ". A model probability is an estimate from past recessions, not a "
                + "forecast of this one.";
    }

    private String interval() {
        return d.rule().standingEvery().toString().substring(2).toLowerCase(Locale.ROOT);
    }

    private static String capitalised(String s) {
        return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
    }
}
