package org.slopewatch.journal;

import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Locale;
import javax.sql.DataSource;
import org.jboss.logging.Logger;

/**
 * What makes a journal commit durable before the daemon answers for it, on each database: an
 * answer of 200 or 202 promises that the quotes are on disk, whatever URL the operator gave.
 *
 * <p>H2 (2.x, MVStore) acknowledges a commit before it is written: with its default
 * {@code WRITE_DELAY} of 500 ms a background thread writes the changes later, so a process killed
 * in that time loses commits it had acknowledged. With {@code WRITE_DELAY=0} every commit writes
 * its chunk to the file before returning, but never calls fsync, which only {@code CHECKPOINT SYNC}
 * does ({@code FileChannel.force}). So on H2 the journal forces {@code WRITE_DELAY=0} (a URL that
 * sets another value is refused: with the background writer on, a chunk may still be in its
 * queue when the fsync runs) and runs {@code CHECKPOINT SYNC} after every commit, which needs the
 * admin rights the database's creator has.
 *
 * <p>PostgreSQL flushes the write-ahead log at commit unless {@code synchronous_commit} is
 * {@code off}, which a role, a database or the server may set: each journal session raises it to
 * {@code on} when it finds it off (stronger settings, such as {@code remote_apply}, are kept).
 */
final class JournalDurability {

    private static final Logger LOG = Logger.getLogger(JournalDurability.class);
    private static final String WRITE_DELAY = "WRITE_DELAY";

    /** Run once by each new PostgreSQL session: {@code on} where the session starts with {@code off}. */
    static final String POSTGRES_SESSION_SQL =
            "SELECT set_config('synchronous_commit', 'on', false) WHERE current_setting('synchronous_commit') = 'off'";

    private JournalDurability() {
    }

    /**
     * The URL to open: an H2 URL with {@code WRITE_DELAY=0} added where it does not say so already;
     * any other URL as it is.
     *
     * @throws IllegalArgumentException for an H2 URL that sets {@code WRITE_DELAY} to anything else
     */
    static String url(String jdbcUrl) {
        if (!isH2(jdbcUrl)) {
            return jdbcUrl;
        }
        String[] parts = jdbcUrl.split(";");
        for (int i = 1; i < parts.length; i++) {
            int eq = parts[i].indexOf('=');
            if (eq > 0 && parts[i].substring(0, eq).trim().toUpperCase(Locale.ROOT).equals(WRITE_DELAY)) {
                String value = parts[i].substring(eq + 1).trim();
                if (value.equals("0")) {
                    return jdbcUrl;
                }
                throw new IllegalArgumentException("the journal URL " + JournalDatabase.withoutCredentials(jdbcUrl) + " sets WRITE_DELAY="
                        + value + ": H2 would acknowledge commits before writing them, and a process that dies within that delay "
                        + "loses quotes it has answered for; leave WRITE_DELAY out (the journal sets it to 0) or set it to 0");
            }
        }
        return jdbcUrl + ";" + WRITE_DELAY + "=0";
    }

    /** SQL each new connection runs first, or null: on PostgreSQL the session's {@code synchronous_commit}. */
    static String sessionSql(String jdbcUrl) {
        return isPostgres(jdbcUrl) ? POSTGRES_SESSION_SQL : null;
    }

    /**
     * Checks, on a connection of the opened pool, that its commits will be durable, and refuses the
     * journal otherwise (an INIT script or a stored setting may undo what the URL asked for).
     */
    static void check(DataSource ds, String jdbcUrl) {
        String where = JournalDatabase.withoutCredentials(jdbcUrl);
        try (Connection c = ds.getConnection(); Statement s = c.createStatement()) {
            if (isH2(jdbcUrl)) {
                if (c.isReadOnly()) {
                    return; // opened to be read (replay --from-journal): nothing will be committed
                }
                String delay = single(s, "SELECT SETTING_VALUE FROM INFORMATION_SCHEMA.SETTINGS WHERE SETTING_NAME = 'WRITE_DELAY'");
                if (!"0".equals(delay)) {
                    throw new IllegalStateException("the H2 journal at " + where + " runs with WRITE_DELAY " + delay
                            + " although the URL asks for 0: commits would be acknowledged before they are written");
                }
                try {
                    s.execute("CHECKPOINT SYNC");
                } catch (SQLException e) {
                    throw new IllegalStateException("the H2 journal at " + where + " refuses CHECKPOINT SYNC (" + e.getMessage()
                            + "): the journal user needs admin rights, so that each commit can be forced to disk", e);
                }
            } else if (isPostgres(jdbcUrl)) {
                String commit = single(s, "SHOW synchronous_commit");
                if ("off".equalsIgnoreCase(commit)) {
                    throw new IllegalStateException("the PostgreSQL journal at " + where + " runs with synchronous_commit off: "
                            + "commits would be acknowledged before the write-ahead log is flushed");
                }
                if ("off".equalsIgnoreCase(single(s, "SHOW fsync"))) {
                    LOG.warnf("the PostgreSQL server of the journal at %s runs with fsync off: commits survive a crash of slopewatch, "
                            + "not one of the server or its machine", where);
                }
            }
        } catch (SQLException e) {
            throw new JournalException("cannot check how the journal at " + where + " commits", e);
        }
    }

    /**
     * Commits the connection's transaction and returns once it is on disk: on H2 by
     * {@code CHECKPOINT SYNC} (an fsync of the database file, which also covers whatever other
     * sessions committed before), on PostgreSQL by the commit itself.
     */
    static void commit(Connection c) throws SQLException {
        c.commit();
        if ("H2".equals(c.getMetaData().getDatabaseProductName())) {
            try (Statement s = c.createStatement()) {
                s.execute("CHECKPOINT SYNC");
            }
        }
    }

    private static String single(Statement s, String sql) throws SQLException {
        try (ResultSet rs = s.executeQuery(sql)) {
            return rs.next() ? rs.getString(1) : null;
        }
    }

    private static boolean isH2(String jdbcUrl) {
        return jdbcUrl.startsWith("jdbc:h2:");
    }

    private static boolean isPostgres(String jdbcUrl) {
        return jdbcUrl.startsWith("jdbc:postgresql:");
    }
}
