package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;

/** The policy version checks on a real PostgreSQL server, a fresh database per test. */
class PolicyVersionsPostgresTest extends PolicyVersionsChecks {

    @Override
    protected AgroalDataSource database() {
        return postgres();
    }
}
