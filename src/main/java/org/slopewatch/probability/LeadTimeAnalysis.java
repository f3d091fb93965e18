package org.slopewatch.probability;

import java.time.LocalDate;
import java.time.YearMonth;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * Measures confirmations against recession dates: the lead from each confirmation to the next
 * peak, false alarms (no peak within the window), late signals (confirmed after a peak, by its
 * trough) and missed recessions (a peak with no confirmation in the window before it); then, per
 * peak, the outcome its first confirmation gives ({@link PeakLead}).
 *
 * <p>For each confirmed spell that has re-steepened it also gives the months from the
 * re-steepening to the same peak. That peak is the one the confirmation is measured against, not
 * the first peak after the re-steepening: a spread that re-steepens during the recession would
 * otherwise be credited with the next cycle's peak, years away.
 *
 * <p>Months are counted between calendar months, so a confirmation on 1959-10-01 leads a
 * 1960-04 peak by 6 months.
 */
public final class LeadTimeAnalysis {

    /** The usual window: a confirmation with no peak within two years is a false alarm. */
    public static final int DEFAULT_WINDOW_MONTHS = 24;

    private final List<Recession> recessions;
    private final int windowMonths;

    public LeadTimeAnalysis(List<Recession> recessions, int windowMonths) {
        if (windowMonths < 1) {
            throw new IllegalArgumentException("the false-alarm window must be at least 1 month, got " + windowMonths);
        }
        this.recessions = recessions.stream().sorted(Comparator.comparing(Recession::peak)).toList();
        this.windowMonths = windowMonths;
    }

    public int windowMonths() {
        return windowMonths;
    }

    /**
     * @param confirmations confirmed spells in any order
     * @param dataStart     the first date of the data the confirmations came from
     * @param dataEnd       the last date of that data
     */
    public LeadTimeReport analyse(List<Confirmation> confirmations, LocalDate dataStart, LocalDate dataEnd) {
        List<LeadTime> leads = new ArrayList<>();
        Set<YearMonth> signalled = new HashSet<>();
        for (Confirmation c : confirmations.stream().sorted(Comparator.comparing(Confirmation::confirmed)).toList()) {
            LeadTime lead = lead(c, YearMonth.from(dataEnd));
            leads.add(lead);
            if (lead.peak() != null) {
                signalled.add(lead.peak());
            }
        }
        YearMonth start = YearMonth.from(dataStart);
        YearMonth end = YearMonth.from(dataEnd);
        List<YearMonth> missed = new ArrayList<>();
        List<YearMonth> unassessed = new ArrayList<>();
        for (Recession r : recessions) {
            YearMonth peak = r.peak();
            if (peak.isBefore(start) || peak.isAfter(end) || signalled.contains(peak)) {
                continue;
            }
            if (peak.minusMonths(windowMonths).isBefore(start)) {
                unassessed.add(peak);
            } else {
                missed.add(peak);
            }
        }
        return new LeadTimeReport(windowMonths, leads, PeakLeads.of(leads, missed, recessions), missed, unassessed);
    }

    private static YearMonth max(YearMonth a, YearMonth b) {
        return a.isAfter(b) ? a : b;
    }

    private LeadTime lead(Confirmation c, YearMonth lastMonth) {
        LocalDate confirmed = c.confirmed();
        YearMonth month = YearMonth.from(confirmed);
        for (Recession r : recessions) {
            if (r.contains(month)) {
                int months = (int) ChronoUnit.MONTHS.between(r.peak(), month);
                return new LeadTime(confirmed, c.resteepened(), r.peak(), -months, fromResteepening(c, r.peak()), false, true, false);
            }
        }
        for (Recession r : recessions) {
            if (!r.peak().isBefore(month)) {
                int months = (int) ChronoUnit.MONTHS.between(month, r.peak());
                if (months <= windowMonths) {
                    return new LeadTime(confirmed, c.resteepened(), r.peak(), months, fromResteepening(c, r.peak()), false, false, false);
                }
                break;
            }
        }
        // the chronology is known through its last trough; past that and past the data, nobody knows yet
        YearMonth knownUntil = recessions.isEmpty() ? lastMonth
                : max(lastMonth, recessions.get(recessions.size() - 1).trough());
        boolean pending = month.plusMonths(windowMonths).isAfter(knownUntil);
        return new LeadTime(confirmed, c.resteepened(), null, null, null, !pending, false, pending);
    }

    private static Integer fromResteepening(Confirmation c, YearMonth peak) {
        return c.resteepened() == null ? null : (int) ChronoUnit.MONTHS.between(YearMonth.from(c.resteepened()), peak);
    }
}
