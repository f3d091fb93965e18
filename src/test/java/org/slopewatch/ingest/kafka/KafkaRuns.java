package org.slopewatch.ingest.kafka;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Properties;
import java.util.TreeMap;
import java.util.UUID;
import org.apache.kafka.clients.admin.Admin;
import org.apache.kafka.clients.admin.AdminClientConfig;
import org.apache.kafka.clients.admin.NewTopic;
import org.apache.kafka.clients.producer.KafkaProducer;
import org.apache.kafka.clients.producer.ProducerConfig;
import org.apache.kafka.clients.producer.ProducerRecord;
import org.apache.kafka.common.serialization.StringSerializer;
import org.awaitility.Awaitility;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.delivery.TestHttpReceiver;
import org.slopewatch.ingest.QuoteMessage;
import org.slopewatch.ingest.demo.DemoCurve;
import org.slopewatch.ingest.demo.DemoScenario;
import org.slopewatch.testsupport.DaemonProcess;
import org.slopewatch.testsupport.JournalContents;
import org.slopewatch.testsupport.KafkaBroker;
import org.slopewatch.testsupport.PostgresServer.TestDatabase;

/**
 * What the integration tests with packaged daemons on Kafka share: the quotes of a scenario, a
 * daemon's settings for one topic and journal, topics, a producer, and the checks of a run's end.
 */
final class KafkaRuns {

    /** Six curves over six partitions: with the range assignor one of two instances gets GOVT-C and GOVT-D, the other the rest. */
    static final List<String> CURVES = List.of("GOVT-A", "GOVT-B", "GOVT-C", "GOVT-D", "GOVT-E", "GOVT-F");
    static final int PARTITIONS = 6;

    private static final ObjectMapper JSON = new ObjectMapper();

    private KafkaRuns() {
    }

    /** The curves through the demo's tightening cycle, each with its own random stream, in market-date order. */
    static List<QuoteMessage> scenarioQuotes(long seed, int businessDays) {
        DemoCurve template = DemoCurve.tightening();
        List<DemoCurve> curves = CURVES.stream()
                .map(name -> new DemoCurve(name, template.model(), template.policy(), template.quoteNoiseBp())).toList();
        List<QuoteMessage> out = new ArrayList<>();
        // the stream ends before 2026 however long it is: the daemon refuses market dates in the future
        LocalDate start = LocalDate.of(2026, 1, 1).minusDays(businessDays * 7L / 5 + 14);
        for (CurveSnapshot s : new DemoScenario(seed, start, curves).snapshots(businessDays)) {
            out.add(new QuoteMessage("it:" + s.curve() + ":" + s.date(), "integration-test", null, s.curve(), s.date(), s.asMap()));
        }
        return out;
    }

    /**
     * A daemon of the default policy on {@code topic} (also its consumer group) with {@code journal},
     * its chat channel posting alert JSON to {@code chatUrl}. A dead member leaves the group after 6 s
     * (the broker's least session time-out) rather than 45 s, so that a restart after a kill resumes soon.
     */
    static Map<String, String> settings(String topic, TestDatabase journal, String chatUrl) {
        Path home = Path.of("").toAbsolutePath();
        Map<String, String> s = new LinkedHashMap<>();
        s.put("slopewatch.home", home.toString());
        s.put("slopewatch.data-dir", home.resolve("target/it-data/" + topic).toString());
        s.put("slopewatch.journal.url", journal.url());
        s.put("slopewatch.journal.username", journal.user());
        s.put("slopewatch.ingest.curves", String.join(",", CURVES));
        s.put("kafka.bootstrap.servers", KafkaBroker.bootstrapServers());
        s.put("mp.messaging.incoming.quotes.topic", topic);
        s.put("mp.messaging.incoming.quotes.group.id", topic);
        s.put("mp.messaging.incoming.quotes.session.timeout.ms", "6000");
        s.put("mp.messaging.incoming.quotes.heartbeat.interval.ms", "1500");
        s.put("mp.messaging.outgoing.quotes-publish.topic", topic);
        s.put("mp.messaging.outgoing.quotes-dead-letter.topic", topic + ".dead-letter");
        s.put("mp.messaging.outgoing.alerts-out.topic", topic + ".alerts");
        s.put("slopewatch.channels.desk-chat.type", "chat-webhook");
        s.put("slopewatch.channels.desk-chat.url", chatUrl);
        s.put("slopewatch.channels.desk-chat.format", "alert-json");
        s.put("slopewatch.delivery.allowed-hosts", "127.0.0.1");
        s.put("slopewatch.alerts.evaluate-every", "1s");
        s.put("slopewatch.security.write-tokens", UUID.randomUUID().toString());
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

    /**
     * The check every run ends with: each quote journalled once, and the same conclusions as the
     * undisturbed run, row for row (transitions, spells, notices, deliveries).
     */
    static void assertSameJournal(JournalContents actual, JournalContents undisturbed, int quotes) {
        assertThat(actual.quotes()).isEqualTo(quotes);
        assertThat(actual.distinctQuoteIds()).isEqualTo(quotes);
        assertThat(actual.transitions()).containsExactlyElementsOf(undisturbed.transitions());
        assertThat(actual.spells()).containsExactlyElementsOf(undisturbed.spells());
        assertThat(actual.alerts()).containsExactlyElementsOf(undisturbed.alerts());
        assertThat(actual.deliveries()).containsExactlyElementsOf(undisturbed.deliveries());
    }

    /** Notice id → how many times the receiver got it on {@code path}. */
    static Map<String, Long> noticesReceived(TestHttpReceiver chat, String path) throws Exception {
        Map<String, Long> out = new TreeMap<>();
        for (TestHttpReceiver.Request r : chat.requests()) {
            if (r.path().equals(path)) {
                out.merge(JSON.readTree(r.body()).path("id").asText(), 1L, Long::sum);
            }
        }
        return out;
    }
}
