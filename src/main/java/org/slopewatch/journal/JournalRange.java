package org.slopewatch.journal;

import java.time.Instant;
import java.time.LocalDate;

/**
 * Which journal rows a history query reads: one spread (or all), market dates from {@code from}
 * to {@code to} inclusive, as the journal held them at {@code asOf}.
 *
 * @param spreadId a spread id such as {@code GOVT-A:10Y-3M}, or null for every spread
 * @param asOf     rows recorded at or before this moment only; null for everything recorded so far
 */
public record JournalRange(String spreadId, LocalDate from, LocalDate to, Instant asOf) {

    public JournalRange {
        if (from == null || to == null) {
            throw new IllegalArgumentException("a journal range needs both market dates");
        }
    }
}
