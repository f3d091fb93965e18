package org.slopewatch.delivery;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import java.time.Duration;

/** Delivery settings shared by every channel: the retry policy. */
@ConfigMapping(prefix = "slopewatch.delivery")
public interface DeliveryConfig {

    Retry retry();

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
