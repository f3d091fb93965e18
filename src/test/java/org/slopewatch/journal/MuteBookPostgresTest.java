package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;

/** The mute checks on a real PostgreSQL server, a fresh database per test. */
class MuteBookPostgresTest extends MuteBookChecks {

    @Override
    protected AgroalDataSource database() {
        return postgres();
    }
}
