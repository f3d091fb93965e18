package org.slopewatch.monitor;

import org.slopewatch.curve.Resolution;

/**
 * At least {@code share} (0 &lt; share ≤ 1) of the observations in a trailing window of calendar
 * days are below the entry threshold. Evaluated only once a whole window of history is seen.
 */
public record ShareInverted(int windowDays, double share) implements PersistenceTest {

    public static final String NAME = "share-inverted";

    public ShareInverted {
        if (windowDays < 1) {
            throw new IllegalArgumentException("share-inverted window must be at least 1 day, got " + windowDays);
        }
        // compared at the resolution of probabilities, so it must be one there too
        if (!(share > 0 && share <= 1) || Resolution.PROBABILITY.round(share) == 0) {
            throw new IllegalArgumentException("share-inverted share must be in (0, 1], got " + share);
        }
        share = Resolution.PROBABILITY.round(share);
    }

    @Override
    public String name() {
        return NAME;
    }

    @Override
    public String describe() {
        return NAME + "(" + windowDays + " d) >= " + PersistenceTest.number(share);
    }
}
