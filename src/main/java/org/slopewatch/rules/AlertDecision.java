package org.slopewatch.rules;

/**
 * What the rule engine decided for one rule and subject, and why, in words a person reads in the
 * journal: {@code first notice}, {@code repeat interval elapsed}, {@code condition cleared}.
 *
 * @param id      deterministic: rule, subject, episode and notice number, so that a restart or a
 *                second instance computing the same decision produces the same id
 * @param message the rule's template filled in
 */
public record AlertDecision(String id, AlertRule rule, String subject, Notice notice, String why, String message,
                            AlertCondition condition) {

    /** The kind of notice. */
    public enum Notice { FIRING, REPEAT, RESOLVED }
}
