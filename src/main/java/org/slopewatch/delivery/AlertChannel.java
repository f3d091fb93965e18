package org.slopewatch.delivery;

import org.slopewatch.rules.Alert;

/**
 * Where alerts go: one small class per kind of channel (chat webhook, email, stream, log),
 * chosen by a type name in configuration. A channel makes one attempt and says how it went;
 * it never retries on its own and never puts a secret (webhook URL, password, token) in a
 * message.
 */
public interface AlertChannel {

    /** The configured name of this channel, e.g. {@code desk-chat}. */
    String name();

    /** The type name it was chosen by, e.g. {@code chat-webhook}. */
    String type();

    DeliveryOutcome deliver(Alert alert);
}
