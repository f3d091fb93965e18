package org.slopewatch.delivery;

/**
 * What one delivery attempt came to. One retry policy ({@code RetryPolicy}) decides what to do
 * with it for every channel.
 */
public sealed interface DeliveryOutcome permits DeliveryOutcome.Delivered, DeliveryOutcome.RetryLater, DeliveryOutcome.FailedForGood {

    /** The receiver took it (2xx, or the SMTP server accepted the message). */
    record Delivered(String detail) implements DeliveryOutcome {
    }

    /** Worth another try: 5xx, 429, a time-out, a refused connection. The reason never holds a secret. */
    record RetryLater(String reason) implements DeliveryOutcome {
    }

    /** Not worth another try: another 4xx, a rejected address. The reason carries the response, secrets removed. */
    record FailedForGood(String reason) implements DeliveryOutcome {
    }
}
