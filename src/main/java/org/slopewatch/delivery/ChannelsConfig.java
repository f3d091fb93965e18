package org.slopewatch.delivery;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import io.smallrye.config.WithParentName;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The configured channels, by name: {@code slopewatch.channels.<name>.type} and the settings
 * that type reads. Secrets come from the environment, e.g.
 * {@code slopewatch.channels.desk-chat.url=${SLOPEWATCH_CHAT_URL}}; the SMTP password is the
 * Mailer's, {@code quarkus.mailer.password}.
 */
@ConfigMapping(prefix = "slopewatch.channels")
public interface ChannelsConfig {

    @WithParentName
    Map<String, Channel> channels();

    /** One channel's settings; which ones apply depends on the type. */
    interface Channel {

        /** {@code chat-webhook}, {@code email}, {@code log} or {@code stream}. */
        String type();

        /** chat-webhook: where to post; a secret. */
        Optional<String> url();

        /** chat-webhook: {@code text} (default) or {@code alert-json}. */
        Optional<String> format();

        /** email: the recipients. */
        Optional<List<String>> to();

        /** chat-webhook: connect and answer time-out; stream: how long to wait for the broker's acknowledgement. */
        @WithDefault("10s")
        Duration timeout();
    }
}
