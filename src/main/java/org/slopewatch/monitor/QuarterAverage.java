package org.slopewatch.monitor;

import org.slopewatch.curve.Resolution;

/**
 * The average of a complete calendar quarter is below a threshold. A quarter is complete when
 * the first observation dated after it arrives; the confirmation is dated on that observation.
 */
public record QuarterAverage(double belowBp) implements PersistenceTest {

    public static final String NAME = "quarter-average";

    public QuarterAverage {
        belowBp = threshold(belowBp, "quarter-average threshold");
    }

    @Override
    public String name() {
        return NAME;
    }

    @Override
    public String describe() {
        return NAME + " < " + PersistenceTest.number(belowBp) + " bp";
    }

    /** A threshold in basis points as the monitor compares with it: finite, to the resolution. */
    static double threshold(double value, String what) {
        if (!(Math.abs(value) < Observation.MAX_MAGNITUDE_BP)) {
            throw new IllegalArgumentException(what + " must be a finite number of at most " + (long) Observation.MAX_MAGNITUDE_BP + " bp in size, got " + value);
        }
        return Resolution.BASIS_POINTS.round(value);
    }
}
