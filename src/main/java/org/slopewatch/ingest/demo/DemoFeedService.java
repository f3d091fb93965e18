package org.slopewatch.ingest.demo;

import io.quarkus.runtime.ShutdownEvent;
import io.quarkus.runtime.StartupEvent;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.event.Observes;
import java.time.LocalDate;
import java.util.concurrent.TimeUnit;
import org.jboss.logging.Logger;
import org.slopewatch.ingest.QuoteGateway;
import org.slopewatch.pipeline.QuotePipeline;

/**
 * Runs the demo feed in the background when {@code slopewatch.demo.enabled}: the scripted
 * tightening cycle fast, then on at a slower pace, through the same gateway as HTTP.
 */
@ApplicationScoped
public class DemoFeedService {

    private static final Logger LOG = Logger.getLogger(DemoFeedService.class);

    private final DemoConfig config;
    private final QuoteGateway gateway;
    private final QuotePipeline pipeline;
    private Thread thread;

    DemoFeedService(DemoConfig config, QuoteGateway gateway, QuotePipeline pipeline) {
        this.config = config;
        this.gateway = gateway;
        this.pipeline = pipeline;
    }

    void start(@Observes StartupEvent event) {
        if (!config.enabled()) {
            return;
        }
        DemoScenario scenario = DemoScenario.standard(config.seed(), config.start());
        DemoPace pace = DemoPace.of(config);   // a pace that cannot be kept stops start-up, not the feed later
        LocalDate resumeAfter = pipeline.latestCurves().stream().map(s -> s.date()).max(LocalDate::compareTo).orElse(null);
        LOG.infof("demo feed: GOVT-A (a tightening cycle) and GOVT-B from %s, seed %d, %s, one market day every %s s", scenario.start(),
                config.seed(), resumeAfter == null ? "from the start" : "resuming after " + resumeAfter, pace.before(0).toMillis() / 1000.0);
        thread = new Thread(() -> run(scenario, pace, resumeAfter), "slopewatch-demo-feed");
        thread.setDaemon(true);
        thread.start();
    }

    private void run(DemoScenario scenario, DemoPace pace, LocalDate resumeAfter) {
        long[] nextAt = {System.nanoTime()};
        try {
            new DemoFeed(scenario).play(resumeAfter, Long.MAX_VALUE, index -> {
                nextAt[0] += pace.before(index).toNanos();
                long wait = nextAt[0] - System.nanoTime();
                if (wait > 0) {
                    try {
                        TimeUnit.NANOSECONDS.sleep(wait);
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                    }
                } else {
                    nextAt[0] = System.nanoTime(); // behind schedule (a restart, a slow disk): don't rush to catch up
                }
            }, batch -> gateway.submit(batch).toCompletableFuture().get(30, TimeUnit.SECONDS));
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        } catch (Exception e) {
            LOG.errorf("demo feed stopped: %s", e.getMessage());
        }
    }

    void stop(@Observes ShutdownEvent event) {
        if (thread != null) {
            thread.interrupt();
        }
    }
}
