package org.slopewatch.ops;

import io.smallrye.health.api.Wellness;
import jakarta.enterprise.context.ApplicationScoped;
import java.util.Locale;
import java.util.stream.Collectors;
import org.eclipse.microprofile.health.HealthCheck;
import org.eclipse.microprofile.health.HealthCheckResponse;
import org.eclipse.microprofile.health.HealthCheckResponseBuilder;
import org.slopewatch.alerting.AlertDesk;
import org.slopewatch.alerting.ChannelReach;

/**
 * Whether every alert rule of the policy in force can reach the desk with the channels configured
 * here ({@link ChannelReach}): DOWN when a rule's channels are all unconfigured, or a critical
 * rule has only a log channel left. Wellness, not readiness: quotes are still taken and journalled,
 * and taking the daemon out of its load balancer would not bring a channel back.
 */
@Wellness
@ApplicationScoped
public class AlertChannelsCheck implements HealthCheck {

    private final AlertDesk desk;

    AlertChannelsCheck(AlertDesk desk) {
        this.desk = desk;
    }

    @Override
    public HealthCheckResponse call() {
        ChannelReach reach = desk.reach();
        HealthCheckResponseBuilder b = HealthCheckResponse.named("alert channels").status(reach.unreached().isEmpty());
        b.withData("policy", reach.source());
        if (!reach.unconfigured().isEmpty()) {
            b.withData("not configured", reach.unconfigured().stream().map(c -> c.name() + " (" + c.type() + ")")
                    .collect(Collectors.joining(", ")) + ": deliveries recorded as skipped; set slopewatch.channels.<name>.*");
        }
        for (ChannelReach.RuleReach rule : reach.rules()) {
            b.withData(rule.rule(), rule.severity().name().toLowerCase(Locale.ROOT) + ": " + rule.describe());
        }
        return b.build();
    }
}
