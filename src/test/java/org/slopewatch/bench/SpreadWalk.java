package org.slopewatch.bench;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.util.Random;

/**
 * A synthetic daily term spread in basis points: a mean-reverting random walk that spends most of
 * its time above zero and inverts now and then for weeks to years, like 10Y-3M has. Deterministic
 * for a seed. Business days are Monday to Friday (no holidays: they would not change the cost).
 */
final class SpreadWalk {

    static final double MEAN_BP = 120;
    /** Pull towards the mean per day; the half-life of a deviation is ln 2 / 0.002, about 350 business days. */
    static final double REVERSION = 0.002;
    /** Standard deviation of a daily step; with the reversion the spread's own spread is about 79 bp. */
    static final double STEP_BP = 5;
    static final double LOW_BP = -400;
    static final double HIGH_BP = 500;

    private final Random random;
    private double valueBp = MEAN_BP;

    SpreadWalk(long seed) {
        this.random = new Random(seed);
    }

    /** The next day's value, kept inside [-400, 500] bp by reflection. */
    double next() {
        double v = valueBp + REVERSION * (MEAN_BP - valueBp) + STEP_BP * random.nextGaussian();
        if (v < LOW_BP) {
            v = 2 * LOW_BP - v;
        } else if (v > HIGH_BP) {
            v = 2 * HIGH_BP - v;
        }
        valueBp = v;
        return v;
    }

    /** The business day after {@code date}. */
    static LocalDate nextBusinessDay(LocalDate date) {
        LocalDate d = date.plusDays(1);
        while (!isBusinessDay(d)) {
            d = d.plusDays(1);
        }
        return d;
    }

    /** Monday to Friday. */
    static boolean isBusinessDay(LocalDate date) {
        return date.getDayOfWeek() != DayOfWeek.SATURDAY && date.getDayOfWeek() != DayOfWeek.SUNDAY;
    }
}
