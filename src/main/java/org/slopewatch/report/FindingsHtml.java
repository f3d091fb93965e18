package org.slopewatch.report;

import static org.slopewatch.report.Cells.date;
import static org.slopewatch.report.Cells.esc;
import static org.slopewatch.report.Cells.num;
import static org.slopewatch.report.Cells.td;
import static org.slopewatch.report.Cells.th;

import java.time.YearMonth;
import java.util.IntSummaryStatistics;
import java.util.List;
import java.util.Locale;
import java.util.TreeMap;
import java.util.stream.Collectors;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.probability.LiveProbability;
import org.slopewatch.probability.PeakLead;
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
                    .append("</code>. A peak counts once, signalled by the first confirmation measured against it: ahead when that came by ")
                    .append("the peak month, late when it came during the recession; a confirmation with no peak within ")
                    .append(window).append(" months is a false alarm. Peaks are dated, and announced, months after the fact: ")
                    .append("where the dates give the day a peak was announced, the signal is compared with it too.</p>\n");
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
        List<PeakLead> ahead = f.peaks(PeakLead.Outcome.AHEAD);
        int late = f.peaks(PeakLead.Outcome.LATE).size();
        int missed = f.peaks(PeakLead.Outcome.MISSED).size();
        int assessed = f.peaks().size();
        StringBuilder b = new StringBuilder();
        if (assessed == 0) {
            b.append("no peak inside the data could be assessed");
        } else {
            b.append(ahead.size()).append(" of ").append(assessed).append(assessed == 1 ? " assessed peak" : " assessed peaks")
                    .append(" signalled ahead");
            if (!ahead.isEmpty()) {
                IntSummaryStatistics months = ahead.stream().mapToInt(PeakLead::months).summaryStatistics();
                b.append(months.getMin() == months.getMax() ? " (" + months(months.getMin()) + " before)"
                        : " (" + months.getMin() + " to " + months(months.getMax()) + " before)");
            }
            b.append("; ").append(late).append(" late; ").append(missed == 0 ? "none" : Integer.toString(missed)).append(" missed");
            List<PeakLead> announced = f.peaks().stream().filter(p -> p.announced() != null).toList();
            if (!announced.isEmpty()) {
                long known = announced.stream().filter(p -> p.timing() == PeakLead.Timing.BEFORE_PEAK
                        || p.timing() == PeakLead.Timing.BEFORE_ANNOUNCEMENT).count();
                b.append("; signalled before the announcement for ").append(known).append(" of ").append(announced.size())
                        .append(announced.size() == 1 ? " peak" : " peaks").append(" with an announcement date");
            }
        }
        if (!f.notAssessed().isEmpty()) {
            b.append(". Not assessed: ").append(f.notAssessed().stream().map(YearMonth::toString).collect(Collectors.joining(", ")));
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
                .append(": the first confirmation measured against it, or why there is none, and whether it came before the peak ")
                .append("was known</caption>\n<thead><tr>").append(th("Peak")).append(th("Finding")).append(th("First confirmation"))
                .append(th("Months before the peak", true)).append(th("Peak announced")).append(th("Signal came"))
                .append(th("Other confirmations of this peak")).append("</tr></thead>\n<tbody>\n");
        // the assessed peaks and those not assessed, in peak order
        TreeMap<YearMonth, PeakLead> rows = new TreeMap<>();
        f.notAssessed().forEach(m -> rows.put(m, null));
        f.peaks().forEach(p -> rows.put(p.peak(), p));
        rows.forEach((peak, p) -> {
            out.append("<tr data-peak=\"").append(peak).append("\" data-outcome=\"")
                    .append(p == null ? "not_assessed" : p.outcome().name().toLowerCase(Locale.ROOT)).append("\"");
            if (p != null && p.timing() != null) {
                out.append(" data-timing=\"").append(p.timing().name().toLowerCase(Locale.ROOT)).append("\"");
            }
            out.append("><th scope=\"row\" class=\"date\">").append(peak).append("</th>");
            if (p == null) {
                out.append(td("not assessed: the data begin less than " + window + " months before it")).append(td("none")).append(num("-"))
                        .append(td("-")).append(td("-")).append(td("none"));
            } else {
                out.append(td(finding(p))).append(p.firstConfirmed() == null ? td("none") : date(p.firstConfirmed().toString()))
                        .append(num(p.months() == null ? "-" : p.months().toString()))
                        .append(p.announced() == null ? td("not given") : date(p.announced().toString()))
                        .append(td(timing(p)))
                        .append(td(p.laterConfirmations().isEmpty() ? "none"
                                : p.laterConfirmations().stream().map(FindingsHtml::other).collect(Collectors.joining("; "))));
            }
            out.append("</tr>\n");
        });
        if (rows.isEmpty()) {
            out.append("<tr><td colspan=\"7\" class=\"none\">No business-cycle peak inside the data.</td></tr>\n");
        }
        out.append("</tbody>\n</table></div>\n");
    }

    private String finding(PeakLead p) {
        return switch (p.outcome()) {
            case AHEAD -> p.months() == 0 ? "signalled in the peak month" : "signalled " + months(p.months()) + " ahead";
            case LATE -> "late: first confirmed " + months(-p.months()) + " after the peak, with the recession under way";
            case MISSED -> "missed: no confirmation in the " + window + " months before it, nor during the recession";
        };
    }

    /** When the signal came against what was known: before the peak, before its announcement, or after both. */
    private static String timing(PeakLead p) {
        if (p.timing() == null) {
            return "-";
        }
        return switch (p.timing()) {
            case BEFORE_PEAK -> p.announced() == null ? "before the peak" : "before the peak, " + beforeAnnouncement(p);
            case BEFORE_ANNOUNCEMENT -> "after the peak, " + beforeAnnouncement(p);
            case AFTER_BOTH -> "after the peak and its announcement";
            case AFTER_PEAK -> "after the peak; no announcement date to compare with";
        };
    }

    private static String beforeAnnouncement(PeakLead p) {
        int n = p.monthsBeforeAnnouncement();
        return n == 0 ? "before its announcement, in the same month" : months(n) + " before its announcement";
    }

    private static String other(PeakLead.LaterConfirmation l) {
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
