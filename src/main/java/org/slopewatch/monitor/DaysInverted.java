package org.slopewatch.monitor;

/**
 * Continuously below the entry threshold for at least {@code days} calendar days, counted from
 * the first observation of the run. Calendar days make daily and monthly data comparable.
 */
public record DaysInverted(int days) implements PersistenceTest {

    public static final String NAME = "days-inverted";

    public DaysInverted {
        if (days < 1) {
            throw new IllegalArgumentException("days-inverted needs at least 1 day, got " + days);
        }
    }

    @Override
    public String name() {
        return NAME;
    }

    @Override
    public String describe() {
        return NAME + " >= " + days + " d";
    }
}
