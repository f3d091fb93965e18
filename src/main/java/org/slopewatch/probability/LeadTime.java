package org.slopewatch.probability;

import java.time.LocalDate;
import java.time.YearMonth;

/**
 * How one confirmed inversion related to the business cycle.
 *
 * @param peak       the peak it is measured against: the next peak within the window, the peak
 *                   of a recession already under way (late), or null (false alarm or pending)
 * @param months     months from the confirmation's month to the peak (negative when late), or null
 * @param falseAlarm no peak followed within the window
 * @param late       the confirmation came after the peak, by the trough: a recession under way
 * @param pending    no peak known yet, and the window reaches past the end of the data
 */
public record LeadTime(LocalDate confirmed, YearMonth peak, Integer months, boolean falseAlarm, boolean late,
                       boolean pending) {

    public String outcome() {
        if (late) {
            return "late";
        }
        if (falseAlarm) {
            return "false alarm";
        }
        return pending ? "pending" : "hit";
    }
}
