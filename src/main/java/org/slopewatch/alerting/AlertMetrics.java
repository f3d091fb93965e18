package org.slopewatch.alerting;

import io.micrometer.core.instrument.Counter;
import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import jakarta.inject.Singleton;
import java.util.Collection;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.atomic.AtomicLong;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertRule;
import org.slopewatch.rules.Policy;

/**
 * Alerting's meters under {@code slopewatch.}: logical notices by rule, severity and kind; every
 * delivery attempt by channel and outcome; each delivery's final outcome; the outbox backlog;
 * policy reloads by outcome. Attempts and notices are counted apart, so retries never inflate the
 * count of alerts. Every series the policy in force can move exists at zero from the start ({@link #expect}).
 */
@Singleton
public class AlertMetrics {

    private final MeterRegistry registry;
    private final AtomicLong backlog = new AtomicLong();

    AlertMetrics(MeterRegistry registry) {
        this.registry = registry;
        Gauge.builder("slopewatch.alert.backlog", backlog, AtomicLong::get)
                .description("deliveries waiting in the outbox (all channels)").register(registry);
        for (String outcome : RELOAD_OUTCOMES) {
            reloads(outcome).increment(0);
        }
    }

    private static final String[] RELOAD_OUTCOMES = {"applied", "rejected"};
    private static final String[] ATTEMPT_OUTCOMES = {"delivered", "retry", "failed"};
    private static final String[] FINAL_OUTCOMES = {"delivered", "failed", "skipped"};

    /**
     * Every series a policy can move, at zero before anything happened, so that a rate or an
     * increase over it is defined from the start (and alerting rules need not guard against a
     * missing series): per rule, each kind muted or not and each attempt outcome on each of its
     * channels; per channel, named in the policy or configured, each final outcome.
     */
    void expect(Policy policy, Collection<String> configuredChannels) {
        Set<String> channels = new TreeSet<>(configuredChannels);
        for (AlertRule rule : policy.alerts()) {
            String severity = lower(rule.severity());
            for (Alert.Kind kind : Alert.Kind.values()) {
                for (boolean muted : new boolean[] {false, true}) {
                    alerts(rule.name(), severity, lower(kind), muted).increment(0);
                }
            }
            for (String channel : rule.channels()) {
                channels.add(channel);
                for (String outcome : ATTEMPT_OUTCOMES) {
                    attempts(channel, rule.name(), severity, outcome).increment(0);
                }
            }
        }
        policy.channels().forEach(c -> channels.add(c.name()));
        for (String channel : channels) {
            for (String outcome : FINAL_OUTCOMES) {
                deliveries(channel, outcome).increment(0);
            }
        }
    }

    void decided(Alert alert, boolean muted) {
        alerts(alert.rule(), lower(alert.severity()), lower(alert.kind()), muted).increment();
    }

    /** @param outcome {@code delivered}, {@code retry} or {@code failed} */
    void attempt(String channel, Alert alert, String outcome) {
        attempts(channel, alert.rule(), lower(alert.severity()), outcome).increment();
    }

    /** @param outcome {@code delivered}, {@code failed} or {@code skipped}: how a delivery ended */
    void finished(String channel, String outcome) {
        deliveries(channel, outcome).increment();
    }

    private Counter alerts(String rule, String severity, String kind, boolean muted) {
        return Counter.builder("slopewatch.alerts").description("notices decided by the rule engine")
                .tag("rule", rule).tag("severity", severity).tag("kind", kind).tag("muted", Boolean.toString(muted)).register(registry);
    }

    private Counter attempts(String channel, String rule, String severity, String outcome) {
        return Counter.builder("slopewatch.alert.attempts").description("delivery attempts")
                .tag("channel", channel).tag("rule", rule).tag("severity", severity).tag("outcome", outcome).register(registry);
    }

    private Counter deliveries(String channel, String outcome) {
        return Counter.builder("slopewatch.alert.deliveries").description("deliveries by how they ended")
                .tag("channel", channel).tag("outcome", outcome).register(registry);
    }

    private Counter reloads(String outcome) {
        return Counter.builder("slopewatch.policy.reloads").description("policy reloads by outcome").tag("outcome", outcome)
                .register(registry);
    }

    private static String lower(Enum<?> value) {
        return value.name().toLowerCase(Locale.ROOT);
    }

    void backlog(long pending) {
        backlog.set(pending);
    }

    /** @param outcome {@code applied} or {@code rejected} */
    public void reload(String outcome) {
        reloads(outcome).increment();
    }
}
