package org.slopewatch.journal;

import java.sql.PreparedStatement;
import java.sql.Timestamp;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import javax.sql.DataSource;

/**
 * The policy each instance on this journal runs, and the reloads the instances accepted. Several
 * daemons share one journal but each reads its own copy of the policy file; an accepted reload is
 * written here so that every other instance takes the same content from its own file, and each
 * instance writes which content it runs (with a heartbeat), so that a disagreement can be seen.
 */
public final class PolicyInForce {

    /** The longest instance id kept (the column's width). */
    public static final int INSTANCE_CHARS = 200;

    /**
     * What one instance said last.
     *
     * @param id         the row's id: the order instances first appeared in, and the list's cursor
     * @param since      when it put this content in force (or, for content it ran at start-up, when it started)
     * @param lastSeen   its heartbeat
     * @param waitingFor the hash of a reload accepted elsewhere that its own file does not give yet; null when none
     */
    public record Instance(long id, String instance, String hash, String source, Instant since, Instant lastSeen, String waitingFor) {
    }

    /** A reload some instance accepted: the content the whole fleet is to run from then on. */
    public record AcceptedReload(long id, String hash, String instance, Instant acceptedAt) {
    }

    private static final String COLUMNS = "id, instance_id, content_hash, source, since, last_seen, waiting_for";

    private final JournalSql sql;
    private final Clock clock;

    public PolicyInForce(DataSource dataSource, Clock clock) {
        this.sql = new JournalSql(dataSource);
        this.clock = clock;
    }

    /** Records a reload accepted by {@code instance}: content {@code hash} is applied there. */
    public void accepted(String hash, String instance) {
        Timestamp now = Timestamp.from(clock.instant());
        sql.update("INSERT INTO policy_reload (content_hash, instance_id, accepted_at) VALUES (?,?,?)", s -> {
            s.setString(1, hash);
            s.setString(2, JournalWriter.fit(instance, INSTANCE_CHARS));
            s.setTimestamp(3, now);
        }, "policy reloads");
    }

    /** The reload accepted last, by any instance; empty before the first. */
    public Optional<AcceptedReload> newestReload() {
        List<AcceptedReload> out = new ArrayList<>(1);
        sql.query("SELECT id, content_hash, instance_id, accepted_at FROM policy_reload ORDER BY id DESC FETCH FIRST 1 ROWS ONLY",
                JournalSql.NONE, rs -> out.add(new AcceptedReload(rs.getLong(1), rs.getString(2), rs.getString(3), JournalSql.instant(rs, 4))),
                "policy reloads");
        return out.stream().findFirst();
    }

    /**
     * The heartbeat of {@code instance}: it runs content {@code hash} from {@code source}, now.
     * {@code since} moves only when the hash differs from the one recorded before, so that it says
     * how long this content has been in force there.
     */
    public void seen(String instance, String hash, String source, String waitingFor) {
        Timestamp now = Timestamp.from(clock.instant());
        String id = JournalWriter.fit(instance, INSTANCE_CHARS);
        String from = JournalWriter.fit(source, 400);
        sql.transaction(c -> {
            // every right-hand side reads the row as it was, so since compares with the old hash
            try (PreparedStatement s = c.prepareStatement("UPDATE policy_in_force SET since = CASE WHEN content_hash = ? THEN since ELSE ? END, "
                    + "content_hash = ?, source = ?, last_seen = ?, waiting_for = ? WHERE instance_id = ?")) {
                s.setString(1, hash);
                s.setTimestamp(2, now);
                s.setString(3, hash);
                s.setString(4, from);
                s.setTimestamp(5, now);
                s.setString(6, waitingFor);
                s.setString(7, id);
                if (s.executeUpdate() == 1) {
                    return null;
                }
            }
            // one process per instance id, so no other writer inserts this row meanwhile
            try (PreparedStatement s = c.prepareStatement("INSERT INTO policy_in_force (instance_id, content_hash, source, since, last_seen, "
                    + "waiting_for) VALUES (?,?,?,?,?,?)")) {
                s.setString(1, id);
                s.setString(2, hash);
                s.setString(3, from);
                s.setTimestamp(4, now);
                s.setTimestamp(5, now);
                s.setString(6, waitingFor);
                s.executeUpdate();
            }
            return null;
        }, "the policy in force");
    }

    /** Every instance seen at or after {@code bound}, by instance id: the live ones. */
    public List<Instance> seenSince(Instant bound) {
        List<Instance> out = new ArrayList<>();
        sql.query("SELECT " + COLUMNS + " FROM policy_in_force WHERE last_seen >= ? ORDER BY instance_id",
                s -> s.setTimestamp(1, Timestamp.from(bound)), rs -> out.add(instance(rs)), "the policy in force");
        return out;
    }

    /** Up to {@code n} instances in the order they first appeared, after the row {@code afterId} (null: from the first). */
    public List<Instance> page(int n, Long afterId) {
        List<Instance> out = new ArrayList<>();
        sql.query("SELECT " + COLUMNS + " FROM policy_in_force WHERE id > ? ORDER BY id", s -> s.setLong(1, afterId == null ? 0 : afterId), n,
                rs -> out.add(instance(rs)), "the policy in force");
        return out;
    }

    private static Instance instance(java.sql.ResultSet rs) throws java.sql.SQLException {
        return new Instance(rs.getLong(1), rs.getString(2), rs.getString(3), rs.getString(4), JournalSql.instant(rs, 5),
                JournalSql.instant(rs, 6), rs.getString(7));
    }
}
