package org.slopewatch.pipeline;

import java.time.Instant;
import java.time.LocalDate;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;
import org.slopewatch.curve.Tenor;

/**
 * One accepted quote message: a single quote, or a snapshot of several tenors of one curve on
 * one market date, with yields already in basis points on a bond-equivalent basis.
 *
 * @param id     idempotency key: a message whose id was seen before is a duplicate; may be null
 * @param source who sent it, free text; may be null
 * @param time   when the sender produced it; may be null
 */
public record QuoteMessage(String id, String source, Instant time, String curve, LocalDate date,
                           SortedMap<Tenor, Double> yieldsBp) {

    public QuoteMessage {
        if (yieldsBp.isEmpty()) {
            throw new IllegalArgumentException("a quote message needs at least one yield");
        }
        yieldsBp = java.util.Collections.unmodifiableSortedMap(new TreeMap<>(yieldsBp));
    }

    public static QuoteMessage of(String curve, LocalDate date, Map<Tenor, Double> yieldsBp) {
        return new QuoteMessage(null, null, null, curve, date, new TreeMap<>(yieldsBp));
    }
}
