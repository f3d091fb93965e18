package org.slopewatch.ops;

import io.micrometer.core.instrument.FunctionCounter;
import io.micrometer.core.instrument.Gauge;
import io.micrometer.core.instrument.MeterRegistry;
import io.quarkus.runtime.Startup;
import jakarta.inject.Singleton;
import org.slopewatch.pipeline.PulledSources;

/**
 * Per pulled source: {@code slopewatch.source.last.success} (when the last fetch came to an answer,
 * 200 or 304, in seconds since the epoch; NaN before the first) and {@code slopewatch.source.fetch.failures}
 * (failed fetch attempts, retries included, from zero). Tag values: the configured source names only.
 */
@Startup
@Singleton
public class SourceMetrics {

    SourceMetrics(MeterRegistry registry, PulledSources sources) {
        sources.eachSource(name -> {
            Gauge.builder("slopewatch.source.last.success", sources,
                            s -> s.status(name).flatMap(PulledSources.Status::lastSuccessAt).map(t -> t.toEpochMilli() / 1000.0)
                                    .orElse(Double.NaN))
                    .description("When the source's last fetch came to an answer (200 or 304), seconds since the epoch; NaN before the first")
                    .baseUnit("seconds").tag("source", name).register(registry);
            FunctionCounter.builder("slopewatch.source.fetch.failures", sources,
                            s -> s.status(name).map(PulledSources.Status::failures).orElse(0L))
                    .description("Failed fetch attempts of the source, retries included: no answer, an error status, a body refused")
                    .tag("source", name).register(registry);
        });
    }
}
