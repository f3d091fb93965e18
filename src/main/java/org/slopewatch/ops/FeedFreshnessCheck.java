package org.slopewatch.ops;

import io.smallrye.health.api.Wellness;
import jakarta.enterprise.context.ApplicationScoped;
import java.time.Clock;
import java.time.Instant;
import java.util.Locale;
import java.util.Map;
import org.eclipse.microprofile.health.HealthCheck;
import org.eclipse.microprofile.health.HealthCheckResponse;
import org.eclipse.microprofile.health.HealthCheckResponseBuilder;
import org.slopewatch.ingest.IngestConfig;
import org.slopewatch.ingest.QuotePipeline;

/**
 * Feed freshness per watched curve: DOWN when a curve has had no accepted quote for more than the
 * configured business hours (counted from start-up for a curve not yet heard from). A wellness
 * check, so that a quiet feed shows in {@code /q/health} without taking the daemon out of a load
 * balancer.
 */
@Wellness
@ApplicationScoped
public class FeedFreshnessCheck implements HealthCheck {

    private final QuotePipeline pipeline;
    private final IngestConfig ingest;
    private final FeedConfig feeds;
    private final Clock clock;
    private final Instant started;

    FeedFreshnessCheck(QuotePipeline pipeline, IngestConfig ingest, FeedConfig feeds, Clock clock) {
        this.pipeline = pipeline;
        this.ingest = ingest;
        this.feeds = feeds;
        this.clock = clock;
        this.started = Instant.now(clock);
    }

    @Override
    public HealthCheckResponse call() {
        Instant now = Instant.now(clock);
        Map<String, Instant> last = pipeline.lastReceived();
        HealthCheckResponseBuilder b = HealthCheckResponse.named("feed freshness").up();
        for (String curve : ingest.curves()) {
            Instant since = last.getOrDefault(curve, started);
            double quiet = BusinessHours.between(since, now);
            boolean stale = quiet > feeds.staleAfterBusinessHours();
            b.withData(curve, String.format(Locale.ROOT, "%s: last quote %s, %.1f business hours ago",
                    stale ? "stale" : "fresh", last.containsKey(curve) ? last.get(curve).toString() : "none since start", quiet));
            if (stale) {
                b.down();
            }
        }
        return b.build();
    }
}
