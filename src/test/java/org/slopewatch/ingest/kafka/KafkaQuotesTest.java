package org.slopewatch.ingest.kafka;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.awaitility.Awaitility.await;
import static org.hamcrest.Matchers.equalTo;

import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import io.restassured.http.ContentType;
import io.smallrye.reactive.messaging.kafka.KafkaClientService;
import jakarta.inject.Inject;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Properties;
import java.util.UUID;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeoutException;
import org.apache.kafka.clients.consumer.ConsumerConfig;
import org.apache.kafka.clients.consumer.ConsumerRecord;
import org.apache.kafka.clients.consumer.KafkaConsumer;
import org.apache.kafka.clients.producer.KafkaProducer;
import org.apache.kafka.clients.producer.ProducerConfig;
import org.apache.kafka.clients.producer.ProducerRecord;
import org.apache.kafka.common.header.Header;
import org.apache.kafka.common.serialization.StringDeserializer;
import org.apache.kafka.common.serialization.StringSerializer;
import org.eclipse.microprofile.config.ConfigProvider;
import org.eclipse.microprofile.config.inject.ConfigProperty;
import org.junit.jupiter.api.Test;
import org.slopewatch.testsupport.KafkaBroker;

/**
 * The daemon in the Kafka profile against a real broker: quotes produced to the topic by a plain
 * producer, keyed by curve, go through the monitor into the journal; bad records are journalled
 * as rejects and copied to the dead-letter topic with their reason, and consumption goes on after
 * them; HTTP ingest publishes to the topic instead of processing in-line.
 *
 * <p>All Kafka checks live in this class so that Quarkus boots once for this profile.
 */
@QuarkusTest
@TestProfile(KafkaQuotesTest.KafkaProfile.class)
class KafkaQuotesTest {

    private static final Duration PATIENCE = Duration.ofSeconds(60);
    /** Not the default (12), so that the check sees the setting at work; the run's topic is new to the broker. */
    static final int QUOTES_PARTITIONS = 3;

    /** The {@code kafka} profile on the test broker, with topics and a consumer group of this run's own. */
    public static final class KafkaProfile implements QuarkusTestProfile {

        @Override
        public String getConfigProfile() {
            // test first for the journal under target/ and the policy path, kafka on top
            return "test,kafka";
        }

        @Override
        public Map<String, String> getConfigOverrides() {
            String run = UUID.randomUUID().toString().substring(0, 8);
            String topic = "slopewatch.quotes.test-" + run;
            Map<String, String> config = new LinkedHashMap<>();
            config.put("kafka.bootstrap.servers", KafkaBroker.bootstrapServers());
            config.put("mp.messaging.incoming.quotes.topic", topic);
            config.put("mp.messaging.incoming.quotes.group.id", "slopewatch-test-" + run);
            config.put("mp.messaging.outgoing.quotes-publish.topic", topic);
            config.put("mp.messaging.outgoing.quotes-dead-letter.topic", topic + ".dead-letter");
            config.put("slopewatch.data-dir", "./target/test-data/kafka-" + run);
            config.put("slopewatch.kafka.quotes-partitions", String.valueOf(QUOTES_PARTITIONS));
            // these outrank the %kafka. keys of application.properties: a plain key in a source of
            // higher ordinal wins over a profile key in a lower one
            return config;
        }
    }

    @ConfigProperty(name = "mp.messaging.incoming.quotes.topic")
    String topic;

    @ConfigProperty(name = "mp.messaging.outgoing.quotes-dead-letter.topic")
    String deadLetterTopic;

    @ConfigProperty(name = "kafka.bootstrap.servers")
    String bootstrap;

    /** A good quote: GOVT-A's 3-month and 10-year yields in percent on one date. */
    private static String snapshot(LocalDate date, double threeMonth, double tenYear) {
        return "{\"curve\":\"GOVT-A\",\"date\":\"" + date + "\",\"yields\":{\"3M\":" + threeMonth + ",\"10Y\":" + tenYear + "}}";
    }

