package org.slopewatch.ingest;

import io.quarkus.runtime.Startup;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.inject.Produces;
import jakarta.inject.Singleton;
import java.time.Clock;
import java.util.Set;
import org.jboss.logging.Logger;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.rules.Policy;

/** Builds the ingest side from configuration: rules, decoder, and the pipeline rebuilt from the journal. */
@ApplicationScoped
public class IngestBeans {

    private static final Logger LOG = Logger.getLogger(IngestBeans.class);

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
    CsvQuoteDecoder csvQuoteDecoder(QuoteDecoder decoder, IngestRules rules) {
        return new CsvQuoteDecoder(decoder, rules);
    }

    @Produces
    @Singleton
    @Startup
    QuotePipeline quotePipeline(IngestConfig config, PolicyHolder policies, JournalWriter writer, JournalReader reader,
                                PipelineListener listener, AlertStage alerts, Clock clock) {
        Policy policy = policies.policy();
        QuotePipeline pipeline = new QuotePipeline(policy.watches(), writer, reader, listener, alerts, clock);
        long started = System.nanoTime();
        long replayed = pipeline.recover();
        // the duration tells an operator what a restart costs as the journal grows
        LOG.infof("watching %d spread(s) from %s on curves %s; rebuilt from %d journalled quote message(s) in %d ms",
                policy.watches().size(), config.policy(), config.curves(), replayed, (System.nanoTime() - started) / 1_000_000);
        return pipeline;
    }
}
