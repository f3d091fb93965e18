package org.slopewatch.curve;

/**
 * The range of yields, in basis points, that can plausibly be a government yield.
 *
 * <p>The bound exists to catch unit mistakes: 421.5 meant as basis points but sent as percent is
 * 42,150 bp and is rejected, never rescaled by guesswork. The default, −5 % to +30 %, covers
 * every developed-market government yield on record with room to spare.
 */
public record YieldBounds(double minBp, double maxBp) {

    public static final YieldBounds DEFAULT = new YieldBounds(-500.0, 3_000.0);

    public YieldBounds {
        if (!(minBp < maxBp)) {
            throw new IllegalArgumentException("yield bounds must satisfy min < max, got " + minBp + " .. " + maxBp);
        }
    }

    /**
     * Converts a quoted value to basis points and checks it.
     *
     * @throws IllegalArgumentException naming the value and unit if it is not finite or out of range
     */
    public double toBasisPoints(double value, YieldUnit unit) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("yield is not a finite number: " + value);
        }
        double bp = unit.toBasisPoints(value);
        if (bp < minBp || bp > maxBp) {
            throw new IllegalArgumentException("implausible yield " + value + " " + unit.label() + " (= " + bp
                    + " bp; accepted " + minBp + " to " + maxBp + " bp): check the unit");
        }
        return bp;
    }
}
