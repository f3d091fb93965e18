package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.Objects;

/**
 * A recession between business-cycle turning points. By the usual convention it occupies the
 * months after the peak through the trough, inclusive.
 */
public record Recession(YearMonth peak, YearMonth trough) {

    public Recession {
        Objects.requireNonNull(peak, "peak");
        Objects.requireNonNull(trough, "trough");
        if (!trough.isAfter(peak)) {
            throw new IllegalArgumentException("trough " + trough + " must come after peak " + peak);
        }
    }

    /** True for the months after the peak through the trough. */
    public boolean contains(YearMonth month) {
        return month.isAfter(peak) && !month.isAfter(trough);
    }
}
