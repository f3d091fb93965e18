package org.slopewatch.report;

import static org.slopewatch.report.Cells.date;
import static org.slopewatch.report.Cells.esc;
import static org.slopewatch.report.Cells.num;
import static org.slopewatch.report.Cells.td;
import static org.slopewatch.report.Cells.th;

import java.util.IntSummaryStatistics;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.probability.LiveProbability;
import org.slopewatch.probability.ProbabilityText;

/**
 * The section a report opens with: per spread, where it stands now (state, value, since when,
 * the recession probability when a model covers it) and, with recession dates, each peak
 * signalled ahead, late or missed, and the false alarms. The detail behind each line follows
 * further down the page.
 */
final class FindingsHtml {

    private final StringBuilder out;
    private final Integer window;

    private FindingsHtml(StringBuilder out, Integer window) {
        this.out = out;
        this.window = window;
    }

    static void write(StringBuilder out, ReportDocument doc) {
        new FindingsHtml(out, doc.falseAlarmWindowMonths()).section(doc);
    }

    private void section(ReportDocument doc) {
        out.append("<section class=\"findings\" aria-labelledby=\"findings\">\n<h2 id=\"findings\">Findings</h2>\n");
        if (doc.recessions() == null) {
            out.append("<p class=\"scope\">No business-cycle dates were given, so no peak is assessed.</p>\n");
        } else {
            out.append("<p class=\"scope\">Measured against the business-cycle peaks in <code>").append(esc(doc.recessions().source()))
                    .append("</code>. A peak counts as signalled by the first confirmation before it; a confirmation with no peak within ")
                    .append(window).append(" months is a false alarm.</p>\n");
        }
        int index = 0;
        for (SpreadSection s : doc.spreads()) {
            spread(SpreadFindings.of(s), ++index);
        }
        out.append("</section>\n");
    }

    private void spread(SpreadFindings f, int index) {
        SpreadSection s = f.spread();
        out.append("<div class=\"spread-findings\" data-spread=\"").append(esc(s.id())).append("\">\n<h3><a href=\"#spread-")
                .append(index).append("\">").append(esc(s.id())).append("</a></h3>\n<dl class=\"facts now\">\n");
        fact("Now", "state-now", now(f));
        if (s.probability() != null) {
            LiveProbability complete = s.probability().completeMonth();
            LiveProbability toDate = s.probability().monthToDate();
            if (complete != null) {
                fact("Recession probability", "probability final", esc(ProbabilityText.sentence(s.spread(), complete)));
            }
            if (toDate != null) {
                fact(complete == null ? "Recession probability (provisional)" : "Month to date (provisional)", "probability provisional",
                        esc(ProbabilityText.sentence(s.spread(), toDate)));
            }
        }
        if (s.leads() != null) {
            fact("Peaks", "peak-summary", esc(peakSummary(f)));
            fact("False alarms", "false-alarms", f.falseAlarms().isEmpty() ? "none"
                    : f.falseAlarms().size() + ": " + f.falseAlarms().stream().map(FindingsHtml::falseAlarm).collect(Collectors.joining("; ")));
            if (!f.pending().isEmpty()) {
                fact("No verdict yet", "pending", esc(f.pending().stream().map(l -> "confirmed " + l.confirmed())
                        .collect(Collectors.joining("; ")) + ": no peak dated within " + window + " months so far, and the window "
                        + "reaches past the dates known"));
            }
        }
        out.append("</dl>\n");
        if (s.leads() != null) {
            peaks(f);
        }
        out.append("</div>\n");
    }

    private static String now(SpreadFindings f) {
        SpreadSection s = f.spread();
        if (s.lastDate() == null) {
            return "<span class=\"none\">no value</span>";
        }
        StringBuilder b = new StringBuilder("<strong>").append(esc(s.finalState())).append("</strong> since ")
                .append(f.stateSince() == null ? "the data begin, <span class=\"date\">" + s.firstDate() + "</span>"
                        : "<span class=\"date\">" + f.stateSince() + "</span>");
        if (s.lastValueBp() != null) {
            b.append(String.format(Locale.ROOT, "; %+.1f bp", s.lastValueBp()));
        }
        b.append(" on <span class=\"date\">").append(s.lastDate()).append("</span>");
        s.spells().stream().filter(x -> x.end() == null).findFirst().ifPresent(open -> b.append("; inverted spell open since <span class=\"date\">")
                .append(open.start()).append("</span>").append(open.confirmed() == null ? ", not confirmed" : ", confirmed " + open.confirmed()));
        return b.toString();
    }

