package org.slopewatch.monitor;

/**
 * Why a transition happened, in numbers.
 *
 * @param test         the rule that decided: a persistence test name, {@code entry} or {@code exit}
 *                     (threshold crossings) or {@code hold} (hold period over)
 * @param window       what the measure covers: a quarter ({@code 1966Q1}), a trailing window
 *                     ({@code 90d}), a run ({@code since 1966-01-01})
 * @param measured     the measured value (bp, days or a share, per the test)
 * @param limit        the threshold it was compared with
 * @param valueBp      the spread on the transition's date
 * @param daysInverted calendar days continuously below the entry threshold up to that date
 */
public record Evidence(String test, String window, double measured, double limit, double valueBp, long daysInverted) {
}
