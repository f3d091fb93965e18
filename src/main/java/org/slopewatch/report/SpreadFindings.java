package org.slopewatch.report;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.replay.SpreadReport;

/**
 * The findings a report opens with for one spread: where it stands now and, with recession dates,
 * each peak signalled ahead, late or missed, and the false alarms. Everything is regrouped from
 * what the replay or the journal already gave ({@link SpreadSection}); nothing is measured again.
 *
 * @param stateSince the date the spread entered its final state, or null when it never changed
 *                   state (then it has been in it since {@code firstDate})
 * @param peaks      by peak month; empty without recession dates
 * @param falseAlarms confirmations with no peak within the window
 * @param pending    confirmations whose window reaches past what is known: no verdict yet
 */
public record SpreadFindings(SpreadSection spread, LocalDate stateSince, List<PeakFinding> peaks, List<LeadTime> falseAlarms,
                             List<LeadTime> pending) {

    public SpreadFindings {
        peaks = List.copyOf(peaks);
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
            return new SpreadFindings(s, since, List.of(), List.of(), List.of());
        }
        Map<YearMonth, List<LeadTime>> byPeak = new LinkedHashMap<>();
        List<LeadTime> falseAlarms = new ArrayList<>();
        List<LeadTime> pending = new ArrayList<>();
        for (LeadTime l : s.leads().stream().sorted(Comparator.comparing(LeadTime::confirmed)).toList()) {
            if (l.peak() != null) {
                byPeak.computeIfAbsent(l.peak(), p -> new ArrayList<>()).add(l);
            } else if (l.falseAlarm()) {
                falseAlarms.add(l);
            } else {
                pending.add(l);
            }
        }
        List<PeakFinding> peaks = new ArrayList<>();
        byPeak.forEach((peak, leads) -> {
            LeadTime first = leads.stream().filter(l -> !l.late()).findFirst().orElse(leads.get(0));
            List<LeadTime> later = leads.stream().filter(l -> l != first).toList();
            peaks.add(new PeakFinding(peak, first.late() ? PeakFinding.Outcome.LATE : PeakFinding.Outcome.AHEAD, first, later));
        });
        for (YearMonth m : orEmpty(s.missedPeaks())) {
            peaks.add(new PeakFinding(m, PeakFinding.Outcome.MISSED, null, List.of()));
        }
        for (YearMonth m : orEmpty(s.unassessedPeaks())) {
            peaks.add(new PeakFinding(m, PeakFinding.Outcome.NOT_ASSESSED, null, List.of()));
        }
        peaks.sort(Comparator.comparing(PeakFinding::peak));
        return new SpreadFindings(s, since, peaks, falseAlarms, pending);
    }

    /** Peaks with the given outcome. */
    public List<PeakFinding> peaks(PeakFinding.Outcome outcome) {
        return peaks.stream().filter(p -> p.outcome() == outcome).toList();
    }

    private static List<YearMonth> orEmpty(List<YearMonth> months) {
        return months == null ? List.of() : months;
    }
}
