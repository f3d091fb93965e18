package org.slopewatch.journal;

import java.sql.Timestamp;
import java.time.Clock;
import java.time.Instant;
import javax.sql.DataSource;

/**
 * Every policy load journalled with its content hash, applied or rejected: which rule set is in
 * force now, and which was at a past moment, so that a history answer can name the rules behind it.
 */
public final class PolicyVersions {

    private final JournalSql sql;
    private final Clock clock;

    public PolicyVersions(DataSource dataSource, Clock clock) {
        this.sql = new JournalSql(dataSource);
        this.clock = clock;
    }

    /** Journals a policy load: its content hash, where it came from, applied or rejected and why. */
    public void policyVersion(String hash, String source, String outcome, String detail) {
        Timestamp now = Timestamp.from(clock.instant());
        sql.update("INSERT INTO policy_version (content_hash, source, outcome, detail, recorded_at) VALUES (?,?,?,?,?)", s -> {
            s.setString(1, hash);
            s.setString(2, JournalWriter.fit(source, 400));
            s.setString(3, outcome);
            s.setString(4, JournalWriter.fit(detail, 4000));
            s.setTimestamp(5, now);
        }, "alert records");
    }

    /** The hash of the last policy applied at or before {@code asOf}: the rule set in force then, or null before the first. */
    public String policyHashAt(Instant asOf) {
        String[] hash = {null};
        sql.query("SELECT content_hash FROM policy_version WHERE outcome = 'applied' AND recorded_at <= ? "
                + "ORDER BY recorded_at DESC, id DESC FETCH FIRST 1 ROWS ONLY", s -> s.setTimestamp(1, Timestamp.from(asOf)),
                rs -> hash[0] = rs.getString(1), "alerts");
        return hash[0];
    }

    /** The hash of the policy applied last, or null. */
    public String currentPolicyHash() {
        String[] hash = {null};
        sql.query("SELECT content_hash FROM policy_version WHERE outcome = 'applied' ORDER BY id DESC FETCH FIRST 1 ROWS ONLY",
                JournalSql.NONE, rs -> hash[0] = rs.getString(1), "alerts");
        return hash[0];
    }
}
