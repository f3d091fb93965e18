package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;

/** The stored notices checks on a real PostgreSQL server, a fresh database per test. */
class AlertHistoryPostgresTest extends AlertHistoryChecks {

    @Override
    protected AgroalDataSource database() {
        return postgres();
    }
}
