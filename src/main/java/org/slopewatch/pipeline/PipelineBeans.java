package org.slopewatch.pipeline;

import io.quarkus.runtime.Startup;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.inject.Produces;
import jakarta.inject.Singleton;
import java.io.IOException;
import java.time.Clock;
import org.jboss.logging.Logger;
import org.slopewatch.alerting.AlertStage;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.journal.CurveCheckpoints;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;

/** Builds the step from configuration: the policy in force, and the pipeline rebuilt from the journal. */
@ApplicationScoped
public class PipelineBeans {

    private static final Logger LOG = Logger.getLogger(PipelineBeans.class);

    @Produces
    @Singleton
    PolicyHolder policyHolder(IngestConfig config) {
        String file = config.policy();
        try {
            return new PolicyHolder(PolicyHolder.read(file));
        } catch (IOException e) {
            throw new IllegalStateException("cannot read the policy file " + file + " (slopewatch.ingest.policy): " + e, e);
        } catch (PolicyException e) {
            throw new IllegalStateException("the policy file is invalid:" + System.lineSeparator() + e.getMessage(), e);
        }
    }

    @Produces
    @Singleton
    @Startup
    QuotePipeline quotePipeline(IngestConfig config, PolicyHolder policies, JournalWriter writer, JournalReader reader,
                                CurveCheckpoints checkpoints, PipelineListener listener, AlertStage alerts, Clock clock) {
        Policy policy = policies.policy();
        QuotePipeline.Memory memory = new QuotePipeline.Memory(config.seenIdsCache(), config.memoryDays(),
                config.checkpointEvery().isZero() ? null : checkpoints);
        QuotePipeline pipeline = new QuotePipeline(policy.watches(), writer, reader, listener, alerts, clock, memory);
        long started = System.nanoTime();
        long replayed = pipeline.recover();
        // the duration tells an operator what a restart costs as the journal grows
        LOG.infof("watching %d spread(s) from %s on curves %s; rebuilt from %d journalled quote message(s) in %d ms",
                policy.watches().size(), config.policy(), config.curves(), replayed, (System.nanoTime() - started) / 1_000_000);
        return pipeline;
    }
}
