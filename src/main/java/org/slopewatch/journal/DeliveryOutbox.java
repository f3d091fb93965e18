package org.slopewatch.journal;

import java.sql.PreparedStatement;
import java.sql.Timestamp;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import javax.sql.DataSource;
import org.slopewatch.rules.Alert;

/**
 * The outbox the dispatcher works from: one row per notice and channel, written with the notice
 * ({@link AlertRows#insert}); here what is due, the claim on a row before an attempt, and each
 * attempt recorded with where the delivery stands after it, durable before the call returns.
 */
public final class DeliveryOutbox {

    /** Outbox states. */
    public enum Status { PENDING, DELIVERED, FAILED, SKIPPED }

    /** One delivery of one alert to one channel as it stands. */
    public record Delivery(String alertId, String channel, Status status, int attempts, Instant nextAttemptAt,
                           Instant firstAttemptAt, String lastDetail, Instant updatedAt) {
    }

    /** A delivery due now, with its alert. */
    public record Due(Alert alert, Delivery delivery) {
    }

    private final JournalSql sql;
    private final Clock clock;

    public DeliveryOutbox(DataSource dataSource, Clock clock) {
        this.sql = new JournalSql(dataSource);
        this.clock = clock;
    }

    /** Deliveries of a channel due at {@code now}, oldest first. */
    public List<Due> due(String channel, Instant now, int limit) {
        String query = "SELECT " + AlertRows.ALERT_COLUMNS + ", " + AlertRows.DELIVERY_COLUMNS + " FROM delivery d JOIN alert a "
                + "ON a.id = d.alert_id WHERE d.channel = ? AND d.status = 'PENDING' AND d.next_attempt_at <= ? "
                + "ORDER BY d.next_attempt_at, a.created_at FETCH FIRST " + limit + " ROWS ONLY";
        List<Due> out = new ArrayList<>();
        sql.query(query, s -> {
            s.setString(1, channel);
            s.setTimestamp(2, Timestamp.from(now));
        }, rs -> out.add(new Due(AlertRows.alert(rs).alert(), AlertRows.delivery(rs, 18))), "alerts");
        return out;
    }

    /**
     * Claims a due delivery for one attempt by this instance, until {@code until}. False when
     * another instance holds an unexpired claim, or the row has moved on since it was read (an
     * attempt recorded, the delivery finished): then this instance must not attempt it.
     */
    public boolean claim(Delivery d, String instance, Instant now, Instant until) {
        return sql.update("UPDATE delivery SET claimed_by = ?, claimed_until = ? "
                + "WHERE alert_id = ? AND channel = ? AND status = 'PENDING' AND attempts = ? "
                + "AND (claimed_until IS NULL OR claimed_until < ? OR claimed_by = ?)", s -> {
                    s.setString(1, instance);
                    s.setTimestamp(2, Timestamp.from(until));
                    s.setString(3, d.alertId());
                    s.setString(4, d.channel());
                    s.setInt(5, d.attempts());
                    s.setTimestamp(6, Timestamp.from(now));
                    s.setString(7, instance);
                }, "alert records") == 1;
    }

    /**
     * Records one attempt and where the delivery stands after it, in one transaction, so that an
     * attempt recorded as made is not made again after a crash.
     *
     * @param next   when to try again, or null when the delivery is finished
     * @param status PENDING with {@code next}, or DELIVERED / FAILED
     */
    public void attempt(Delivery before, Instant attemptedAt, String outcome, String detail, String decision, Status status,
                        Instant next) {
        Timestamp now = Timestamp.from(clock.instant());
        sql.transaction(c -> {
            try (PreparedStatement s = c.prepareStatement("INSERT INTO delivery_attempt (alert_id, channel, attempt, outcome, detail, "
                    + "decision, attempted_at, recorded_at) VALUES (?,?,?,?,?,?,?,?)")) {
                s.setString(1, before.alertId());
                s.setString(2, before.channel());
                s.setInt(3, before.attempts() + 1);
                s.setString(4, outcome);
                s.setString(5, JournalWriter.fit(detail, 1000));
                s.setString(6, JournalWriter.fit(decision, 1000));
                s.setTimestamp(7, Timestamp.from(attemptedAt));
                s.setTimestamp(8, now);
                s.executeUpdate();
            }
            try (PreparedStatement s = c.prepareStatement("UPDATE delivery SET status = ?, attempts = attempts + 1, next_attempt_at = ?, "
                    + "first_attempt_at = COALESCE(first_attempt_at, ?), last_detail = ?, updated_at = ?, claimed_by = NULL, "
                    + "claimed_until = NULL WHERE alert_id = ? AND channel = ?")) {
                s.setString(1, status.name());
                s.setTimestamp(2, next == null ? null : Timestamp.from(next));
                s.setTimestamp(3, Timestamp.from(attemptedAt));
                s.setString(4, JournalWriter.fit(decision, 1000));
                s.setTimestamp(5, now);
                s.setString(6, before.alertId());
                s.setString(7, before.channel());
                s.executeUpdate();
            }
            return null;
        }, "alert records");
    }

    /** Pending deliveries, all channels: the outbox backlog. */
    public long backlog() {
        long[] n = {0};
        sql.query("SELECT COUNT(*) FROM delivery WHERE status = 'PENDING'", JournalSql.NONE, rs -> n[0] = rs.getLong(1), "alerts");
        return n[0];
    }
}
