package org.slopewatch.ops;

import io.smallrye.health.api.Wellness;
import jakarta.enterprise.context.ApplicationScoped;
import java.util.Locale;
import org.eclipse.microprofile.health.HealthCheck;
import org.eclipse.microprofile.health.HealthCheckResponse;
import org.eclipse.microprofile.health.HealthCheckResponseBuilder;
import org.slopewatch.pipeline.FeedFreshness;

/**
 * Feed freshness per watched curve: DOWN when a curve has had no accepted quote for more than the
 * configured business hours, or has never been quoted at all (no quote in the journal). A
 * wellness check, so that a quiet feed shows in {@code /q/health} without taking the daemon out of
 * a load balancer.
 */
@Wellness
@ApplicationScoped
public class FeedFreshnessCheck implements HealthCheck {

    private final FeedFreshness freshness;

    FeedFreshnessCheck(FeedFreshness freshness) {
        this.freshness = freshness;
    }

    @Override
    public HealthCheckResponse call() {
        HealthCheckResponseBuilder b = HealthCheckResponse.named("feed freshness").up();
        for (FeedFreshness.CurveFeed feed : freshness.now().values()) {
            if (!feed.ownedHere()) {
                b.withData(feed.curve(), "owned by another instance of the consumer group, which reports its feed");
                continue;
            }
            if (feed.neverQuoted()) {
                b.withData(feed.curve(), String.format(Locale.ROOT, "never quoted: no quote in the journal, %.1f business hours since "
                        + "start-up", feed.quietBusinessHours()));
            } else {
                b.withData(feed.curve(), String.format(Locale.ROOT, "%s: last quote %s, %.1f business hours ago",
                        feed.stale() ? "stale" : "fresh", feed.lastQuote(), feed.quietBusinessHours()));
            }
            if (feed.stale() || feed.neverQuoted()) {
                b.down();
            }
        }
        return b.build();
    }
}
