package org.slopewatch.pipeline;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Path;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.journal.JournalDatabase;

/** The as-of checks on the embedded journal: an H2 file database per test. */
class AsOfJournalTest extends AsOfJournalChecks {

    @TempDir
    Path dir;

    @Override
    protected AgroalDataSource database() {
        return closeAfterTest(JournalDatabase.open("jdbc:h2:file:" + dir.resolve("journal") + ";DB_CLOSE_DELAY=0", "sa", "", 4));
    }
}
