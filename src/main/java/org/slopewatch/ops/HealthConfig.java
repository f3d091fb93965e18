package org.slopewatch.ops;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import java.time.Duration;

/** When the wellness check counts a channel's delivery attempts as failing ({@link DeliveryFailuresCheck}). */
@ConfigMapping(prefix = "slopewatch.health")
public interface HealthConfig {

    /** Attempts in a row on one channel that did not deliver before the channel counts as failing; at least 1. */
    @WithDefault("3")
    int failingAfterAttempts();

    /**
     * How recent the latest of those attempts must be. Longer than the retry policy's cap, so that
     * a channel still being retried does not look well between two attempts.
     */
    @WithDefault("1h")
    Duration failingWithin();
}
