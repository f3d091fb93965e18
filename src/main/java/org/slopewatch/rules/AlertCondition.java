package org.slopewatch.rules;

import java.time.LocalDate;
import java.util.Map;
import java.util.function.Supplier;

/**
 * Whether one rule holds for one subject (a spread id, or a curve for feed rules) right now, with
 * the values its message may name. The values are worked out only when a message is written:
 * every rule's condition is read for every spread at every step, and few of them become a notice.
 *
 * @param since        the market date the condition became true (it names the episode), or null when it does not hold
 * @param placeholders placeholder values for the message template ({@code curve}, {@code spread}, {@code value}, …),
 *                     built when asked, from values that do not change
 */
public record AlertCondition(String rule, String subject, boolean holds, LocalDate since, Supplier<Map<String, String>> placeholders) {

    /** A condition whose values are known already. */
    public AlertCondition(String rule, String subject, boolean holds, LocalDate since, Map<String, String> values) {
        this(rule, subject, holds, since, known(values));
    }

    /** The values its message may name. */
    public Map<String, String> values() {
        return placeholders.get();
    }

    private static Supplier<Map<String, String>> known(Map<String, String> values) {
        Map<String, String> copy = Map.copyOf(values);
        return () -> copy;
    }
}
