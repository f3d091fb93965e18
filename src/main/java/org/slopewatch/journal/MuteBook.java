package org.slopewatch.journal;

import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.Timestamp;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import javax.sql.DataSource;

/**
 * Mutes of a rule or a spread until a time, journalled with who and why, and lifted early with who
 * lifted them; every mute stays in the book, so the desk rebuilds the active ones after a restart.
 */
public final class MuteBook {

    public record Mute(long id, String kind, String target, Instant until, String reason, String by, Instant createdAt,
                       Instant liftedAt, String liftedBy) {

        public boolean activeAt(Instant now) {
            return liftedAt == null && until.isAfter(now);
        }
    }

    private final JournalSql sql;
    private final Clock clock;

    public MuteBook(DataSource dataSource, Clock clock) {
        this.sql = new JournalSql(dataSource);
        this.clock = clock;
    }

    /** Stores a mute and returns it with its id. */
    public Mute mute(String kind, String target, Instant until, String reason, String by) {
        Instant now = clock.instant();
        long id = sql.transaction(c -> {
            try (PreparedStatement s = c.prepareStatement("INSERT INTO mute (target_kind, target, until_at, reason, muted_by, recorded_at) "
                    + "VALUES (?,?,?,?,?,?)", new String[] {"id"})) {
                s.setString(1, kind);
                s.setString(2, JournalWriter.fit(target, AlertColumns.TARGET_CHARS));
                s.setTimestamp(3, Timestamp.from(until));
                s.setString(4, JournalWriter.fit(reason, AlertColumns.REASON_CHARS));
                s.setString(5, JournalWriter.fit(by, AlertColumns.BY_CHARS));
                s.setTimestamp(6, Timestamp.from(now));
                s.executeUpdate();
                try (ResultSet keys = s.getGeneratedKeys()) {
                    keys.next();
                    return keys.getLong(1);
                }
            }
        }, "alert records");
        return new Mute(id, kind, target, until, reason, by, now, null, null);
    }

    /** Ends a mute early; false when there is no such mute or it was lifted already. */
    public boolean lift(long id, String by) {
        Timestamp now = Timestamp.from(clock.instant());
        return sql.update("UPDATE mute SET lifted_at = ?, lifted_by = ? WHERE id = ? AND lifted_at IS NULL", s -> {
            s.setTimestamp(1, now);
            s.setString(2, JournalWriter.fit(by, AlertColumns.BY_CHARS));
            s.setLong(3, id);
        }, "alert records") == 1;
    }

    /** All mutes, newest first. */
    public List<Mute> mutes() {
        List<Mute> out = new ArrayList<>();
        sql.query("SELECT id, target_kind, target, until_at, reason, muted_by, recorded_at, lifted_at, lifted_by FROM mute ORDER BY id DESC",
                JournalSql.NONE, rs -> out.add(new Mute(rs.getLong(1), rs.getString(2), rs.getString(3), JournalSql.instant(rs, 4),
                        rs.getString(5), rs.getString(6), JournalSql.instant(rs, 7), JournalSql.instant(rs, 8), rs.getString(9))),
                "alerts");
        return out;
    }
}
