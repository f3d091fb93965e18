package org.slopewatch.ops;

import io.agroal.api.AgroalDataSource;
import org.slopewatch.journal.JournalDatabase;

/** The two-instance policy checks on the embedded journal: both instances on one H2 file, each through its own pool. */
class PolicyFleetTest extends PolicyFleetChecks {

    @Override
    protected AgroalDataSource journal() {
        return closeAfterTest(JournalDatabase.open("jdbc:h2:file:" + dir.resolve("journal") + ";DB_CLOSE_DELAY=0", "sa", "", 4));
    }
}