    @Test
    void quotesFromTheTopicAreMonitoredAndBadRecordsAreDeadLettered() throws Exception {
        // weekly GOVT-A curves, 10Y at 4.50 %: a one-week dip, then an inversion of -40 bp that
        // lasts past the policy's 90 days (days-inverted), then five weeks back above the exit level
        LocalDate monday = LocalDate.of(2025, 1, 6);
        List<String> good = new ArrayList<>();
        for (int week = 0; week < 31; week++) {
            LocalDate date = monday.plusWeeks(week);
            double threeMonth = week == 4 ? 4.60 : week >= 10 && week <= 25 ? 4.90 : 4.00;
            good.add(snapshot(date, threeMonth, 4.50));
        }
        Map<String, String> bad = new LinkedHashMap<>(); // raw record -> expected reason
        bad.put("this is not a quote {", "malformed");
        bad.put("{\"curve\":\"GOVT-Z\",\"tenor\":\"10Y\",\"date\":\"2025-03-03\",\"yield\":4.1}", "unknown-curve");
        bad.put("{\"curve\":\"GOVT-A\",\"tenor\":\"7Q\",\"date\":\"2025-03-03\",\"yield\":4.1}", "unknown-tenor");
        bad.put("{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2025-03-03\",\"yield\":450}", "implausible");

        // the bad records go in among the good ones: consumption must carry on after them
        List<ProducerRecord<String, String>> records = new ArrayList<>();
        good.subList(0, 8).forEach(v -> records.add(new ProducerRecord<>(topic, "GOVT-A", v)));
        bad.keySet().forEach(v -> records.add(new ProducerRecord<>(topic, v.contains("GOVT-Z") ? "GOVT-Z" : "GOVT-A", v)));
        good.subList(8, good.size()).forEach(v -> records.add(new ProducerRecord<>(topic, "GOVT-A", v)));
        produce(records);

        List<String> expected = List.of(
                "2025-02-03 NORMAL->INVERTED entry",
                "2025-03-10 INVERTED->NORMAL exit",
                "2025-03-17 NORMAL->INVERTED entry",
                "2025-06-16 INVERTED->CONFIRMED days-inverted",
                "2025-08-04 CONFIRMED->RESTEEPENING exit");
        await("GOVT-A 10Y-3M transitions in the journal").atMost(PATIENCE).untilAsserted(() -> {
            List<Map<String, Object>> transitions = given().queryParam("spread", "GOVT-A:10Y-3M").get("/api/transitions")
                    .then().statusCode(200).extract().jsonPath().getList("");
            assertThat(transitions).extracting(t -> t.get("date") + " " + t.get("from") + "->" + t.get("to") + " " + t.get("test"))
                    .as("a one-week dip enters and leaves after 5 observations at or above 5 bp; the long inversion is "
                            + "confirmed once 90 calendar days below 0 bp have passed (2025-03-17 + 90 days), and "
                            + "re-steepens after 5 observations back above")
                    .containsExactlyElementsOf(expected);
        });

        await("rejects from the topic in the journal").atMost(PATIENCE).untilAsserted(() -> {
            List<Map<String, Object>> rejects = given().queryParam("limit", 100).get("/api/rejects")
                    .then().statusCode(200).extract().jsonPath().getList("");
            Map<String, String> fromKafka = new LinkedHashMap<>();
            rejects.stream().filter(r -> "kafka".equals(r.get("origin")))
                    .forEach(r -> fromKafka.put((String) r.get("raw"), (String) r.get("reason")));
            assertThat(fromKafka).as("each bad record journalled once with its raw text and reason").isEqualTo(bad);
        });

        Map<String, String> deadLetters = new LinkedHashMap<>();
        try (KafkaConsumer<String, String> consumer = consumer()) {
            consumer.subscribe(List.of(deadLetterTopic));
            await("the dead-letter topic " + deadLetterTopic).atMost(PATIENCE).untilAsserted(() -> {
                for (ConsumerRecord<String, String> r : consumer.poll(Duration.ofMillis(500))) {
                    Header reason = r.headers().lastHeader("slopewatch-reason");
                    Header detail = r.headers().lastHeader("slopewatch-detail");
                    assertThat(detail).as("slopewatch-detail header on dead letter %s", r.value()).isNotNull();
                    deadLetters.put(r.value(), reason == null ? "(no slopewatch-reason header)"
                            : new String(reason.value(), StandardCharsets.UTF_8));
                }
                assertThat(deadLetters).as("each bad record dead-lettered as it came, with its reason in the header, "
                        + "and no good one").isEqualTo(bad);
            });
        }
    }

    @Test
    void httpIngestPublishesToTheTopicAndTheQuoteIsProcessedFromThere() {
        given().contentType(ContentType.JSON).body("""
                {"curve":"GOVT-B","tenor":"10Y","date":"2025-09-01","yield":4.25,"id":"kafka-http-1"}""")
                .post("/api/quotes").then()
                .statusCode(202).body("processed", equalTo(false)).body("accepted", equalTo(1));
        await("GOVT-B on 2025-09-01 processed from the topic").atMost(PATIENCE).untilAsserted(() ->
                given().get("/api/curves/GOVT-B/2025-09-01").then().statusCode(200).body("yields_bp.'10Y'", equalTo(425.0f)));
    }

    @Inject
    KafkaClientService kafkaClients;

