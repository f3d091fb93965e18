package org.slopewatch.ingest.kafka;

import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Properties;
import org.apache.kafka.clients.admin.Admin;
import org.apache.kafka.clients.admin.AdminClientConfig;
import org.apache.kafka.clients.admin.NewTopic;
import org.apache.kafka.clients.producer.KafkaProducer;
import org.apache.kafka.clients.producer.ProducerConfig;
import org.apache.kafka.clients.producer.ProducerRecord;
import org.apache.kafka.common.serialization.StringSerializer;
import org.awaitility.Awaitility;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.testsupport.DaemonProcess;
import org.slopewatch.testsupport.JournalContents;
import org.slopewatch.testsupport.KafkaBroker;
import org.slopewatch.testsupport.PostgresServer.TestDatabase;
import org.slopewatch.testsupport.ScenarioQuotes;

/**
 * What the integration tests with packaged daemons on Kafka share: the scenario on six curves, a
 * daemon's settings for one topic and journal, topics, a producer, and the wait for a run's end.
 * What is not about Kafka is shared with the embedded runs: {@link ScenarioQuotes},
 * {@link DaemonProcess#scenarioSettings}, {@link JournalContents#assertEndsAs} and
 * {@code TestHttpReceiver.noticesReceived}.
 */
final class KafkaRuns {

    /** Six curves over six partitions: with the range assignor one of two instances gets GOVT-C and GOVT-D, the other the rest. */
    static final List<String> CURVES = List.of("GOVT-A", "GOVT-B", "GOVT-C", "GOVT-D", "GOVT-E", "GOVT-F");
    static final int PARTITIONS = 6;
    /**
     * The consumer group's session time-out of every daemon here: the broker's least
     * ({@code group.min.session.timeout.ms}, 6 s by default (from memory)), so that a killed member
     * leaves the group, and the others take its partitions, as soon as the broker allows.
     */
    static final String SESSION_TIMEOUT_MS = "6000";

    private KafkaRuns() {
    }

    /** The curves through the demo's tightening cycle ({@link ScenarioQuotes}), on the six curves. */
    static List<QuoteMessage> scenarioQuotes(long seed, int businessDays) {
        return ScenarioQuotes.tightening(CURVES, seed, businessDays);
    }

    /**
     * A daemon of the default policy on {@code topic} (also its consumer group) with {@code journal},
     * its chat channel posting alert JSON to {@code chatUrl}. A dead member leaves the group after 6 s
     * (the broker's least session time-out) rather than the daemon's 10 s, so that a restart or a takeover after a kill
     * resumes soon;
     * checkpoints are written every second.
     */
    static Map<String, String> settings(String topic, TestDatabase journal, String chatUrl) {
        Map<String, String> s = DaemonProcess.scenarioSettings(Path.of("target/it-data/" + topic).toAbsolutePath(), CURVES, chatUrl);
        s.put("slopewatch.journal.url", journal.url());
        s.put("slopewatch.journal.username", journal.user());
        s.put("kafka.bootstrap.servers", KafkaBroker.bootstrapServers());
        s.put("mp.messaging.incoming.quotes.topic", topic);
        s.put("mp.messaging.incoming.quotes.group.id", topic);
        s.put("mp.messaging.incoming.quotes.session.timeout.ms", SESSION_TIMEOUT_MS);
        s.put("mp.messaging.incoming.quotes.heartbeat.interval.ms", "1500");
        // checkpoints every second: restarts and takeovers start from them, and must come out as an uninterrupted run would
        s.put("slopewatch.ingest.checkpoint-every", "1s");
        s.put("mp.messaging.outgoing.quotes-publish.topic", topic);
        s.put("mp.messaging.outgoing.quotes-dead-letter.topic", topic + ".dead-letter");
        s.put("mp.messaging.outgoing.alerts-out.topic", topic + ".alerts");
        return s;
    }

    static Map<String, String> secrets(TestDatabase journal) {
        return Map.of("SLOPEWATCH_JOURNAL_PASSWORD", journal.password());
    }

    static DaemonProcess start(String name, String topic, TestDatabase journal, String chatUrl) {
        return DaemonProcess.start(name, settings(topic, journal, chatUrl), secrets(journal));
    }

    static void createTopics(String... topics) throws Exception {
        Properties p = new Properties();
        p.put(AdminClientConfig.BOOTSTRAP_SERVERS_CONFIG, KafkaBroker.bootstrapServers());
        try (Admin admin = Admin.create(p)) {
            List<NewTopic> all = new ArrayList<>();
            for (String t : topics) {
                all.add(new NewTopic(t, PARTITIONS, (short) 1));
            }
            admin.createTopics(all).all().get();
        }
    }

    static KafkaProducer<String, String> producer() {
        Properties p = new Properties();
        p.put(ProducerConfig.BOOTSTRAP_SERVERS_CONFIG, KafkaBroker.bootstrapServers());
        p.put(ProducerConfig.KEY_SERIALIZER_CLASS_CONFIG, StringSerializer.class.getName());
        p.put(ProducerConfig.VALUE_SERIALIZER_CLASS_CONFIG, StringSerializer.class.getName());
        p.put(ProducerConfig.LINGER_MS_CONFIG, "5");
        return new KafkaProducer<>(p);
    }

    /** Sends a quote to each topic, keyed by curve as the daemon's own publishers do. */
    static void send(KafkaProducer<String, String> producer, QuoteMessage quote, String... topics) {
        String json = QuoteJson.encode(quote);
        for (String topic : topics) {
            producer.send(new ProducerRecord<>(topic, quote.curve(), json));
        }
    }

    static JournalContents contents(TestDatabase journal) {
        return JournalContents.read(journal.url(), journal.user(), journal.password());
    }

    /** Waits until every journal holds every quote and no delivery waits any more (a run has settled). */
    static void awaitSettled(Duration atMost, int quotes, TestDatabase... journals) {
        Awaitility.await("every quote journalled and every delivery settled, in every run").atMost(atMost)
                .pollInterval(Duration.ofSeconds(1)).until(() -> Arrays.stream(journals).allMatch(j -> settled(j, quotes)));
    }

    /** Every quote journalled and no delivery waiting any more. */
    private static boolean settled(TestDatabase journal, int quotes) {
        JournalContents c = contents(journal);
        return c.quotes() == quotes && !c.deliveries().isEmpty() && c.deliveries().stream().noneMatch(d -> d.endsWith(" | PENDING"));
    }
}
