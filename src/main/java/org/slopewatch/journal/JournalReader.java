package org.slopewatch.journal;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.sql.Connection;
import java.sql.Date;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Consumer;
import javax.sql.DataSource;
import org.slopewatch.curve.Resolution;
import org.slopewatch.monitor.Spell;
import org.slopewatch.spread.SpreadKey;

/** Reads the journal: recovery on start, and the history the read API serves. */
public final class JournalReader {

    /**
     * A stored transition as the API shows it. Its numbers are read back to the resolution values are
     * compared and written at ({@link Resolution#BASIS_POINTS}; six decimals serve a measured share or
     * count of days as well), since a journal written before that rule holds binary residues.
     */
    public record StoredTransition(long id, String spreadId, LocalDate date, String from, String to, String reason, String test,
                                   String window, double measured, double limit, double valueBp, long daysInverted,
                                   long spellId, long seq, Long supersededBy, Instant recordedAt) {

        public StoredTransition {
            measured = Resolution.BASIS_POINTS.round(measured);
            limit = Resolution.BASIS_POINTS.round(limit);
            valueBp = Resolution.BASIS_POINTS.round(valueBp);
        }
    }

    /** Where a page of transitions ended: the market date and id of its last transition (the list's order). */
    public record TransitionPosition(LocalDate date, long id) {
    }

    /** A stored reject. */
    public record StoredReject(long id, String origin, String reason, String detail, int item, String raw, Instant recordedAt) {
    }

    /** A spread's standing value on a date, to {@link Resolution#BASIS_POINTS} (as {@link StoredTransition}). */
    public record HistoryPoint(LocalDate date, double valueBp, long seq) {

        public HistoryPoint {
            valueBp = Resolution.BASIS_POINTS.round(valueBp);
        }
    }

    /**
     * One computed spread value as journalled. Every value is kept; {@code standing} says whether
     * it is the last one recorded for its spread and date (as of the moment the query asked about).
     */
    public record StoredObservation(long id, String spreadId, LocalDate date, double valueBp, long seq, boolean standing,
                                    Instant recordedAt) {

        public StoredObservation {
            valueBp = Resolution.BASIS_POINTS.round(valueBp); // as StoredTransition
        }

        StoredObservation replaced() {
            return new StoredObservation(id, spreadId, date, valueBp, seq, false, recordedAt);
        }
    }

    private final DataSource dataSource;
    private final JournalSql sql;

