package org.slopewatch.replay;

import java.time.LocalDate;
import java.util.List;
import java.util.Objects;
import org.slopewatch.probability.SpreadObservation;

/**
 * One spread of one curve as read off a history file, date by date, in percentage points (the
 * probit's unit).
 *
 * @param observations     dates on which the spread could be computed, in date order
 * @param datesWithoutValue dates of this curve on which a leg was missing, so the spread was not
 *                          computed (left out, never averaged in as zero or carried forward)
 * @param rows             data rows read from the file, for the report
 */
public record SpreadSeries(String source, String curve, String spread, List<SpreadObservation> observations,
                           long datesWithoutValue, long rows) {

    public SpreadSeries {
        Objects.requireNonNull(curve, "curve");
        Objects.requireNonNull(spread, "spread");
        observations = List.copyOf(observations);
    }

    public LocalDate firstDate() {
        return observations.isEmpty() ? null : observations.get(0).date();
    }

    public LocalDate lastDate() {
        return observations.isEmpty() ? null : observations.get(observations.size() - 1).date();
    }
}
