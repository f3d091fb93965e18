package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Path;
import org.junit.jupiter.api.io.TempDir;

/** The policy-in-force checks on the embedded journal: an H2 file database per test. */
class PolicyInForceTest extends PolicyInForceChecks {

    @TempDir
    Path dir;

    @Override
    protected AgroalDataSource database() {
        return h2(dir);
    }
}
