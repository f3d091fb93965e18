package org.slopewatch.journal;

import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Clock;
import java.time.Instant;
import java.util.Optional;
import javax.sql.DataSource;

/**
 * The API's what-if jobs as journal rows (table {@code what_if_job}), so that a job accepted by one
 * instance can be read from any: the instance running it writes its progress with a heartbeat while
 * it runs and its result (JSON, which this class does not read) when it ends. Whether a job whose
 * heartbeat stopped is abandoned is for the reader to say; the row keeps what was written.
 */
public final class WhatIfRows {

    /** What a job's state column holds. */
    public static final String RUNNING = "running";

    private static final int HISTORY_CHARS = 200;
    private static final int ERROR_CHARS = 1000;

    /**
     * One job as last written.
     *
     * @param result the report as JSON once done, else null
     */
    public record Row(String id, String history, String state, long done, long total, Instant submittedAt, Instant startedAt,
                      Instant finishedAt, Instant heartbeatAt, String result, String error) {
    }

    private final JournalSql sql;
    private final Clock clock;

    public WhatIfRows(DataSource dataSource, Clock clock) {
        this.sql = new JournalSql(dataSource);
        this.clock = clock;
    }

    /** A job accepted: running, nothing done yet. */
    public void accepted(String id, String history, Instant submittedAt, long total) {
        Timestamp now = Timestamp.from(clock.instant());
        sql.update("INSERT INTO what_if_job (id, history, state, quotes_done, quotes_total, submitted_at, heartbeat_at, recorded_at) "
                + "VALUES (?,?,?,?,?,?,?,?)", s -> {
                    s.setString(1, id);
                    s.setString(2, JournalWriter.fit(history, HISTORY_CHARS));
                    s.setString(3, RUNNING);
                    s.setLong(4, 0);
                    s.setLong(5, total);
                    s.setTimestamp(6, Timestamp.from(submittedAt));
                    s.setTimestamp(7, now);
                    s.setTimestamp(8, now);
                }, "a what-if job");
    }

    /** The instance running a job is alive: its progress, and the heartbeat now. Nothing for a job that has ended. */
    public void beat(String id, long done, long total, Instant startedAt) {
        Timestamp now = Timestamp.from(clock.instant());
        sql.update("UPDATE what_if_job SET quotes_done = ?, quotes_total = ?, started_at = ?, heartbeat_at = ? WHERE id = ? AND state = ?",
                s -> {
                    s.setLong(1, done);
                    s.setLong(2, total);
                    s.setTimestamp(3, startedAt == null ? null : Timestamp.from(startedAt));
                    s.setTimestamp(4, now);
                    s.setString(5, id);
                    s.setString(6, RUNNING);
                }, "a what-if job");
    }

    /** A job ended: its state, final progress, and its result (JSON) or why it failed. */
    public void ended(String id, String state, long done, long total, Instant startedAt, Instant finishedAt, String result, String error) {
        Timestamp now = Timestamp.from(clock.instant());
        sql.update("UPDATE what_if_job SET state = ?, quotes_done = ?, quotes_total = ?, started_at = ?, finished_at = ?, heartbeat_at = ?, "
                + "result = ?, error = ? WHERE id = ?", s -> {
                    s.setString(1, state);
                    s.setLong(2, done);
                    s.setLong(3, total);
                    s.setTimestamp(4, startedAt == null ? null : Timestamp.from(startedAt));
                    s.setTimestamp(5, finishedAt == null ? null : Timestamp.from(finishedAt));
                    s.setTimestamp(6, now);
                    s.setString(7, result);
                    s.setString(8, JournalWriter.fit(error, ERROR_CHARS));
                    s.setString(9, id);
                }, "a what-if job");
    }

    public Optional<Row> find(String id) {
        Row[] found = {null};
        sql.query("SELECT id, history, state, quotes_done, quotes_total, submitted_at, started_at, finished_at, heartbeat_at, result, error "
                + "FROM what_if_job WHERE id = ?", s -> s.setString(1, id), rs -> found[0] = row(rs), "what-if jobs");
        return Optional.ofNullable(found[0]);
    }

    /**
     * Forgets old jobs: every job but the {@code keep} most recently submitted, except those still
     * running with a heartbeat since {@code aliveSince}.
     *
     * @return the number of jobs forgotten
     */
    public int forgetBeyond(int keep, Instant aliveSince) {
        return sql.update("DELETE FROM what_if_job WHERE (state <> ? OR heartbeat_at < ?) AND submitted_at < "
                + "(SELECT MIN(submitted_at) FROM (SELECT submitted_at FROM what_if_job ORDER BY submitted_at DESC LIMIT ?) newest)", s -> {
                    s.setString(1, RUNNING);
                    s.setTimestamp(2, Timestamp.from(aliveSince));
                    s.setInt(3, keep);
                }, "what-if jobs");
    }

    private static Row row(ResultSet rs) throws SQLException {
        return new Row(rs.getString(1), rs.getString(2), rs.getString(3), rs.getLong(4), rs.getLong(5), JournalSql.instant(rs, 6),
                JournalSql.instant(rs, 7), JournalSql.instant(rs, 8), JournalSql.instant(rs, 9), rs.getString(10), rs.getString(11));
    }
}
