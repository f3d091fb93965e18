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
 * alerting design (a standing notice is the episode's next notice), applied to hand-written rows.
 */
abstract class AlertHistoryChecks extends AlertJournalFixture {

    @Test
    void aNoticeHeldBackByTheLongestQuietPeriodIsStored() {
        // The desk describes the quiet period that held a notice back as "quiet period ID on KIND TARGET, set by BY until
        // UNTIL (NOTE)"; with a rule of 100 characters, set_by of 100 and a note of 400 (what the journal's mute table
        // holds, V2__alerts.sql) that is about 650 characters, and alert.muted_by holds 400: the write of the notice,
        // and with it the whole pipeline step, failed.
        AgroalDataSource ds = database();
        String quietedBy = "quiet period 1 on rule " + "r".repeat(100) + ", set by " + "b".repeat(100) + " until " + T0.plusSeconds(3600)
                + " (" + "x".repeat(400) + ")";
        new JournalWriter(ds, clock).write(notice(ID, 1, Alert.Kind.OPENING, quietedBy));
        String stored = new AlertHistory(ds).find(ID).stored().quietedBy();
        assertThat(stored).hasSize(400).startsWith("quiet period 1 on rule " + "r".repeat(100) + ", set by ").endsWith("…");
    }

    @Test
    void theLatestNoticeOfAnEpisodeIsWhereItStands() {
        AgroalDataSource ds = database();
        new JournalWriter(ds, clock).write(notice(ID, 1, Alert.Kind.OPENING));
        new JournalWriter(ds, Clock.offset(clock, Duration.ofDays(1)))
                .write(notice("inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~2", 2, Alert.Kind.STANDING));

        assertThat(new AlertHistory(ds).latestPerEpisode()).singleElement().satisfies(a -> {
            assertThat(a.notice()).isEqualTo(2);
            assertThat(a.episodeSince()).isEqualTo(LocalDate.of(2026, 9, 30));
            assertThat(a.policyHash()).isEqualTo("abc123");
        });
    }
}
