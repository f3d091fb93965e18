package org.slopewatch.probability;

import java.time.YearMonth;
import java.time.temporal.ChronoUnit;
import java.util.Objects;

/**
 * One business-cycle contraction, dated by its peak and trough months. The recession occupies
 * the months after the peak through the trough, inclusive (the convention of the dating
 * committee's chronology and of the probit literature), so it lasts trough − peak months.
 */
public record Recession(YearMonth peak, YearMonth trough) {

    public Recession {
        Objects.requireNonNull(peak, "peak");
        Objects.requireNonNull(trough, "trough");
        if (!trough.isAfter(peak)) {
            throw new IllegalArgumentException("trough " + trough + " must come after peak " + peak);
        }
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
