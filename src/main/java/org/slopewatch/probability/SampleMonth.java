package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.Objects;

/**
 * One row of a probit sample: the month's average spread (percentage points) and whether a
 * recession is under way the horizon's number of months later.
 */
public record SampleMonth(YearMonth month, double spreadPct, boolean recessionAhead) {

    public SampleMonth {
        Objects.requireNonNull(month, "month");
    }
}
