package org.slopewatch.journal;

import java.sql.Date;
import java.sql.PreparedStatement;
import java.sql.Timestamp;
import java.time.Clock;
import java.time.LocalDate;
import java.util.HashSet;
import java.util.Set;
import javax.sql.DataSource;

/**
 * Acknowledgements of notices, journalled with who and when: an acknowledged episode sends no more
 * standing notices, and the desk asks here after a restart, and whenever {@link DeskChanges} moved,
 * which open episodes were acknowledged. Each acknowledgement counts as a change of the desk in its
 * own transaction. The API lists them with their notices ({@link AlertHistory}).
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
        sql.transaction(c -> {
            try (PreparedStatement s = c.prepareStatement("INSERT INTO alert_ack (alert_id, acked_by, note, recorded_at) VALUES (?,?,?,?)")) {
                s.setString(1, alertId);
                s.setString(2, JournalWriter.fit(by, AlertColumns.BY_CHARS));
                s.setString(3, JournalWriter.fit(note, AlertColumns.NOTE_CHARS));
                s.setTimestamp(4, now);
                s.executeUpdate();
            }
            DeskChanges.bump(c);
            return null;
        }, "alert records");
    }

    /**
     * Every acknowledged episode, as {@link #episodeKey}: what the desk compares its open episodes
     * with when another instance may have acknowledged one. Acknowledgements are made by people, so
     * the list stays short.
     */
    public Set<String> acknowledgedEpisodes() {
        Set<String> out = new HashSet<>();
        sql.query("SELECT DISTINCT a.rule, a.subject, a.episode_since FROM alert_ack k JOIN alert a ON a.id = k.alert_id "
                + "WHERE a.episode_since IS NOT NULL", JournalSql.NONE,
                rs -> out.add(episodeKey(rs.getString(1), rs.getString(2), rs.getDate(3).toLocalDate())), "alerts");
        return out;
    }

    /** One episode: its rule, subject and start. */
    public static String episodeKey(String rule, String subject, LocalDate since) {
        return rule + "|" + subject + "|" + since;
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
