package org.slopewatch.ingest;

import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.inject.Produces;
import jakarta.inject.Singleton;
import java.io.IOException;
import java.nio.file.Path;
import java.time.Clock;
import java.util.Set;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.history.SeriesMap;
import org.slopewatch.pipeline.IngestConfig;

/** Builds the decoding side from configuration: the rules a quote must satisfy and the decoders that apply them. */
@ApplicationScoped
public class IngestBeans {

    @Produces
    @Singleton
    IngestRules ingestRules(IngestConfig config, Clock clock) {
        return new IngestRules(Set.copyOf(config.curves()),
                new YieldBounds(config.minYieldPercent() * 100, config.maxYieldPercent() * 100), config.maxDaysAhead(), clock);
    }

    @Produces
    @Singleton
    QuoteDecoder quoteDecoder(IngestRules rules) {
        return new QuoteDecoder(rules);
    }

    @Produces
    @Singleton
    CsvQuoteDecoder csvQuoteDecoder(QuoteDecoder decoder, IngestRules rules, IngestConfig config) throws IOException {
        return new CsvQuoteDecoder(decoder, rules, SeriesMap.readOrNone(config.seriesMap().map(Path::of).orElse(null)));
    }
}
