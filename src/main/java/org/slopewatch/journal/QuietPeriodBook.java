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
 * Quiet periods of a rule or a spread until a time, journalled with who set them and why, and
 * lifted early with who lifted them; every quiet period stays in the book, so the desk rebuilds the
 * active ones after a restart. Setting and lifting count as a change of the desk ({@link DeskChanges})
 * in the same transaction, so that every instance on the journal notices. The journal keeps them in its {@code mute} table, whose columns
 * predate the name.
 */
public final class QuietPeriodBook {

    /**
     * One quiet period.
     *
     * @param kind   {@code rule} or {@code spread}: what {@code target} names
     * @param target a rule's name, a spread's name (every curve) or a spread id
     */
    public record QuietPeriod(long id, String kind, String target, Instant until, String note, String setBy, Instant setAt,
                              Instant liftedAt, String liftedBy) {

        public boolean activeAt(Instant now) {
            return liftedAt == null && until.isAfter(now);
        }
    }

    private final JournalSql sql;
    private final Clock clock;

    public QuietPeriodBook(DataSource dataSource, Clock clock) {
        this.sql = new JournalSql(dataSource);
        this.clock = clock;
    }

    /** Stores a quiet period and returns it with its id. */
    public QuietPeriod add(String kind, String target, Instant until, String note, String setBy) {
        Instant now = clock.instant();
        long id = sql.transaction(c -> {
            try (PreparedStatement s = c.prepareStatement("INSERT INTO mute (target_kind, target, until_at, reason, muted_by, recorded_at) "
                    + "VALUES (?,?,?,?,?,?)", new String[] {"id"})) {
                s.setString(1, kind);
                s.setString(2, JournalWriter.fit(target, AlertColumns.TARGET_CHARS));
                s.setTimestamp(3, Timestamp.from(until));
                s.setString(4, JournalWriter.fit(note, AlertColumns.QUIET_NOTE_CHARS));
                s.setString(5, JournalWriter.fit(setBy, AlertColumns.BY_CHARS));
                s.setTimestamp(6, Timestamp.from(now));
                s.executeUpdate();
                long key;
                try (ResultSet keys = s.getGeneratedKeys()) {
                    keys.next();
                    key = keys.getLong(1);
                }
                DeskChanges.bump(c);
                return key;
            }
        }, "alert records");
        return new QuietPeriod(id, kind, target, until, note, setBy, now, null, null);
    }

    /** Ends a quiet period early; false when there is no such quiet period or it was lifted already. */
    public boolean lift(long id, String liftedBy) {
        Timestamp now = Timestamp.from(clock.instant());
        return sql.transaction(c -> {
            try (PreparedStatement s = c.prepareStatement("UPDATE mute SET lifted_at = ?, lifted_by = ? WHERE id = ? AND lifted_at IS NULL")) {
                s.setTimestamp(1, now);
                s.setString(2, JournalWriter.fit(liftedBy, AlertColumns.BY_CHARS));
                s.setLong(3, id);
                if (s.executeUpdate() != 1) {
                    return false;
                }
            }
            DeskChanges.bump(c);
            return true;
        }, "alert records");
    }

    /** Every quiet period, newest first. */
    public List<QuietPeriod> all() {
        List<QuietPeriod> out = new ArrayList<>();
        sql.query("SELECT id, target_kind, target, until_at, reason, muted_by, recorded_at, lifted_at, lifted_by FROM mute ORDER BY id DESC",
                JournalSql.NONE, rs -> out.add(new QuietPeriod(rs.getLong(1), rs.getString(2), rs.getString(3), JournalSql.instant(rs, 4),
                        rs.getString(5), rs.getString(6), JournalSql.instant(rs, 7), JournalSql.instant(rs, 8), rs.getString(9))),
                "alerts");
        return out;
    }
}
