package org.slopewatch.probability;

import java.time.LocalDate;
import java.util.Objects;

/**
 * A confirmed inversion as the lead-time analysis sees it: the date a persistence test held and
 * the date the spread re-steepened (the spell's end), or null when it was still inverted at the
 * end of the data.
 */
public record Confirmation(LocalDate confirmed, LocalDate resteepened) {

    public Confirmation {
        Objects.requireNonNull(confirmed, "confirmed");
        if (resteepened != null && resteepened.isBefore(confirmed)) {
            throw new IllegalArgumentException("re-steepening on " + resteepened + " comes before the confirmation on "
                    + confirmed);
        }
    }
}
