package org.slopewatch.report;

import org.slopewatch.text.Html;

/** Table cells and escaping for the report's HTML, so that every table marks numbers and dates alike. */
final class Cells {

    private Cells() {
    }

    static String th(String text) {
        return th(text, false);
    }

    static String th(String text, boolean numeric) {
        return "<th scope=\"col\"" + (numeric ? " class=\"num\"" : "") + ">" + esc(text) + "</th>";
    }

    static String td(String text) {
        return "<td>" + esc(text) + "</td>";
    }

    static String num(String text) {
        return "<td class=\"num\">" + esc(text) + "</td>";
    }

    /** A cell holding a date or a month: it never breaks across lines (report.css, {@code .date}). */
    static String date(String text) {
        return "<td class=\"date\">" + esc(text) + "</td>";
    }

    static String esc(String text) {
        return Html.escape(text);
    }
}
