package org.slopewatch.journal;

import java.sql.Connection;
import java.sql.Date;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import javax.sql.DataSource;

/** Reads the journal: recovery on start, and the history the read API serves. */
public final class JournalReader {

    /** A stored transition as the API shows it. */
    public record StoredTransition(long id, String spreadId, LocalDate date, String from, String to, String reason, String test,
                                   String window, double measured, double limit, double valueBp, long daysInverted,
                                   long spellId, long seq, Long supersededBy, Instant recordedAt) {
    }

    /** A stored reject. */
    public record StoredReject(long id, String origin, String reason, String detail, int item, String raw, Instant recordedAt) {
    }

    /** A spread's standing value on a date. */
    public record HistoryPoint(LocalDate date, double valueBp, long seq) {
    }

    private final DataSource dataSource;

    public JournalReader(DataSource dataSource) {
        this.dataSource = dataSource;
    }

    /** True when the journal answers a trivial query. */
    public boolean reachable() {
        try (Connection c = dataSource.getConnection(); PreparedStatement s = c.prepareStatement("SELECT 1");
             ResultSet rs = s.executeQuery()) {
            return rs.next();
        } catch (SQLException e) {
            return false;
        }
    }

    /**
     * Hands every accepted quote message back in the order it was recorded, for rebuilding the
     * in-memory state on start.
     */
    public void replayQuotes(Consumer<JournalEntries.AcceptedQuote> sink) {
        String sql = "SELECT seq, message_id, origin, source, sent_at, curve, market_date, yields FROM quote ORDER BY id";
        try (Connection c = dataSource.getConnection(); PreparedStatement s = c.prepareStatement(sql)) {
            s.setFetchSize(5_000);
            try (ResultSet rs = s.executeQuery()) {
                while (rs.next()) {
                    Timestamp sent = rs.getTimestamp(5);
                    sink.accept(new JournalEntries.AcceptedQuote(rs.getLong(1), rs.getString(3), rs.getString(2), rs.getString(4),
                            sent == null ? null : sent.toInstant(), rs.getString(6), rs.getDate(7).toLocalDate(),
                            YieldsText.read(rs.getString(8))));
                }
            }
        } catch (SQLException e) {
            throw new JournalException("cannot read the journal's quotes for recovery", e);
        }
    }

    /** Accepted quote messages recorded so far: the length of {@link #replayQuotes}, for progress reports. */
    public long quoteCount() {
        try (Connection c = dataSource.getConnection(); PreparedStatement s = c.prepareStatement("SELECT COUNT(*) FROM quote");
             ResultSet rs = s.executeQuery()) {
            return rs.next() ? rs.getLong(1) : 0;
        } catch (SQLException e) {
            throw new JournalException("cannot count the journal's quotes", e);
        }
    }

    /** The standing value of a spread on each date in a range (the last value recorded for the date). */
    public List<HistoryPoint> history(String spreadId, LocalDate from, LocalDate to) {
        String sql = "SELECT market_date, value_bp, seq FROM observation WHERE spread_id = ? AND market_date >= ? AND market_date <= ? "
                + "ORDER BY market_date, id";
        Map<LocalDate, HistoryPoint> byDate = new LinkedHashMap<>();
        try (Connection c = dataSource.getConnection(); PreparedStatement s = c.prepareStatement(sql)) {
            s.setString(1, spreadId);
            s.setDate(2, Date.valueOf(from));
            s.setDate(3, Date.valueOf(to));
            try (ResultSet rs = s.executeQuery()) {
                while (rs.next()) {
                    LocalDate d = rs.getDate(1).toLocalDate();
                    byDate.put(d, new HistoryPoint(d, rs.getDouble(2), rs.getLong(3)));
                }
            }
        } catch (SQLException e) {
            throw new JournalException("cannot read the history of " + spreadId, e);
        }
        return new ArrayList<>(byDate.values());
    }

    /**
     * Transitions in market-date order.
     *
     * @param spreadId           one spread, or null for all
     * @param includeSuperseded  also those a revision replaced
     */
    public List<StoredTransition> transitions(String spreadId, LocalDate from, LocalDate to, boolean includeSuperseded, int limit) {
        StringBuilder sql = new StringBuilder("SELECT id, spread_id, market_date, from_state, to_state, reason, test, window_label, measured, "
                + "limit_value, value_bp, days_inverted, spell_id, seq, superseded_by, recorded_at FROM transition WHERE market_date >= ? AND market_date <= ?");
        if (spreadId != null) {
            sql.append(" AND spread_id = ?");
        }
        if (!includeSuperseded) {
            sql.append(" AND superseded_by IS NULL");
        }
        sql.append(" ORDER BY market_date, id");
        List<StoredTransition> out = new ArrayList<>();
        try (Connection c = dataSource.getConnection(); PreparedStatement s = c.prepareStatement(sql.toString())) {
            s.setDate(1, Date.valueOf(from));
            s.setDate(2, Date.valueOf(to));
            if (spreadId != null) {
                s.setString(3, spreadId);
            }
            s.setMaxRows(limit);
            try (ResultSet rs = s.executeQuery()) {
                while (rs.next()) {
                    long superseded = rs.getLong(15);
                    out.add(new StoredTransition(rs.getLong(1), rs.getString(2), rs.getDate(3).toLocalDate(), rs.getString(4),
                            rs.getString(5), rs.getString(6), rs.getString(7), rs.getString(8), rs.getDouble(9), rs.getDouble(10),
                            rs.getDouble(11), rs.getLong(12), rs.getLong(13), rs.getLong(14), rs.wasNull() ? null : superseded,
                            rs.getTimestamp(16).toInstant()));
                }
            }
        } catch (SQLException e) {
            throw new JournalException("cannot read transitions", e);
        }
        return out;
    }

    /** The most recent rejects, newest first. */
    public List<StoredReject> rejects(int limit) {
        List<StoredReject> out = new ArrayList<>();
        try (Connection c = dataSource.getConnection();
             PreparedStatement s = c.prepareStatement("SELECT id, origin, reason, detail, item, raw, recorded_at FROM reject ORDER BY id DESC")) {
            s.setMaxRows(limit);
            try (ResultSet rs = s.executeQuery()) {
                while (rs.next()) {
                    out.add(new StoredReject(rs.getLong(1), rs.getString(2), rs.getString(3), rs.getString(4), rs.getInt(5),
                            rs.getString(6), rs.getTimestamp(7).toInstant()));
                }
            }
        } catch (SQLException e) {
            throw new JournalException("cannot read rejects", e);
        }
        return out;
    }
}
