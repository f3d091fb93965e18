package org.slopewatch.pipeline;

import io.quarkus.runtime.Startup;
import io.quarkus.scheduler.Scheduled.ConcurrentExecution;
import io.quarkus.scheduler.Scheduler;
import jakarta.inject.Singleton;
import java.time.Duration;
import org.jboss.logging.Logger;
import org.slopewatch.alerting.AlertsConfig;

/**
 * Runs the clock-driven half of alerting at {@code slopewatch.alerts.evaluate-every}: standing notices of
 * conditions that still hold, and stale feeds. Transitions do not wait for it; the pipeline
 * decides those as they happen. Only for the curves this instance owns: with several instances
 * on one consumer group, each curve's clock-driven notices come from the one holding its partition.
 * A tick still running when the next is due is skipped, not queued.
 */
@Startup
@Singleton
public class AlertTicker {

    private static final Logger LOG = Logger.getLogger(AlertTicker.class);

    AlertTicker(QuotePipeline pipeline, FeedFreshness freshness, CurveOwnership ownership, AlertsConfig config, Scheduler scheduler) {
        Duration every = config.evaluateEvery();
        scheduler.newJob("slopewatch-alert-tick").setInterval(every.toString()).setDelayed(every.toString())
                .setConcurrentExecution(ConcurrentExecution.SKIP).setTask(execution -> {
                    try {
                        pipeline.tick(freshness.staleSince(), ownership);
                    } catch (RuntimeException e) {
                        // the journal may be down; the next tick tries again, and nothing was decided in memory only
                        LOG.warnf("alert evaluation failed, will retry in %s: %s", every, e.getMessage());
                    }
                }).schedule();
    }
}
