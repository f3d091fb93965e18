package org.slopewatch.journal;

import java.sql.Timestamp;
import java.sql.Types;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import javax.sql.DataSource;

/**
 * Every fetch of a pulled source, journalled: when it started, what the server answered, how many
 * dates of the publication were new, revised or unchanged, how many rows were refused and why; and
 * the validators the next fetch sends back, so that a restart still asks conditionally.
 */
public final class SourceFetches {

    /**
     * One fetch.
     *
     * @param httpStatus the server's status code, or null when none came (refused connection, time-out)
     * @param outcome    {@code forwarded}, {@code not-modified}, {@code refused} (the body was not read whole or not as a
     *                   publication) or {@code failed} (no answer worth reading)
     * @param etag       the entity tag of the publication read, or null
     * @param lastModified the {@code Last-Modified} value of the publication read, as the server wrote it, or null
     */
    public record Fetch(String source, String curve, Instant startedAt, Integer httpStatus, String outcome, int datesNew,
                        int datesRevised, int datesUnchanged, int rejected, String detail, String etag, String lastModified) {
    }

    /** The validators of the last publication read whole: what a conditional GET sends back. */
    public record Validators(String etag, String lastModified) {
    }

    private final JournalSql sql;
    private final Clock clock;

    public SourceFetches(DataSource dataSource, Clock clock) {
        this.sql = new JournalSql(dataSource);
        this.clock = clock;
    }

    public void record(Fetch f) {
        Timestamp now = Timestamp.from(clock.instant());
        sql.update("INSERT INTO source_fetch (source, curve, started_at, http_status, outcome, dates_new, dates_revised, dates_same, "
                + "rejected, detail, etag, last_modified, recorded_at) VALUES (?,?,?,?,?,?,?,?,?,?,?,?,?)", s -> {
                    s.setString(1, JournalWriter.fit(f.source(), 200));
                    s.setString(2, f.curve() == null ? null : JournalWriter.fit(f.curve(), 200));
                    s.setTimestamp(3, Timestamp.from(f.startedAt()));
                    if (f.httpStatus() == null) {
                        s.setNull(4, Types.INTEGER);
                    } else {
                        s.setInt(4, f.httpStatus());
                    }
                    s.setString(5, f.outcome());
                    s.setInt(6, f.datesNew());
                    s.setInt(7, f.datesRevised());
                    s.setInt(8, f.datesUnchanged());
                    s.setInt(9, f.rejected());
                    s.setString(10, f.detail() == null ? null : JournalWriter.fit(f.detail(), 4000));
                    s.setString(11, f.etag() == null ? null : JournalWriter.fit(f.etag(), 400));
                    s.setString(12, f.lastModified() == null ? null : JournalWriter.fit(f.lastModified(), 100));
                    s.setTimestamp(13, now);
                }, "source fetches");
    }

    /** The validators of the source's last publication forwarded (or found unchanged), if any. */
    public Optional<Validators> validators(String source) {
        Validators[] v = {null};
        sql.query("SELECT etag, last_modified FROM source_fetch WHERE source = ? AND outcome = 'forwarded' "
                + "ORDER BY id DESC FETCH FIRST 1 ROWS ONLY", s -> s.setString(1, source),
                rs -> v[0] = new Validators(rs.getString(1), rs.getString(2)), "source fetches");
        return Optional.ofNullable(v[0]);
    }

    /** The source's fetches, newest first, at most {@code limit}. */
    public List<Fetch> recent(String source, int limit) {
        List<Fetch> out = new ArrayList<>();
        sql.query("SELECT source, curve, started_at, http_status, outcome, dates_new, dates_revised, dates_same, rejected, detail, "
                + "etag, last_modified FROM source_fetch WHERE source = ? ORDER BY id DESC", s -> s.setString(1, source), limit,
                rs -> {
                    int status = rs.getInt(4);
                    Integer httpStatus = rs.wasNull() ? null : status;
                    out.add(new Fetch(rs.getString(1), rs.getString(2), rs.getTimestamp(3).toInstant(), httpStatus, rs.getString(5),
                            rs.getInt(6), rs.getInt(7), rs.getInt(8), rs.getInt(9), rs.getString(10), rs.getString(11), rs.getString(12)));
                }, "source fetches");
        return out;
    }
}
