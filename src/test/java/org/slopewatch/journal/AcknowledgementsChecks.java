package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.time.Clock;
import java.time.Duration;
import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Alert;

/**
 * Acknowledgements, the same checks on H2 and PostgreSQL: acknowledging one notice of an episode
 * acknowledges the episode (same rule, subject and start), as the alerting design has it.
 */
abstract class AcknowledgementsChecks extends AlertJournalFixture {

    @Test
    void anAcknowledgedNoticeAcknowledgesItsEpisode() {
        AgroalDataSource ds = database();
        new JournalWriter(ds, clock).write(notice(ID, 1, Alert.Kind.FIRING));
        new JournalWriter(ds, Clock.offset(clock, Duration.ofDays(1)))
                .write(notice("inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~2", 2, Alert.Kind.REPEAT));
        Acknowledgements store = new Acknowledgements(ds, clock);

        assertThat(store.episodeAcknowledged("inversion-confirmed", "GOVT-A:10Y-3M", LocalDate.of(2026, 9, 30))).isFalse();
        store.ack(ID, "desk-lead", "seen");
        assertThat(store.episodeAcknowledged("inversion-confirmed", "GOVT-A:10Y-3M", LocalDate.of(2026, 9, 30))).isTrue();
    }
}
