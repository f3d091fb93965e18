package org.slopewatch.cli;

import java.io.PrintWriter;
import java.time.YearMonth;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import org.slopewatch.monitor.Quarter;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.probability.PeakLead;
import org.slopewatch.replay.ReplayReport;
import org.slopewatch.replay.SpreadReport;

/** The replay report as text for people: a summary per spread, confirmed spells, lead times, each peak. */
final class ReplayText {

    private static final String LATE = "late: recession already under way";
    /** The outcome column is padded so that the re-steepening columns line up after the longest outcome. */
    private static final int OUTCOME_WIDTH = LATE.length();
    private static final int TIMING_WIDTH = timing(PeakLead.Timing.AFTER_PEAK).length();

    private final PrintWriter out;
    private final boolean listTransitions;

    ReplayText(PrintWriter out, boolean listTransitions) {
        this.out = out;
        this.listTransitions = listTransitions;
    }

    void print(ReplayReport r) {
        out.printf(Locale.ROOT, "slopewatch replay of %s%n", r.source());
        out.printf(Locale.ROOT, "  %,d rows, %,d quotes, %s to %s%n", r.rows(), r.quotes(), r.firstDate(), r.lastDate());
        for (SpreadReport s : r.spreads()) {
            out.println();
            spread(s, r.falseAlarmWindowMonths());
        }
        out.println();
        out.println(r.caution());
    }

    private void spread(SpreadReport s, Integer window) {
        out.println(s.id());
        out.printf(Locale.ROOT, "  rules      %s%n", s.rules());
        out.printf(Locale.ROOT, "  at end     %s on %s at %+.1f bp (%,d observations)%n", s.finalState(), s.lastDate(),
                s.lastValueBp(), s.observations());
        List<SpreadReport.QuarterRow> below = s.quarters().stream().filter(q -> q.averageBp() < 0).toList();
        out.printf(Locale.ROOT, "  quarters   %d complete, %d averaging below 0 bp%s%n", s.quarters().size(), below.size(),
                below.isEmpty() ? "" : "; runs begin " + String.join(", ", runStarts(below)));
        long confirmed = s.spells().stream().filter(x -> x.confirmed() != null).count();
        String deepest = s.spells().stream().min((a, b) -> Double.compare(a.deepestBp(), b.deepestBp()))
                .map(x -> String.format(Locale.ROOT, ", deepest %.1f bp on %s", x.deepestBp(), x.deepestDate())).orElse("");
        out.printf(Locale.ROOT, "  spells     %d (%d confirmed)%s%n", s.spells().size(), confirmed, deepest);
        if (!s.revisions().isEmpty()) {
            out.printf(Locale.ROOT, "  revisions  %d changed outcomes%n", s.revisions().size());
        }
        if (confirmed > 0) {
            out.println();
            out.println("  confirmed spells");
            out.printf(Locale.ROOT, "    %4s  %-10s  %-10s  %-16s  %-10s  %6s  %9s%n", "#", "start", "confirmed", "by", "ended", "days", "deepest");
            for (SpreadReport.SpellRow x : s.spells()) {
                if (x.confirmed() != null) {
                    out.printf(Locale.ROOT, "    %4d  %-10s  %-10s  %-16s  %-10s  %6d  %9.1f%n", x.id(), x.start(), x.confirmed(),
                            x.confirmedBy(), x.end() == null ? "open" : x.end().toString(), x.durationDays(), x.deepestBp());
                }
            }
        }
        if (listTransitions) {
            out.println();
            out.println("  transitions");
            for (SpreadReport.TransitionRow t : s.transitions()) {
                out.printf(Locale.ROOT, "    %s  %-12s -> %-12s  %s%n", t.date(), t.from(), t.to(), t.reason());
            }
        }
        if (s.leads() != null) {
            leads(s, window);
        }
    }

