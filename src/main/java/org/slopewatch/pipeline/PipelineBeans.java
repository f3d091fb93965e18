package org.slopewatch.pipeline;

import io.quarkus.runtime.Startup;
import io.quarkus.scheduler.Scheduled.ConcurrentExecution;
import io.quarkus.scheduler.Scheduler;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.inject.Produces;
import jakarta.inject.Singleton;
import java.io.IOException;
import java.time.Clock;
import java.time.Duration;
import org.jboss.logging.Logger;
import org.slopewatch.alerting.AlertMetrics;
import org.slopewatch.alerting.AlertStage;
import org.slopewatch.alerting.AlertsConfig;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.journal.CurveCheckpoints;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.journal.PolicyInForce;
import org.slopewatch.journal.PolicyVersions;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;

/**
 * Builds the step from configuration: the policy in force, the pipeline rebuilt from the journal,
 * the policy's reloader and this instance's part in the fleet, with their scheduled checks.
 */
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

    @Produces
    @Singleton
    @Startup
    PolicyReloader policyReloader(PolicyHolder policies, QuotePipeline pipeline, AlertStage desk, PolicyVersions versions,
                                  PolicyInForce fleet, FleetConfig fleetConfig, AlertMetrics metrics, AlertsConfig config, Clock clock,
                                  Scheduler scheduler) {
        PolicyReloader reloader = new PolicyReloader(policies, pipeline, desk, versions, fleet, InstanceId.of(fleetConfig.instanceId()),
                metrics::reload, clock);
        every(scheduler, "slopewatch-policy-reload", config.reloadCheck(), reloader::checkQuietly);
        return reloader;
    }

    @Produces
    @Singleton
    @Startup
    PolicyFleet policyFleet(PolicyReloader reloader, PolicyHolder policies, PolicyInForce store, FleetConfig config, Scheduler scheduler) {
        Duration every = config.checkEvery();
        if (every.compareTo(Duration.ZERO) > 0 && config.liveWithin().compareTo(every) <= 0) {
            throw new IllegalStateException("slopewatch.fleet.live-within (" + config.liveWithin()
                    + ") must be longer than slopewatch.fleet.check-every (" + every + "), or every instance would look gone between heartbeats");
        }
        PolicyFleet fleet = new PolicyFleet(reloader, policies, store, InstanceId.of(config.instanceId()));
        every(scheduler, "slopewatch-policy-fleet", every, fleet::checkQuietly);
        return fleet;
    }

    /** A job every {@code period}, first after one period, skipped while the one before still runs; none for a period of 0 or less. */
    private static void every(Scheduler scheduler, String name, Duration period, Runnable task) {
        if (!period.isZero() && !period.isNegative()) {
            scheduler.newJob(name).setInterval(period.toString()).setDelayed(period.toString())
                    .setConcurrentExecution(ConcurrentExecution.SKIP).setTask(execution -> task.run()).schedule();
        }
    }
}
