package org.slopewatch.rules;

import java.util.Locale;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.monitor.SpreadStatus;

/**
 * How notices put a spread's numbers into words, in one place so that a message's
 * {@code {reason}}, a notice's body and its facts say the same thing with the same figures: all
 * of them read one {@link SpreadStatus}, whose days inverted and their first date are those a
 * {@code days-inverted} confirmation reports.
 */
public final class SpreadText {

    private SpreadText() {
    }

    /** A value in basis points as notices write it: one decimal, e.g. {@code -23.4 bp}. */
    public static String bp(double valueBp) {
        return Double.isFinite(valueBp) ? String.format(Locale.ROOT, "%.1f bp", valueBp) : "no value";
    }

    /** A state in words: {@code normal}, {@code inverted}, {@code confirmed inverted}, {@code re-steepening}. */
    public static String state(SpreadState state) {
        return switch (state) {
            case NORMAL -> "normal";
            case INVERTED -> "inverted";
            case CONFIRMED -> "confirmed inverted";
            case RESTEEPENING -> "re-steepening";
        };
    }

    /**
     * The open spell and the run of days below the entry threshold, e.g. {@code the spell began on
     * 2026-06-24; below the entry threshold without a break since 2026-06-26: 90 days}; null
     * without an open spell.
     */
    public static String run(SpreadStatus s) {
        Spell spell = s.openSpell();
        if (spell == null) {
            return null;
        }
        if (s.invertedSince() == null) {
            return "the spell began on " + spell.start() + "; the latest value is not below the entry threshold, so no days inverted "
                    + "are counted until the next one that is";
        }
        if (s.invertedSince().equals(spell.start())) {
            return "the spell began on " + spell.start() + " and the spread has been below the entry threshold without a break since: "
                    + days(s.daysInverted());
        }
        return "the spell began on " + spell.start() + "; below the entry threshold without a break since " + s.invertedSince() + ": "
                + days(s.daysInverted());
    }

    /** The deepest value and the confirmation of an open or ended spell, e.g. {@code deepest -55.0 bp on 2026-11-03, confirmed on …}. */
    public static String spellDetail(Spell spell) {
        return "deepest " + bp(spell.deepestBp()) + " on " + spell.deepestDate() + (spell.confirmed() == null ? ""
                : ", confirmed on " + spell.confirmed() + " by " + spell.confirmedBy());
    }

    /** {@code 1 day}, {@code 90 days}. */
    public static String days(long n) {
        return n == 1 ? "1 day" : n + " days";
    }
}
