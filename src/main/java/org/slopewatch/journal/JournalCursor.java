package org.slopewatch.journal;

import java.io.IOException;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import javax.sql.DataSource;

/**
 * Runs a query through a cursor with a bounded fetch size, so that memory stays flat however
 * many rows match (exports of millions of rows). PostgreSQL keeps a cursor only inside a
 * transaction, hence auto-commit off for the read (and back on before the connection returns to
 * the pool).
 */
final class JournalCursor {

    private static final int FETCH_SIZE = 1_000;

    @FunctionalInterface
    interface Binder {
        void bind(PreparedStatement s) throws SQLException;
    }

    @FunctionalInterface
    interface Cursor {
        void read(ResultSet rs) throws SQLException, IOException;
    }

    private JournalCursor() {
    }

    static void stream(DataSource dataSource, String sql, Binder binder, Cursor cursor, String what) throws IOException {
        try (Connection c = dataSource.getConnection()) {
            boolean autoCommit = c.getAutoCommit();
            c.setAutoCommit(false);
            try (PreparedStatement s = c.prepareStatement(sql, ResultSet.TYPE_FORWARD_ONLY, ResultSet.CONCUR_READ_ONLY)) {
                binder.bind(s);
                s.setFetchSize(FETCH_SIZE);
                try (ResultSet rs = s.executeQuery()) {
                    cursor.read(rs);
                }
            } finally {
                c.rollback(); // read only: nothing to keep
                c.setAutoCommit(autoCommit);
            }
        } catch (SQLException e) {
            throw new JournalException("cannot read " + what + " from the journal", e);
        }
    }
}
