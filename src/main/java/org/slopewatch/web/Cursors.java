package org.slopewatch.web;

import java.time.DateTimeException;
import java.time.Instant;
import java.time.LocalDate;
import java.util.Locale;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.NewestAlerts;
import org.slopewatch.journal.TimelineRows;
import org.slopewatch.text.Excerpt;

/**
 * The {@code after} cursors of the lists, written and read in one place. A cursor names the last
 * item of a page by the keys of its list's order, so the next page starts right after it even
 * when that item has gone meanwhile. Clients take cursors from {@code next} and do not build
 * them: the form may change. Parts are joined with {@code ~}; a notice's id, which holds
 * {@code ~} itself, always comes last.
 */
final class Cursors {

    private static final String SEPARATOR = "~";

    private Cursors() {
    }

    /** Transitions: market date and id. */
    static String transition(JournalReader.StoredTransition t) {
        return t.date() + SEPARATOR + t.id();
    }

    static JournalReader.TransitionPosition transition(String text) {
        if (absent(text)) {
            return null;
        }
        String[] parts = parts(text, 2);
        try {
            return new JournalReader.TransitionPosition(LocalDate.parse(parts[0]), Long.parseLong(parts[1]));
        } catch (DateTimeException | NumberFormatException e) {
            throw unusable(text);
        }
    }

    /** A spread's history: the market date. */
    static String historyPoint(JournalReader.HistoryPoint p) {
        return p.date().toString();
    }

    static LocalDate historyPoint(String text) {
        if (absent(text)) {
            return null;
        }
        try {
            return LocalDate.parse(text);
        } catch (DateTimeException e) {
            throw unusable(text);
        }
    }

    /** Rejects and quiet periods, newest first: the row id. */
    static String rowId(long id) {
        return Long.toString(id);
    }

    static Long rowId(String text) {
        if (absent(text)) {
            return null;
        }
        try {
            return Long.parseLong(text);
        } catch (NumberFormatException e) {
            throw unusable(text);
        }
    }

    /** Notices, newest first: creation time and id. */
    static String alert(AlertHistory.AlertView v) {
        return v.stored().alert().createdAt() + SEPARATOR + v.stored().alert().id();
    }

    static NewestAlerts.Position alert(String text) {
        if (absent(text)) {
            return null;
        }
        String[] parts = parts(text, 2);
        try {
            return new NewestAlerts.Position(Instant.parse(parts[0]), parts[1]);
        } catch (DateTimeException e) {
            throw unusable(text);
        }
    }

    /** A timeline: recording time, kind, and the row id (a notice: its creation time and id). */
    static String timeline(TimelineRows.Position p) {
        String head = p.recordedAt() + SEPARATOR + p.kind().name().toLowerCase(Locale.ROOT) + SEPARATOR;
        return p.kind() == TimelineRows.Kind.ALERT ? head + p.createdAt() + SEPARATOR + p.alertId() : head + p.id();
    }

    static TimelineRows.Position timeline(String text) {
        if (absent(text)) {
            return null;
        }
        String[] head = parts(text, 3);
        try {
            Instant recorded = Instant.parse(head[0]);
            TimelineRows.Kind kind = TimelineRows.Kind.valueOf(head[1].toUpperCase(Locale.ROOT));
            if (kind != TimelineRows.Kind.ALERT) {
                return TimelineRows.Position.of(recorded, kind, Long.parseLong(head[2]));
            }
            String[] alert = parts(head[2], 2);
            return TimelineRows.Position.ofAlert(recorded, Instant.parse(alert[0]), alert[1]);
        } catch (DateTimeException | IllegalArgumentException e) {
            throw unusable(text); // NumberFormatException is an IllegalArgumentException, as is an unknown kind
        }
    }

    /** No cursor: the first page. */
    private static boolean absent(String text) {
        return text == null || text.isBlank();
    }

    /** The first {@code n - 1} parts split at {@code ~}, and the rest as the last. */
    private static String[] parts(String text, int n) {
        String[] parts = text.split(SEPARATOR, n);
        if (parts.length != n || parts[n - 1].isEmpty()) {
            throw unusable(text);
        }
        return parts;
    }

    private static ProblemException unusable(String text) {
        return QueryParams.bad("unusable after " + Excerpt.quoted(text) + ": take it from the next link of the page before");
    }
}
