package org.slopewatch.alerting;

import io.agroal.api.AgroalDataSource;
import io.quarkus.test.junit.QuarkusTest;
import java.util.List;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.testsupport.PostgresServer;

/** The checks across instances on a real PostgreSQL server: a new database, two pools on it, dropped after the test. */
@QuarkusTest
class DeskAcrossInstancesPostgresTest extends DeskAcrossInstancesChecks {

    @Override
    protected List<AgroalDataSource> oneJournalTwice() {
        PostgresServer.TestDatabase db = closeAfterTest(PostgresServer.freshDatabase());
        return List.of(closeAfterTest(JournalDatabase.open(db.url(), db.user(), db.password(), 4)),
                closeAfterTest(JournalDatabase.open(db.url(), db.user(), db.password(), 4)));
    }
}
