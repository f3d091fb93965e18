package org.slopewatch.spread;

import java.util.Objects;
import org.slopewatch.text.Excerpt;

/**
 * One watched series: a spread on a curve. {@link #id()} is its stable identifier in reports,
 * the journal and URLs ({@code GOVT-A:10Y-3M}).
 */
public record SpreadKey(String curve, String spread) {

    public SpreadKey {
        Objects.requireNonNull(curve, "curve");
        Objects.requireNonNull(spread, "spread");
    }

    public String id() {
        return curve + ":" + spread;
    }

    /** Parses an id written by {@link #id()}. */
    public static SpreadKey parse(String id) {
        int colon = id.lastIndexOf(':');
        if (colon <= 0 || colon == id.length() - 1) {
            throw new IllegalArgumentException("spread id must be CURVE:SPREAD, got " + Excerpt.quoted(id));
        }
        return new SpreadKey(id.substring(0, colon), id.substring(colon + 1));
    }

    /** The form used in log lines and reasons: {@code GOVT-A 10Y-3M}. */
    @Override
    public String toString() {
        return curve + " " + spread;
    }
}
