package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;
import org.slopewatch.testsupport.PostgresServer;

/** The paging checks on a real PostgreSQL server, a fresh database per test. */
class JournalPagesPostgresTest extends JournalPagesChecks {

    @Override
    protected AgroalDataSource database() {
        PostgresServer.TestDatabase db = closeAfterTest(PostgresServer.freshDatabase());
        return closeAfterTest(JournalDatabase.open(db.url(), db.user(), db.password(), 4));
    }
}
