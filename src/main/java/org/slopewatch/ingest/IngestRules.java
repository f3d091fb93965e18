package org.slopewatch.ingest;

import java.time.Clock;
import java.time.LocalDate;
import java.util.Set;
import org.slopewatch.curve.YieldBounds;

/**
 * What an incoming quote must satisfy.
 *
 * @param curves       the curves the desk watches; a quote for any other is rejected (empty: accept any)
 * @param bounds       plausible yields; outside is a unit mistake, rejected
 * @param maxDaysAhead a market date more than this many days after today is rejected
 * @param clock        today's date, injected so that tests control it
 */
public record IngestRules(Set<String> curves, YieldBounds bounds, int maxDaysAhead, Clock clock) {

    public IngestRules {
        curves = Set.copyOf(curves);
        if (maxDaysAhead < 0) {
            throw new IllegalArgumentException("max days ahead must not be negative, got " + maxDaysAhead);
        }
    }

    boolean knowsCurve(String curve) {
        return curves.isEmpty() || curves.contains(curve);
    }

    LocalDate latestAcceptedDate() {
        return LocalDate.now(clock).plusDays(maxDaysAhead);
    }
}
