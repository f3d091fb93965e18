package org.slopewatch.monitor;

/**
 * The average of the observations in a trailing window of calendar days is below a threshold.
 * Evaluated only once the monitor has seen a whole window of history.
 */
public record RollingAverage(int windowDays, double belowBp) implements PersistenceTest {

    public static final String NAME = "rolling-average";

    public RollingAverage {
        if (windowDays < 1) {
            throw new IllegalArgumentException("rolling-average window must be at least 1 day, got " + windowDays);
        }
        belowBp = QuarterAverage.threshold(belowBp, "rolling-average threshold");
    }

    @Override
    public String name() {
        return NAME;
    }

    @Override
    public String describe() {
        return NAME + "(" + windowDays + " d) < " + PersistenceTest.number(belowBp) + " bp";
    }
}
