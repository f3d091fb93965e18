package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Properties;
import org.junit.jupiter.api.Test;
import org.slopewatch.testsupport.PostgresServer;

/**
 * On PostgreSQL a commit returns once the write-ahead log is flushed, unless
 * {@code synchronous_commit} is {@code off} ("there can be a delay between when success is reported
 * to the client and when the transaction is really guaranteed to be safe against a server crash",
 * PostgreSQL 15 documentation, 20.5.1 Settings, {@code synchronous_commit}). A role, a database or
 * the server may set it off; the journal's sessions must not run with it. The test server itself
 * runs with it off ({@code .ci/postgres.sh}), and the database is set off on top.
 */
class JournalDurabilityPostgresTest {

    @Test
    void journalSessionsCommitSynchronouslyWhereTheDatabaseSaysOtherwise() throws SQLException {
        try (PostgresServer.TestDatabase db = PostgresServer.freshDatabase()) {
            try (Connection c = connect(db); Statement s = c.createStatement()) {
                s.execute("ALTER DATABASE " + db.name() + " SET synchronous_commit = off");
            }
            try (Connection plain = connect(db)) {
                assertThat(synchronousCommit(plain)).as("a plain session on the database (the premise)").isEqualTo("off");
            }
            try (AgroalDataSource ds = JournalDatabase.open(db.url(), db.user(), db.password(), 3)) {
                for (int i = 0; i < 3; i++) {
                    try (Connection c = ds.getConnection()) {
                        assertThat(synchronousCommit(c)).as("synchronous_commit of a journal session").isEqualTo("on");
                    }
                }
            }
        }
    }

    /** A plain connection, the driver named directly as {@code PostgresServer} does. */
    private static Connection connect(PostgresServer.TestDatabase db) throws SQLException {
        Properties p = new Properties();
        p.setProperty("user", db.user());
        p.setProperty("password", db.password());
        return new org.postgresql.Driver().connect(db.url(), p);
    }

    private static String synchronousCommit(Connection c) throws SQLException {
        try (Statement s = c.createStatement(); ResultSet rs = s.executeQuery("SHOW synchronous_commit")) {
            rs.next();
            return rs.getString(1);
        }
    }
}
