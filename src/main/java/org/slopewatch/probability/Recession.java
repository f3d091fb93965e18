package org.slopewatch.probability;

import java.time.LocalDate;
import java.time.YearMonth;
import java.time.temporal.ChronoUnit;
import java.util.Objects;

/**
 * One business-cycle contraction, dated by its peak and trough months. The recession occupies
 * the months after the peak through the trough, inclusive (the convention of the dating
 * committee's chronology and of the probit literature), so it lasts trough − peak months.
 *
 * <p>Peaks are dated long after the fact: {@code peakAnnounced} is the day the peak was made
 * public, when the dates file gives it, so that a signal can be compared with what was known
 * then. It is null when not given.
 */
public record Recession(YearMonth peak, YearMonth trough, LocalDate peakAnnounced) {

    public Recession {
        Objects.requireNonNull(peak, "peak");
        Objects.requireNonNull(trough, "trough");
        if (!trough.isAfter(peak)) {
            throw new IllegalArgumentException("trough " + trough + " must come after peak " + peak);
        }
        // a peak is the month activity turned: it can only be seen, and so announced, after that month
        if (peakAnnounced != null && !YearMonth.from(peakAnnounced).isAfter(peak)) {
            throw new IllegalArgumentException("peak announced " + peakAnnounced + " must come after the peak month " + peak);
        }
    }

    /** A recession whose peak's announcement date is not known. */
    public Recession(YearMonth peak, YearMonth trough) {
        this(peak, trough, null);
    }

    /** True for the months after the peak through the trough, inclusive. */
    public boolean contains(YearMonth month) {
        return month.isAfter(peak) && !month.isAfter(trough);
    }

    /** Number of recession months, trough − peak. */
    public int months() {
        return (int) ChronoUnit.MONTHS.between(peak, trough);
    }
}
