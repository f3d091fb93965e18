package org.slopewatch.pipeline;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import org.junit.jupiter.api.Test;

/** Business hours count Monday to Friday only (UTC), so a quiet weekend never makes a feed stale. */
class BusinessHoursTest {

    private static double hours(String from, String to) {
        return BusinessHours.between(Instant.parse(from), Instant.parse(to));
    }

    @Test
    void withinOneWeekday() {
        // Wednesday 2026-12-02, 09:00 to 13:30
        assertThat(hours("2026-12-02T09:00:00Z", "2026-12-02T13:30:00Z")).isEqualTo(4.5);
    }

    @Test
    void aWeekendInBetweenCountsForNothing() {
        // Friday 2026-12-04 20:00 to Monday 2026-12-07 02:00: 4 h on Friday + 2 h on Monday
        assertThat(hours("2026-12-04T20:00:00Z", "2026-12-07T02:00:00Z")).isEqualTo(6.0);
    }

    @Test
    void aWholeWeekendAloneIsZeroAndBackwardsIsZero() {
        assertThat(hours("2026-12-05T00:00:00Z", "2026-12-07T00:00:00Z")).isZero();
        assertThat(hours("2026-12-03T00:00:00Z", "2026-12-02T00:00:00Z")).isZero();
    }

    @Test
    void aFullWeekIsFiveDays() {
        assertThat(hours("2026-11-30T00:00:00Z", "2026-12-07T00:00:00Z")).isEqualTo(120.0);
    }
}
