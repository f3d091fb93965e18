/**
 * Delivery: alert channels (chat webhook, email, stream, log) chosen by type name in
 * configuration ({@link org.slopewatch.delivery.ChannelFactory}, {@link org.slopewatch.delivery.ChannelRegistry}),
 * and one {@link org.slopewatch.delivery.RetryPolicy} that turns every channel's outcome into
 * done, retry at a time, or give up.
 *
 * <p>Invariants: a channel makes one attempt and returns a {@link org.slopewatch.delivery.DeliveryOutcome};
 * it never retries on its own. Webhook URLs, passwords and tokens never reach a log line or an
 * error message: every foreign string passes through a {@link org.slopewatch.delivery.Redactor}
 * ({@code SecretsNeverLeakTest} holds each channel type to it). The retry policy reads time only
 * from its injected clock. Stream channels publish only to Kafka
 * ({@link org.slopewatch.delivery.StreamTransport}): the in-process connector would keep every event.
 */
package org.slopewatch.delivery;