    public JournalReader(DataSource dataSource) {
        this.dataSource = dataSource;
        this.sql = new JournalSql(dataSource);
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
     * Hands every accepted quote message back in the order it was processed, for rebuilding the
     * in-memory state on start.
     *
     * <p>The order is the pipeline's sequence number, not the row id: PostgreSQL hands identity
     * values to each connection in cached blocks, so ids need not follow commit order. Instances
     * sharing a journal number their steps independently, but a curve's quotes are only ever
     * processed by one of them at a time, and the next owner continues above every number it
     * rebuilt from, so each curve's quotes come back in their order (ties, across curves, by id).
     */
    public void replayQuotes(Consumer<JournalEntries.AcceptedQuote> sink) {
        replayQuotes(null, null, sink);
    }

    /**
     * As {@link #replayQuotes(Consumer)}, bounded: only the quotes recorded at or before
     * {@code until}, and only those of {@code curve} (each curve's monitors depend on its own
     * quotes alone). Null bounds nothing.
     */
    public void replayQuotes(Instant until, String curve, Consumer<JournalEntries.AcceptedQuote> sink) {
        eachQuote("1 = 1" + (until == null ? "" : " AND recorded_at <= ?") + (curve == null ? "" : " AND curve = ?"), s -> {
            int i = 1;
            if (until != null) {
                s.setTimestamp(i++, Timestamp.from(until));
            }
            if (curve != null) {
                s.setString(i, curve);
            }
        }, sink);
    }

    /**
     * The quotes a condition picks, in processing order, through a cursor: memory stays flat however
     * long the journal (PostgreSQL keeps a cursor only with auto-commit off, which {@link JournalSql#stream} sees to).
     */
    private void eachQuote(String where, JournalSql.Binder binder, Consumer<JournalEntries.AcceptedQuote> sink) {
        try {
            sql.stream("SELECT " + QUOTE_COLUMNS + " FROM quote WHERE " + where + " ORDER BY seq, id", binder, rs -> {
                while (rs.next()) {
                    sink.accept(acceptedQuote(rs));
                }
            }, "the quotes to rebuild from");
        } catch (IOException e) {
            throw new UncheckedIOException(e); // the sink writes nowhere: no I/O of its own to fail
        }
    }

    /** The columns {@link #acceptedQuote} reads, in its order. */
    private static final String QUOTE_COLUMNS = "seq, message_id, origin, source, sent_at, curve, market_date, yields";

    /** A quote row read back as the pipeline took it. */
    private static JournalEntries.AcceptedQuote acceptedQuote(ResultSet rs) throws SQLException {
        Timestamp sent = rs.getTimestamp(5);
        return new JournalEntries.AcceptedQuote(rs.getLong(1), rs.getString(3), rs.getString(2), rs.getString(4),
                sent == null ? null : sent.toInstant(), rs.getString(6), rs.getDate(7).toLocalDate(), YieldsText.read(rs.getString(8)));
    }

    /**
     * As {@link #replayQuotes(Consumer)}, only the quotes numbered above {@code afterSeq}: the tail
     * after the oldest checkpoint.
     */
    public void replayQuotesAfter(long afterSeq, Consumer<JournalEntries.AcceptedQuote> sink) {
        replayQuotesAfter(afterSeq, null, sink);
    }

    /** As {@link #replayQuotesAfter(long, Consumer)}, only the quotes of the given curves (null: of all). */
    public void replayQuotesAfter(long afterSeq, Collection<String> curves, Consumer<JournalEntries.AcceptedQuote> sink) {
        List<String> only = curves == null ? List.of() : List.copyOf(curves);
        eachQuote("seq > ?" + (curves == null ? "" : " AND curve IN (" + JournalSql.placeholders(only.size()) + ")"), s -> {
            s.setLong(1, afterSeq);
            for (int i = 0; i < only.size(); i++) {
                s.setString(2 + i, only.get(i));
            }
        }, sink);
    }

    /**
     * A spread's standing value on each date up to and including {@code through}, oldest first, as
     * the observations numbered below {@code beforeSeq} left it (the highest number of a date wins):
     * what a monitor that let go of those dates re-runs a revision on.
     */
    public List<HistoryPoint> standingObservations(String spreadId, LocalDate through, long beforeSeq) {
        List<HistoryPoint> out = new ArrayList<>();
        sql.query("SELECT market_date, value_bp, seq FROM observation WHERE spread_id = ? AND market_date <= ? AND seq < ? "
                + "ORDER BY market_date, seq, id", s -> {
                    s.setString(1, spreadId);
                    s.setDate(2, Date.valueOf(through));
                    s.setLong(3, beforeSeq);
                }, rs -> {
                    HistoryPoint p = new HistoryPoint(rs.getDate(1).toLocalDate(), rs.getDouble(2), rs.getLong(3));
                    if (!out.isEmpty() && out.get(out.size() - 1).date().equals(p.date())) {
                        out.set(out.size() - 1, p);
                    } else {
                        out.add(p);
                    }
                }, "observations");
        return out;
    }

    /**
     * The quotes of a curve on its latest market date on or before {@code date} among those
     * numbered below {@code beforeSeq}, in the order they were processed; empty when there are none.
     */
    public List<JournalEntries.AcceptedQuote> quotesOnOrBefore(String curve, LocalDate date, long beforeSeq) {
        List<JournalEntries.AcceptedQuote> out = new ArrayList<>();
        sql.query("SELECT " + QUOTE_COLUMNS + " FROM quote WHERE curve = ? AND seq < ? "
                + "AND market_date = (SELECT MAX(market_date) FROM quote WHERE curve = ? AND market_date <= ? AND seq < ?) ORDER BY seq, id",
                s -> {
                    s.setString(1, curve);
                    s.setLong(2, beforeSeq);
                    s.setString(3, curve);
                    s.setDate(4, Date.valueOf(date));
                    s.setLong(5, beforeSeq);
                }, rs -> out.add(acceptedQuote(rs)), "quotes");
        return out;
    }

    /**
     * The message ids among {@code ids} that the journal holds as seen (taken with their quote, by
     * this instance or another sharing the journal): the pipeline's exact answer on duplicates for
     * whatever its bounded memory of recent ids has let go. One query per few hundred ids, each an
     * index lookup (the primary key of {@code seen_message}).
     */
    public Set<String> seenAmong(Collection<String> ids) {
        Set<String> found = new HashSet<>();
        for (List<String> chunk : JournalSql.chunks(List.copyOf(ids))) {
            sql.query("SELECT message_id FROM seen_message WHERE message_id IN (" + JournalSql.placeholders(chunk.size()) + ")",
                    s -> JournalSql.bind(s, chunk), rs -> found.add(rs.getString(1)), "the message ids seen");
        }
        return found;
    }

    /**
     * A curve's latest quote: its sequence number (what tells whether another instance moved the curve
     * on) and when it was journalled, by whichever instance (where a feed's quiet time starts).
     */
    public record LastQuote(long seq, Instant recorded) {
    }

    /**
     * Each curve's latest quote (highest sequence number; a curve's quotes are numbered in the order
     * they were processed, by whichever instance held it), found by walking the {@code (curve, seq)}
     * index from one curve to the next and reading each curve's last entry: a few index seeks per
     * curve, where a grouping would read every quote of a long journal at each start.
     */
    public Map<String, LastQuote> lastQuotes() {
        Map<String, LastQuote> out = new HashMap<>();
        try (Connection c = dataSource.getConnection();
             PreparedStatement first = c.prepareStatement("SELECT curve FROM quote ORDER BY curve FETCH FIRST 1 ROWS ONLY");
             PreparedStatement next = c.prepareStatement("SELECT curve FROM quote WHERE curve > ? ORDER BY curve FETCH FIRST 1 ROWS ONLY");
             PreparedStatement last = c.prepareStatement("SELECT seq, recorded_at FROM quote WHERE curve = ? "
                     + "ORDER BY curve DESC, seq DESC FETCH FIRST 1 ROWS ONLY")) {
            String curve = firstString(first);
            while (curve != null) {
                last.setString(1, curve);
                try (ResultSet rs = last.executeQuery()) {
                    if (rs.next()) {
                        out.put(curve, new LastQuote(rs.getLong(1), rs.getTimestamp(2).toInstant()));
                    }
                }
                next.setString(1, curve);
                curve = firstString(next);
            }
        } catch (SQLException e) {
            throw new JournalException("cannot read each curve's latest quote", e);
        }
        return out;
    }

    private static String firstString(PreparedStatement s) throws SQLException {
        try (ResultSet rs = s.executeQuery()) {
            return rs.next() ? rs.getString(1) : null;
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
        return history(spreadId, from, to, null);
    }

    /**
     * As {@link #history(String, LocalDate, LocalDate)} as the journal held it at {@code asOf}:
     * the value of a date is the last one recorded at or before that moment. Null: now.
     */
    public List<HistoryPoint> history(String spreadId, LocalDate from, LocalDate to, Instant asOf) {
        return history(spreadId, from, to, asOf, Integer.MAX_VALUE);
    }

    /** As {@link #history(String, LocalDate, LocalDate, Instant)}, the first {@code limit} dates only. */
    public List<HistoryPoint> history(String spreadId, LocalDate from, LocalDate to, Instant asOf, int limit) {
        String sql = "SELECT market_date, value_bp, seq FROM observation WHERE spread_id = ? AND market_date >= ? AND market_date <= ? "
                + (asOf == null ? "" : "AND recorded_at <= ? ") + "ORDER BY market_date, id";
        Map<LocalDate, HistoryPoint> byDate = new LinkedHashMap<>();
        try {
            stream(sql, s -> {
                s.setString(1, spreadId);
                s.setDate(2, Date.valueOf(from));
                s.setDate(3, Date.valueOf(to));
                if (asOf != null) {
                    s.setTimestamp(4, Timestamp.from(asOf));
                }
            }, rs -> {
                while (rs.next()) {
                    LocalDate d = rs.getDate(1).toLocalDate();
                    if (!byDate.containsKey(d) && byDate.size() == limit) {
                        return; // the rows come by date: the dates asked for are complete
                    }
                    byDate.put(d, new HistoryPoint(d, rs.getDouble(2), rs.getLong(3)));
                }
            }, "the history of " + spreadId);
        } catch (IOException e) {
            throw new UncheckedIOException(e); // the rows go to a map, which never throws it
        }
        return new ArrayList<>(byDate.values());
    }

    /**
     * A spread's ended spells as the journal holds them now, oldest first: each as it stands after
     * any revision or restatement of its figures.
     */
    public List<Spell> spells(SpreadKey spread) {
        List<Spell> out = new ArrayList<>();
        try {
            stream("SELECT spell_id, start_date, confirmed_date, confirmed_by, end_date, duration_days, observations, deepest_bp, "
                    + "deepest_date, area_bp_days FROM spell WHERE spread_id = ? ORDER BY spell_id", s -> s.setString(1, spread.id()), rs -> {
                        while (rs.next()) {
                            Date confirmed = rs.getDate(3);
                            out.add(new Spell(spread, rs.getLong(1), rs.getDate(2).toLocalDate(), confirmed == null ? null : confirmed.toLocalDate(),
                                    rs.getString(4), rs.getDate(5).toLocalDate(), rs.getLong(6), rs.getInt(7), rs.getDouble(8),
                                    rs.getDate(9).toLocalDate(), rs.getDouble(10)));
                        }
                    }, "the spells of " + spread.id());
        } catch (IOException e) {
            throw new UncheckedIOException(e); // the rows go to a list, which never throws it
        }
        return out;
    }

    /**
     * Transitions in market-date order.
     *
     * @param spreadId           one spread, or null for all
     * @param includeSuperseded  also those a revision replaced
     */
    public List<StoredTransition> transitions(String spreadId, LocalDate from, LocalDate to, boolean includeSuperseded, int limit) {
        return transitions(new JournalRange(spreadId, from, to, null), includeSuperseded, limit);
    }

    /**
     * Transitions in market-date order as the journal held them at {@code range.asOf()}: those
     * recorded by then, each marked superseded only if the revision that replaced it had been
     * recorded by then too (before a revision, the transitions it later replaced were standing).
     */
    public List<StoredTransition> transitions(JournalRange range, boolean includeSuperseded, int limit) {
        return transitions(range, includeSuperseded, null, limit);
    }

    /**
     * As {@link #transitions(JournalRange, boolean, int)}, those after {@code after} in the same
     * order (null: from the first): one page of the list, whichever pages came before.
     */
    public List<StoredTransition> transitions(JournalRange range, boolean includeSuperseded, TransitionPosition after, int limit) {
        List<StoredTransition> out = new ArrayList<>();
        String sql = transitionSql(range, includeSuperseded, after == null ? "" : " AND (t.market_date > ? OR (t.market_date = ? AND t.id > ?))",
                "t.market_date, t.id");
        try (Connection c = dataSource.getConnection(); PreparedStatement s = c.prepareStatement(sql)) {
            int next = bindTransitions(s, range, includeSuperseded);
            if (after != null) {
                s.setDate(next, Date.valueOf(after.date()));
                s.setDate(next + 1, Date.valueOf(after.date()));
                s.setLong(next + 2, after.id());
            }
            s.setMaxRows(limit);
            try (ResultSet rs = s.executeQuery()) {
                while (rs.next()) {
                    out.add(transition(rs, range.asOf()));
                }
            }
        } catch (SQLException e) {
            throw new JournalException("cannot read transitions", e);
        }
        return out;
    }

    /** Every transition of a range, superseded ones included and marked as of the range's moment, streamed in market-date order. */
    public void eachTransition(JournalRange range, RowSink<StoredTransition> sink) throws IOException {
        stream(transitionSql(range, true, "", "t.market_date, t.id"), s -> bindTransitions(s, range, true), rs -> {
            while (rs.next()) {
                sink.accept(transition(rs, range.asOf()));
            }
        }, "transitions");
    }

    /**
     * The query of a range's transitions: {@code condition} (with its own parameters, bound after
     * those of {@link #bindTransitions}) narrows it further, {@code order} is its ORDER BY.
     */
    static String transitionSql(JournalRange range, boolean includeSuperseded, String condition, String order) {
        // the revision's own time decides whether a transition was superseded at the moment asked about
        StringBuilder sql = new StringBuilder("SELECT t.id, t.spread_id, t.market_date, t.from_state, t.to_state, t.reason, t.test, "
                + "t.window_label, t.measured, t.limit_value, t.value_bp, t.days_inverted, t.spell_id, t.seq, t.superseded_by, t.recorded_at, "
                + "r.recorded_at FROM transition t LEFT JOIN revision r ON r.id = t.superseded_by WHERE t.market_date >= ? AND t.market_date <= ?");
        if (range.spreadId() != null) {
            sql.append(" AND t.spread_id = ?");
        }
        if (range.asOf() != null) {
            sql.append(" AND t.recorded_at <= ?");
        }
        if (!includeSuperseded) {
            sql.append(range.asOf() == null ? " AND t.superseded_by IS NULL" : " AND (t.superseded_by IS NULL OR r.recorded_at > ?)");
        }
        return sql.append(condition).append(" ORDER BY ").append(order).toString();
    }

    /** @return the index of the next parameter */
    static int bindTransitions(PreparedStatement s, JournalRange range, boolean includeSuperseded) throws SQLException {
        int next = range.bind(s);
        if (range.asOf() != null && !includeSuperseded) {
            s.setTimestamp(next++, Timestamp.from(range.asOf()));
        }
        return next;
    }

    static StoredTransition transition(ResultSet rs, Instant asOf) throws SQLException {
        long superseded = rs.getLong(15);
        boolean marked = !rs.wasNull();
        Timestamp revisedAt = rs.getTimestamp(17);
        if (marked && asOf != null && (revisedAt == null || revisedAt.toInstant().isAfter(asOf))) {
            marked = false; // the revision came later: at asOf this transition was standing
        }
        return new StoredTransition(rs.getLong(1), rs.getString(2), rs.getDate(3).toLocalDate(), rs.getString(4),
                rs.getString(5), rs.getString(6), rs.getString(7), rs.getString(8), rs.getDouble(9), rs.getDouble(10),
                rs.getDouble(11), rs.getLong(12), rs.getLong(13), rs.getLong(14), marked ? superseded : null,
                rs.getTimestamp(16).toInstant());
    }

    /**
     * Every journalled value of a range in order of spread, market date and recording, each
     * marked standing or replaced as of the range's moment, at most {@code max} of them.
     */
    public List<StoredObservation> observations(JournalRange range, int max) {
        List<StoredObservation> out = new ArrayList<>();
        try {
            observationRows(range, max, out::add);
        } catch (IOException e) {
            throw new UncheckedIOException(e); // a list never throws it
        }
        return out;
    }

    /** As {@link #observations(JournalRange, int)}, all of them, streamed. */
    public void eachObservation(JournalRange range, RowSink<StoredObservation> sink) throws IOException {
        observationRows(range, Long.MAX_VALUE, sink);
    }

    private void observationRows(JournalRange range, long max, RowSink<StoredObservation> sink) throws IOException {
        String sql = "SELECT id, spread_id, market_date, value_bp, seq, recorded_at FROM observation WHERE market_date >= ? AND market_date <= ?"
                + (range.spreadId() == null ? "" : " AND spread_id = ?") + (range.asOf() == null ? "" : " AND recorded_at <= ?")
                + " ORDER BY spread_id, market_date, id";
        stream(sql, range::bind, rs -> {
            // a value stands until a later row for the same spread and date replaces it: one row of look-ahead tells
            StoredObservation pending = null;
            long emitted = 0;
            while (emitted < max && rs.next()) {
                StoredObservation o = new StoredObservation(rs.getLong(1), rs.getString(2), rs.getDate(3).toLocalDate(), rs.getDouble(4),
                        rs.getLong(5), true, rs.getTimestamp(6).toInstant());
                if (pending != null) {
                    sink.accept(pending.spreadId().equals(o.spreadId()) && pending.date().equals(o.date()) ? pending.replaced() : pending);
                    emitted++;
                }
                pending = o;
            }
            if (pending != null && emitted < max) {
                sink.accept(pending);
            }
        }, "observations");
    }

    /** The most recent rejects, newest first. */
    public List<StoredReject> rejects(int limit) {
        return rejects(limit, null);
    }

    /** The most recent rejects recorded at or before {@code asOf} (null: now), newest first. */
    public List<StoredReject> rejects(int limit, Instant asOf) {
        return rejects(limit, asOf, null);
    }

    /**
     * As {@link #rejects(int, Instant)}, those after the reject {@code before} in the same order
     * (ids below it; null: from the newest): one page of the list.
     */
    public List<StoredReject> rejects(int limit, Instant asOf, Long before) {
        List<StoredReject> out = new ArrayList<>();
        try (Connection c = dataSource.getConnection();
             PreparedStatement s = c.prepareStatement("SELECT id, origin, reason, detail, item, raw, recorded_at FROM reject WHERE 1 = 1"
                     + (asOf == null ? "" : " AND recorded_at <= ?") + (before == null ? "" : " AND id < ?") + " ORDER BY id DESC")) {
            int i = 1;
            if (asOf != null) {
                s.setTimestamp(i++, Timestamp.from(asOf));
            }
            if (before != null) {
                s.setLong(i, before);
            }
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

    private void stream(String query, JournalSql.Binder binder, JournalSql.Cursor cursor, String what) throws IOException {
        sql.stream(query, binder, cursor, what);
    }
}
