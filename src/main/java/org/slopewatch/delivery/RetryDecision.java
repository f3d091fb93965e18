package org.slopewatch.delivery;

import java.time.Instant;

/** What {@link RetryPolicy} makes of one attempt's outcome. */
public sealed interface RetryDecision permits RetryDecision.Done, RetryDecision.RetryAt, RetryDecision.GiveUp {

    /** A reason a person can read in a log line. */
    String reason();

    /** Delivered: nothing more to do. */
    record Done(String reason) implements RetryDecision {
    }

    /** Try again at {@code at} (the backoff after the attempt, with jitter). */
    record RetryAt(Instant at, String reason) implements RetryDecision {
    }

    /** No more attempts: the receiver refused for good, or the alert grew too old. */
    record GiveUp(String reason) implements RetryDecision {
    }
}
