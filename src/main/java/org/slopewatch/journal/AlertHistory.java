package org.slopewatch.journal;

import java.io.IOException;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import javax.sql.DataSource;
import org.slopewatch.rules.Alert;

/**
 * The stored notices read back: one for the API with its deliveries and acknowledgements, streamed
 * for exports, the latest of each episode for the desk's recovery, and those of some kinds for a
 * what-if to compare with; the API's lists read them a page at a time ({@link NewestAlerts},
 * {@link TimelineRows}, through the same {@link #filter} of a range). Notices are written by
 * {@link JournalWriter} in the transaction of the step that decided them ({@link AlertRows#insert}).
 */
public final class AlertHistory {

    /** A stored notice with what the rule engine needs to pick up its episode after a restart. */
    public record StoredAlert(Alert alert, String subject, LocalDate episodeSince, int notice, String quietedBy, String policyHash,
                              Instant recordedAt) {
    }

    /** A stored notice with its deliveries and acknowledgements, as the API lists it. */
    public record AlertView(StoredAlert stored, List<DeliveryOutbox.Delivery> deliveries, List<Ack> acks) {
    }

    public record Ack(String alertId, String by, String note, Instant at) {
    }

    private final JournalSql sql;
    private final AlertViews views;

    public AlertHistory(DataSource dataSource) {
        this.sql = new JournalSql(dataSource);
        this.views = new AlertViews(sql, new DeliveryAttempts(dataSource));
    }

    /** One alert with its deliveries and acknowledgements, or null. */
    public AlertView find(String id) {
        List<AlertView> found = views.of(alerts("SELECT " + AlertRows.ALERT_COLUMNS + " FROM alert a WHERE a.id = ?",
                s -> s.setString(1, id)), null);
        return found.isEmpty() ? null : found.get(0);
    }

    /** Every alert of a range ({@code spreadId} is the subject, null for all), streamed oldest first. */
    public void eachAlert(JournalRange range, RowSink<StoredAlert> sink) throws IOException {
        String query = "SELECT " + AlertRows.ALERT_COLUMNS + " FROM alert a WHERE " + filter(range) + " ORDER BY a.created_at, a.id";
        sql.stream(query, range::bind, rs -> {
            while (rs.next()) {
                sink.accept(AlertRows.alert(rs));
            }
        }, "alerts");
    }

    /**
     * The notices of a range, for a query that reads {@code alert a} and binds the range with
     * {@link JournalRange#bind} first: a market date in the range, or none (a stale feed's notice
     * belongs to every range); the range's spread as subject; recorded by its moment.
     */
    static String filter(JournalRange range) {
        // notices without a market date (a stale feed) belong to every range
        return "(a.market_date IS NULL OR (a.market_date >= ? AND a.market_date <= ?))"
                + (range.spreadId() == null ? "" : " AND a.subject = ?") + (range.asOf() == null ? "" : " AND a.recorded_at <= ?");
    }

    /** The latest notice of every rule and subject: where each episode stands. */
    public List<StoredAlert> latestPerEpisode() {
        Map<String, StoredAlert> latest = new LinkedHashMap<>();
        sql.query("SELECT " + AlertRows.ALERT_COLUMNS + " FROM alert a ORDER BY a.created_at, a.notice", JournalSql.NONE, rs -> {
            StoredAlert a = AlertRows.alert(rs);
            latest.put(a.alert().rule() + "|" + a.subject(), a);
        }, "alerts");
        return List.copyOf(latest.values());
    }

    /**
     * Every notice of the given kinds, oldest first, without deliveries: what did fire, for a
     * what-if to compare with.
     */
    public List<StoredAlert> notices(Set<Alert.Kind> kinds) {
        List<StoredAlert> out = new ArrayList<>();
        if (kinds.isEmpty()) {
            return out;
        }
        // a journal written before the present names also holds the old ones
        List<String> names = kinds.stream().flatMap(k -> k.storedNames().stream()).sorted().toList();
        sql.query("SELECT " + AlertRows.ALERT_COLUMNS + " FROM alert a WHERE a.kind IN (" + JournalSql.placeholders(names.size())
                + ") ORDER BY a.created_at, a.id", s -> JournalSql.bind(s, names), rs -> out.add(AlertRows.alert(rs)), "alerts");
        return out;
    }

    /** The alerts a query finds, by id in the order found. */
    private Map<String, StoredAlert> alerts(String query, JournalSql.Binder binder) {
        Map<String, StoredAlert> alerts = new LinkedHashMap<>();
        sql.query(query, binder, rs -> {
            StoredAlert a = AlertRows.alert(rs);
            alerts.put(a.alert().id(), a);
        }, "alerts");
        return alerts;
    }
}
