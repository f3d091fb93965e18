package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Path;
import org.junit.jupiter.api.io.TempDir;

/** Old stored notice kinds on the embedded journal (vocabulary: deprecation path). */
class OldStoredKindsTest extends OldStoredKindsChecks {

    @TempDir
    Path dir;

    @Override
    protected AgroalDataSource database() {
        return h2(dir);
    }
}
