package org.slopewatch.ingest.kafka;

import jakarta.annotation.PreDestroy;
import jakarta.enterprise.context.ApplicationScoped;
import java.util.Collection;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import org.apache.kafka.common.TopicPartition;
import org.jboss.logging.Logger;
import org.slopewatch.pipeline.QuotePipeline;

/**
 * The rebuilds that assignments of quotes partitions call for, run one after another on a thread
 * of their own, not on the consumer's poll thread: a rebuild that outlasted the consumer's
 * {@code max.poll.interval.ms} would make the instance leave the group and start the rebalance
 * over. The assignment returns at once; the records of the new partitions wait instead
 * ({@link #awaitRebuilt} before each step), and the connector, its queue full, pauses the
 * partitions while it goes on polling. Until its rebuild is done a partition's curves are held but
 * not owned ({@link PartitionOwnership}): no clock-driven notice and no checkpoint is made of a
 * curve this instance may still hold behind its previous owner.
 */
@ApplicationScoped
public class TakeoverQueue {

    private static final Logger LOG = Logger.getLogger(TakeoverQueue.class);

    private final QuotePipeline pipeline;
    private final PartitionOwnership ownership;
    private final ExecutorService worker = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "slopewatch-takeover");
        t.setDaemon(true);
        return t;
    });
    /** The latest rebuild asked for; each runs after the one before, and none completes exceptionally. */
    private volatile CompletableFuture<Void> latest = CompletableFuture.completedFuture(null);

    TakeoverQueue(QuotePipeline pipeline, PartitionOwnership ownership) {
        this.pipeline = pipeline;
        this.ownership = ownership;
    }

    /** On the poll thread, for an assignment already noted in {@link PartitionOwnership#assigned}: queues its rebuild. */
    synchronized void rebuild(Collection<TopicPartition> partitions, long assignment) {
        List<TopicPartition> handed = List.copyOf(partitions);
        long asked = System.nanoTime();
        latest = latest.thenRunAsync(() -> takeOver(handed, assignment, asked), worker);
    }

    /** Returns once every rebuild asked for so far is done (at once when none is waiting). */
    public void awaitRebuilt() {
        latest.join();
    }

    private void takeOver(List<TopicPartition> partitions, long assignment, long asked) {
        try {
            int rebuilt = pipeline.takeOver(ownership::holdsCurve).size();
            LOG.infof("quotes partitions assigned %s: %d curve(s) rebuilt from the journal, %d ms after the assignment "
                    + "(their records waited meanwhile)", partitions, rebuilt, (System.nanoTime() - asked) / 1_000_000);
        } catch (RuntimeException e) {
            // the pipeline knows its memory is behind the journal and rebuilds before its next step
            LOG.errorf(e, "quotes partitions assigned %s: the rebuild from the journal failed (%s); the next step rebuilds first",
                    partitions, e.getMessage());
        } finally {
            ownership.rebuilt(partitions, assignment);
        }
    }

    @PreDestroy
    void stop() {
        // rebuilds already queued still run, so that no step waits forever for one
        worker.shutdown();
    }
}
