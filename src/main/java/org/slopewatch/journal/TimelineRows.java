package org.slopewatch.journal;

import java.sql.Date;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javax.sql.DataSource;

/**
 * What the journal holds about a range (one spread, market dates, as of a moment), kind by kind,
 * in the order it was recorded, a page at a time: each query reads the rows of its kind after a
 * {@link Position}, so that a timeline merged from them can be read page after page with every
 * row once. The order is total and the same in every query: recording time; within one recording
 * (one pipeline step is one transaction, so its rows share the time) the {@link Kind}s in turn;
 * within a kind the row id (a notice: its creation time, then its id).
 */
public final class TimelineRows {

    /** The kinds of rows, in the order rows recorded together are listed: inputs before conclusions. */
    public enum Kind { OBSERVATION, TRANSITION, ALERT, ATTEMPT, ACK }

    /**
     * A row's place in the timeline.
     *
     * @param id        the row id (unused for a notice)
     * @param createdAt a notice's creation time (null for other kinds)
     * @param alertId   a notice's id (null for other kinds)
     */
    public record Position(Instant recordedAt, Kind kind, long id, Instant createdAt, String alertId) {

        public static Position of(Instant recordedAt, Kind kind, long id) {
            return new Position(recordedAt, kind, id, null, null);
        }

        public static Position ofAlert(Instant recordedAt, Instant createdAt, String alertId) {
            return new Position(recordedAt, Kind.ALERT, 0, createdAt, alertId);
        }
    }

    /** A row and its place. */
    public record Row<T>(T value, Position position) {
    }

    /** An acknowledgement and its row id, which orders acknowledgements recorded at the same moment. */
    private record AckRow(AlertHistory.Ack ack, long id) {
    }

    private final JournalSql sql;
    private final AlertViews views;

    public TimelineRows(DataSource dataSource) {
        this.sql = new JournalSql(dataSource);
        this.views = new AlertViews(sql, new DeliveryAttempts(dataSource));
    }

    /** Computed spread values, each marked standing unless a later value for its spread and date was recorded by the range's moment. */
    public List<Row<JournalReader.StoredObservation>> observations(JournalRange range, Position after, int limit) {
        List<Object> params = new ArrayList<>();
        if (range.asOf() != null) {
            params.add(range.asOf());
        }
        params.add(range.from());
        params.add(range.to());
        if (range.spreadId() != null) {
            params.add(range.spreadId());
        }
        if (range.asOf() != null) {
            params.add(range.asOf());
        }
        // the same rule as JournalReader.observations: a value stands until a row with a higher id replaces it
        String query = "SELECT o.id, o.spread_id, o.market_date, o.value_bp, o.seq, o.recorded_at, CASE WHEN EXISTS (SELECT 1 FROM observation n "
                + "WHERE n.spread_id = o.spread_id AND n.market_date = o.market_date AND n.id > o.id"
                + (range.asOf() == null ? "" : " AND n.recorded_at <= ?") + ") THEN 0 ELSE 1 END FROM observation o "
                + "WHERE o.market_date >= ? AND o.market_date <= ?" + (range.spreadId() == null ? "" : " AND o.spread_id = ?")
                + (range.asOf() == null ? "" : " AND o.recorded_at <= ?") + after("o", Kind.OBSERVATION, after, params)
                + " ORDER BY o.recorded_at, o.id";
        List<Row<JournalReader.StoredObservation>> out = new ArrayList<>();
        sql.query(query, s -> bind(s, 1, params), limit, rs -> {
            var o = new JournalReader.StoredObservation(rs.getLong(1), rs.getString(2), rs.getDate(3).toLocalDate(), rs.getDouble(4),
                    rs.getLong(5), rs.getInt(7) == 1, rs.getTimestamp(6).toInstant());
            out.add(new Row<>(o, Position.of(o.recordedAt(), Kind.OBSERVATION, o.id())));
        }, "observations");
        return out;
    }

    /** Transitions, superseded ones included and marked as of the range's moment. */
    public List<Row<JournalReader.StoredTransition>> transitions(JournalRange range, Position after, int limit) {
        List<Object> params = new ArrayList<>();
        String query = JournalReader.transitionSql(range, true, after("t", Kind.TRANSITION, after, params), "t.recorded_at, t.id");
        List<Row<JournalReader.StoredTransition>> out = new ArrayList<>();
        sql.query(query, s -> bind(s, JournalReader.bindTransitions(s, range, true), params), limit, rs -> {
            var t = JournalReader.transition(rs, range.asOf());
            out.add(new Row<>(t, Position.of(t.recordedAt(), Kind.TRANSITION, t.id())));
        }, "transitions");
        return out;
    }