    private void leads(SpreadReport s, Integer window) {
        out.println();
        out.printf(Locale.ROOT, "  lead to the next business-cycle peak (false alarm: no peak within %d months)%n", window);
        out.println("  months: from the confirmation, and from the re-steepening, to that peak (negative: after it)");
        out.printf(Locale.ROOT, "    %-10s  %-7s  %6s  %-" + OUTCOME_WIDTH + "s  %-12s  %6s%n", "confirmed", "peak", "months", "outcome",
                "re-steepened", "months");
        for (LeadTime l : s.leads()) {
            String outcome = l.late() ? LATE : l.outcome();
            out.printf(Locale.ROOT, "    %-10s  %-7s  %6s  %-" + OUTCOME_WIDTH + "s  %-12s  %6s%n", l.confirmed(),
                    l.peak() == null ? "-" : l.peak().toString(), orDash(l.months()), outcome,
                    l.resteepened() == null ? "not yet" : l.resteepened().toString(), orDash(l.monthsFromResteepening()));
        }
        // a confirmation before a peak is not a hit of its own: peaks are counted once, below
        long before = s.leads().stream().filter(l -> l.peak() != null && !l.late()).count();
        long late = s.leads().stream().filter(LeadTime::late).count();
        long falseAlarms = s.leads().stream().filter(LeadTime::falseAlarm).count();
        long pending = s.leads().stream().filter(LeadTime::pending).count();
        out.printf(Locale.ROOT, "    confirmations %d: %d before a peak, %d late, %d false %s%s%n", s.leads().size(), before, late, falseAlarms,
                falseAlarms == 1 ? "alarm" : "alarms", pending == 0 ? "" : ", " + pending + " pending");
        peaks(s, window);
    }

    /** One row per peak, from the report's per-peak outcomes: nothing is counted here. */
    private void peaks(SpreadReport s, Integer window) {
        out.println();
        out.println("  each business-cycle peak, signalled by its first confirmation (later ones are named, not counted)");
        out.println("  signal came: before the peak, after it but before the peak was announced, or after both");
        out.printf(Locale.ROOT, "    %-7s  %-7s  %-10s  %6s  %-10s  %-" + TIMING_WIDTH + "s  %s%n", "peak", "outcome", "first", "months", "announced",
                "signal came", "later confirmations");
        for (PeakLead p : s.peaks()) {
            out.printf(Locale.ROOT, "    %-7s  %-7s  %-10s  %6s  %-10s  %-" + TIMING_WIDTH + "s  %s%n", p.peak(), outcome(p.outcome()),
                    p.firstConfirmed() == null ? "-" : p.firstConfirmed().toString(), orDash(p.months()),
                    p.announced() == null ? "-" : p.announced().toString(), timing(p.timing()), later(p.laterConfirmations()));
        }
        long ahead = s.peaks().stream().filter(p -> p.outcome() == PeakLead.Outcome.AHEAD).count();
        long late = s.peaks().stream().filter(p -> p.outcome() == PeakLead.Outcome.LATE).count();
        long missed = s.peaks().stream().filter(p -> p.outcome() == PeakLead.Outcome.MISSED).count();
        out.printf(Locale.ROOT, "    peaks %d assessed: %d signalled ahead, %d late, %d missed%n", s.peaks().size(), ahead, late, missed);
        if (!s.unassessedPeaks().isEmpty()) {
            out.printf(Locale.ROOT, "    not assessed (data starts less than %d months before): %s%n", window, months(s.unassessedPeaks()));
        }
    }

    private static String outcome(PeakLead.Outcome o) {
        return switch (o) {
            case AHEAD -> "ahead";
            case LATE -> "late";
            case MISSED -> "missed";
        };
    }

    static String timing(PeakLead.Timing t) {
        if (t == null) {
            return "-";
        }
        return switch (t) {
            case BEFORE_PEAK -> "before the peak";
            case BEFORE_ANNOUNCEMENT -> "before the announcement";
            case AFTER_BOTH -> "after both";
            case AFTER_PEAK -> "after the peak (no announcement date)";
        };
    }

    private static String later(List<PeakLead.LaterConfirmation> later) {
        return later.isEmpty() ? "none" : later.stream()
                .map(l -> l.confirmed() + " (" + months(Math.abs(l.months())) + (l.months() >= 0 ? " before)" : " after)"))
                .collect(Collectors.joining(", "));
    }

    private static String months(int n) {
        return n + (n == 1 ? " month" : " months");
    }

    private static String orDash(Integer months) {
        return months == null ? "-" : months.toString();
    }

    private static String months(List<YearMonth> months) {
        return months.isEmpty() ? "none" : months.stream().map(YearMonth::toString).collect(Collectors.joining(", "));
    }

    /** The first quarter of each run of consecutive quarters in the list. */
    static List<String> runStarts(List<SpreadReport.QuarterRow> quarters) {
        List<String> starts = new ArrayList<>();
        int previous = Integer.MIN_VALUE;
        for (SpreadReport.QuarterRow q : quarters) {
            int index = Quarter.parse(q.quarter()).index();
            if (index != previous + 1) {
                starts.add(q.quarter());
            }
            previous = index;
        }
        return starts;
    }
}
