package org.slopewatch.report;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.List;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.probability.PeakLead;
import org.slopewatch.replay.SpreadReport;

/**
 * The findings a report opens with for one spread: where it stands now and, with recession dates,
 * each peak signalled ahead, late or missed, and the false alarms. Everything is taken from what
 * the replay or the journal already gave ({@link SpreadSection}): the peaks as the lead-time
 * analysis decided them ({@link PeakLead}), nothing regrouped or measured again.
 *
 * @param stateSince  the date the spread entered its final state, or null when it never changed
 *                    state (then it has been in it since {@code firstDate})
 * @param peaks       one per assessed peak, in peak order; empty without recession dates
 * @param notAssessed peaks inside the data whose window starts before the data do
 * @param falseAlarms confirmations with no peak within the window
 * @param pending     confirmations whose window reaches past what is known: no verdict yet
 */
public record SpreadFindings(SpreadSection spread, LocalDate stateSince, List<PeakLead> peaks, List<YearMonth> notAssessed,
                             List<LeadTime> falseAlarms, List<LeadTime> pending) {

    public SpreadFindings {
        peaks = List.copyOf(peaks);
        notAssessed = List.copyOf(notAssessed);
        falseAlarms = List.copyOf(falseAlarms);
        pending = List.copyOf(pending);
    }

    public static SpreadFindings of(SpreadSection s) {
        LocalDate since = null;
        for (SpreadReport.TransitionRow t : s.transitions()) {
            if (t.to().equals(s.finalState())) {
                since = t.date(); // the last move into the final state
            }
        }
        if (s.leads() == null) {
            return new SpreadFindings(s, since, List.of(), List.of(), List.of(), List.of());
        }
        return new SpreadFindings(s, since, orEmpty(s.peaks()), orEmpty(s.unassessedPeaks()),
                s.leads().stream().filter(LeadTime::falseAlarm).toList(), s.leads().stream().filter(LeadTime::pending).toList());
    }

    /** Peaks with the given outcome. */
    public List<PeakLead> peaks(PeakLead.Outcome outcome) {
        return peaks.stream().filter(p -> p.outcome() == outcome).toList();
    }

    private static <T> List<T> orEmpty(List<T> list) {
        return list == null ? List.of() : list;
    }
}
