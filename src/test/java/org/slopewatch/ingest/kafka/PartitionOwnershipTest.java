package org.slopewatch.ingest.kafka;

import static org.assertj.core.api.Assertions.assertThat;

import io.smallrye.reactive.messaging.kafka.api.IncomingKafkaRecordBatchMetadata;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.kafka.clients.consumer.ConsumerRecord;
import org.apache.kafka.clients.consumer.ConsumerRecords;
import org.apache.kafka.clients.producer.internals.BuiltInPartitioner;
import org.apache.kafka.common.TopicPartition;
import org.eclipse.microprofile.reactive.messaging.Message;
import org.junit.jupiter.api.Test;
import org.slopewatch.pipeline.QuoteBatch;

class PartitionOwnershipTest {

    private static final String TOPIC = "slopewatch.quotes";

    @Test
    void aCurveBelongsToTheInstanceHoldingThePartitionTheKafkaProducerWritesItsKeyTo() {
        // reference: the Kafka producer's own choice of partition for a keyed record (kafka-clients 4.1.2)
        int partitions = 6;
        for (String curve : List.of("GOVT-A", "GOVT-B", "GOVT-C", "GOVT-D", "GOVT-E", "GOVT-F", "UST", "Bund 10y")) {
            int producerChoice = BuiltInPartitioner.partitionForKey(curve.getBytes(StandardCharsets.UTF_8), partitions);
            PartitionOwnership holder = new PartitionOwnership();
            handOver(holder, List.of(new TopicPartition(TOPIC, producerChoice)), partitions);
            PartitionOwnership other = new PartitionOwnership();
            handOver(other, List.of(new TopicPartition(TOPIC, (producerChoice + 1) % partitions)), partitions);

            assertThat(holder.ownsCurve(curve)).as(curve).isTrue();
            assertThat(other.ownsCurve(curve)).as(curve).isFalse();
        }
    }

    @Test
    void nothingIsOwnedBeforeTheFirstAssignmentNorAfterARevocation() {
        PartitionOwnership ownership = new PartitionOwnership();
        assertThat(ownership.ownsCurve("GOVT-A")).isFalse();

        List<TopicPartition> all = List.of(new TopicPartition(TOPIC, 0), new TopicPartition(TOPIC, 1));
        handOver(ownership, all, 2);
        assertThat(ownership.ownsCurve("GOVT-A")).isTrue();

        ownership.revoked(all);
        assertThat(ownership.ownsCurve("GOVT-A")).isFalse();
    }

    @Test
    void recordsOfAPartitionTakenAwayAreLeftForTheNextOwner() {
        PartitionOwnership ownership = new PartitionOwnership();
        TopicPartition kept = new TopicPartition(TOPIC, 0);
        TopicPartition lost = new TopicPartition(TOPIC, 1);
        handOver(ownership, List.of(kept, lost), 2);
        ownership.revoked(List.of(lost));
        QuoteBatch fromKept = new QuoteBatch("kafka", List.of(), List.of());
        QuoteBatch fromLost = new QuoteBatch("kafka", List.of(), List.of());
        Map<TopicPartition, List<ConsumerRecord<String, QuoteBatch>>> polled = new LinkedHashMap<>();
        polled.put(kept, List.of(new ConsumerRecord<>(TOPIC, 0, 10, "GOVT-A", fromKept)));
        polled.put(lost, List.of(new ConsumerRecord<>(TOPIC, 1, 20, "GOVT-B", fromLost)));
        Message<List<QuoteBatch>> message = Message.of(List.of(fromKept, fromLost))
                .addMetadata(new IncomingKafkaRecordBatchMetadata<>(new ConsumerRecords<>(polled), TOPIC, Map.of()));

        assertThat(ownership.stillHeld(message)).containsExactly(fromKept);
        assertThat(ownership.stillHeld(Message.of(List.of(fromKept, fromLost))))
                .as("not from Kafka: everything").containsExactly(fromKept, fromLost);
    }

    @Test
    void aCurveWhoseRecordsArriveOnAnotherPartitionBelongsToThatPartitionsHolder() {
        int partitions = 6;
        String curve = "GOVT-A";
        // reference: where the Kafka producer's default partitioner puts the key (kafka-clients 4.1.2)
        int byDefault = BuiltInPartitioner.partitionForKey(curve.getBytes(StandardCharsets.UTF_8), partitions);
        int arrived = (byDefault + 1) % partitions; // a producer with a partitioner of its own
        PartitionOwnership holder = new PartitionOwnership();
        handOver(holder, List.of(new TopicPartition(TOPIC, arrived)), partitions);
        PartitionOwnership other = new PartitionOwnership();
        handOver(other, List.of(new TopicPartition(TOPIC, byDefault)), partitions);
        QuoteBatch batch = new QuoteBatch("kafka", List.of(new org.slopewatch.pipeline.QuoteMessage("m1", "test", null, curve,
                java.time.LocalDate.of(2026, 3, 2), new java.util.TreeMap<>(Map.of(org.slopewatch.curve.Tenor.years(10), 400.0)))), List.of());
        Message<List<QuoteBatch>> message = Message.of(List.of(batch)).addMetadata(new IncomingKafkaRecordBatchMetadata<>(
                new ConsumerRecords<>(Map.of(new TopicPartition(TOPIC, arrived),
                        List.of(new ConsumerRecord<>(TOPIC, arrived, 7, curve, batch)))), TOPIC, Map.of()));

        assertThat(other.ownsCurve(curve)).as("before any record: the default partitioner's answer").isTrue();
        holder.stillHeld(message);
        other.stillHeld(message);

        assertThat(holder.ownsCurve(curve)).as("the holder of the partition the records arrive on").isTrue();
        assertThat(other.ownsCurve(curve)).as("the holder of the partition a recomputation names").isFalse();
    }

    @Test
    void aPartitionJustAssignedIsHeldButItsCurvesAreOwnedOnlyOnceTheirRebuildIsDone() {
        PartitionOwnership ownership = new PartitionOwnership();
        List<TopicPartition> all = List.of(new TopicPartition(TOPIC, 0));
        long first = ownership.assigned(all, 1);
        assertThat(ownership.holds(all.get(0))).as("its records are taken, to wait for the rebuild").isTrue();
        assertThat(ownership.holdsCurve("GOVT-A")).isTrue();
        assertThat(ownership.ownsCurve("GOVT-A")).as("no clock-driven notice nor checkpoint before the rebuild").isFalse();

        // handed over again before the first rebuild ended: the first rebuild's end does not make it owned
        ownership.revoked(all);
        long second = ownership.assigned(all, 1);
        ownership.rebuilt(all, first);
        assertThat(ownership.ownsCurve("GOVT-A")).isFalse();
        ownership.rebuilt(all, second);
        assertThat(ownership.ownsCurve("GOVT-A")).isTrue();
    }

    /** An assignment whose rebuild is done: the curves of the partitions are owned. */
    private static void handOver(PartitionOwnership ownership, List<TopicPartition> partitions, int partitionsOfTopic) {
        ownership.rebuilt(partitions, ownership.assigned(partitions, partitionsOfTopic));
    }
}
