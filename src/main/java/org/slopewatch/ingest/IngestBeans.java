package org.slopewatch.ingest;

import io.quarkus.runtime.Startup;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.inject.Produces;
import jakarta.inject.Singleton;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.Set;
import org.jboss.logging.Logger;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyParser;

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
    @Startup
    QuotePipeline quotePipeline(IngestConfig config, JournalWriter writer, JournalReader reader, PipelineListener listener, Clock clock) {
        Policy policy = policy(config.policy());
        QuotePipeline pipeline = new QuotePipeline(policy.watches(), writer, reader, listener, clock);
        long replayed = pipeline.recover();
        LOG.infof("watching %d spread(s) from %s on curves %s; rebuilt from %d journalled quote message(s)",
                policy.watches().size(), config.policy(), config.curves(), replayed);
        return pipeline;
    }

    /** Reads the policy; a missing or invalid file stops start-up with every problem listed. */
    static Policy policy(String file) {
        try {
            return PolicyParser.parse(file, Files.readString(Path.of(file)));
        } catch (IOException e) {
            throw new IllegalStateException("cannot read the policy file " + file + " (slopewatch.ingest.policy): " + e, e);
        } catch (PolicyException e) {
            throw new IllegalStateException("the policy file is invalid:" + System.lineSeparator() + e.getMessage(), e);
        }
    }
}
