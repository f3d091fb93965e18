package org.slopewatch.alerting;

import io.micrometer.core.instrument.Counter;
import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import jakarta.inject.Singleton;
import java.util.Locale;
import java.util.concurrent.atomic.AtomicLong;
import org.slopewatch.delivery.Alert;

/**
 * Alerting's meters under {@code slopewatch.}: logical notices by rule, severity and kind; every
 * delivery attempt by channel and outcome; each delivery's final outcome; the outbox backlog;
 * policy reloads by outcome. Attempts and notices are counted apart, so retries never inflate the
 * count of alerts.
 */
@Singleton
public class AlertMetrics {

    private final MeterRegistry registry;
    private final AtomicLong backlog = new AtomicLong();

    AlertMetrics(MeterRegistry registry) {
        this.registry = registry;
        Gauge.builder("slopewatch.alert.backlog", backlog, AtomicLong::get)
                .description("deliveries waiting in the outbox (all channels)").register(registry);
    }

    void decided(Alert alert, boolean muted) {
        Counter.builder("slopewatch.alerts").description("notices decided by the rule engine")
                .tag("rule", alert.rule()).tag("severity", alert.severity().name().toLowerCase(Locale.ROOT))
                .tag("kind", alert.kind().name().toLowerCase(Locale.ROOT)).tag("muted", Boolean.toString(muted))
                .register(registry).increment();
    }

    /** @param outcome {@code delivered}, {@code retry} or {@code failed} */
    void attempt(String channel, Alert alert, String outcome) {
        Counter.builder("slopewatch.alert.attempts").description("delivery attempts")
                .tag("channel", channel).tag("rule", alert.rule())
                .tag("severity", alert.severity().name().toLowerCase(Locale.ROOT)).tag("outcome", outcome)
                .register(registry).increment();
    }

    /** @param outcome {@code delivered}, {@code failed} or {@code skipped}: how a delivery ended */
    void finished(String channel, String outcome) {
        Counter.builder("slopewatch.alert.deliveries").description("deliveries by how they ended")
                .tag("channel", channel).tag("outcome", outcome).register(registry).increment();
    }

    void backlog(long pending) {
        backlog.set(pending);
    }

    /** @param outcome {@code applied} or {@code rejected} */
    void reload(String outcome) {
        Counter.builder("slopewatch.policy.reloads").description("policy reloads by outcome")
                .tag("outcome", outcome).register(registry).increment();
    }
}
