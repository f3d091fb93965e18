package org.slopewatch.ingest.kafka;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Properties;
import java.util.UUID;
import java.util.concurrent.TimeUnit;
import java.util.logging.Level;
import org.apache.kafka.clients.admin.Admin;
import org.apache.kafka.clients.admin.AdminClientConfig;
import org.apache.kafka.clients.admin.ConsumerGroupDescription;
import org.apache.kafka.clients.admin.NewTopic;
import org.apache.kafka.clients.consumer.ConsumerConfig;
import org.apache.kafka.clients.consumer.KafkaConsumer;
import org.apache.kafka.common.GroupState;
import org.apache.kafka.common.serialization.StringDeserializer;
import org.awaitility.Awaitility;
import org.junit.jupiter.api.Test;
import org.slopewatch.delivery.LogCapture;
import org.slopewatch.testsupport.KafkaBroker;

/**
 * The quotes topic against the real test broker, which runs with Kafka's default
 * {@code num.partitions=1} ({@code .ci/kafka.sh}): a topic the daemon finds missing is created with
 * the configured partitions, and a topic with fewer partitions than the consumer group has members
 * is left as it is and named in a warning with both numbers. Kafka gives each partition to at most
 * one member of a group, "if there are more consumers in a group than partitions, some consumers
 * will get no data" (Apache Kafka documentation, design: the consumer (from memory)).
 */
class QuotesTopicTest {

    private static final String CATEGORY = QuotesTopicCheck.class.getName();

    private static Map<String, Object> adminConfig() {
        return Map.of(AdminClientConfig.BOOTSTRAP_SERVERS_CONFIG, KafkaBroker.bootstrapServers());
    }

    private static String unique(String what) {
        return "slopewatch.quotes.topic-test-" + what + "-" + UUID.randomUUID().toString().substring(0, 8);
    }

    private static int partitionsOf(Admin admin, String topic) throws Exception {
        return admin.describeTopics(List.of(topic)).allTopicNames().get(30, TimeUnit.SECONDS).get(topic).partitions().size();
    }

    private static List<LogCapture.Line> warnings(LogCapture log) {
        return log.lines().stream().filter(l -> l.level().intValue() >= Level.WARNING.intValue()).toList();
    }

    @Test
    void aMissingTopicIsCreatedWithTheConfiguredPartitions() throws Exception {
        String name = unique("fresh");
        QuotesTopic topic = new QuotesTopic(adminConfig(), new QuotesTopic.Settings(name, name, 5, Optional.empty()));
        try (LogCapture log = LogCapture.of(CATEGORY); Admin admin = Admin.create(adminConfig())) {
            QuotesTopicCheck.atStart(topic);
            assertThat(partitionsOf(admin, name)).as("partitions of the topic the check created (the broker's default is 1)").isEqualTo(5);
            assertThat(warnings(log)).as("one instance about to join a topic of five partitions: no shortfall").isEmpty();
            assertThat(topic.ensure()).as("a second start finds the topic and leaves it").isFalse();
        }
    }

    @Test
    void aOnePartitionTopicIsLeftAsItIsAndTheShortfallIsLoggedWithBothNumbers() throws Exception {
        String name = unique("short");
        try (Admin admin = Admin.create(adminConfig())) {
            admin.createTopics(List.of(new NewTopic(name, 1, (short) 1))).all().get(30, TimeUnit.SECONDS);
        }
        QuotesTopic topic = new QuotesTopic(adminConfig(), new QuotesTopic.Settings(name, name, 12, Optional.empty()));
        List<KafkaConsumer<String, String>> members = new ArrayList<>();
        try (LogCapture log = LogCapture.of(CATEGORY); Admin admin = Admin.create(adminConfig())) {
            members.add(member(name));
            awaitMembers(admin, name, members);

            // at start: one member running and this instance about to join, one partition
            QuotesTopicCheck.atStart(topic);
            assertThat(partitionsOf(admin, name)).as("an existing topic is never altered").isEqualTo(1);
            assertThat(warnings(log)).as("the warning at start").singleElement().satisfies(w -> assertThat(w.message())
                    .contains(name + " has 1 partition(s)").contains("has 2 member(s)").contains("1 instance(s) get no partition"));

            // after an assignment: two members in the group, one of them idle
            members.add(member(name));
            awaitMembers(admin, name, members);
            QuotesTopicCheck.afterAssignment(topic);
            assertThat(warnings(log)).as("the warning after an assignment").hasSize(2).last().satisfies(w -> assertThat(w.message())
                    .contains(name + " has 1 partition(s)").contains("has 2 member(s)"));
        } finally {
            members.forEach(KafkaConsumer::close);
        }
    }

    @Test
    void asManyMembersAsPartitionsIsNoShortfall() {
        assertThat(PartitionShortfall.of("t", 2, "g", 2)).as("two members, two partitions: each gets one").isEmpty();
        assertThat(PartitionShortfall.of("t", 2, "g", 3)).as("three members, two partitions: one idles").isPresent();
    }

    private static KafkaConsumer<String, String> member(String group) {
        Properties p = new Properties();
        p.put(ConsumerConfig.BOOTSTRAP_SERVERS_CONFIG, KafkaBroker.bootstrapServers());
        p.put(ConsumerConfig.GROUP_ID_CONFIG, group);
        p.put(ConsumerConfig.KEY_DESERIALIZER_CLASS_CONFIG, StringDeserializer.class.getName());
        p.put(ConsumerConfig.VALUE_DESERIALIZER_CLASS_CONFIG, StringDeserializer.class.getName());
        KafkaConsumer<String, String> consumer = new KafkaConsumer<>(p);
        consumer.subscribe(List.of(group));
        return consumer;
    }

    /** Polls every member (each must, to take part in a rebalance) until the group is stable with {@code count} of them. */
    private static void awaitMembers(Admin admin, String group, List<KafkaConsumer<String, String>> members) {
        int count = members.size();
        // the members are polled from this thread only: a Kafka consumer is not thread-safe
        Awaitility.await("a stable group of " + count).atMost(Duration.ofSeconds(60)).pollInSameThread().ignoreExceptions() // the group is unknown until its first member joins
                .pollInterval(Duration.ofMillis(100)).until(() -> {
                    members.forEach(m -> m.poll(Duration.ofMillis(50)));
                    ConsumerGroupDescription d = admin.describeConsumerGroups(List.of(group)).all().get(10, TimeUnit.SECONDS).get(group);
                    return d.groupState() == GroupState.STABLE && d.members().size() == count;
                });
    }
}
