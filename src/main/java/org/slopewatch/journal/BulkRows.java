package org.slopewatch.journal;

import java.io.IOException;
import java.io.StringReader;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.LocalDate;
import org.postgresql.PGConnection;

/**
 * Rows of one table written in one go within the caller's transaction: on PostgreSQL by
 * {@code COPY … FROM STDIN} (text format), elsewhere by a batched {@code INSERT}. A step of the
 * pipeline writes a quote row and a row per watched spread for every snapshot; {@code COPY} takes
 * them in one command, without a statement execution per row on the server.
 *
 * <p>Values are {@link String}, {@link Long}, {@link Integer}, {@link Double}, {@link LocalDate},
 * {@link Timestamp} or null, and reach the table the same either way: a double by its shortest
 * round-trip decimal ({@link Double#toString}), a timestamp as its instant with the offset
 * {@code Z}, a text with the four characters {@code COPY}'s text format escapes escaped.
 */
abstract sealed class BulkRows implements AutoCloseable {

    private int rows;

    /** Rows for {@code table}'s {@code columns}, by the means the connection's database takes best. */
    static BulkRows into(Connection c, String table, String... columns) throws SQLException {
        String list = String.join(", ", columns);
        if ("PostgreSQL".equals(c.getMetaData().getDatabaseProductName())) {
            return new Copy(c, "COPY " + table + " (" + list + ") FROM STDIN");
        }
        return new Insert(c.prepareStatement("INSERT INTO " + table + " (" + list + ") VALUES (" + "?,".repeat(columns.length - 1) + "?)"));
    }

    /** One row, its values in the order of the columns. */
    final void row(Object... values) throws SQLException {
        add(values);
        rows++;
    }

    /** Writes the rows added (nothing when none was). */
    final void write() throws SQLException {
        if (rows > 0) {
            flush();
            rows = 0;
        }
    }

    abstract void add(Object[] values) throws SQLException;

    abstract void flush() throws SQLException;

    @Override
    public void close() throws SQLException {
    }

    private static final class Copy extends BulkRows {

        private final Connection connection;
        private final String sql;
        private final StringBuilder text = new StringBuilder(1 << 16);

        Copy(Connection connection, String sql) {
            this.connection = connection;
            this.sql = sql;
        }

        @Override
        void add(Object[] values) {
            for (int i = 0; i < values.length; i++) {
                if (i > 0) {
                    text.append('\t');
                }
                append(values[i]);
            }
            text.append('\n');
        }

        private void append(Object v) {
            if (v == null) {
                text.append("\\N");
            } else if (v instanceof String s) {
                escape(s);
            } else if (v instanceof Timestamp t) {
                text.append(t.toInstant());
            } else if (v instanceof Long || v instanceof Integer || v instanceof Double || v instanceof LocalDate) {
                text.append(v);
            } else {
                throw new IllegalArgumentException("no COPY text for a " + v.getClass().getSimpleName());
            }
        }

        /** COPY's text format: backslash, tab, line feed and carriage return are escaped, everything else is taken as it is. */
        private void escape(String s) {
            for (int i = 0; i < s.length(); i++) {
                char ch = s.charAt(i);
                switch (ch) {
                    case '\\' -> text.append("\\\\");
                    case '\t' -> text.append("\\t");
                    case '\n' -> text.append("\\n");
                    case '\r' -> text.append("\\r");
                    default -> text.append(ch);
                }
            }
        }

        @Override
        void flush() throws SQLException {
            try {
                connection.unwrap(PGConnection.class).getCopyAPI().copyIn(sql, new StringReader(text.toString()));
            } catch (IOException e) {
                throw new SQLException("COPY of journal rows failed: " + e.getMessage(), e);
            }
            text.setLength(0);
        }
    }

    private static final class Insert extends BulkRows {

        private final PreparedStatement statement;

        Insert(PreparedStatement statement) {
            this.statement = statement;
        }

        @Override
        void add(Object[] values) throws SQLException {
            for (int i = 0; i < values.length; i++) {
                Object v = values[i];
                // a LocalDate goes as it is (JDBC 4.2), not through java.sql.Date, whose calendar shifts dates before 1582
                if (v instanceof Timestamp t) {
                    statement.setTimestamp(i + 1, t);
                } else {
                    statement.setObject(i + 1, v);
                }
            }
            statement.addBatch();
        }

        @Override
        void flush() throws SQLException {
            statement.executeBatch();
        }

        @Override
        public void close() throws SQLException {
            statement.close();
        }
    }
}
