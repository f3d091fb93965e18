package org.slopewatch.delivery;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.Random;
import java.util.random.RandomGenerator;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.slopewatch.testsupport.MutableClock;

/**
 * The retry policy as a table: base 30 s, cap 10 min, maximum age 2 h, jitter 0.2, the clock at
 * 21:05:00. Each row: the outcome of attempt N, when the first attempt was made, the random draw,
 * and the decision.
 */
class RetryPolicyTest {

    private static final Instant NOW = Instant.parse("2026-06-30T21:05:00Z");
    private static final DeliveryOutcome OK = new DeliveryOutcome.Delivered("HTTP 200");
    private static final DeliveryOutcome BUSY = new DeliveryOutcome.RetryLater("HTTP 503");
    private static final DeliveryOutcome GONE = new DeliveryOutcome.FailedForGood("HTTP 404: no such hook");

    /** A random source that always draws the same number, so that jitter is predictable. */
    record FixedDraw(double value) implements RandomGenerator {
        @Override
        public long nextLong() {
            return (long) (value * Long.MAX_VALUE);
        }

        @Override
        public double nextDouble() {
            return value;
        }
    }

    private static RetryPolicy policy(double draw) {
        return new RetryPolicy(Duration.ofSeconds(30), Duration.ofMinutes(10), Duration.ofHours(2), 0.2,
                Clock.fixed(NOW, ZoneOffset.UTC), new FixedDraw(draw));
    }

    static Stream<Arguments> table() {
        return Stream.of(
                // outcome, attempt, first attempt this long before now, draw, expected decision
                Arguments.of(OK, 1, Duration.ZERO, 0.0, "done"),
                Arguments.of(OK, 7, Duration.ofHours(3), 0.0, "done"),
                Arguments.of(GONE, 1, Duration.ZERO, 0.0, "give up"),
                Arguments.of(BUSY, 1, Duration.ZERO, 0.0, "retry in 30s"),
                Arguments.of(BUSY, 2, Duration.ofSeconds(30), 0.0, "retry in 1m"),
                Arguments.of(BUSY, 3, Duration.ofSeconds(90), 0.0, "retry in 2m"),
                Arguments.of(BUSY, 5, Duration.ofMinutes(8), 0.0, "retry in 8m"),
                Arguments.of(BUSY, 6, Duration.ofMinutes(16), 0.0, "retry in 10m"),
                Arguments.of(BUSY, 40, Duration.ofMinutes(100), 0.0, "retry in 10m"),
                Arguments.of(BUSY, 1, Duration.ZERO, 0.5, "retry in 27s"),
                Arguments.of(BUSY, 6, Duration.ofMinutes(16), 0.999999, "retry in 8m"),
                Arguments.of(BUSY, 8, Duration.ofMinutes(110), 0.0, "retry in 10m"),
                Arguments.of(BUSY, 8, Duration.ofMinutes(111), 0.0, "give up"),
                Arguments.of(BUSY, 8, Duration.ofMinutes(111), 0.5, "retry in 9m"),
                Arguments.of(BUSY, 1, Duration.ofHours(3), 0.0, "give up"));
    }

    @ParameterizedTest(name = "[{index}] {0} on attempt {1}, first attempt {2} ago, draw {3} -> {4}")
    @MethodSource("table")
    void decides(DeliveryOutcome outcome, int attempt, Duration sinceFirst, double draw, String expected) {
        RetryDecision decision = policy(draw).decide(outcome, attempt, NOW.minus(sinceFirst));

        assertThat(describe(decision)).as("decision for %s on attempt %d", outcome, attempt).isEqualTo(expected);
    }

    private static String describe(RetryDecision d) {
        if (d instanceof RetryDecision.RetryAt at) {
            return "retry in " + Duration.between(NOW, at.at()).toString().substring(2).toLowerCase();
        }
        return d instanceof RetryDecision.Done ? "done" : "give up";
    }

