package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;

/** The policy-in-force checks on a real PostgreSQL server, a fresh database per test. */
class PolicyInForcePostgresTest extends PolicyInForceChecks {

    @Override
    protected AgroalDataSource database() {
        return postgres();
    }
}
