package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;

/** The quiet period checks on a real PostgreSQL server, a fresh database per test. */
class QuietPeriodBookPostgresTest extends QuietPeriodBookChecks {

    @Override
    protected AgroalDataSource database() {
        return postgres();
    }
}
