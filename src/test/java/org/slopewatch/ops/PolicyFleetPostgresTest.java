package org.slopewatch.ops;

import io.agroal.api.AgroalDataSource;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.testsupport.PostgresServer;

/** The two-instance policy checks on a real PostgreSQL server: one fresh database, each instance through its own pool. */
class PolicyFleetPostgresTest extends PolicyFleetChecks {

    private PostgresServer.TestDatabase db;

    @Override
    protected AgroalDataSource journal() {
        if (db == null) {
            db = PostgresServer.freshDatabase();
            closeAfterTest(() -> {
                db.close();
                db = null;
            });
        }
        return closeAfterTest(JournalDatabase.open(db.url(), db.user(), db.password(), 4));
    }
}
