package org.slopewatch.journal;

import java.sql.PreparedStatement;
import java.sql.Timestamp;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import javax.sql.DataSource;

/**
 * The journal's checkpoints of curves: one row per curve holding the bytes of its in-memory state
 * as of a sequence number, replaced as a whole. What the bytes mean is the writer's business;
 * this class only keeps them, with the fingerprint of the watches and the layout they were
 * written under, so that a reader can pass over rows it cannot use.
 */
public final class CurveCheckpoints {

    /** Checkpoints read at a time. */
    private static final int PAGE = 16;

    /**
     * One curve's checkpoint.
     *
     * @param seq      the sequence number of the last quote of the curve it includes
     * @param watches  the fingerprint of the watches in force when it was written
     * @param layout   the layout of {@code image}
     */
    public record Stored(String curve, long seq, String watches, int layout, byte[] image) {
    }

    private final JournalSql sql;
    private final Clock clock;

    public CurveCheckpoints(DataSource dataSource, Clock clock) {
        this.sql = new JournalSql(dataSource);
        this.clock = clock;
    }

    /** Replaces the checkpoints of the given curves in one durable transaction. */
    public void write(List<Stored> checkpoints) {
        if (checkpoints.isEmpty()) {
            return;
        }
        Timestamp now = Timestamp.from(clock.instant());
        sql.transaction(c -> {
            try (PreparedStatement delete = c.prepareStatement("DELETE FROM curve_checkpoint WHERE curve = ?");
                 PreparedStatement insert = c.prepareStatement("INSERT INTO curve_checkpoint (curve, seq, watches, layout, image, "
                         + "recorded_at) VALUES (?,?,?,?,?,?)")) {
                for (Stored s : checkpoints) {
                    delete.setString(1, s.curve());
                    delete.addBatch();
                    insert.setString(1, s.curve());
                    insert.setLong(2, s.seq());
                    insert.setString(3, s.watches());
                    insert.setInt(4, s.layout());
                    insert.setBytes(5, s.image());
                    insert.setTimestamp(6, now);
                    insert.addBatch();
                }
                delete.executeBatch();
                insert.executeBatch();
            }
            return null;
        }, "curve checkpoints");
    }

    /**
     * Hands the checkpoints of {@code curves} (those that have one; null: every curve's) to
     * {@code sink}, whatever they were written under, a few at a time: a checkpoint holds a curve's
     * recent history (hundreds of kilobytes with a long one), so a start on a thousand curves
     * must not hold them all at once beside the states it builds from them.
     */
    public void each(java.util.Collection<String> curves, java.util.function.Consumer<Stored> sink) {
        String columns = "SELECT curve, seq, watches, layout, image FROM curve_checkpoint ";
        if (curves == null) {
            for (String after = ""; ; ) {
                List<Stored> page = new ArrayList<>();
                String from = after;
                sql.query(columns + "WHERE curve > ? ORDER BY curve", s -> s.setString(1, from), PAGE, rs -> page.add(stored(rs)),
                        "curve checkpoints");
                page.forEach(sink);
                if (page.size() < PAGE) {
                    return;
                }
                after = page.get(page.size() - 1).curve();
            }
        }
        List<String> named = List.copyOf(curves);
        for (int i = 0; i < named.size(); i += PAGE) {
            List<String> chunk = named.subList(i, Math.min(named.size(), i + PAGE));
            List<Stored> page = new ArrayList<>();
            sql.query(columns + "WHERE curve IN (" + JournalSql.placeholders(chunk.size()) + ") ORDER BY curve",
                    s -> JournalSql.bind(s, chunk), rs -> page.add(stored(rs)), "curve checkpoints");
            page.forEach(sink);
        }
    }

    private static Stored stored(java.sql.ResultSet rs) throws java.sql.SQLException {
        return new Stored(rs.getString(1), rs.getLong(2), rs.getString(3), rs.getInt(4), rs.getBytes(5));
    }

    /** Drops every checkpoint (they are a cache: the quotes are the record). */
    public int clear() {
        return sql.update("DELETE FROM curve_checkpoint", JournalSql.NONE, "curve checkpoints");
    }
}
