package org.slopewatch.journal;

import java.io.IOException;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.function.Supplier;
import javax.sql.DataSource;

/**
 * The journal's JDBC, shared by its stores: a query whose rows are handed on one at a time, a
 * transaction that returns only once it is on disk ({@link JournalDurability#commit}, the one place
 * that says how), a read through a cursor for exports, and lists of ids cut for {@code IN}. Every
 * SQL failure becomes a {@link JournalException} saying what was being read or written.
 */
final class JournalSql {

    /** Rows a cursor reads before handing them on: enough for few round trips, few enough to keep memory flat. */
    private static final int FETCH_SIZE = 1_000;
    /** Ids in one {@code IN} list: small enough for any database. */
    private static final int IN_LIST = 500;

    @FunctionalInterface
    interface Binder {
        void bind(PreparedStatement s) throws SQLException;
    }

    /** A statement without parameters. */
    static final Binder NONE = s -> { };

    @FunctionalInterface
    interface Row {
        void read(ResultSet rs) throws SQLException;
    }

    @FunctionalInterface
    interface Cursor {
        void read(ResultSet rs) throws SQLException, IOException;
    }

    @FunctionalInterface
    interface Work<T> {
        T run(Connection c) throws SQLException;
    }

    @FunctionalInterface
    interface AfterCommit {
        void run(Connection c);
    }

    private final DataSource dataSource;

    JournalSql(DataSource dataSource) {
        this.dataSource = dataSource;
    }

    /** Runs a query and hands each row to {@code row}; a failure reads "cannot read WHAT from the journal". */
    void query(String sql, Binder binder, Row row, String what) {
        query(sql, binder, 0, row, what);
    }

    /**
     * As {@link #query(String, Binder, Row, String)}, the first {@code maxRows} rows only (0: all):
     * a page of a list, whose query orders its rows.
     */
    void query(String sql, Binder binder, int maxRows, Row row, String what) {
        try (Connection c = dataSource.getConnection(); PreparedStatement s = c.prepareStatement(sql)) {
            binder.bind(s);
            s.setMaxRows(maxRows);
            try (ResultSet rs = s.executeQuery()) {
                while (rs.next()) {
                    row.read(rs);
                }
            }
        } catch (SQLException e) {
            throw new JournalException("cannot read " + what + " from the journal", e);
        }
    }

    /** One statement in a transaction of its own, on disk when this returns; the number of rows it changed. */
    int update(String sql, Binder binder, String what) {
        return transaction(c -> {
            try (PreparedStatement s = c.prepareStatement(sql)) {
                binder.bind(s);
                return s.executeUpdate();
            }
        }, what);
    }

    /**
     * Runs {@code work} in one transaction and returns once it is on disk, so that nothing recorded
     * as done is done again after a crash; a failure reads "cannot write WHAT to the journal".
     */
    <T> T transaction(Work<T> work, String what) {
        return transaction(work, c -> { }, () -> what);
    }

    /**
     * As {@link #transaction(Work, String)}, then {@code after} on the same connection once the
     * commit is durable; {@code what} is only built for a failure.
     */
    <T> T transaction(Work<T> work, AfterCommit after, Supplier<String> what) {
        try (Connection c = dataSource.getConnection()) {
            c.setAutoCommit(false);
            T result;
            try {
                result = work.run(c);
                JournalDurability.commit(c);
            } catch (SQLException | RuntimeException e) {
                c.rollback();
                throw e;
            }
            after.run(c);
            return result;
        } catch (SQLException e) {
            throw new JournalException("cannot write " + what.get() + " to the journal", e);
        }
    }

    /**
     * Runs a query through a cursor with a bounded fetch size, so that memory stays flat however
     * many rows match (exports of millions of rows). PostgreSQL keeps a cursor only inside a
     * transaction, hence auto-commit off for the read (and back on before the connection returns
     * to the pool).
     */
    void stream(String sql, Binder binder, Cursor cursor, String what) throws IOException {
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

    /** Id lists in pieces small enough for one {@code IN} list on any database. */
    static List<List<String>> chunks(List<String> ids) {
        List<List<String>> out = new ArrayList<>();
        for (int i = 0; i < ids.size(); i += IN_LIST) {
            out.add(ids.subList(i, Math.min(ids.size(), i + IN_LIST)));
        }
        return out;
    }

    /** {@code ?,?,…} for an {@code IN} list of {@code n} values. */
    static String placeholders(int n) {
        return String.join(",", Collections.nCopies(n, "?"));
    }

    /** Binds {@code values} to the first parameters, in order. */
    static void bind(PreparedStatement s, List<String> values) throws SQLException {
        for (int i = 0; i < values.size(); i++) {
            s.setString(i + 1, values.get(i));
        }
    }

    static Instant instant(ResultSet rs, int column) throws SQLException {
        Timestamp t = rs.getTimestamp(column);
        return t == null ? null : t.toInstant();
    }
}
