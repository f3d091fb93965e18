/**
 * Delivery: alert channels (chat webhook, email, stream, log), the outbox and the dispatcher
 * with one retry policy for every channel.
 *
 * <p>Invariants: a channel makes one attempt and returns a {@link org.slopewatch.delivery.DeliveryOutcome};
 * webhook URLs, passwords and tokens never reach a log line or an error message.
 */
package org.slopewatch.delivery;
