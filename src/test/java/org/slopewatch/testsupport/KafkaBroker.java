package org.slopewatch.testsupport;

import java.util.Map;

/**
 * The real Kafka broker the tests talk to. CI starts it with {@code .ci/kafka.sh} and names it in
 * {@value #ENV}; without that variable (a developer's machine) the same script starts a broker on
 * free ports for this JVM, stopped when the JVM exits.
 */
public final class KafkaBroker {

    /** host:port of a running broker, e.g. {@code 127.0.0.1:9092}. */
    public static final String ENV = "SLOPEWATCH_TEST_KAFKA";

    private static final String PROPERTY = "slopewatch.test.kafka.bootstrap";

    private KafkaBroker() {
    }

    /** The broker's bootstrap address; starts one for this JVM on first use if CI has not. */
    public static synchronized String bootstrapServers() {
        String fromEnv = LocalService.env(ENV);
        if (fromEnv != null) {
            return fromEnv;
        }
        String started = System.getProperty(PROPERTY);
        if (started != null) {
            return started;
        }
        int port = LocalService.freePort();
        int controllerPort = LocalService.freePort();
        while (controllerPort == port) {
            controllerPort = LocalService.freePort();
        }
        int controller = controllerPort;
        LocalService.startOnce("Kafka broker", "kafka.sh", dir -> Map.of(
                "SLOPEWATCH_KAFKA_PORT", String.valueOf(port),
                "SLOPEWATCH_KAFKA_CONTROLLER_PORT", String.valueOf(controller),
                "SLOPEWATCH_KAFKA_DIR", dir.toString()),
                "Start one yourself with '.ci/kafka.sh start' (Kafka 4.1.2 from Maven Central, needs only a JDK) and run the tests with "
                        + ENV + "=127.0.0.1:9092.");
        String address = "127.0.0.1:" + port;
        System.setProperty(PROPERTY, address);
        return address;
    }
}
