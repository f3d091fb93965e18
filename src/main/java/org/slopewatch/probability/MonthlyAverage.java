package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.Objects;

/**
 * The average spread of one calendar month, in percentage points, and how many observations
 * went into it (a month averaged from three days deserves less trust than one from twenty-two).
 *
 * <p>The value is not checked for finiteness here: the fitter reports a non-finite month with
 * its name, which is more useful than a failure while building the list.
 */
public record MonthlyAverage(YearMonth month, double averagePct, int count) {

    public MonthlyAverage {
        Objects.requireNonNull(month, "month");
        if (count < 1) {
            throw new IllegalArgumentException("a monthly average needs at least one observation: " + month);
        }
    }
}
