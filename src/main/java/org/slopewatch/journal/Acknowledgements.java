package org.slopewatch.journal;

import java.sql.Date;
import java.sql.Timestamp;
import java.time.Clock;
import java.time.LocalDate;
import javax.sql.DataSource;

/**
 * Acknowledgements of notices, journalled with who and when: an acknowledged episode sends no more
 * standing notices, and the desk asks here after a restart whether an open episode was acknowledged. The
 * API lists them with their notices ({@link AlertHistory}).
 */
public final class Acknowledgements {

    private final JournalSql sql;
    private final Clock clock;

    public Acknowledgements(DataSource dataSource, Clock clock) {
        this.sql = new JournalSql(dataSource);
        this.clock = clock;
    }

    public void ack(String alertId, String by, String note) {
        Timestamp now = Timestamp.from(clock.instant());
        sql.update("INSERT INTO alert_ack (alert_id, acked_by, note, recorded_at) VALUES (?,?,?,?)", s -> {
            s.setString(1, alertId);
            s.setString(2, JournalWriter.fit(by, AlertColumns.BY_CHARS));
            s.setString(3, JournalWriter.fit(note, AlertColumns.NOTE_CHARS));
            s.setTimestamp(4, now);
        }, "alert records");
    }

    /** Acknowledgements of the alerts of one episode (same rule, subject and start). */
    public boolean episodeAcknowledged(String rule, String subject, LocalDate since) {
        boolean[] found = {false};
        sql.query("SELECT 1 FROM alert_ack k JOIN alert a ON a.id = k.alert_id WHERE a.rule = ? AND a.subject = ? AND a.episode_since = ?",
                s -> {
                    s.setString(1, rule);
                    s.setString(2, subject);
                    s.setDate(3, Date.valueOf(since));
                }, rs -> found[0] = true, "alerts");
        return found[0];
    }
}
