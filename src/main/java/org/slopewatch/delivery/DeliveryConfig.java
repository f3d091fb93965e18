package org.slopewatch.delivery;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import java.time.Duration;
import java.util.List;
import java.util.Optional;

/** Delivery settings shared by every channel: the retry policy and where webhooks may go. */
@ConfigMapping(prefix = "slopewatch.delivery")
public interface DeliveryConfig {

    Retry retry();

    /**
     * Hosts chat webhooks may point at: names, addresses or {@code *.domain}; empty allows none, so
     * a webhook channel then stops start-up.
     */
    Optional<List<String>> allowedHosts();

    /**
     * The CloudEvents {@code source} of the events stream channels send: a URI reference naming
     * this deployment, so that consumers of several desks' alerts can tell them apart.
     */
    @WithDefault(StreamChannel.DEFAULT_SOURCE)
    String cloudEventsSource();

    /** See {@link RetryPolicy}. */
    interface Retry {

        /** The wait after the first failed attempt. */
        @WithDefault("30s")
        Duration base();

        /** The longest wait between two attempts. */
        @WithDefault("30m")
        Duration cap();

        /** After this long since the first attempt an alert is no longer worth delivering. */
        @WithDefault("24h")
        Duration maxAge();

        /** The largest share of a wait taken off at random, in [0, 1). */
        @WithDefault("0.2")
        double jitter();
    }
}
