package org.slopewatch.web;

import java.time.Instant;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import org.slopewatch.spread.SpreadKey;
import org.slopewatch.text.Excerpt;

/** The query parameters the history endpoints share, checked the same way everywhere (400 with what was expected). */
final class QueryParams {

    static final LocalDate EARLIEST = LocalDate.of(1900, 1, 1);
    static final LocalDate LATEST = LocalDate.of(9999, 12, 31);

    private QueryParams() {
    }

    /** {@code as_of}: an ISO-8601 instant, or null when absent (meaning now). */
    static Instant asOf(String text) {
        if (text == null || text.isBlank()) {
            return null;
        }
        try {
            return Instant.parse(text.strip());
        } catch (DateTimeParseException e) {
            throw bad("unparsable as_of " + Excerpt.quoted(text) + " (expected an ISO-8601 instant such as 2026-04-01T17:30:00Z; "
                    + "write + in an offset as %2B)");
        }
    }

    static LocalDate date(String text, LocalDate otherwise) {
        if (text == null || text.isBlank()) {
            return otherwise;
        }
        try {
            return LocalDate.parse(text);
        } catch (DateTimeParseException e) {
            throw bad("unparsable date " + Excerpt.quoted(text) + " (expected YYYY-MM-DD)");
        }
    }

    /** A spread id such as GOVT-A:10Y-3M, or null when absent. */
    static SpreadKey spread(String id) {
        if (id == null || id.isBlank()) {
            return null;
        }
        try {
            return SpreadKey.parse(id);
        } catch (IllegalArgumentException e) {
            throw bad(e.getMessage());
        }
    }

    /** A 400 whose detail says what was wrong. */
    static ProblemException bad(String message) {
        return ProblemException.invalidParameter(message);
    }
}
