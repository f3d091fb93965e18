package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.sql.Connection;
import java.sql.Statement;
import java.time.Clock;
import java.time.Duration;
import java.util.EnumSet;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Alert;

/**
 * A journal written before the notice kinds had their present names holds FIRING, REPEAT and
 * RESOLVED in {@code alert.kind} (vocabulary: deprecation path): they read as OPENING, STANDING and
 * CLOSING everywhere a kind is read back, the what-if's query by kind included. The same checks on
 * H2 and PostgreSQL.
 */
abstract class OldStoredKindsChecks extends AlertJournalFixture {

    @Test
    void oldKindsReadAsTheNewOnes() throws Exception {
        AgroalDataSource ds = database();
        new JournalWriter(ds, clock).write(notice(ID, 1, Alert.Kind.OPENING));
        new JournalWriter(ds, Clock.offset(clock, Duration.ofDays(1)))
                .write(notice("inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~2", 2, Alert.Kind.STANDING));
        new JournalWriter(ds, Clock.offset(clock, Duration.ofDays(2)))
                .write(notice("inversion-confirmed~GOVT-A:10Y-3M~2026-09-30~3", 3, Alert.Kind.CLOSING));
        try (Connection c = ds.getConnection(); Statement s = c.createStatement()) {
            s.executeUpdate("UPDATE alert SET kind = 'FIRING' WHERE notice = 1");
            s.executeUpdate("UPDATE alert SET kind = 'REPEAT' WHERE notice = 2");
            s.executeUpdate("UPDATE alert SET kind = 'RESOLVED' WHERE notice = 3");
        }

        AlertHistory history = new AlertHistory(ds);
        assertThat(new NewestAlerts(ds).page(10, null, null)).extracting(v -> v.stored().alert().kind())
                .containsExactlyInAnyOrder(Alert.Kind.OPENING, Alert.Kind.STANDING, Alert.Kind.CLOSING);
        assertThat(history.notices(EnumSet.of(Alert.Kind.OPENING, Alert.Kind.CLOSING))).extracting(a -> a.alert().kind())
                .as("the query by kind finds the old names").containsExactly(Alert.Kind.OPENING, Alert.Kind.CLOSING);
        assertThat(history.latestPerEpisode()).singleElement().satisfies(a -> assertThat(a.alert().kind()).isEqualTo(Alert.Kind.CLOSING));
    }
}
