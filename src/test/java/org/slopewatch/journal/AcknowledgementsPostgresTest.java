package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;

/** The acknowledgement checks on a real PostgreSQL server, a fresh database per test. */
class AcknowledgementsPostgresTest extends AcknowledgementsChecks {

    @Override
    protected AgroalDataSource database() {
        return postgres();
    }
}