    private static String peakSummary(SpreadFindings f) {
        List<PeakFinding> ahead = f.peaks(PeakFinding.Outcome.AHEAD);
        int late = f.peaks(PeakFinding.Outcome.LATE).size();
        int missed = f.peaks(PeakFinding.Outcome.MISSED).size();
        int assessed = ahead.size() + late + missed;
        StringBuilder b = new StringBuilder();
        if (assessed == 0) {
            b.append("no peak inside the data could be assessed");
        } else {
            b.append(ahead.size()).append(" of ").append(assessed).append(assessed == 1 ? " assessed peak" : " assessed peaks")
                    .append(" signalled ahead");
            if (!ahead.isEmpty()) {
                IntSummaryStatistics months = ahead.stream().mapToInt(p -> p.first().months()).summaryStatistics();
                b.append(months.getMin() == months.getMax() ? " (" + months(months.getMin()) + " before)"
                        : " (" + months.getMin() + " to " + months(months.getMax()) + " before)");
            }
            b.append("; ").append(late).append(" late; ").append(missed == 0 ? "none" : Integer.toString(missed)).append(" missed");
        }
        List<PeakFinding> unassessed = f.peaks(PeakFinding.Outcome.NOT_ASSESSED);
        if (!unassessed.isEmpty()) {
            b.append(". Not assessed: ").append(unassessed.stream().map(p -> p.peak().toString()).collect(Collectors.joining(", ")));
        }
        return b.append('.').toString();
    }

    private static String falseAlarm(LeadTime l) {
        return "confirmed <span class=\"date\">" + l.confirmed() + "</span>" + (l.resteepened() == null ? ", still inverted"
                : ", re-steepened <span class=\"date\">" + l.resteepened() + "</span>");
    }

    private void peaks(SpreadFindings f) {
        SpreadSection s = f.spread();
        out.append("<div class=\"table-wrap\"><table class=\"peaks\">\n<caption>Each business-cycle peak in the data of ").append(esc(s.id()))
                .append(": the first confirmation before it, or why there is none</caption>\n<thead><tr>").append(th("Peak"))
                .append(th("Finding")).append(th("First confirmation")).append(th("Months before the peak", true))
                .append(th("Other confirmations of this peak")).append("</tr></thead>\n<tbody>\n");
        for (PeakFinding p : f.peaks()) {
            LeadTime first = p.first();
            out.append("<tr data-peak=\"").append(p.peak()).append("\" data-outcome=\"").append(p.outcome().name().toLowerCase(Locale.ROOT))
                    .append("\"><th scope=\"row\" class=\"date\">").append(p.peak()).append("</th>").append(td(finding(p)))
                    .append(first == null ? td("none") : date(first.confirmed().toString()))
                    .append(num(first == null ? "-" : first.months().toString()))
                    .append(td(p.later().isEmpty() ? "none" : p.later().stream().map(FindingsHtml::other).collect(Collectors.joining("; "))))
                    .append("</tr>\n");
        }
        if (f.peaks().isEmpty()) {
            out.append("<tr><td colspan=\"5\" class=\"none\">No business-cycle peak inside the data.</td></tr>\n");
        }
        out.append("</tbody>\n</table></div>\n");
    }

    private String finding(PeakFinding p) {
        return switch (p.outcome()) {
            case AHEAD -> p.first().months() == 0 ? "signalled in the peak month" : "signalled " + months(p.first().months()) + " ahead";
            case LATE -> "late: first confirmed " + months(-p.first().months()) + " after the peak, with the recession under way";
            case MISSED -> "missed: no confirmation in the " + window + " months before it, nor during the recession";
            case NOT_ASSESSED -> "not assessed: the data begin less than " + window + " months before it";
        };
    }

    private static String other(LeadTime l) {
        int m = l.months();
        return l.confirmed() + " (" + (m >= 0 ? months(m) + " before" : months(-m) + " after, late") + ")";
    }

    private static String months(int n) {
        return n + (n == 1 ? " month" : " months");
    }

    private void fact(String label, String cssClass, String valueHtml) {
        out.append("<dt>").append(esc(label)).append("</dt><dd class=\"").append(cssClass).append("\">").append(valueHtml).append("</dd>\n");
    }
}
