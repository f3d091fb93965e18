package org.slopewatch.journal;

import java.sql.Date;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Timestamp;
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

    /**
     * Binds the range to a query whose filter reads, in this order, the first and last market
     * date, the spread id (when there is one) and the moment (when there is one).
     *
     * @return the index of the next parameter
     */
    int bind(PreparedStatement s) throws SQLException {
        int i = 1;
        s.setDate(i++, Date.valueOf(from));
        s.setDate(i++, Date.valueOf(to));
        if (spreadId != null) {
            s.setString(i++, spreadId);
        }
        if (asOf != null) {
            s.setTimestamp(i++, Timestamp.from(asOf));
        }
        return i;
    }
}
