package org.slopewatch.journal;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import javax.sql.DataSource;

/**
 * The journalled delivery attempts read back ({@link DeliveryOutbox#attempt} writes them): every
 * try of one notice for a post-mortem, and those of several notices up to a moment, for timelines
 * and for where a delivery stood then ({@link DeliveryAsOf}).
 */
public final class DeliveryAttempts {

    /** One journalled delivery attempt. */
    public record Attempt(String channel, int attempt, String outcome, String detail, String decision, Instant attemptedAt) {
    }

    /** One journalled delivery attempt with its alert and when it was recorded, for timelines and as-of answers. */
    public record StoredAttempt(long id, String alertId, String channel, int attempt, String outcome, String detail, String decision,
                                Instant attemptedAt, Instant recordedAt) {
    }

    /** The columns {@link #stored} reads, of {@code delivery_attempt} as {@code x}. */
    static final String STORED_COLUMNS = "x.id, x.alert_id, x.channel, x.attempt, x.outcome, x.detail, x.decision, x.attempted_at, "
            + "x.recorded_at";

    private final JournalSql sql;

    public DeliveryAttempts(DataSource dataSource) {
        this.sql = new JournalSql(dataSource);
    }

    /** The delivery attempts of some alerts recorded at or before {@code asOf} (null: all), in the order they were recorded. */
    public List<StoredAttempt> attempts(List<String> alertIds, Instant asOf) {
        List<StoredAttempt> out = new ArrayList<>();
        for (List<String> ids : JournalSql.chunks(alertIds)) {
            sql.query("SELECT " + STORED_COLUMNS + " FROM delivery_attempt x WHERE x.alert_id IN (" + JournalSql.placeholders(ids.size())
                    + ")" + (asOf == null ? "" : " AND x.recorded_at <= ?") + " ORDER BY x.id", s -> {
                        JournalSql.bind(s, ids);
                        if (asOf != null) {
                            s.setTimestamp(ids.size() + 1, Timestamp.from(asOf));
                        }
                    }, rs -> out.add(stored(rs)), "alerts");
        }
        out.sort(Comparator.comparingLong(StoredAttempt::id));
        return out;
    }

    /** Every delivery attempt of an alert, in the order they were made. */
    public List<Attempt> attempts(String alertId) {
        List<Attempt> out = new ArrayList<>();
        sql.query("SELECT channel, attempt, outcome, detail, decision, attempted_at FROM delivery_attempt WHERE alert_id = ? ORDER BY id",
                s -> s.setString(1, alertId), rs -> out.add(new Attempt(rs.getString(1), rs.getInt(2), rs.getString(3), rs.getString(4),
                        rs.getString(5), JournalSql.instant(rs, 6))), "alerts");
        return out;
    }

    /** A row read with {@link #STORED_COLUMNS} first. */
    static StoredAttempt stored(ResultSet rs) throws SQLException {
        return new StoredAttempt(rs.getLong(1), rs.getString(2), rs.getString(3), rs.getInt(4), rs.getString(5), rs.getString(6),
                rs.getString(7), JournalSql.instant(rs, 8), JournalSql.instant(rs, 9));
    }
}
