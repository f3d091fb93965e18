package org.slopewatch.probability;

import java.time.LocalDate;
import java.time.YearMonth;

/**
 * How one confirmed inversion related to the business cycle.
 *
 * @param resteepened            the date the spread re-steepened (the spell ended, RESTEEPENING),
 *                               or null while it was still inverted at the end of the data
 * @param peak                   the peak it is measured against: the next peak within the window, the
 *                               peak of a recession already under way (late), or null (false alarm or
 *                               pending)
 * @param months                 months from the confirmation's month to the peak (negative when late),
 *                               or null
 * @param monthsFromResteepening months from the re-steepening's month to the same peak, negative when
 *                               the spread re-steepened after the peak; null without a peak or a
 *                               re-steepening
 * @param falseAlarm             no peak followed within the window
 * @param late                   the confirmation came after the peak, by the trough: a recession under way
 * @param pending                no peak known yet, and the window reaches past the end of the data
 */
public record LeadTime(LocalDate confirmed, LocalDate resteepened, YearMonth peak, Integer months,
                       Integer monthsFromResteepening, boolean falseAlarm, boolean late, boolean pending) {

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
