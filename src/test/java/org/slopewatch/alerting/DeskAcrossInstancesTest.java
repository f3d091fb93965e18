package org.slopewatch.alerting;

import io.agroal.api.AgroalDataSource;
import io.quarkus.test.junit.QuarkusTest;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.journal.JournalDatabase;

/** The checks across instances on an H2 file journal, opened twice (two pools) in this JVM. */
@QuarkusTest
class DeskAcrossInstancesTest extends DeskAcrossInstancesChecks {

    @TempDir
    Path dir;

    @Override
    protected List<AgroalDataSource> oneJournalTwice() {
        String url = "jdbc:h2:file:" + dir.resolve("journal") + ";DB_CLOSE_DELAY=0";
        return List.of(closeAfterTest(JournalDatabase.open(url, "sa", "", 4)), closeAfterTest(JournalDatabase.open(url, "sa", "", 4)));
    }
}
