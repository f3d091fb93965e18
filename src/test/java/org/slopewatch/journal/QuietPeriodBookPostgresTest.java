package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;

/** The mute checks on a real PostgreSQL server, a fresh database per test. */
class QuietPeriodBookPostgresTest extends QuietPeriodBookChecks {

    @Override
    protected AgroalDataSource database() {
        return postgres();
    }
}
