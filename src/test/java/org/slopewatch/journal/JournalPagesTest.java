package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Path;
import org.junit.jupiter.api.io.TempDir;

/** The paging checks on the embedded journal: an H2 file database per test. */
class JournalPagesTest extends JournalPagesChecks {

    @TempDir
    Path dir;

    @Override
    protected AgroalDataSource database() {
        return closeAfterTest(JournalDatabase.open("jdbc:h2:file:" + dir.resolve("journal") + ";DB_CLOSE_DELAY=0", "sa", "", 4));
    }
}
