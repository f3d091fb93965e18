package org.slopewatch.report;

import java.time.YearMonth;
import java.util.List;
import java.util.Objects;
import org.slopewatch.probability.LeadTime;

/**
 * What the monitor made of one business-cycle peak inside the data, read off the lead-time
 * analysis. The analysis measures every confirmation; a reader asks about each peak, and a peak
 * confirmed twice before it was signalled once, by the first of them.
 *
 * @param first the confirmation the finding rests on: the first before the peak ({@link Outcome#AHEAD})
 *              or the first after it ({@link Outcome#LATE}); null for a missed or unassessed peak
 * @param later the peak's other confirmations, in date order
 */
public record PeakFinding(YearMonth peak, Outcome outcome, LeadTime first, List<LeadTime> later) {

    /** How a peak was met. */
    public enum Outcome {
        /** Confirmed before the peak (or in its month). */
        AHEAD,
        /** First confirmed after the peak, with the recession under way. */
        LATE,
        /** A whole window of data before it and no confirmation in it, nor during the recession. */
        MISSED,
        /** The data begin less than a window before it, so a miss could not be told. */
        NOT_ASSESSED
    }

    public PeakFinding {
        Objects.requireNonNull(peak, "peak");
        Objects.requireNonNull(outcome, "outcome");
        if ((first == null) != (outcome == Outcome.MISSED || outcome == Outcome.NOT_ASSESSED)) {
            throw new IllegalArgumentException(outcome + " at " + peak + (first == null ? " needs" : " has no") + " a confirmation");
        }
        later = List.copyOf(later);
    }
}
