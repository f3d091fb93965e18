package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;

/** Old stored notice kinds on PostgreSQL (vocabulary: deprecation path). */
class OldStoredKindsPostgresTest extends OldStoredKindsChecks {

    @Override
    protected AgroalDataSource database() {
        return postgres();
    }
}
