package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/**
 * Mutes, the same checks on H2 and PostgreSQL: a mute is active until its time or until it is
 * lifted, and is lifted once.
 */
abstract class MuteBookChecks extends AlertJournalFixture {

    @Test
    void aMuteIsActiveUntilLiftedAndLiftedOnce() {
        MuteBook store = new MuteBook(database(), clock);

        MuteBook.Mute m = store.mute("spread", "GOVT-B:10Y-2Y", T0.plusSeconds(3600), "vendor maintenance", "ops");
        assertThat(store.mutes()).singleElement().satisfies(x -> assertThat(x.activeAt(T0)).isTrue());
        assertThat(store.lift(m.id(), "ops")).isTrue();
        assertThat(store.lift(m.id(), "ops")).as("lifted once").isFalse();
        assertThat(store.mutes().get(0).activeAt(T0)).isFalse();
    }
}
