package org.slopewatch.pipeline;

import java.time.DayOfWeek;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;

/** Hours between two instants that fall on Monday to Friday (UTC): a weekend without quotes is not a stale feed. */
public final class BusinessHours {

    private BusinessHours() {
    }

    public static double between(Instant from, Instant to) {
        if (!to.isAfter(from)) {
            return 0;
        }
        long seconds = 0;
        LocalDate day = from.atZone(ZoneOffset.UTC).toLocalDate();
        LocalDate last = to.atZone(ZoneOffset.UTC).toLocalDate();
        while (!day.isAfter(last)) {
            if (day.getDayOfWeek() != DayOfWeek.SATURDAY && day.getDayOfWeek() != DayOfWeek.SUNDAY) {
                Instant start = max(from, day.atStartOfDay(ZoneOffset.UTC).toInstant());
                Instant end = min(to, day.plusDays(1).atStartOfDay(ZoneOffset.UTC).toInstant());
                if (end.isAfter(start)) {
                    seconds += Duration.between(start, end).getSeconds();
                }
            }
            day = day.plusDays(1);
        }
        return seconds / 3600.0;
    }

    private static Instant max(Instant a, Instant b) {
        return a.isAfter(b) ? a : b;
    }

    private static Instant min(Instant a, Instant b) {
        return a.isBefore(b) ? a : b;
    }
}
