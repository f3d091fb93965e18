package org.slopewatch.alerting;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.awaitility.Awaitility;
import org.junit.jupiter.api.Test;
import org.slopewatch.testsupport.DaemonProcess;
import org.slopewatch.testsupport.KafkaBroker;

/**
 * The packaged daemon started with a policy that sends its alerts to a stream channel: on the
 * embedded defaults, where {@code alerts-out} is the in-process connector that would keep every
 * event in memory, start-up stops and says which key to set; with {@code serve --kafka} on the test
 * broker ({@link KafkaBroker}) the same policy and channel start.
 */
class StreamChannelStartIT {

    private static final Duration PATIENCE = Duration.ofSeconds(120);
    private static final String POLICY = """
            watch:
              - spread: 10Y-3M
                confirm: [quarter-average]
            channels:
              alerts-topic: { type: stream }
            alerts:
              - name: confirmed
                when: { enters-state: CONFIRMED }
                severity: critical
                channels: [log, alerts-topic]
                message: "{curve} {spread} confirmed"
            """;

    @Test
    void onTheInMemoryConnectorStartUpStopsNamingTheKeyToSet() throws IOException {
        String run = "stream-start-memory-" + UUID.randomUUID().toString().substring(0, 8);
        Map<String, String> settings = settings(run);
        try (DaemonProcess daemon = DaemonProcess.startEmbedded(run, settings)) {
            Awaitility.await("the daemon gives up at start").atMost(PATIENCE).until(() -> !daemon.isAlive());
            assertThat(daemon.logText()).as("the daemon's output")
                    .contains(settings.get("slopewatch.ingest.policy") + ": channel alerts-topic is a stream channel, but alerts-out is"
                            + " on the smallrye-in-memory connector, not Kafka, and would keep every event in memory; set"
                            + " mp.messaging.outgoing.alerts-out.connector=smallrye-kafka and kafka.bootstrap.servers to the brokers")
                    .doesNotContain("Listening on");
        }
    }

    @Test
    void onKafkaTheSameChannelStarts() throws IOException {
        String run = "stream-start-kafka-" + UUID.randomUUID().toString().substring(0, 8);
        Map<String, String> settings = settings(run);
        settings.put("kafka.bootstrap.servers", KafkaBroker.bootstrapServers());
        // topics and a consumer group of this run's own
        settings.put("mp.messaging.incoming.quotes.topic", run);
        settings.put("mp.messaging.incoming.quotes.group.id", run);
        settings.put("mp.messaging.outgoing.quotes-publish.topic", run);
        settings.put("mp.messaging.outgoing.quotes-dead-letter.topic", run + ".dead-letter");
        settings.put("mp.messaging.outgoing.alerts-out.topic", run + ".alerts");
        try (DaemonProcess daemon = DaemonProcess.start(run, settings, Map.of())) {
            daemon.awaitReady(PATIENCE);
            assertThat(daemon.logText()).contains("delivery channels: alerts-topic (stream), desk-chat (chat-webhook), log (log)")
                    .doesNotContain("would keep every event in memory");
        }
    }

    /** The daemon's settings: this policy, data under target/it-data, the stream channel configured, HTTP on the loopback address. */
    private static Map<String, String> settings(String run) throws IOException {
        Path data = Path.of("target", "it-data", run).toAbsolutePath();
        Files.createDirectories(data);
        Path policy = data.resolve("policy.yaml");
        Files.writeString(policy, POLICY);
        // the chat channel these settings configure is not in this policy and is never used
        Map<String, String> s = DaemonProcess.scenarioSettings(data, List.of("GOVT-A"), "http://127.0.0.1:9/unused");
        s.put("quarkus.http.host", "127.0.0.1");
        s.put("slopewatch.ingest.policy", policy.toString());
        s.put("slopewatch.channels.alerts-topic.type", "stream");
        return s;
    }
}
