package org.slopewatch.report;

import static org.slopewatch.report.Cells.date;
import static org.slopewatch.report.Cells.esc;
import static org.slopewatch.report.Cells.num;
import static org.slopewatch.report.Cells.td;
import static org.slopewatch.report.Cells.th;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.time.YearMonth;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import org.slopewatch.monitor.PersistenceTest;
import org.slopewatch.probability.LeadTime;
import org.slopewatch.probability.PeakLead;
import org.slopewatch.probability.Recession;
import org.slopewatch.replay.SpreadReport;

/**
 * Writes a {@link ReportDocument} as one HTML page that needs nothing else: the style sheet is
 * inlined and each chart is an inline SVG, so the file opens offline and survives being mailed.
 * Structure is for people first (headings, captioned tables with header cells, chart titles and
 * descriptions); the class names also let a test find each part.
 */
public final class ReportHtml {

    private static final String CSS = css();

    private final StringBuilder out = new StringBuilder(64 * 1024);

    private ReportHtml() {
    }

    public static String render(ReportDocument doc) {
        return new ReportHtml().page(doc);
    }

    private String page(ReportDocument doc) {
        out.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<meta name=\"generator\" content=\"slopewatch\">\n")
                .append("<title>").append(esc(doc.title())).append("</title>\n<style>\n").append(CSS).append("</style>\n</head>\n<body>\n");
        out.append("<header class=\"masthead\">\n<h1>").append(esc(doc.title())).append("</h1>\n<p>")
                .append(esc(doc.source().kind())).append(": ").append(esc(doc.source().name())).append(" &middot; generated ")
                .append(esc(doc.source().generatedAt().truncatedTo(ChronoUnit.SECONDS).toString())).append("</p>\n</header>\n<main>\n");
        // findings first, then the charts and tables behind them, then what the report was made from
        FindingsHtml.write(out, doc);
        caution(doc.caution());
        contents(doc);
        int index = 0;
        for (SpreadSection s : doc.spreads()) {
            spread(doc, s, ++index);
        }
        source(doc);
        if (doc.recessions() != null) {
            recessions(doc);
        }
        policy(doc.policy());
        out.append("</main>\n<footer>\n");
        caution(doc.caution());
        out.append("<p>Written by slopewatch. Values in basis points (bp) unless stated; dates are market dates.</p>\n</footer>\n")
                .append("</body>\n</html>\n");
        return out.toString();
    }

    private void caution(String caution) {
        out.append("<p class=\"caution\" role=\"note\"><strong>Caution</strong>").append(esc(caution)).append("</p>\n");
    }

    private void contents(ReportDocument doc) {
        out.append("<nav class=\"contents\" aria-label=\"Contents\">\n<ul>\n<li><a href=\"#findings\">Findings</a></li>\n");
        int index = 0;
        for (SpreadSection s : doc.spreads()) {
            out.append("<li><a href=\"#spread-").append(++index).append("\">").append(esc(s.id())).append("</a></li>\n");
        }
        out.append("<li><a href=\"#source\">What the report covers</a></li>\n");
        if (doc.recessions() != null) {
            out.append("<li><a href=\"#recessions\">Recession dates</a></li>\n");
        }
        out.append("<li><a href=\"#policy\">Policy</a></li>\n</ul>\n</nav>\n");
    }

    private void source(ReportDocument doc) {
        ReportSource src = doc.source();
        out.append("<section aria-labelledby=\"source\">\n<h2 id=\"source\">What the report covers</h2>\n<dl class=\"facts source\">\n");
        fact(src.kind().substring(0, 1).toUpperCase(Locale.ROOT) + src.kind().substring(1), "<code>" + esc(src.name()) + "</code>");
        fact("Curves", esc(String.join(", ", src.curves())));
        fact("Spreads", esc(String.join(", ", src.spreads())));
        fact("Dates", src.firstDate() == null ? "<span class=\"none\">no data</span>" : esc(src.firstDate() + " to " + src.lastDate()));
        for (ReportSource.Detail d : src.details()) {
            fact(esc(d.label()), esc(d.value()));
        }
        fact("Generated", "<time datetime=\"" + esc(src.generatedAt().toString()) + "\">"
                + esc(src.generatedAt().truncatedTo(ChronoUnit.SECONDS).toString()) + "</time>");
        out.append("</dl>\n</section>\n");
    }

    private void policy(PolicySummary p) {
        out.append("<section aria-labelledby=\"policy\">\n<h2 id=\"policy\">Policy</h2>\n<dl class=\"facts policy\">\n");
        fact("File", p.file() == null ? "<span class=\"none\">none: rules from the command line</span>" : "<code class=\"policy-file\">"
                + esc(p.file()) + "</code>");
        fact("SHA-256", p.sha256() == null ? "<span class=\"none\">none</span>" : "<code class=\"hash policy-hash\">" + esc(p.sha256()) + "</code>");
        if (p.note() != null) {
            fact("Note", esc(p.note()));
        }
        out.append("</dl>\n");
        out.append("<div class=\"table-wrap\"><table class=\"rules\">\n<caption>Monitor rules of each watched spread</caption>\n<thead><tr>")
                .append(th("Spread")).append(th("Curves")).append(th("Spell starts below", true))
                .append(th("Spell ends at or above", true)).append(th("after observations", true))
                .append(th("Hold after re-steepening", true)).append(th("Confirmed by (first test that holds)"))
                .append("</tr></thead>\n<tbody>\n");
        for (SpreadRules r : p.rules()) {
            out.append("<tr><th scope=\"row\">").append(esc(r.spread())).append("</th>")
                    .append(td(r.curves().isEmpty() ? "all" : String.join(", ", r.curves())))
                    .append(num(PersistenceTest.number(r.entryBelowBp()) + " bp"))
                    .append(num(PersistenceTest.number(r.exitAtOrAboveBp()) + " bp"))
                    .append(num(Integer.toString(r.exitObservations())))
                    .append(num(r.holdDays() + " days"))
                    .append(td(String.join(" or ", r.tests()))).append("</tr>\n");
        }
        out.append("</tbody>\n</table></div>\n</section>\n");
    }

    private void recessions(ReportDocument doc) {
        RecessionDates r = doc.recessions();
        out.append("<section aria-labelledby=\"recessions\">\n<h2 id=\"recessions\">Recession dates</h2>\n<dl class=\"facts\">\n");
        fact("File", "<code>" + esc(r.source()) + "</code>");
        fact("Recessions in the file", Integer.toString(r.recessions().size()));
        long announced = r.recessions().stream().filter(x -> x.peakAnnounced() != null).count();
        fact("Peak announcement dates", announced == 0 ? "none given" : "given for " + announced + " of " + r.recessions().size() + " peaks");
        fact("False alarm", "a confirmation with no peak within " + doc.falseAlarmWindowMonths() + " months");
        out.append("</dl>\n<p>In the charts a recession is a bar along the bottom of the plot, from the month after its peak through "
                + "its trough month, labelled with its peak month.</p>\n</section>\n");
    }

    private void spread(ReportDocument doc, SpreadSection s, int index) {
        String key = "spread-" + index;
        out.append("<section class=\"spread\" aria-labelledby=\"").append(key).append("\" data-spread=\"").append(esc(s.id())).append("\">\n")
                .append("<h2 id=\"").append(key).append("\">").append(esc(s.id())).append("</h2>\n");
        long confirmed = s.spells().stream().filter(b -> b.confirmed() != null).count();
        out.append("<p class=\"summary\">");
        if (s.lastDate() != null) {
            out.append("At the end: <strong>").append(esc(s.finalState())).append("</strong> on <span class=\"date\">").append(s.lastDate())
                    .append("</span>");
            if (s.lastValueBp() != null) {
                out.append(String.format(Locale.ROOT, " at %+.1f bp", s.lastValueBp()));
            }
            out.append(". ");
        }
        out.append(String.format(Locale.ROOT, "%,d observations; %d inverted spells, %d confirmed.", s.observations(), s.spells().size(),
                confirmed)).append("</p>\n<p class=\"summary\">Rules: <code>").append(esc(s.rules())).append("</code></p>\n");
        List<Recession> recessions = doc.recessions() == null || s.points().isEmpty() ? List.of()
                : doc.recessions().within(s.firstDate(), s.lastPlottedDate());
        if (!s.points().isEmpty()) {
            out.append("<figure class=\"chart\">\n").append(SpreadChart.svg(s, recessions, "chart" + index)).append("\n<figcaption>")
                    .append(esc(ChartText.description(s, recessions))).append("</figcaption>\n</figure>\n");
        }
        spells(s);
        if (s.leads() != null) {
            leads(s, doc.falseAlarmWindowMonths());
        }
        transitions(s);
        out.append("</section>\n");
    }

    private void spells(SpreadSection s) {
        out.append("<h3>Inverted spells</h3>\n");
        if (s.spells().isEmpty()) {
            out.append("<p class=\"none\">No inverted spell.</p>\n");
            return;
        }
        out.append("<div class=\"table-wrap\"><table class=\"spells\">\n<caption>Inverted spells of ").append(esc(s.id()))
                .append(" (shaded in the chart)</caption>\n<thead><tr>").append(th("Spell", true)).append(th("Start"))
                .append(th("Confirmed")).append(th("Ended")).append("</tr></thead>\n<tbody>\n");
        for (SpellBand b : s.spells()) {
            out.append("<tr>").append(num(Long.toString(b.id()))).append(date(b.start().toString()))
                    .append(date(b.confirmed() == null ? "not confirmed" : b.confirmed().toString()))
                    .append(date(b.end() == null ? "still open" : b.end().toString())).append("</tr>\n");
        }
        out.append("</tbody>\n</table></div>\n");
    }

    private void leads(SpreadSection s, Integer window) {
        out.append("<h3>Lead times to the business cycle</h3>\n");
        out.append("<div class=\"table-wrap\"><table class=\"leads\">\n<caption>Months from each confirmation of ").append(esc(s.id()))
                .append(", and from the same spell's re-steepening, to the business-cycle peak it is measured against ")
                .append("(negative: after the peak)</caption>\n<thead><tr>")
                .append(th("Confirmed")).append(th("Peak")).append(th("Months, confirmation to peak", true)).append(th("Outcome"))
                .append(th("Re-steepened")).append(th("Months, re-steepening to peak", true)).append("</tr></thead>\n<tbody>\n");
        for (LeadTime l : s.leads()) {
            out.append("<tr>").append(date(l.confirmed().toString())).append(date(l.peak() == null ? "-" : l.peak().toString()))
                    .append(num(l.months() == null ? "-" : l.months().toString()))
                    .append(td(l.late() ? "late: recession already under way" : l.outcome()))
                    .append(date(l.resteepened() == null ? "not yet" : l.resteepened().toString()))
                    .append(num(l.monthsFromResteepening() == null ? "-" : l.monthsFromResteepening().toString())).append("</tr>\n");
        }
        if (s.leads().isEmpty()) {
            out.append("<tr><td colspan=\"6\" class=\"none\">No confirmation.</td></tr>\n");
        }
        out.append("</tbody>\n</table></div>\n<dl class=\"facts lead-summary\">\n");
        // peaks are counted once each, as the findings list them; two confirmations before one peak are one peak signalled
        fact("Peaks signalled ahead", Long.toString(s.peaks().stream().filter(p -> p.outcome() == PeakLead.Outcome.AHEAD).count()));
        fact("Peaks signalled late", Long.toString(s.peaks().stream().filter(p -> p.outcome() == PeakLead.Outcome.LATE).count()));
        fact("False alarms", Long.toString(s.leads().stream().filter(LeadTime::falseAlarm).count())
                + " (no peak within " + window + " months)");
        fact("Missed recessions", months(s.missedPeaks()));
        if (s.unassessedPeaks() != null && !s.unassessedPeaks().isEmpty()) {
            fact("Not assessed", months(s.unassessedPeaks()) + " (the data starts less than " + window + " months before the peak)");
        }
        out.append("</dl>\n");
    }

    private void transitions(SpreadSection s) {
        out.append("<h3>Transitions</h3>\n");
        if (s.transitions().isEmpty()) {
            out.append("<p class=\"none\">No transition: the spread stayed NORMAL.</p>\n");
            return;
        }
        out.append("<div class=\"table-wrap\"><table class=\"transitions\">\n<caption>State changes of ").append(esc(s.id()))
                .append(" with their evidence</caption>\n<thead><tr>").append(th("Date")).append(th("From")).append(th("To"))
                .append(th("Test")).append(th("Value", true)).append(th("Spell", true)).append(th("Reason")).append("</tr></thead>\n<tbody>\n");
        for (SpreadReport.TransitionRow t : s.transitions()) {
            out.append("<tr>").append(date(t.date().toString())).append(td(t.from())).append(td(t.to())).append(td(t.test()))
                    .append(num(String.format(Locale.ROOT, "%+.1f bp", t.valueBp())))
                    .append(num(t.spell() == 0 ? "-" : Long.toString(t.spell()))).append(td(t.reason())).append("</tr>\n");
        }
        out.append("</tbody>\n</table></div>\n");
    }

    private void fact(String label, String valueHtml) {
        out.append("<dt>").append(label).append("</dt><dd>").append(valueHtml).append("</dd>\n");
    }

    private static String months(List<YearMonth> months) {
        return months == null || months.isEmpty() ? "none" : months.stream().map(YearMonth::toString).collect(Collectors.joining(", "));
    }

    private static String css() {
        try (InputStream in = ReportHtml.class.getResourceAsStream("report.css")) {
            if (in == null) {
                throw new IllegalStateException("report.css is missing from the application");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read report.css", e);
        }
    }
}
