package org.slopewatch.journal;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import javax.sql.DataSource;

/**
 * The journal's marker of what people set on the desk: a counter (table {@code desk_change}, one
 * row) that goes up in the same transaction as every quiet period set or lifted and every
 * acknowledgement. Reading it is one primary-key lookup, so an instance can ask before every
 * notice it lets out whether another instance changed anything, and read the quiet periods and
 * acknowledgements again only when it did.
 *
 * <p>A counter, not the highest row id: identity values are handed out before commit, so a row
 * with a lower id can become visible after one with a higher id, and a lift changes no id. Two
 * transactions bumping the counter queue on its row lock, so each commit leaves a higher value.
 */
public final class DeskChanges {

    private final JournalSql sql;

    public DeskChanges(DataSource dataSource) {
        this.sql = new JournalSql(dataSource);
    }

    /** The counter now; it only grows. */
    public long counter() {
        long[] counter = {0};
        sql.query("SELECT counter FROM desk_change WHERE id = 1", JournalSql.NONE, rs -> counter[0] = rs.getLong(1), "desk changes");
        return counter[0];
    }

    /** Counts a change, inside the transaction that makes it. */
    static void bump(Connection c) throws SQLException {
        try (PreparedStatement s = c.prepareStatement("UPDATE desk_change SET counter = counter + 1 WHERE id = 1")) {
            if (s.executeUpdate() != 1) {
                throw new SQLException("the journal has no desk_change row (schema V6)");
            }
        }
    }
}
