package org.slopewatch.delivery;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.quarkus.test.junit.QuarkusTest;
import io.smallrye.reactive.messaging.kafka.api.OutgoingKafkaRecordMetadata;
import io.smallrye.reactive.messaging.memory.InMemoryConnector;
import io.smallrye.reactive.messaging.memory.InMemorySink;
import jakarta.inject.Inject;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import org.eclipse.microprofile.reactive.messaging.Message;
import org.eclipse.microprofile.reactive.messaging.spi.Connector;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Alert;

/** The stream channel as configured: each alert on {@code alerts-out} (in memory here) as a structured CloudEvent. */
@QuarkusTest
class StreamChannelTest {

    private static final ObjectMapper JSON = new ObjectMapper();

    @Inject
    ChannelRegistry registry;

    @Inject
    @Connector("smallrye-in-memory")
    InMemoryConnector memory;

    private InMemorySink<String> sink;

    @BeforeEach
    void emptySink() {
        sink = memory.sink(StreamChannel.CHANNEL);
        sink.clear();
    }

    @Test
    void anAlertBecomesACloudEventKeyedBySpread() throws Exception {
        Alert alert = TestAlerts.confirmed();

        DeliveryOutcome outcome = registry.channel("alerts-topic").orElseThrow().deliver(alert);

        assertThat(outcome).as("the in-memory sink acknowledges").isEqualTo(new DeliveryOutcome.Delivered("stream 'alerts-topic': acknowledged"));
        assertThat(sink.received()).hasSize(1);
        Message<String> message = sink.received().get(0);
        JsonNode event = JSON.readTree(message.getPayload());
        assertThat(event.get("specversion").asText()).isEqualTo("1.0");
        assertThat(event.get("id").asText()).as("the event id is the alert id, so consumers can drop repeats").isEqualTo(alert.id());
        assertThat(event.get("source").asText()).as("slopewatch.delivery.cloud-events-source of the test profile")
                .isEqualTo("urn:slopewatch:test-desk");
        assertThat(event.get("type").asText()).isEqualTo("org.slopewatch.alert.firing");
        assertThat(event.get("subject").asText()).isEqualTo("GOVT-A:10Y-3M");
        assertThat(event.get("time").asText()).isEqualTo("2026-06-30T21:05:00Z");
        assertThat(event.get("datacontenttype").asText()).isEqualTo("application/json");
        JsonNode data = event.get("data");
        assertThat(data.get("id").asText()).isEqualTo(alert.id());
        assertThat(data.get("spread_id").asText()).isEqualTo("GOVT-A:10Y-3M");
        assertThat(data.get("market_date").asText()).isEqualTo("2026-06-30");
        assertThat(data.get("severity").asText()).isEqualTo("critical");
        assertThat(data.get("facts").size()).isEqualTo(4);
        assertThat(data.get("caution").asText()).isEqualTo(Alert.CAUTION);

        @SuppressWarnings("unchecked")
        OutgoingKafkaRecordMetadata<String> kafka = message.getMetadata(OutgoingKafkaRecordMetadata.class).orElseThrow();
        assertThat(kafka.getKey()).as("Kafka key: the spread, so one spread's alerts stay in order").isEqualTo("GOVT-A:10Y-3M");
        assertThat(new String(kafka.getHeaders().lastHeader("content-type").value(), StandardCharsets.UTF_8))
                .startsWith("application/cloudevents+json");
    }

    @Test
    void theEventTypeFollowsTheKindOfNotice() throws Exception {
        Alert a = TestAlerts.confirmed();
        Alert resolved = new Alert("govt-a-10y3m/confirmation/2026-03-31/resolved/1", a.rule(), a.severity(), Alert.Kind.RESOLVED,
                a.spreadId(), LocalDate.of(2026, 9, 1), "NORMAL", "[CRITICAL] GOVT-A 10Y-3M resolved", "Resolved.\n\n" + Alert.CAUTION,
                a.facts(), a.dashboard(), a.createdAt());

        registry.channel("alerts-topic").orElseThrow().deliver(resolved);

        assertThat(JSON.readTree(sink.received().get(0).getPayload()).get("type").asText()).isEqualTo("org.slopewatch.alert.resolved");
    }
}
