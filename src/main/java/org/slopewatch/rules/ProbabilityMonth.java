package org.slopewatch.rules;

import java.util.Locale;

/**
 * Which calendar month's average a {@code probability-above} rule applies the model to. The models
 * are fitted on whole-month averages, so a rule reads the last complete month unless its policy asks
 * for the month so far, which on a month's first business day is a single observation.
 */
public enum ProbabilityMonth {
    /** The last complete calendar month: final, the figure a probability is quoted at. The default. */
    COMPLETE,
    /** The month so far: provisional, moved by every day of the month until it ends. Only when asked for. */
    TO_DATE;

    /** The word used in policy files: {@code complete}, {@code to-date}. */
    public String key() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** The value for a word of the policy file, or null for an unknown one. */
    static ProbabilityMonth of(String key) {
        for (ProbabilityMonth m : values()) {
            if (m.key().equals(key)) {
                return m;
            }
        }
        return null;
    }
}
