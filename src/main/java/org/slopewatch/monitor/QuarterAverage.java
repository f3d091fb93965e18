package org.slopewatch.monitor;

/**
 * The average of a complete calendar quarter is below a threshold. A quarter is complete when
 * the first observation dated after it arrives; the confirmation is dated on that observation.
 */
public record QuarterAverage(double belowBp) implements PersistenceTest {

    public static final String NAME = "quarter-average";

    public QuarterAverage {
        requireFinite(belowBp, "quarter-average threshold");
    }

    @Override
    public String name() {
        return NAME;
    }

    @Override
    public String describe() {
        return NAME + " < " + PersistenceTest.number(belowBp) + " bp";
    }

    static void requireFinite(double value, String what) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException(what + " must be a finite number, got " + value);
        }
    }
}