    /** Notices about the range's subject, with their deliveries as they stood at the range's moment. */
    public List<Row<AlertHistory.AlertView>> alerts(JournalRange range, Position after, int limit) {
        List<Object> params = new ArrayList<>();
        String query = "SELECT " + AlertRows.ALERT_COLUMNS + " FROM alert a WHERE " + AlertHistory.filter(range)
                + after("a", Kind.ALERT, after, params) + " ORDER BY a.recorded_at, a.created_at, a.id";
        Map<String, AlertHistory.StoredAlert> alerts = new LinkedHashMap<>();
        sql.query(query, s -> bind(s, range.bind(s), params), limit, rs -> {
            AlertHistory.StoredAlert a = AlertRows.alert(rs);
            alerts.put(a.alert().id(), a);
        }, "alerts");
        return views.of(alerts, range.asOf()).stream().map(v -> new Row<>(v,
                Position.ofAlert(v.stored().recordedAt(), v.stored().alert().createdAt(), v.stored().alert().id()))).toList();
    }

    /** Delivery attempts of the notices of the range, recorded by its moment. */
    public List<Row<DeliveryAttempts.StoredAttempt>> attempts(JournalRange range, Position after, int limit) {
        List<Object> params = new ArrayList<>();
        if (range.asOf() != null) {
            params.add(range.asOf());
        }
        String query = "SELECT " + DeliveryAttempts.STORED_COLUMNS + " FROM delivery_attempt x JOIN alert a ON a.id = x.alert_id WHERE "
                + AlertHistory.filter(range) + (range.asOf() == null ? "" : " AND x.recorded_at <= ?") + after("x", Kind.ATTEMPT, after, params)
                + " ORDER BY x.recorded_at, x.id";
        List<Row<DeliveryAttempts.StoredAttempt>> out = new ArrayList<>();
        sql.query(query, s -> bind(s, range.bind(s), params), limit, rs -> {
            DeliveryAttempts.StoredAttempt a = DeliveryAttempts.stored(rs);
            out.add(new Row<>(a, Position.of(a.recordedAt(), Kind.ATTEMPT, a.id())));
        }, "delivery attempts");
        return out;
    }

    /** Acknowledgements of the notices of the range, recorded by its moment. */
    public List<Row<AlertHistory.Ack>> acks(JournalRange range, Position after, int limit) {
        List<Object> params = new ArrayList<>();
        if (range.asOf() != null) {
            params.add(range.asOf());
        }
        // the columns AlertViews reads an acknowledgement from, then the row id
        String query = "SELECT k.alert_id, k.acked_by, k.note, k.recorded_at, k.id FROM alert_ack k JOIN alert a ON a.id = k.alert_id WHERE "
                + AlertHistory.filter(range) + (range.asOf() == null ? "" : " AND k.recorded_at <= ?") + after("k", Kind.ACK, after, params)
                + " ORDER BY k.recorded_at, k.id";
        List<AckRow> rows = new ArrayList<>();
        sql.query(query, s -> bind(s, range.bind(s), params), limit, rs -> rows.add(new AckRow(AlertViews.ack(rs), rs.getLong(5))),
                "acknowledgements");
        return rows.stream().map(r -> new Row<>(r.ack(), Position.of(r.ack().at(), Kind.ACK, r.id()))).toList();
    }

    /**
     * The condition that keeps the rows of {@code kind} after {@code after}: recorded later; or
     * recorded at the same moment, of a later kind; or of the same kind, later in its order.
     */
    private static String after(String alias, Kind kind, Position after, List<Object> params) {
        if (after == null) {
            return "";
        }
        params.add(after.recordedAt());
        int order = kind.compareTo(after.kind());
        if (order < 0) {
            return " AND " + alias + ".recorded_at > ?";
        }
        if (order > 0) {
            return " AND " + alias + ".recorded_at >= ?";
        }
        params.add(after.recordedAt());
        if (kind == Kind.ALERT) {
            params.add(after.createdAt());
            params.add(after.createdAt());
            params.add(after.alertId());
            return " AND (a.recorded_at > ? OR (a.recorded_at = ? AND (a.created_at > ? OR (a.created_at = ? AND a.id > ?))))";
        }
        params.add(after.id());
        return " AND (" + alias + ".recorded_at > ? OR (" + alias + ".recorded_at = ? AND " + alias + ".id > ?))";
    }

    private static int bind(PreparedStatement s, int first, List<Object> values) throws SQLException {
        int i = first;
        for (Object v : values) {
            if (v instanceof Instant t) {
                s.setTimestamp(i++, Timestamp.from(t));
            } else if (v instanceof LocalDate d) {
                s.setDate(i++, Date.valueOf(d));
            } else if (v instanceof Long n) {
                s.setLong(i++, n);
            } else {
                s.setString(i++, (String) v);
            }
        }
        return i;
    }
}
