package org.slopewatch.ingest.kafka;

import io.smallrye.reactive.messaging.kafka.api.IncomingKafkaRecordBatchMetadata;
import jakarta.enterprise.context.ApplicationScoped;
import java.nio.charset.StandardCharsets;
import java.util.Collection;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicLong;
import org.apache.kafka.clients.consumer.ConsumerRecord;
import org.apache.kafka.common.TopicPartition;
import org.apache.kafka.common.utils.Utils;
import org.eclipse.microprofile.reactive.messaging.Message;
import org.slopewatch.pipeline.QuoteBatch;

/**
 * The partitions of the quotes topic this instance holds right now, as the consumer group's
 * rebalances hand them over ({@link RebuildOnRebalance} keeps it current).
 *
 * <p>Two uses. Records of a partition taken away are not processed even if they were fetched
 * before the rebalance: the new owner reads them again from the last committed offset, and
 * processing them here too would journal them twice. And a curve belongs to the instance holding
 * the partition its quotes arrive on, which decides who raises its clock-driven notices: the
 * partition its latest record came on, as this instance saw it, whatever partitioner the producer
 * used; for a curve whose records this instance has not seen, the Kafka producer's default for a
 * keyed record (murmur2 of the key, modulo the partition count), which is how the daemon's own
 * publishers and {@code deploy/kafka/create-topics.sh} write the topic.
 *
 * <p>A partition just assigned is held (its records are taken, and wait for the rebuild) but its
 * curves are not owned until {@link TakeoverQueue} has rebuilt them from the journal: until then
 * this instance neither decides their clock-driven notices nor checkpoints them, since what it
 * holds of them may be behind what their previous owner journalled.
 */
@ApplicationScoped
public class PartitionOwnership {

    private final Set<TopicPartition> held = ConcurrentHashMap.newKeySet();
    /** Held partitions whose curves are not rebuilt yet, each with the assignment that handed it over. */
    private final Map<TopicPartition, Long> rebuilding = new ConcurrentHashMap<>();
    private final AtomicLong assignments = new AtomicLong();
    /** The partition each curve's latest record arrived on, as seen here. */
    private final Map<String, Integer> arrivedOn = new ConcurrentHashMap<>();
    private volatile int partitionCount;

    /**
     * Partitions handed to this instance, held from now on, their curves owned once {@link #rebuilt}.
     *
     * @return the assignment's number, which {@link #rebuilt} takes back
     */
    long assigned(Collection<TopicPartition> partitions, int partitionsOfTopic) {
        long assignment = assignments.incrementAndGet();
        partitionCount = partitionsOfTopic;
        partitions.forEach(p -> rebuilding.put(p, assignment));
        held.addAll(partitions);
        return assignment;
    }

    /** The curves of these partitions are rebuilt: owned from now on, unless a later assignment handed a partition over again. */
    void rebuilt(Collection<TopicPartition> partitions, long assignment) {
        partitions.forEach(p -> rebuilding.remove(p, assignment));
    }

    void revoked(Collection<TopicPartition> partitions) {
        held.removeAll(partitions);
        partitions.forEach(rebuilding::remove);
    }

    public boolean holds(TopicPartition partition) {
        return held.contains(partition);
    }

    /** Whether the curve's partition is held here and its curves rebuilt; false before the first assignment. */
    public boolean ownsCurve(String curve) {
        return heldFor(curve).filter(p -> !rebuilding.containsKey(p)).isPresent();
    }

    /** Whether the curve's partition is held here, rebuilt or not: the curves a takeover rebuilds. */
    boolean holdsCurve(String curve) {
        return heldFor(curve).isPresent();
    }

    private Optional<TopicPartition> heldFor(String curve) {
        int count = partitionCount;
        if (count == 0) {
            return Optional.empty();
        }
        Integer seen = arrivedOn.get(curve);
        int partition = seen != null ? seen : Utils.toPositive(Utils.murmur2(curve.getBytes(StandardCharsets.UTF_8))) % count;
        return held.stream().filter(p -> p.partition() == partition).findAny();
    }

    /**
     * The message's batches without those read from partitions no longer held; all of them when
     * the message did not come from Kafka. Notes which partition each curve's records arrive on.
     */
    public List<QuoteBatch> stillHeld(Message<List<QuoteBatch>> message) {
        @SuppressWarnings("unchecked")
        IncomingKafkaRecordBatchMetadata<?, QuoteBatch> kafka = message.getMetadata(IncomingKafkaRecordBatchMetadata.class).orElse(null);
        if (kafka == null) {
            return message.getPayload();
        }
        Set<QuoteBatch> dropped = Collections.newSetFromMap(new IdentityHashMap<>());
        for (ConsumerRecord<?, QuoteBatch> record : kafka.getRecords()) {
            if (record.value() != null) {
                record.value().messages().forEach(m -> arrivedOn.put(m.curve(), record.partition()));
            }
            if (!holds(new TopicPartition(record.topic(), record.partition()))) {
                dropped.add(record.value());
            }
        }
        return dropped.isEmpty() ? message.getPayload() : message.getPayload().stream().filter(b -> !dropped.contains(b)).toList();
    }
}
