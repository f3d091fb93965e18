package org.slopewatch.ops;

import io.smallrye.health.api.Wellness;
import jakarta.enterprise.context.ApplicationScoped;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import org.eclipse.microprofile.health.HealthCheck;
import org.eclipse.microprofile.health.HealthCheckResponse;
import org.eclipse.microprofile.health.HealthCheckResponseBuilder;
import org.slopewatch.pipeline.PulledSources;

/**
 * DOWN while a pulled source is failing ({@link PulledSources.Status#failing}): its latest fetch
 * failed and it has not answered within its interval. Wellness: the other feeds go on. The answer
 * is open, so it gives ages and counts only; why a fetch failed is in the journal's
 * {@code source_fetch} rows and the log.
 */
@Wellness
@ApplicationScoped
public class PulledSourcesCheck implements HealthCheck {

    private final PulledSources sources;
    private final Clock clock;

    PulledSourcesCheck(PulledSources sources, Clock clock) {
        this.sources = sources;
        this.clock = clock;
    }

    @Override
    public HealthCheckResponse call() {
        Instant now = clock.instant();
        HealthCheckResponseBuilder b = HealthCheckResponse.named("pulled sources").up();
        for (PulledSources.Status s : sources.all().values()) {
            Duration age = s.lastSuccess() == null ? null : Duration.between(s.lastSuccess(), now);
            boolean failing = s.failing(now);
            if (failing) {
                b.down();
            }
            b.withData(s.source(), (failing ? "failing: " : "")
                    + (age == null ? "no answer yet" : "last answer " + s.lastSuccess() + " (" + age.toSeconds() + " s ago)")
                    + ", failures in a row " + s.failuresInARow());
        }
        return b.build();
    }
}
