package org.slopewatch.monitor;

/**
 * A rule that turns an inversion into a confirmed one. A spread may combine several; the first
 * that holds confirms the spell and is named in the evidence.
 */
public sealed interface PersistenceTest permits QuarterAverage, DaysInverted, RollingAverage, ShareInverted {

    /** The name used in policy files, evidence and reports, e.g. {@code quarter-average}. */
    String name();

    /** Trailing window in calendar days for windowed tests, or 0. */
    default int windowDays() {
        return 0;
    }

    /** The test in a few words, e.g. {@code quarter-average < 0 bp}. */
    String describe();

    /** A threshold as written: whole numbers without decimals. */
    static String number(double v) {
        return v == Math.rint(v) ? String.valueOf((long) v) : String.valueOf(v);
    }
}