    /**
     * A 202 promises that the quotes are on the topic: the gateway answers once the publisher's
     * message is acknowledged, which the connector does after the broker's answer
     * ({@code waitForWriteCompletion}, default true), and the producer asks for {@code acks=all}:
     * "the leader will wait for the full set of in-sync replicas to acknowledge the record"
     * (Apache Kafka documentation, producer configuration {@code acks}). The connector's own
     * default is {@code acks=1}, the leader alone.
     */
    @Test
    void publishingWaitsForEveryInSyncReplica() {
        for (String channel : List.of("quotes-publish", "quotes-dead-letter")) {
            assertThat(kafkaClients.getProducer(channel).configuration().get(ProducerConfig.ACKS_CONFIG))
                    .as("acks of the producer of " + channel).hasToString("all");
            assertThat(ConfigProvider.getConfig().getOptionalValue("mp.messaging.outgoing." + channel + ".waitForWriteCompletion",
                    Boolean.class)).as("waitForWriteCompletion of " + channel).isNotEqualTo(java.util.Optional.of(false));
        }
    }

    /**
     * The quotes consumer as the running daemon configured it (the connector's resolved map, what
     * the Kafka client is given). A dead member's partitions move after session.timeout.ms (the
     * Kafka client's own default is 45000 since Kafka 3.0, KIP-735 (from memory)); heartbeats at a
     * third of it: heartbeat.interval.ms "must be set lower than session.timeout.ms, but typically
     * should be set no higher than 1/3 of that value" (Apache Kafka documentation, consumer
     * configuration). max.poll.interval.ms bounds the rebuild on assignment, which runs in the poll.
     */
    @Test
    void theConsumerTakesOverFromADeadMemberWithinTenSeconds() {
        Map<String, ?> consumer = kafkaClients.getConsumer("quotes").configuration();
        assertThat(consumer.get(ConsumerConfig.SESSION_TIMEOUT_MS_CONFIG)).as("session.timeout.ms").hasToString("10000");
        assertThat(consumer.get(ConsumerConfig.HEARTBEAT_INTERVAL_MS_CONFIG)).as("heartbeat.interval.ms").hasToString("3000");
        assertThat(consumer.get(ConsumerConfig.MAX_POLL_INTERVAL_MS_CONFIG)).as("max.poll.interval.ms").hasToString("300000");
    }

    /** The daemon created its quotes topic, new to the broker, with the configured partitions before its consumer could. */
    @Test
    void theQuotesTopicIsCreatedWithTheConfiguredPartitions() throws Exception {
        Properties p = new Properties();
        p.put(org.apache.kafka.clients.admin.AdminClientConfig.BOOTSTRAP_SERVERS_CONFIG, bootstrap);
        try (org.apache.kafka.clients.admin.Admin admin = org.apache.kafka.clients.admin.Admin.create(p)) {
            int partitions = admin.describeTopics(List.of(topic)).allTopicNames().get(30, java.util.concurrent.TimeUnit.SECONDS)
                    .get(topic).partitions().size();
            assertThat(partitions).as("partitions of " + topic + " (a broker at its defaults would make 1)").isEqualTo(QUOTES_PARTITIONS);
        }
    }

    private void produce(List<ProducerRecord<String, String>> records) throws InterruptedException, ExecutionException, TimeoutException {
        Properties p = new Properties();
        p.put(ProducerConfig.BOOTSTRAP_SERVERS_CONFIG, bootstrap);
        p.put(ProducerConfig.KEY_SERIALIZER_CLASS_CONFIG, StringSerializer.class.getName());
        p.put(ProducerConfig.VALUE_SERIALIZER_CLASS_CONFIG, StringSerializer.class.getName());
        p.put(ProducerConfig.ACKS_CONFIG, "all");
        p.put(ProducerConfig.ENABLE_IDEMPOTENCE_CONFIG, "true");
        try (KafkaProducer<String, String> producer = new KafkaProducer<>(p)) {
            for (ProducerRecord<String, String> r : records) {
                producer.send(r).get(30, java.util.concurrent.TimeUnit.SECONDS);
            }
        }
    }

    private KafkaConsumer<String, String> consumer() {
        Properties p = new Properties();
        p.put(ConsumerConfig.BOOTSTRAP_SERVERS_CONFIG, bootstrap);
        p.put(ConsumerConfig.GROUP_ID_CONFIG, "dead-letter-reader-" + UUID.randomUUID());
        p.put(ConsumerConfig.AUTO_OFFSET_RESET_CONFIG, "earliest");
        p.put(ConsumerConfig.KEY_DESERIALIZER_CLASS_CONFIG, StringDeserializer.class.getName());
        p.put(ConsumerConfig.VALUE_DESERIALIZER_CLASS_CONFIG, StringDeserializer.class.getName());
        return new KafkaConsumer<>(p);
    }
}
