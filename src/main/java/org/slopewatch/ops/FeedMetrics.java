package org.slopewatch.ops;

import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import io.quarkus.runtime.Startup;
import jakarta.inject.Singleton;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import org.slopewatch.pipeline.FeedFreshness;
import org.slopewatch.pipeline.IngestConfig;

/**
 * Per watched curve, {@code slopewatch.curve.last.quote.age} in seconds: how long ago this
 * instance's journal took the curve's latest quote (NaN until one arrives). The stale-feed rule
 * itself is {@link FeedFreshness}'s, in business hours; this gauge is the raw age behind it, so
 * a dashboard can show a feed slowing down before the rule calls it stale. Tag values: the
 * configured curves only.
 */
@Startup
@Singleton
public class FeedMetrics {

    FeedMetrics(MeterRegistry registry, FeedFreshness freshness, IngestConfig ingest, Clock clock) {
        for (String curve : ingest.curves()) {
            Gauge.builder("slopewatch.curve.last.quote.age", () -> ageSeconds(freshness.lastQuote(curve), Instant.now(clock)))
                    .description("Seconds since the curve's latest accepted quote was journalled (NaN before the first)")
                    .baseUnit("seconds").tag("curve", curve).register(registry);
        }
    }

    static double ageSeconds(Instant lastQuote, Instant now) {
        return lastQuote == null ? Double.NaN : Duration.between(lastQuote, now).toMillis() / 1000.0;
    }
}
