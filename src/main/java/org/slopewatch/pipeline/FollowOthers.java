package org.slopewatch.pipeline;

import io.quarkus.runtime.Startup;
import io.quarkus.scheduler.Scheduled.ConcurrentExecution;
import io.quarkus.scheduler.Scheduler;
import jakarta.inject.Singleton;
import java.time.Duration;
import java.util.Set;
import org.jboss.logging.Logger;

/**
 * With several instances on one consumer group, each decides for the curves it owns; this brings
 * the others' curves up to date from the shared journal at {@code slopewatch.ingest.follow-every},
 * so that any instance answers reads of every curve ({@link QuotePipeline#follow}). Not scheduled
 * with the embedded transport, where one instance owns everything.
 */
@Startup
@Singleton
public class FollowOthers {

    private static final Logger LOG = Logger.getLogger(FollowOthers.class);

    FollowOthers(QuotePipeline pipeline, CurveOwnership ownership, IngestConfig config, Scheduler scheduler) {
        Duration every = config.followEvery();
        if (every.isNegative()) {
            throw new IllegalStateException("slopewatch.ingest.follow-every must not be negative, got " + every);
        }
        if (every.isZero() || config.transport() != IngestConfig.Transport.KAFKA) {
            return;
        }
        scheduler.newJob("slopewatch-follow-others").setInterval(every.toString()).setDelayed(every.toString())
                .setConcurrentExecution(ConcurrentExecution.SKIP).setTask(execution -> {
                    try {
                        Set<String> rebuilt = pipeline.follow(ownership);
                        if (!rebuilt.isEmpty()) {
                            LOG.debugf("followed %d curve(s) other instances moved on: %s", rebuilt.size(), rebuilt);
                        }
                    } catch (RuntimeException e) {
                        // the journal may be down; reads of those curves stay as they were until the next round
                        LOG.warnf("following other instances' curves failed, will retry in %s: %s", every, e.getMessage());
                    }
                }).schedule();
    }
}
