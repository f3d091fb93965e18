package org.slopewatch.whatif;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.journal.JournalDatabase;

/** What-if jobs across instances on an H2 file journal, opened twice (two pools) in this JVM. */
class WhatIfJobsAcrossInstancesTest extends WhatIfJobsAcrossInstancesChecks {

    @TempDir
    Path dir;

    @Override
    protected List<AgroalDataSource> oneJournalTwice() {
        String url = "jdbc:h2:file:" + dir.resolve("journal") + ";DB_CLOSE_DELAY=0";
        return List.of(closeAfterTest(JournalDatabase.open(url, "sa", "", 4)), closeAfterTest(JournalDatabase.open(url, "sa", "", 4)));
    }
}
