package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;

/** The outbox checks on a real PostgreSQL server, a fresh database per test. */
class DeliveryOutboxPostgresTest extends DeliveryOutboxChecks {

    @Override
    protected AgroalDataSource database() {
        return postgres();
    }
}
