package org.slopewatch.probability;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.List;
import java.util.Objects;

/**
 * What the confirmations made of one business-cycle peak: the lead-time analysis measures every
 * confirmation, a reader asks about each peak. A peak is signalled once, by the first confirmation
 * measured against it; its later confirmations are named, never counted again.
 *
 * @param outcome                  ahead, late or missed (see {@link Outcome})
 * @param firstConfirmed           the confirmation the outcome rests on, or null when missed
 * @param months                   months from that confirmation's month to the peak, negative when it
 *                                 came after the peak; null when missed
 * @param laterConfirmations       the peak's other confirmations, in date order
 * @param announced                the day the peak was made public, or null when the dates do not give it
 * @param timing                   when the first confirmation came against the peak and its announcement,
 *                                 or null when missed
 * @param monthsBeforeAnnouncement months from the first confirmation's month to the announcement's month,
 *                                 negative when it came after; null without either
 */
public record PeakLead(YearMonth peak, Outcome outcome, LocalDate firstConfirmed, Integer months,
                       List<LaterConfirmation> laterConfirmations, LocalDate announced, Timing timing,
                       Integer monthsBeforeAnnouncement) {

    /** How a peak was met. */
    public enum Outcome {
        /** Signalled ahead: first confirmed before the peak, or in its month, within the window. */
        AHEAD,
        /** First confirmed after the peak, by its trough: the recession was under way. */
        LATE,
        /** A whole window of data before it and no confirmation in it, nor during the recession. */
        MISSED
    }

    /** When the signal came against what was known: peaks are dated, and announced, months after the fact. */
    public enum Timing {
        /** By the peak month: before anyone could know of the peak. */
        BEFORE_PEAK,
        /** After the peak but before the day it was announced. */
        BEFORE_ANNOUNCEMENT,
        /** On or after the day the peak was announced. */
        AFTER_BOTH,
        /** After the peak; the dates give no announcement to compare with. */
        AFTER_PEAK
    }

    /** Another confirmation of the same peak: months to the peak, negative when after it. */
    public record LaterConfirmation(LocalDate confirmed, int months) {
    }

    public PeakLead {
        Objects.requireNonNull(peak, "peak");
        Objects.requireNonNull(outcome, "outcome");
        if ((firstConfirmed == null) != (outcome == Outcome.MISSED)) {
            throw new IllegalArgumentException(outcome + " at " + peak + (firstConfirmed == null ? " needs" : " has no") + " a confirmation");
        }
        laterConfirmations = List.copyOf(laterConfirmations);
    }
}
