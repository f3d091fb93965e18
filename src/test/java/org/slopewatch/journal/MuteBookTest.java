package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Path;
import org.junit.jupiter.api.io.TempDir;

/** The mute checks on the embedded journal: an H2 file database per test. */
class MuteBookTest extends MuteBookChecks {

    @TempDir
    Path dir;

    @Override
    protected AgroalDataSource database() {
        return h2(dir);
    }
}
