package org.slopewatch.delivery;

import java.util.Optional;

/**
 * What carries the events of stream channels: the connector of the outgoing messaging channel
 * {@value StreamChannel#CHANNEL}, set by {@value #CONNECTOR_KEY}. Only Kafka lets an event go
 * once the broker has it. The in-process connector of the embedded defaults
 * ({@code smallrye-in-memory}) keeps every message it is sent for the life of the daemon, so a
 * stream channel delivering there would grow the heap by every alert, with no one to read them.
 *
 * @param connector the configured connector's name, or null when none is configured
 */
public record StreamTransport(String connector) {

    public static final String CONNECTOR_KEY = "mp.messaging.outgoing." + StreamChannel.CHANNEL + ".connector";
    public static final String KAFKA = "smallrye-kafka";

    public boolean isKafka() {
        return KAFKA.equals(connector);
    }

    /** Why stream channel {@code channel} may not deliver on this transport; empty on Kafka. */
    public Optional<String> refusal(String channel) {
        if (isKafka()) {
            return Optional.empty();
        }
        return Optional.of("channel " + channel + " is a stream channel, but " + StreamChannel.CHANNEL + " is on "
                + (connector == null ? "no connector" : "the " + connector + " connector") + ", not Kafka, and would keep every event in"
                + " memory; set " + CONNECTOR_KEY + "=" + KAFKA + " and kafka.bootstrap.servers to the brokers (serve --kafka sets the"
                + " connector)");
    }
}
