package org.slopewatch.curve;

import java.util.Locale;
import org.slopewatch.text.Excerpt;

/**
 * How a yield was quoted. Everything inside the engine is in basis points, so that yields and
 * spreads share one unit and no conversion hides in the middle of a computation.
 */
public enum YieldUnit {
    PERCENT("percent", 100.0),
    BASIS_POINTS("bp", 1.0),
    DECIMAL("decimal", 10_000.0);

    private final String label;
    private final double basisPointsPerUnit;

    YieldUnit(String label, double basisPointsPerUnit) {
        this.label = label;
        this.basisPointsPerUnit = basisPointsPerUnit;
    }

    public double toBasisPoints(double value) {
        return value * basisPointsPerUnit;
    }

    public String label() {
        return label;
    }

    /** Parses {@code percent}, {@code bp} or {@code decimal} (case-insensitive). */
    public static YieldUnit parse(String text) {
        String key = text == null ? "" : text.strip().toLowerCase(Locale.ROOT);
        for (YieldUnit unit : values()) {
            if (unit.label.equals(key)) {
                return unit;
            }
        }
        throw new IllegalArgumentException("unknown yield unit " + Excerpt.quoted(text) + " (accepted: percent, bp, decimal)");
    }
}
