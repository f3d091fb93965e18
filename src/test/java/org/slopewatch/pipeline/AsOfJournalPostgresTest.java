package org.slopewatch.pipeline;

import io.agroal.api.AgroalDataSource;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.testsupport.PostgresServer;

/** The as-of checks on a real PostgreSQL server, a fresh database per test. */
class AsOfJournalPostgresTest extends AsOfJournalChecks {

    @Override
    protected AgroalDataSource database() {
        PostgresServer.TestDatabase db = closeAfterTest(PostgresServer.freshDatabase());
        return closeAfterTest(JournalDatabase.open(db.url(), db.user(), db.password(), 4));
    }
}
