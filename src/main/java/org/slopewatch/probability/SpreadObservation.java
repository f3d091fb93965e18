package org.slopewatch.probability;

import java.time.LocalDate;
import java.util.Objects;

/**
 * One observed spread on a market date, in percentage points (the unit of the probit
 * literature; the rest of the engine works in basis points, so divide by 100 on the way in).
 */
public record SpreadObservation(LocalDate date, double spreadPct) {

    public SpreadObservation {
        Objects.requireNonNull(date, "date");
    }
}
