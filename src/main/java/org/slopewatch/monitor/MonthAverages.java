package org.slopewatch.monitor;

import java.time.YearMonth;
import org.slopewatch.curve.Resolution;

/**
 * A spread's calendar-month averages at its latest observation: the month so far, and the month
 * before it, which is complete once the month after it has begun. The probability models are
 * fitted on monthly averages, so these are what they read.
 *
 * @param month             the month of the latest observation, or null before any
 * @param averageBp         that month's average so far, to {@link Resolution#BASIS_POINTS} (NaN without observations)
 * @param previousAverageBp the month before's average (NaN when there are no observations of it)
 */
public record MonthAverages(YearMonth month, double averageBp, int observations, double previousAverageBp, int previousObservations) {

    public static final MonthAverages NONE = new MonthAverages(null, Double.NaN, 0, Double.NaN, 0);

    /** Reads the two latest calendar months off a track's observations (a month or two of them, newest first). */
    static MonthAverages of(SpreadTrack track) {
        int n = track.size();
        if (n == 0) {
            return NONE;
        }
        YearMonth month = YearMonth.from(track.date(n - 1));
        YearMonth previous = month.minusMonths(1);
        // summed in steps of the resolution: exact, so an average on a model's bound is on it
        long sum = 0;
        int count = 0;
        long previousSum = 0;
        int previousCount = 0;
        for (int i = n - 1; i >= 0; i--) {
            YearMonth m = YearMonth.from(track.date(i));
            if (m.equals(month)) {
                sum += Resolution.BASIS_POINTS.units(track.valueBp(i));
                count++;
            } else if (m.equals(previous)) {
                previousSum += Resolution.BASIS_POINTS.units(track.valueBp(i));
                previousCount++;
            } else {
                break;
            }
        }
        return new MonthAverages(month, Resolution.BASIS_POINTS.average(sum, count), count,
                Resolution.BASIS_POINTS.average(previousSum, previousCount), previousCount);
    }
}
