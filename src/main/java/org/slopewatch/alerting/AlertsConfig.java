package org.slopewatch.alerting;

import io.smallrye.config.ConfigMapping;
import io.smallrye.config.WithDefault;
import java.time.Duration;

/** How often the clock-driven parts of alerting run, and where alerts link to. */
@ConfigMapping(prefix = "slopewatch.alerts")
public interface AlertsConfig {

    /** How often standing notices and stale feeds are evaluated (the pipeline evaluates transitions as they happen). */
    @WithDefault("30s")
    Duration evaluateEvery();

    /** How often the outbox is polled for due deliveries (new alerts are sent at once regardless). */
    @WithDefault("1s")
    Duration deliveryPoll();

    /**
     * How long a delivery claimed by an instance is that instance's alone: longer than any attempt
     * can take, short enough that a delivery left by an instance that died is soon taken by another
     * (or by the same daemon started again).
     */
    @WithDefault("2m")
    Duration deliveryClaim();

    /** How often the policy file is checked for changes (hot reload); 0 turns reloading off. */
    @WithDefault("5s")
    Duration reloadCheck();

    /** The dashboard's address as people reach it; alerts link to it. */
    @WithDefault("http://localhost:8080/")
    String dashboardUrl();
}
