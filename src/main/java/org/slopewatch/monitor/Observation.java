package org.slopewatch.monitor;

import java.time.LocalDate;

/**
 * One value of a spread on a market date, with the sequence number of the input that produced it
 * (so a transition can name what caused it).
 */
public record Observation(LocalDate date, double valueBp, long sequence) {

    public Observation {
        if (date == null) {
            throw new IllegalArgumentException("observation without a date");
        }
        if (!Double.isFinite(valueBp)) {
            throw new IllegalArgumentException("observation value must be finite, got " + valueBp + " on " + date);
        }
    }
}
