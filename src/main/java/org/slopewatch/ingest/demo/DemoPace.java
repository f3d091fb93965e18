package org.slopewatch.ingest.demo;

import java.time.Duration;

/**
 * How fast the demo feed plays its market days on the wall clock: the scripted cycle at one pace,
 * the days after it at another. Slow enough that each state of the cycle, a confirmed inversion
 * above all, stays on the dashboard long enough for a person to look at it.
 *
 * @param fastDays           how many days, from the first, belong to the scripted cycle
 * @param fastDaysPerSecond  market days a second during the cycle
 * @param laterDaysPerSecond market days a second after it
 */
public record DemoPace(int fastDays, double fastDaysPerSecond, double laterDaysPerSecond) {

    public DemoPace {
        if (fastDays < 0) {
            throw new IllegalArgumentException("the scripted cycle cannot have fewer than 0 days, got " + fastDays);
        }
        if (!(fastDaysPerSecond > 0) || !(laterDaysPerSecond > 0) || Double.isInfinite(fastDaysPerSecond)
                || Double.isInfinite(laterDaysPerSecond)) {
            throw new IllegalArgumentException("demo days per second must be positive and finite, got " + fastDaysPerSecond + " and "
                    + laterDaysPerSecond);
        }
    }

    public static DemoPace of(DemoConfig config) {
        return new DemoPace(config.fastDays(), config.fastDaysPerSecond(), config.laterDaysPerSecond());
    }

    /** The wall time to wait before sending the day with this index (the start date is 0). */
    public Duration before(long index) {
        double perSecond = index < fastDays ? fastDaysPerSecond : laterDaysPerSecond;
        return Duration.ofNanos(Math.round(1e9 / perSecond));
    }

    /**
     * How long the state reached on day {@code from} stays on screen when the next change comes
     * on day {@code to}: from sending the one to sending the other.
     */
    public Duration between(long from, long to) {
        Duration total = Duration.ZERO;
        for (long i = from + 1; i <= to; i++) {
            total = total.plus(before(i));
        }
        return total;
    }
}
