package org.slopewatch.rules;

import java.time.LocalDate;

/**
 * What the rule engine decided for one rule and subject, and why, in words a person reads in the
 * journal: {@code the condition now holds}, {@code standing interval of PT24H elapsed},
 * {@code the condition no longer holds}.
 *
 * @param id      deterministic: rule, subject, episode and notice number, so that a restart or a
 *                second instance computing the same decision produces the same id
 * @param since   the market date the condition started to hold: it names the episode
 * @param number  the notice's number within its episode, from 1
 * @param message the rule's template filled in
 */
public record AlertDecision(String id, AlertRule rule, String subject, LocalDate since, int number, Alert.Kind notice, String why,
                            String message, AlertCondition condition) {
}
