package org.slopewatch.rules;

import java.time.LocalDate;

/**
 * What the rule engine decided for one rule and subject, and why, in words a person reads in the
 * journal: {@code first notice}, {@code repeat interval elapsed}, {@code condition cleared}.
 *
 * @param id      deterministic: rule, subject, episode and notice number, so that a restart or a
 *                second instance computing the same decision produces the same id
 * @param since   the market date the condition started to hold: it names the episode
 * @param number  the notice's number within its episode, from 1
 * @param message the rule's template filled in
 */
public record AlertDecision(String id, AlertRule rule, String subject, LocalDate since, int number, Notice notice, String why,
                            String message, AlertCondition condition) {

    /** The kind of notice. */
    public enum Notice { FIRING, REPEAT, RESOLVED }
}
