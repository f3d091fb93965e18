package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;
import org.slopewatch.testsupport.PostgresServer;

/** The alert store checks on a real PostgreSQL server, a fresh database per test. */
class AlertStorePostgresTest extends AlertStoreChecks {

    @Override
    protected AgroalDataSource database() {
        PostgresServer.TestDatabase db = closeAfterTest(PostgresServer.freshDatabase());
        return closeAfterTest(JournalDatabase.open(db.url(), db.user(), db.password(), 4));
    }
}
