package org.slopewatch.journal;

import java.sql.Connection;
import java.sql.Date;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.sql.Types;
import java.util.List;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.Severity;

/**
 * How a notice and its outbox rows are written and read back: the insert of a step's new notices
 * in the step's transaction, and the columns and records of the {@code alert} and
 * {@code delivery} tables that the stores read.
 */
final class AlertRows {

    static final String ALERT_COLUMNS = "a.id, a.rule, a.subject, a.episode_since, a.notice, a.kind, a.severity, a.market_date, "
            + "a.state, a.title, a.body, a.facts, a.dashboard, a.muted_by, a.policy_hash, a.created_at, a.recorded_at";
    static final String DELIVERY_COLUMNS = "d.alert_id, d.channel, d.status, d.attempts, d.next_attempt_at, d.first_attempt_at, "
            + "d.last_detail, d.updated_at";

    private AlertRows() {
    }

    /** Inserts notices not stored yet and their outbox rows; part of the caller's transaction. */
    static void insert(Connection c, List<JournalEntries.AlertEntry> alerts, Timestamp now) throws SQLException {
        if (alerts.isEmpty()) {
            return;
        }
        try (PreparedStatement exists = c.prepareStatement("SELECT 1 FROM alert WHERE id = ?");
             PreparedStatement a = c.prepareStatement("INSERT INTO alert (id, rule, subject, episode_since, notice, kind, severity, "
                     + "market_date, state, title, body, facts, dashboard, muted_by, policy_hash, seq, created_at, recorded_at) "
                     + "VALUES (?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?)");
             PreparedStatement d = c.prepareStatement("INSERT INTO delivery (alert_id, channel, status, attempts, next_attempt_at, "
                     + "last_detail, updated_at, recorded_at) VALUES (?,?,?,0,?,?,?,?)")) {
            for (JournalEntries.AlertEntry e : alerts) {
                Alert alert = e.alert();
                exists.setString(1, alert.id());
                try (ResultSet rs = exists.executeQuery()) {
                    if (rs.next()) {
                        continue; // decided before (a restart or another instance): never twice
                    }
                }
                a.setString(1, alert.id());
                a.setString(2, alert.rule());
                a.setString(3, e.subject());
                a.setDate(4, e.episodeSince() == null ? null : Date.valueOf(e.episodeSince()));
                a.setInt(5, e.notice());
                a.setString(6, alert.kind().name());
                a.setString(7, alert.severity().name());
                a.setDate(8, alert.marketDate() == null ? null : Date.valueOf(alert.marketDate()));
                a.setString(9, alert.state());
                a.setString(10, JournalWriter.fit(alert.subject(), 400));
                a.setString(11, JournalWriter.fit(alert.text(), 8000));
                a.setString(12, JournalWriter.fit(FactsText.write(alert.facts()), 4000));
                a.setString(13, alert.dashboard());
                a.setString(14, JournalWriter.fit(e.mutedBy(), AlertColumns.MUTED_BY_CHARS));
                a.setString(15, e.policyHash());
                if (e.seq() == null) {
                    a.setNull(16, Types.BIGINT);
                } else {
                    a.setLong(16, e.seq());
                }
                a.setTimestamp(17, Timestamp.from(alert.createdAt()));
                a.setTimestamp(18, now);
                a.executeUpdate();
                for (JournalEntries.Outbox o : e.outbox()) {
                    d.setString(1, alert.id());
                    d.setString(2, o.channel());
                    d.setString(3, (o.skipped() == null ? DeliveryOutbox.Status.PENDING : DeliveryOutbox.Status.SKIPPED).name());
                    d.setTimestamp(4, o.skipped() == null ? Timestamp.from(alert.createdAt()) : null);
                    d.setString(5, JournalWriter.fit(o.skipped(), 1000));
                    d.setTimestamp(6, now);
                    d.setTimestamp(7, now);
                    d.addBatch();
                }
            }
            d.executeBatch();
        }
    }

    /** A row read with {@link #ALERT_COLUMNS} first. */
    static AlertHistory.StoredAlert alert(ResultSet rs) throws SQLException {
        Date since = rs.getDate(4);
        Date market = rs.getDate(8);
        Alert alert = new Alert(rs.getString(1), rs.getString(2), Severity.valueOf(rs.getString(7)), Alert.Kind.valueOf(rs.getString(6)),
                rs.getString(3), market == null ? null : market.toLocalDate(), rs.getString(9), rs.getString(10), rs.getString(11),
                FactsText.read(rs.getString(12)), rs.getString(13), JournalSql.instant(rs, 16));
        return new AlertHistory.StoredAlert(alert, rs.getString(3), since == null ? null : since.toLocalDate(), rs.getInt(5),
                rs.getString(14), rs.getString(15), JournalSql.instant(rs, 17));
    }

    /** A row read with {@link #DELIVERY_COLUMNS} from column {@code first} on. */
    static DeliveryOutbox.Delivery delivery(ResultSet rs, int first) throws SQLException {
        return new DeliveryOutbox.Delivery(rs.getString(first), rs.getString(first + 1),
                DeliveryOutbox.Status.valueOf(rs.getString(first + 2)), rs.getInt(first + 3), JournalSql.instant(rs, first + 4),
                JournalSql.instant(rs, first + 5), rs.getString(first + 6), JournalSql.instant(rs, first + 7));
    }
}
