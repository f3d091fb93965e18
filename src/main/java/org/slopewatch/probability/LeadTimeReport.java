package org.slopewatch.probability;

import java.time.YearMonth;
import java.util.List;

/**
 * Confirmations against business-cycle peaks.
 *
 * @param leads            one per confirmation, in date order
 * @param peaks            one per assessed peak (signalled ahead, late or missed), in peak order
 * @param missedPeaks      peaks with a whole window of data before them and no confirmation in
 *                         it, nor during the recession
 * @param unassessedPeaks  peaks inside the data whose window starts before the data does
 */
public record LeadTimeReport(int windowMonths, List<LeadTime> leads, List<PeakLead> peaks, List<YearMonth> missedPeaks,
                             List<YearMonth> unassessedPeaks) {

    public LeadTimeReport {
        leads = List.copyOf(leads);
        peaks = List.copyOf(peaks);
        missedPeaks = List.copyOf(missedPeaks);
        unassessedPeaks = List.copyOf(unassessedPeaks);
    }
}
