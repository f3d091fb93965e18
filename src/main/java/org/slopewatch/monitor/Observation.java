package org.slopewatch.monitor;

import java.time.LocalDate;
import org.slopewatch.curve.Resolution;

/**
 * One value of a spread on a market date, with the sequence number of the input that produced it
 * (so a transition can name what caused it). The value is taken to {@link Resolution#BASIS_POINTS}
 * whoever built it, since the monitor compares and sums values on that grid only.
 */
public record Observation(LocalDate date, double valueBp, long sequence) {

    /**
     * The largest size of a value or threshold, 10⁷ bp: far beyond any spread, and small enough that
     * sums of values in steps of the resolution stay within a {@code long} over any window.
     */
    public static final double MAX_MAGNITUDE_BP = 1e7;

    public Observation {
        if (date == null) {
            throw new IllegalArgumentException("observation without a date");
        }
        if (!(Math.abs(valueBp) < MAX_MAGNITUDE_BP)) {
            // far beyond any spread; the bound keeps the monitor's exact sums of steps within a long
            throw new IllegalArgumentException("observation value must be a finite number of at most "
                    + (long) MAX_MAGNITUDE_BP + " bp in size, got " + valueBp + " on " + date);
        }
        valueBp = Resolution.BASIS_POINTS.round(valueBp);
    }
}
