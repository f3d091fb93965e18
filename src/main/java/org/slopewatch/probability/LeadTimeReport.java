package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.List;

/**
 * Confirmations against business-cycle peaks.
 *
 * @param missedPeaks      peaks with a whole window of data before them and no confirmation in
 *                         it, nor during the recession
 * @param unassessedPeaks  peaks inside the data whose window starts before the data does
 */
public record LeadTimeReport(int windowMonths, List<LeadTime> leads, List<YearMonth> missedPeaks,
                             List<YearMonth> unassessedPeaks) {

    public LeadTimeReport {
        leads = List.copyOf(leads);
        missedPeaks = List.copyOf(missedPeaks);
        unassessedPeaks = List.copyOf(unassessedPeaks);
    }
}
