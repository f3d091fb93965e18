package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/**
 * Quiet periods, the same checks on H2 and PostgreSQL: a quiet period is active until its time or
 * until it is lifted, and is lifted once.
 */
abstract class QuietPeriodBookChecks extends AlertJournalFixture {

    @Test
    void aQuietPeriodIsActiveUntilLiftedAndLiftedOnce() {
        QuietPeriodBook store = new QuietPeriodBook(database(), clock);

        QuietPeriodBook.QuietPeriod q = store.add("spread", "GOVT-B:10Y-2Y", T0.plusSeconds(3600), "vendor maintenance", "ops");
        assertThat(store.all()).singleElement().satisfies(x -> {
            assertThat(x.activeAt(T0)).isTrue();
            assertThat(x.note()).isEqualTo("vendor maintenance");
            assertThat(x.setBy()).isEqualTo("ops");
        });
        assertThat(store.lift(q.id(), "desk-lead")).isTrue();
        assertThat(store.lift(q.id(), "desk-lead")).as("lifted once").isFalse();
        assertThat(store.all().get(0).activeAt(T0)).isFalse();
        assertThat(store.all().get(0).liftedBy()).isEqualTo("desk-lead");
    }
}
