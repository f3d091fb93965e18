package org.slopewatch.monitor;

import java.util.List;

/**
 * What the monitor of one spread watches for. Immutable; the per-spread state lives in
 * {@link MonitorState}. Thresholds are kept to {@link org.slopewatch.curve.Resolution#BASIS_POINTS},
 * the resolution spreads are compared at.
 *
 * @param entryBelowBp     a spell starts on an observation below this
 * @param exitAboveBp      an observation at or above this counts towards ending the spell
 *                         (at least {@code entryBelowBp}: the gap is the hysteresis band)
 * @param exitObservations consecutive observations at or above the exit threshold that end a spell
 * @param holdDays         calendar days a re-steepened spread stays in {@code RESTEEPENING}
 * @param tests            persistence tests; the first that holds confirms the spell
 */
public record MonitorDefinition(double entryBelowBp, double exitAboveBp, int exitObservations, int holdDays,
                                List<PersistenceTest> tests) {

    /** A full quarter averaging below zero confirms; one observation back at or above zero ends a spell. */
    public static MonitorDefinition quarterAverageAtZero() {
        return new MonitorDefinition(0, 0, 1, 365, List.of(new QuarterAverage(0)));
    }

    /** One line naming the rules, e.g. {@code confirm: quarter-average < 0 bp; enter < 0 bp, exit >= 0 bp after 1 obs, hold 365 d}. */
    public String describe() {
        StringBuilder b = new StringBuilder("confirm: ");
        for (int i = 0; i < tests.size(); i++) {
            b.append(i == 0 ? "" : " or ").append(tests.get(i).describe());
        }
        return b.append("; enter < ").append(PersistenceTest.number(entryBelowBp)).append(" bp, exit >= ")
                .append(PersistenceTest.number(exitAboveBp)).append(" bp after ").append(exitObservations)
                .append(" obs, hold ").append(holdDays).append(" d").toString();
    }

    public MonitorDefinition {
        entryBelowBp = QuarterAverage.threshold(entryBelowBp, "entry threshold");
        exitAboveBp = QuarterAverage.threshold(exitAboveBp, "exit threshold");
        if (exitAboveBp < entryBelowBp) {
            throw new IllegalArgumentException("exit threshold (" + exitAboveBp + " bp) must not be below the entry threshold ("
                    + entryBelowBp + " bp)");
        }
        if (exitObservations < 1) {
            throw new IllegalArgumentException("exit observations must be at least 1, got " + exitObservations);
        }
        if (holdDays < 0) {
            throw new IllegalArgumentException("hold days must not be negative, got " + holdDays);
        }
        if (tests == null || tests.isEmpty()) {
            throw new IllegalArgumentException("at least one persistence test is needed to confirm an inversion");
        }
        tests = List.copyOf(tests);
    }
}
