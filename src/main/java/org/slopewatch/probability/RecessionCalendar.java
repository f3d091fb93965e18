package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.List;

/**
 * A chronology of recessions in time order, without overlaps.
 *
 * <p>The calendar knows nothing about months after its last entry: a month there counts as an
 * expansion. A caller fitting on recent data must make sure the chronology is complete through
 * the months it asks about (the dating committee announces peaks many months late).
 */
public record RecessionCalendar(List<Recession> recessions) {

    public RecessionCalendar {
        recessions = List.copyOf(recessions);
        for (int i = 1; i < recessions.size(); i++) {
            Recession before = recessions.get(i - 1);
            Recession next = recessions.get(i);
            // A new peak can only follow the previous trough; equal months would make one month
            // both the end of a recession and the start of the next expansion's decline.
            if (next.peak().isBefore(before.trough())) {
                throw new IllegalArgumentException("recessions must be in time order without overlap: peak "
                        + next.peak() + " comes before the previous trough " + before.trough());
            }
        }
    }

    /** True when the month lies after some peak and no later than that recession's trough. */
    public boolean inRecession(YearMonth month) {
        for (Recession r : recessions) {
            if (r.contains(month)) {
                return true;
            }
            if (month.isBefore(r.peak())) {
                return false; // later recessions start later still
            }
        }
        return false;
    }
}