    @Test
    void reasonsSayWhatHappenedAndKeepTheChannelsReason() {
        assertThat(policy(0).decide(BUSY, 2, NOW.minusSeconds(30)).reason())
                .isEqualTo("attempt 2 will be retried in 1m: HTTP 503");
        assertThat(policy(0).decide(GONE, 1, NOW).reason()).isEqualTo("failed for good on attempt 1: HTTP 404: no such hook");
        assertThat(policy(0).decide(BUSY, 8, NOW.minus(Duration.ofMinutes(111))).reason())
                .isEqualTo("gave up after 8 attempts: the next try would come after the maximum age of 2h; last: HTTP 503");
        assertThat(policy(0).decide(OK, 3, NOW).reason()).isEqualTo("delivered on attempt 3: HTTP 200");
    }

    @Test
    void jitterOnlyShortensAWaitAndNeverByMoreThanItsShare() {
        RetryPolicy seeded = new RetryPolicy(Duration.ofSeconds(30), Duration.ofMinutes(10), Duration.ofDays(1), 0.2,
                Clock.fixed(NOW, ZoneOffset.UTC), new Random(20260630));
        for (int attempt = 1; attempt <= 12; attempt++) {
            Duration full = seeded.backoff(attempt);
            for (int i = 0; i < 200; i++) {
                RetryDecision.RetryAt at = (RetryDecision.RetryAt) seeded.decide(BUSY, attempt, NOW);
                Duration wait = Duration.between(NOW, at.at());
                assertThat(wait).as("attempt %d: a wait lies within [0.8, 1] of the backoff %s", attempt, full)
                        .isLessThanOrEqualTo(full).isGreaterThanOrEqualTo(Duration.ofMillis(Math.round(full.toMillis() * 0.8)));
            }
        }
    }

    @Test
    void theSameSeedGivesTheSameSchedule() {
        RetryPolicy a = new RetryPolicy(Duration.ofSeconds(30), Duration.ofMinutes(10), Duration.ofDays(1), 0.2,
                Clock.fixed(NOW, ZoneOffset.UTC), new Random(7));
        RetryPolicy b = new RetryPolicy(Duration.ofSeconds(30), Duration.ofMinutes(10), Duration.ofDays(1), 0.2,
                Clock.fixed(NOW, ZoneOffset.UTC), new Random(7));
        for (int attempt = 1; attempt <= 5; attempt++) {
            assertThat(a.decide(BUSY, attempt, NOW)).as("attempt %d", attempt).isEqualTo(b.decide(BUSY, attempt, NOW));
        }
    }

    @Test
    void theClockDecidesNotTheWallClock() {
        MutableClock clock = new MutableClock(NOW);
        RetryPolicy p = new RetryPolicy(Duration.ofSeconds(30), Duration.ofMinutes(10), Duration.ofHours(2), 0, clock, new FixedDraw(0));
        clock.advance(Duration.ofMinutes(5));
        RetryDecision d = p.decide(BUSY, 1, NOW);
        assertThat(d).as("the retry is 30 s after the injected clock's time, not the machine's")
                .isEqualTo(new RetryDecision.RetryAt(NOW.plus(Duration.ofMinutes(5)).plusSeconds(30), "attempt 1 will be retried in 30s: HTTP 503"));
    }

    @Test
    void impossibleSettingsAreRefusedWithTheirName() {
        Clock c = Clock.fixed(NOW, ZoneOffset.UTC);
        RandomGenerator r = new FixedDraw(0);
        assertThatThrownBy(() -> new RetryPolicy(Duration.ZERO, Duration.ofMinutes(1), Duration.ofHours(1), 0.2, c, r))
                .hasMessageContaining("base");
        assertThatThrownBy(() -> new RetryPolicy(Duration.ofMinutes(2), Duration.ofMinutes(1), Duration.ofHours(1), 0.2, c, r))
                .hasMessageContaining("cap");
        assertThatThrownBy(() -> new RetryPolicy(Duration.ofSeconds(1), Duration.ofMinutes(1), Duration.ZERO, 0.2, c, r))
                .hasMessageContaining("max-age");
        assertThatThrownBy(() -> new RetryPolicy(Duration.ofSeconds(1), Duration.ofMinutes(1), Duration.ofHours(1), 1.0, c, r))
                .hasMessageContaining("jitter");
        assertThatThrownBy(() -> policy(0).decide(BUSY, 0, NOW)).hasMessageContaining("count from 1");
    }
}
