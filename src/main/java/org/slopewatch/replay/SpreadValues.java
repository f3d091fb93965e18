package org.slopewatch.replay;

import java.time.LocalDate;

/**
 * The standing value of one spread on each date of a replay, oldest first, in basis points: what
 * a chart of the replay plots. Held as two primitive arrays because a long daily history has
 * millions of dates; copied out of the engine, so a reader cannot disturb it.
 */
public final class SpreadValues {

    private final String spreadId;
    private final int[] epochDays;
    private final double[] valuesBp;

    SpreadValues(String spreadId, int[] epochDays, double[] valuesBp) {
        if (epochDays.length != valuesBp.length) {
            throw new IllegalArgumentException("dates and values differ in length");
        }
        this.spreadId = spreadId;
        this.epochDays = epochDays;
        this.valuesBp = valuesBp;
    }

    /** The spread's id, {@code CURVE:SPREAD}. */
    public String spreadId() {
        return spreadId;
    }

    public int size() {
        return epochDays.length;
    }

    public LocalDate date(int index) {
        return LocalDate.ofEpochDay(epochDays[index]);
    }

    public double valueBp(int index) {
        return valuesBp[index];
    }
}
