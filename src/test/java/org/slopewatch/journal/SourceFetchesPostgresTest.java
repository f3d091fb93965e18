package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;

/** The source fetch checks on a real PostgreSQL server, a fresh database per test. */
class SourceFetchesPostgresTest extends SourceFetchesChecks {

    @Override
    protected AgroalDataSource database() {
        return postgres();
    }
}
