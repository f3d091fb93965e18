package org.slopewatch.pipeline;

import io.quarkus.runtime.ShutdownEvent;
import io.quarkus.runtime.Startup;
import io.quarkus.scheduler.Scheduled.ConcurrentExecution;
import io.quarkus.scheduler.Scheduler;
import jakarta.enterprise.event.Observes;
import jakarta.inject.Singleton;
import java.time.Duration;
import org.jboss.logging.Logger;

/**
 * Checkpoints the curves that changed at {@code slopewatch.ingest.checkpoint-every} and once more at
 * shutdown, so that the next start replays only what came after. Only the curves this instance owns.
 */
@Startup
@Singleton
public class CheckpointSchedule {

    private static final Logger LOG = Logger.getLogger(CheckpointSchedule.class);

    private final QuotePipeline pipeline;
    private final CurveOwnership ownership;
    private final boolean enabled;

    CheckpointSchedule(QuotePipeline pipeline, CurveOwnership ownership, IngestConfig config, Scheduler scheduler) {
        this.pipeline = pipeline;
        this.ownership = ownership;
        Duration every = config.checkpointEvery();
        this.enabled = !every.isZero();
        if (every.isNegative()) {
            throw new IllegalStateException("slopewatch.ingest.checkpoint-every must not be negative, got " + every);
        }
        if (enabled) {
            scheduler.newJob("slopewatch-checkpoint").setInterval(every.toString()).setDelayed(every.toString())
                    .setConcurrentExecution(ConcurrentExecution.SKIP).setTask(execution -> write("scheduled")).schedule();
        }
    }

    void atShutdown(@Observes ShutdownEvent event) {
        if (enabled) {
            write("at shutdown");
        }
    }

    private void write(String when) {
        long started = System.nanoTime();
        int curves = pipeline.checkpoint(ownership);
        if (curves > 0) {
            LOG.infof("checkpoint %s: %d curve(s) in %d ms", when, curves, (System.nanoTime() - started) / 1_000_000);
        }
    }
}
