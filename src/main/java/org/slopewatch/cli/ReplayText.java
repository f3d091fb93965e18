package org.slopewatch.cli;

import java.io.PrintWriter;
import java.time.YearMonth;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import org.slopewatch.monitor.Quarter;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.replay.ReplayReport;
import org.slopewatch.replay.SpreadReport;

/** The replay report as text for people: a summary per spread, confirmed spells, lead times. */
final class ReplayText {

    private static final String LATE = "late: recession already under way";
    /** The outcome column is padded so that the re-steepening columns line up after the longest outcome. */
    private static final int OUTCOME_WIDTH = LATE.length();

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
        long hits = s.leads().stream().filter(l -> l.outcome().equals("hit")).count();
        long late = s.leads().stream().filter(LeadTime::late).count();
        long falseAlarms = s.leads().stream().filter(LeadTime::falseAlarm).count();
        out.printf(Locale.ROOT, "    hits %d, late %d, false alarms %d; missed peaks: %s%n", hits, late, falseAlarms, months(s.missedPeaks()));
        if (!s.unassessedPeaks().isEmpty()) {
            out.printf(Locale.ROOT, "    not assessed (data starts less than %d months before): %s%n", window, months(s.unassessedPeaks()));
        }
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
