package org.slopewatch.ingest.kafka;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.reflect.Proxy;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import org.apache.kafka.clients.consumer.MockConsumer;
import org.apache.kafka.common.Node;
import org.apache.kafka.common.PartitionInfo;
import org.apache.kafka.common.TopicPartition;
import org.junit.jupiter.api.Test;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.pipeline.IngestConfig;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.rules.PolicyParser;

/**
 * The rebuild an assignment calls for runs off the consumer's poll thread. The Kafka consumer
 * documentation (the {@code max.poll.interval.ms} setting and {@code ConsumerRebalanceListener})
 * says that a consumer which goes longer than {@code max.poll.interval.ms} without polling leaves
 * the group, and that the rebalance callbacks run inside {@code poll}: a rebuild inside the
 * callback counts against that bound. Here the pipeline is kept busy (its lock held, as by a long
 * step or rebuild) while partitions are assigned: the callback must return anyway, the records of
 * the new partitions must wait, and the new curves must not count as owned until rebuilt.
 */
class TakeoverOffThePollThreadTest {

    private static final String TOPIC = "slopewatch.quotes";
    private static final Clock CLOCK = Clock.fixed(Instant.parse("2026-03-02T18:00:00Z"), ZoneOffset.UTC);

    @Test
    void anAssignmentReturnsWhileThePipelineIsBusyAndItsRecordsWaitForTheRebuild() throws Exception {
        var watches = PolicyParser.parse("default.yaml", Files.readString(Path.of("alert-rules/default.yaml"))).watches();
        try (var ds = JournalDatabase.open("jdbc:h2:mem:takeover-" + System.nanoTime() + ";DB_CLOSE_DELAY=-1", "sa", "", 2)) {
            QuotePipeline pipeline = new QuotePipeline(watches, new JournalWriter(ds, CLOCK), new JournalReader(ds), PipelineListener.NONE, CLOCK);
            pipeline.recover();
            PartitionOwnership ownership = new PartitionOwnership();
            TakeoverQueue takeovers = new TakeoverQueue(pipeline, ownership);
            RebuildOnRebalance listener = new RebuildOnRebalance(pipeline, ownership, takeovers, embeddedTopicCheck());
            MockConsumer<String, String> consumer = new MockConsumer<>("earliest");
            Node broker = new Node(0, "127.0.0.1", 9092);
            consumer.updatePartitions(TOPIC, List.of(new PartitionInfo(TOPIC, 0, broker, null, null),
                    new PartitionInfo(TOPIC, 1, broker, null, null)));
            List<TopicPartition> handed = List.of(new TopicPartition(TOPIC, 0), new TopicPartition(TOPIC, 1));

            CompletableFuture<Void> step;
            synchronized (pipeline) { // the pipeline's lock (its monitor), as a long step holds it
                CompletableFuture.runAsync(() -> listener.onPartitionsAssigned(consumer, handed)).get(5, TimeUnit.SECONDS);
                assertThat(ownership.holds(handed.get(0))).as("the records of the new partitions are taken").isTrue();
                assertThat(ownership.ownsCurve("GOVT-A")).as("but their curves are not owned before the rebuild").isFalse();
                step = CompletableFuture.runAsync(takeovers::awaitRebuilt);
                Thread.sleep(300);
                assertThat(step).as("a step of the new partitions waits for the rebuild").isNotDone();
            }
            step.get(10, TimeUnit.SECONDS);
            assertThat(ownership.ownsCurve("GOVT-A")).as("owned once rebuilt").isTrue();
            takeovers.stop();
        }
    }

    /** The topic check of an instance on the embedded transport: it checks nothing, so the test needs no broker. */
    private static QuotesTopicCheck embeddedTopicCheck() {
        IngestConfig embedded = (IngestConfig) Proxy.newProxyInstance(IngestConfig.class.getClassLoader(), new Class<?>[] {IngestConfig.class},
                (proxy, method, args) -> {
                    if (method.getName().equals("transport")) {
                        return IngestConfig.Transport.EMBEDDED;
                    }
                    throw new UnsupportedOperationException(method.getName());
                });
        return new QuotesTopicCheck(embedded, Map.of(), Optional.empty(), Optional.empty(), 12, Optional.empty());
    }
}
