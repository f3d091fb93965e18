package org.slopewatch.pipeline;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Path;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.journal.JournalDatabase;

/** The restart checks on the embedded journal: an H2 file database per journal in a temporary directory. */
class QuotePipelineRestartTest extends QuotePipelineRestartChecks {

    @TempDir
    Path dir;

    @Override
    protected AgroalDataSource database(String name) {
        return closeAfterTest(JournalDatabase.open("jdbc:h2:file:" + dir.resolve(name) + ";DB_CLOSE_DELAY=0", "sa", "", 4));
    }
}
