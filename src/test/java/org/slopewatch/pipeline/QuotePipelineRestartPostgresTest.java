package org.slopewatch.pipeline;

import io.agroal.api.AgroalDataSource;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.testsupport.PostgresServer;

/**
 * The restart checks on a shared journal: a real PostgreSQL server, a new database per journal
 * (dropped after the test), migrated by the same Flyway scripts as H2.
 */
class QuotePipelineRestartPostgresTest extends QuotePipelineRestartChecks {

    @Override
    protected AgroalDataSource database(String name) {
        PostgresServer.TestDatabase db = closeAfterTest(PostgresServer.freshDatabase());
        return closeAfterTest(JournalDatabase.open(db.url(), db.user(), db.password(), 4));
    }
}
