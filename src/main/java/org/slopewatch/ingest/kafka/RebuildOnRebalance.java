package org.slopewatch.ingest.kafka;

import io.smallrye.common.annotation.Identifier;
import io.smallrye.reactive.messaging.kafka.KafkaConsumerRebalanceListener;
import jakarta.enterprise.context.ApplicationScoped;
import java.util.Collection;
import org.apache.kafka.clients.consumer.Consumer;
import org.apache.kafka.common.TopicPartition;
import org.jboss.logging.Logger;
import org.slopewatch.pipeline.QuotePipeline;

/**
 * When Kafka hands this instance partitions of the quotes topic (at start, or when another
 * instance of the same consumer group stops or joins), the curves of those partitions that another
 * instance moved on since this one last saw them are rebuilt from the shared journal (each from its
 * checkpoint and the quotes after it) before the first record of the new partitions is processed:
 * by {@link TakeoverQueue}, off the poll thread, the records waiting for it.
 * The journal holds what the previous owner concluded, so the new owner continues from there rather
 * than from whatever it last saw of those curves. Curves memory is current on are not rebuilt: the
 * first assignment after a start, which the start-up's rebuild already covers, replays nothing.
 *
 * <p>When partitions are taken away, the step in progress is finished first (the pipeline's lock)
 * and the records of those partitions still waiting here are dropped ({@link PartitionOwnership}),
 * so that the next owner, whose rebuild reads the journal, finds every quote this instance
 * processed already journalled and none journalled after it.
 *
 * <p>Each assignment, an empty one included, also has {@link QuotesTopicCheck} compare the topic's
 * partitions with the group's members.
 */
@ApplicationScoped
@Identifier(RebuildOnRebalance.NAME)
public class RebuildOnRebalance implements KafkaConsumerRebalanceListener {

    public static final String NAME = "slopewatch-rebuild-on-rebalance";
    private static final Logger LOG = Logger.getLogger(RebuildOnRebalance.class);

    private final QuotePipeline pipeline;
    private final PartitionOwnership ownership;
    private final TakeoverQueue takeovers;
    private final QuotesTopicCheck topicCheck;

    RebuildOnRebalance(QuotePipeline pipeline, PartitionOwnership ownership, TakeoverQueue takeovers, QuotesTopicCheck topicCheck) {
        this.pipeline = pipeline;
        this.ownership = ownership;
        this.takeovers = takeovers;
        this.topicCheck = topicCheck;
    }

    @Override
    public void onPartitionsAssigned(Consumer<?, ?> consumer, Collection<TopicPartition> partitions) {
        // before the empty case: an instance handed nothing is the one a short topic leaves idle
        topicCheck.assigned();
        if (partitions.isEmpty()) {
            return;
        }
        String topic = partitions.iterator().next().topic();
        takeovers.rebuild(partitions, ownership.assigned(partitions, consumer.partitionsFor(topic).size()));
    }

    @Override
    public void onPartitionsRevoked(Consumer<?, ?> consumer, Collection<TopicPartition> partitions) {
        ownership.revoked(partitions);
        pipeline.awaitStep();
        if (!partitions.isEmpty()) {
            LOG.infof("quotes partitions revoked %s: their records still queued here are left to the next owner", partitions);
        }
    }

    @Override
    public void onPartitionsLost(Consumer<?, ?> consumer, Collection<TopicPartition> partitions) {
        onPartitionsRevoked(consumer, partitions);
    }
}
