package org.slopewatch.rules;

import java.util.Locale;
import org.slopewatch.text.Html;

/**
 * The human-readable forms of an alert, shared by the chat, email and log channels so that
 * every channel says the same thing: the subject, the body, the dashboard link, and the
 * caution last. An alert's text already ends with {@link Alert#CAUTION}; the link goes before
 * it, and the caution is added if a text lacks it.
 */
public final class AlertText {

    private AlertText() {
    }

    /** The body without the caution, trimmed. */
    static String body(Alert alert) {
        String text = alert.text().strip();
        if (text.endsWith(Alert.CAUTION)) {
            text = text.substring(0, text.length() - Alert.CAUTION.length()).strip();
        }
        return text;
    }

    /** Subject, body, dashboard link and caution as plain text, paragraphs separated by a blank line. */
    public static String plain(Alert alert) {
        StringBuilder out = new StringBuilder(alert.subject()).append("\n\n");
        String body = body(alert);
        if (!body.isEmpty()) {
            out.append(body).append("\n\n");
        }
        if (hasLink(alert)) {
            out.append("Dashboard: ").append(alert.dashboard()).append("\n\n");
        }
        return out.append(Alert.CAUTION).toString();
    }

    /** Body, facts, dashboard link and caution as plain text for an email (the subject is the mail's own). */
    public static String mailText(Alert alert) {
        StringBuilder out = new StringBuilder();
        String body = body(alert);
        if (!body.isEmpty()) {
            out.append(body).append("\n\n");
        }
        if (!alert.facts().isEmpty()) {
            for (Alert.Fact f : alert.facts()) {
                out.append(f.label()).append(": ").append(f.value()).append('\n');
            }
            out.append('\n');
        }
        if (hasLink(alert)) {
            out.append("Dashboard: ").append(alert.dashboard()).append("\n\n");
        }
        return out.append(Alert.CAUTION).append('\n').toString();
    }

    /** The same content as {@link #mailText} in HTML: every value escaped, the facts as a table, the caution last. */
    public static String html(Alert alert) {
        StringBuilder out = new StringBuilder("<!DOCTYPE html>\n<html><head><meta charset=\"utf-8\"><title>")
                .append(escape(alert.subject())).append("</title></head>\n<body>\n");
        out.append("<h2>").append(escape(alert.subject())).append("</h2>\n");
        for (String paragraph : body(alert).split("\\n\\s*\\n")) {
            if (!paragraph.isBlank()) {
                out.append("<p>").append(escape(paragraph.strip()).replace("\n", "<br>\n")).append("</p>\n");
            }
        }
        if (!alert.facts().isEmpty()) {
            out.append("<table>\n");
            for (Alert.Fact f : alert.facts()) {
                out.append("<tr><th style=\"text-align:left\">").append(escape(f.label())).append("</th><td>")
                        .append(escape(f.value())).append("</td></tr>\n");
            }
            out.append("</table>\n");
        }
        if (hasLink(alert)) {
            out.append("<p><a href=\"").append(escape(alert.dashboard())).append("\">Dashboard</a></p>\n");
        }
        out.append("<p><em>").append(escape(Alert.CAUTION)).append("</em></p>\n</body></html>\n");
        return out.toString();
    }

    /** Only http(s) links are shown, so that a template can never smuggle a {@code javascript:} link into an email. */
    public static boolean hasLink(Alert alert) {
        String link = alert.dashboard();
        if (link == null || link.isBlank()) {
            return false;
        }
        String lower = link.strip().toLowerCase(Locale.ROOT);
        return lower.startsWith("https://") || lower.startsWith("http://");
    }

    /** HTML text and attribute escaping. */
    public static String escape(String s) {
        return Html.escape(s);
    }
}
