package org.slopewatch.pipeline;

import io.quarkus.runtime.Startup;
import jakarta.annotation.PreDestroy;
import jakarta.inject.Singleton;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import org.jboss.logging.Logger;
import org.slopewatch.alerting.AlertsConfig;

/**
 * Runs the clock-driven half of alerting at {@code slopewatch.alerts.evaluate-every}: repeats of
 * conditions that still hold, and stale feeds. Transitions do not wait for it; the pipeline
 * decides those as they happen. Only for the curves this instance owns: with several instances
 * on one consumer group, each curve's clock-driven notices come from the one holding its partition.
 */
@Startup
@Singleton
public class AlertTicker {

    private static final Logger LOG = Logger.getLogger(AlertTicker.class);

    private final ScheduledExecutorService timer = Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, "slopewatch-alert-tick");
        t.setDaemon(true);
        return t;
    });

    AlertTicker(QuotePipeline pipeline, FeedFreshness freshness, CurveOwnership ownership, AlertsConfig config) {
        long every = Math.max(100, config.evaluateEvery().toMillis());
        timer.scheduleWithFixedDelay(() -> {
            try {
                pipeline.tick(freshness.staleSince(), ownership);
            } catch (RuntimeException e) {
                // the journal may be down; the next tick tries again, and nothing was decided in memory only
                LOG.warnf("alert evaluation failed, will retry in %d ms: %s", every, e.getMessage());
            }
        }, every, every, TimeUnit.MILLISECONDS);
    }

    @PreDestroy
    void stop() {
        timer.shutdownNow();
    }
}
