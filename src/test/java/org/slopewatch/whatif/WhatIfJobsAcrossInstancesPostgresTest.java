package org.slopewatch.whatif;

import io.agroal.api.AgroalDataSource;
import java.util.List;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.testsupport.PostgresServer;

/** What-if jobs across instances on a real PostgreSQL server: a new database, two pools on it, dropped after the test. */
class WhatIfJobsAcrossInstancesPostgresTest extends WhatIfJobsAcrossInstancesChecks {

    @Override
    protected List<AgroalDataSource> oneJournalTwice() {
        PostgresServer.TestDatabase db = closeAfterTest(PostgresServer.freshDatabase());
        return List.of(closeAfterTest(JournalDatabase.open(db.url(), db.user(), db.password(), 4)),
                closeAfterTest(JournalDatabase.open(db.url(), db.user(), db.password(), 4)));
    }
}
