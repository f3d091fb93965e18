package org.slopewatch.delivery;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.Objects;
import java.util.random.RandomGenerator;

/**
 * The one place that decides what happens after a delivery attempt, for every channel.
 * Delivered is done and failed-for-good gives up at once. Retry-later waits
 * {@code min(cap, base · 2^(attempt−1))}, shortened by a random share of up to {@code jitter}
 * so that many alerts held up by one outage do not all come back at the same instant, and gives
 * up instead when the next try would come later than {@code maxAge} after the first attempt.
 *
 * <p>The jitter only shortens a delay, so no wait is ever longer than the cap. The clock and the
 * random source are injected: nothing here reads the time on its own, and a test chooses both.
 */
public final class RetryPolicy {

    private final Duration base;
    private final Duration cap;
    private final Duration maxAge;
    private final double jitter;
    private final Clock clock;
    private final RandomGenerator random;

    /**
     * @param base   the wait after the first failed attempt
     * @param cap    the longest wait between two attempts
     * @param maxAge how long after the first attempt an alert is still worth delivering
     * @param jitter the largest share of a wait taken off at random, in [0, 1)
     */
    public RetryPolicy(Duration base, Duration cap, Duration maxAge, double jitter, Clock clock, RandomGenerator random) {
        this.base = Objects.requireNonNull(base, "base");
        this.cap = Objects.requireNonNull(cap, "cap");
        this.maxAge = Objects.requireNonNull(maxAge, "maxAge");
        this.clock = Objects.requireNonNull(clock, "clock");
        this.random = Objects.requireNonNull(random, "random");
        if (base.isNegative() || base.isZero()) {
            throw new IllegalArgumentException("retry base must be positive, not " + base);
        }
        if (cap.compareTo(base) < 0) {
            throw new IllegalArgumentException("retry cap " + cap + " is shorter than the base " + base);
        }
        if (maxAge.isNegative() || maxAge.isZero()) {
            throw new IllegalArgumentException("retry max-age must be positive, not " + maxAge);
        }
        if (!(jitter >= 0 && jitter < 1)) {
            throw new IllegalArgumentException("retry jitter must be in [0, 1), not " + jitter);
        }
        this.jitter = jitter;
    }

    /**
     * @param outcome      what the attempt came to
     * @param attempt      which attempt it was, 1 for the first
     * @param firstAttempt when the first attempt for this alert on this channel was made
     */
    public RetryDecision decide(DeliveryOutcome outcome, int attempt, Instant firstAttempt) {
        Objects.requireNonNull(outcome, "outcome");
        Objects.requireNonNull(firstAttempt, "firstAttempt");
        if (attempt < 1) {
            throw new IllegalArgumentException("attempts count from 1, not " + attempt);
        }
        if (outcome instanceof DeliveryOutcome.Delivered d) {
            return new RetryDecision.Done("delivered on attempt " + attempt + ": " + d.detail());
        }
        if (outcome instanceof DeliveryOutcome.FailedForGood f) {
            return new RetryDecision.GiveUp("failed for good on attempt " + attempt + ": " + f.reason());
        }
        String reason = ((DeliveryOutcome.RetryLater) outcome).reason();
        Instant now = clock.instant();
        Duration wait = jittered(backoff(attempt));
        Instant at = now.plus(wait);
        Instant deadline = firstAttempt.plus(maxAge);
        if (at.isAfter(deadline)) {
            return new RetryDecision.GiveUp("gave up after " + attempt + (attempt == 1 ? " attempt" : " attempts")
                    + ": the next try would come after the maximum age of " + human(maxAge) + "; last: " + reason);
        }
        return new RetryDecision.RetryAt(at, "attempt " + attempt + " will be retried in " + human(wait) + ": " + reason);
    }

    /** The wait after the given attempt before jitter: {@code min(cap, base · 2^(attempt−1))}. */
    public Duration backoff(int attempt) {
        int doublings = attempt - 1;
        // base · 2^62 overflows any duration worth waiting for; the cap has long been reached
        if (doublings >= 62 || base.toNanos() > (cap.toNanos() >> doublings)) {
            return cap;
        }
        return base.multipliedBy(1L << doublings);
    }

    private Duration jittered(Duration wait) {
        if (jitter == 0) {
            return wait;
        }
        double share = jitter * random.nextDouble();
        // whole milliseconds: a schedule in a log line reads better, and no store needs finer
        return Duration.ofMillis(Math.round(wait.toMillis() * (1 - share)));
    }

    public Duration base() {
        return base;
    }

    public Duration cap() {
        return cap;
    }

    public Duration maxAge() {
        return maxAge;
    }

    public double jitter() {
        return jitter;
    }

    private static String human(Duration d) {
        return d.toString().substring(2).toLowerCase(java.util.Locale.ROOT);
    }
}
