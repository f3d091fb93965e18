package org.slopewatch.probability;

import java.time.LocalDate;
import java.time.YearMonth;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Regroups the lead times, one per confirmation, into one {@link PeakLead} per peak. This is the one
 * place a peak's outcome is decided; the text, JSON and HTML reports only show it.
 */
final class PeakLeads {

    private PeakLeads() {
    }

    /**
     * @param leads      one per confirmation, in date order
     * @param missed     peaks with a whole window of data before them and no confirmation
     * @param recessions the chronology, for each peak's announcement date
     * @return one entry per peak that has a confirmation or was missed, in peak order
     */
    static List<PeakLead> of(List<LeadTime> leads, List<YearMonth> missed, List<Recession> recessions) {
        Map<YearMonth, LocalDate> announced = new LinkedHashMap<>();
        recessions.forEach(r -> announced.put(r.peak(), r.peakAnnounced()));
        Map<YearMonth, List<LeadTime>> byPeak = new LinkedHashMap<>();
        for (LeadTime l : leads) {
            if (l.peak() != null) {
                byPeak.computeIfAbsent(l.peak(), p -> new ArrayList<>()).add(l);
            }
        }
        List<PeakLead> out = new ArrayList<>();
        byPeak.forEach((peak, confirmations) -> out.add(signalled(peak, confirmations, announced.get(peak))));
        for (YearMonth peak : missed) {
            out.add(new PeakLead(peak, PeakLead.Outcome.MISSED, null, null, List.of(), announced.get(peak), null, null));
        }
        out.sort(Comparator.comparing(PeakLead::peak));
        return out;
    }

    /**
     * The first confirmation decides: confirmations before a peak always come before those during
     * its recession, so the first is ahead whenever any is.
     */
    private static PeakLead signalled(YearMonth peak, List<LeadTime> confirmations, LocalDate announced) {
        LeadTime first = confirmations.get(0);
        List<PeakLead.LaterConfirmation> later = confirmations.subList(1, confirmations.size()).stream()
                .map(l -> new PeakLead.LaterConfirmation(l.confirmed(), l.months())).toList();
        PeakLead.Outcome outcome = first.late() ? PeakLead.Outcome.LATE : PeakLead.Outcome.AHEAD;
        PeakLead.Timing timing;
        if (outcome == PeakLead.Outcome.AHEAD) {
            timing = PeakLead.Timing.BEFORE_PEAK;
        } else if (announced == null) {
            timing = PeakLead.Timing.AFTER_PEAK;
        } else {
            timing = first.confirmed().isBefore(announced) ? PeakLead.Timing.BEFORE_ANNOUNCEMENT : PeakLead.Timing.AFTER_BOTH;
        }
        Integer beforeAnnouncement = announced == null ? null
                : (int) ChronoUnit.MONTHS.between(YearMonth.from(first.confirmed()), YearMonth.from(announced));
        return new PeakLead(peak, outcome, first.confirmed(), first.months(), later, announced, timing, beforeAnnouncement);
    }
}
