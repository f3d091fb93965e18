package org.slopewatch.report;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.List;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.probability.PeakLead;
import org.slopewatch.replay.SpreadReport;

/**
 * One spread's part of a report.
 *
 * @param rules        the monitor's rules in one line, or a note that none are known
 * @param observations values the monitor saw; {@code points} may hold fewer (see {@link ChartPoints})
 * @param leads        one per confirmation, or null without recession dates
 * @param peaks        one per assessed peak, as the lead-time analysis decided it, or null without recession dates
 * @param missedPeaks  null without recession dates
 * @param probability  the recession probability at the end, or null when no model covers the spread
 */
public record SpreadSection(String id, String curve, String spread, String rules, String finalState, LocalDate lastDate,
                            Double lastValueBp, long observations, List<ChartPoint> points, List<SpellBand> spells,
                            List<SpreadReport.TransitionRow> transitions, List<LeadTime> leads, List<PeakLead> peaks, List<YearMonth> missedPeaks,
                            List<YearMonth> unassessedPeaks, SpreadProbability probability) {

    public SpreadSection {
        points = List.copyOf(points);
        spells = List.copyOf(spells);
        transitions = List.copyOf(transitions);
        leads = leads == null ? null : List.copyOf(leads);
        peaks = peaks == null ? null : List.copyOf(peaks);
        missedPeaks = missedPeaks == null ? null : List.copyOf(missedPeaks);
        unassessedPeaks = unassessedPeaks == null ? null : List.copyOf(unassessedPeaks);
    }

    public LocalDate firstDate() {
        return points.isEmpty() ? null : points.get(0).date();
    }

    public LocalDate lastPlottedDate() {
        return points.isEmpty() ? null : points.get(points.size() - 1).date();
    }
}
