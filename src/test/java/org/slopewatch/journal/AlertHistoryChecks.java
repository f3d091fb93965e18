package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.time.Clock;
import java.time.Duration;
import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Alert;

/**
 * Stored notices read back, the same checks on H2 and PostgreSQL: a notice keeps what silenced it
 * however long the description, and the latest notice of an episode is where the episode stands.
 * Source of the expectations: the column widths of V2__alerts.sql and the notice numbering of the
 * alerting design (a repeat is the episode's next notice), applied to hand-written rows.
 */
abstract class AlertHistoryChecks extends AlertJournalFixture {

    @Test
    void aNoticeMutedByTheLongestMuteIsStored() {
        // The desk describes the mute that silenced a notice as "KIND TARGET muted by BY until UNTIL (REASON)"; with a
        // rule of 100 characters, by of 100 and a reason of 400 (what the mute table holds, V2__alerts.sql) that is
        // about 650 characters, and alert.muted_by holds 400: the write of the notice, and with it the whole
        // pipeline step, failed.
        AgroalDataSource ds = database();
        String mutedBy = "rule " + "r".repeat(100) + " muted by " + "b".repeat(100) + " until " + T0.plusSeconds(3600) + " ("
                + "x".repeat(400) + ")";
        new JournalWriter(ds, clock).write(notice(ID, 1, Alert.Kind.FIRING, mutedBy));
        String stored = new AlertHistory(ds).find(ID).stored().mutedBy();
        assertThat(stored).hasSize(400).startsWith("rule " + "r".repeat(100) + " muted by ").endsWith("…");
    }

    @Test
    void theLatestNoticeOfAnEpisodeIsWhereItStands() {
        AgroalDataSource ds = database();
        new JournalWriter(ds, clock).write(notice(ID, 1, Alert.Kind.FIRING));
        new JournalWriter(ds, Clock.offset(clock, Duration.ofDays(1)))
                .write(notice("inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~2", 2, Alert.Kind.REPEAT));

        assertThat(new AlertHistory(ds).latestPerEpisode()).singleElement().satisfies(a -> {
            assertThat(a.notice()).isEqualTo(2);
            assertThat(a.episodeSince()).isEqualTo(LocalDate.of(2026, 9, 30));
            assertThat(a.policyHash()).isEqualTo("abc123");
        });
    }
}
