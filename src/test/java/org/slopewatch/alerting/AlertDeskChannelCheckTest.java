package org.slopewatch.alerting;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.HashMap;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import org.junit.jupiter.api.Test;
import org.slopewatch.delivery.AlertChannel;
import org.slopewatch.delivery.DeliveryOutcome;
import org.slopewatch.delivery.StreamTransport;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyParser;

/**
 * The check start-up and every reload make of the policy's channels against the configured ones
 * ({@link AlertDesk#checkChannels(Policy, Function, StreamTransport)}), here for stream channels:
 * their events must go to Kafka, since the in-process connector keeps each one for the life of the
 * daemon. Connector names as SmallRye Reactive Messaging spells them: {@code smallrye-kafka} and
 * {@code smallrye-in-memory} (the names application.properties gives {@code alerts-out}).
 */
class AlertDeskChannelCheckTest {

    private static final String IN_MEMORY = "smallrye-in-memory";
    private static final String REFUSED = "p.yaml: channel alerts-topic is a stream channel, but alerts-out is on the smallrye-in-memory"
            + " connector, not Kafka, and would keep every event in memory; set mp.messaging.outgoing.alerts-out.connector=smallrye-kafka"
            + " and kafka.bootstrap.servers to the brokers (serve --kafka sets the connector)";

    /** A policy sending its confirmations to a stream channel named alerts-topic. */
    private static Policy streaming() throws PolicyException {
        return PolicyParser.parse("p.yaml", """
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
                """);
    }

    /** A configured channel: only its name and type matter to the check. */
    private record Configured(String name, String type) implements AlertChannel {
        @Override
        public DeliveryOutcome deliver(Alert alert) {
            throw new AssertionError("the check delivers nothing");
        }
    }

    private static Function<String, Optional<AlertChannel>> configured(AlertChannel... channels) {
        Map<String, AlertChannel> byName = new HashMap<>();
        for (AlertChannel c : channels) {
            byName.put(c.name(), c);
        }
        return name -> Optional.ofNullable(byName.get(name));
    }

    @Test
    void aStreamChannelOnTheInMemoryConnectorIsRefusedNamingTheKeyToSet() throws PolicyException {
        assertThat(AlertDesk.checkChannels(streaming(), configured(new Configured("alerts-topic", "stream"), new Configured("log", "log")),
                new StreamTransport(IN_MEMORY))).containsExactly(REFUSED);
    }

    @Test
    void aStreamChannelOnNoConnectorAtAllIsRefusedToo() throws PolicyException {
        assertThat(AlertDesk.checkChannels(streaming(), configured(new Configured("alerts-topic", "stream")), new StreamTransport(null)))
                .singleElement().asString().contains("alerts-out is on no connector, not Kafka")
                .contains("set mp.messaging.outgoing.alerts-out.connector=smallrye-kafka");
    }

    @Test
    void aStreamChannelOnKafkaIsAccepted() throws PolicyException {
        assertThat(AlertDesk.checkChannels(streaming(), configured(new Configured("alerts-topic", "stream"), new Configured("log", "log")),
                new StreamTransport(StreamTransport.KAFKA))).isEmpty();
    }

    @Test
    void aDeclaredStreamChannelThatIsNotConfiguredSendsNothingAndIsAllowed() throws PolicyException {
        // its deliveries are recorded as skipped, as for any declared channel without configuration
        assertThat(AlertDesk.checkChannels(streaming(), configured(new Configured("log", "log")), new StreamTransport(IN_MEMORY))).isEmpty();
    }

    @Test
    void aStreamChannelConfiguredAsAnotherTypeIsOneProblemOfTypes() throws PolicyException {
        assertThat(AlertDesk.checkChannels(streaming(), configured(new Configured("alerts-topic", "log")), new StreamTransport(IN_MEMORY)))
                .containsExactly("p.yaml: channel alerts-topic is declared as stream but configured as log (slopewatch.channels.alerts-topic.type)");
    }

    @Test
    void aPolicyWithoutStreamChannelsRunsOnTheInMemoryConnector() throws PolicyException {
        Policy logOnly = PolicyParser.parse("p.yaml", "watch:\n  - spread: 10Y-3M\n    confirm: [quarter-average]\n");
        assertThat(AlertDesk.checkChannels(logOnly, configured(new Configured("log", "log"), new Configured("alerts-topic", "stream")),
                new StreamTransport(IN_MEMORY))).isEmpty();
    }
}
