package org.slopewatch.rules;

import java.time.LocalDate;
import java.util.Map;

/**
 * Whether one rule holds for one subject (a spread id, or a curve for feed rules) right now, with
 * the values its message may name.
 *
 * @param since  the market date the condition became true (it names the episode), or null when it does not hold
 * @param values placeholder values for the message template ({@code curve}, {@code spread}, {@code value}, …)
 */
public record AlertCondition(String rule, String subject, boolean holds, LocalDate since, Map<String, String> values) {

    public AlertCondition {
        values = Map.copyOf(values);
    }
}
