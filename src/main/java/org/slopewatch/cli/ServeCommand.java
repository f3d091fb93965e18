package org.slopewatch.cli;

import io.quarkus.runtime.Quarkus;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code slopewatch serve}: the daemon from configuration. */
@Command(name = "serve", mixinStandardHelpOptions = true,
        description = {"Runs the daemon from configuration (application.properties, config/application.properties in the "
                + "working directory, environment variables such as SLOPEWATCH_JOURNAL_URL).",
                "--kafka takes quotes from the Kafka topic slopewatch.quotes (kafka.bootstrap.servers) instead of in-process."})
final class ServeCommand implements Callable<Integer> {

    @Option(names = "--kafka", description = "Use the Kafka profile: quotes, publishing and dead letters on Kafka topics.")
    boolean kafka;

    @Option(names = "--port", paramLabel = "PORT", description = "HTTP port (default: 8080, or quarkus.http.port).")
    Integer port;

    @Override
    public Integer call() {
        if (kafka) {
            System.setProperty("quarkus.profile", "prod,kafka");
        }
        if (port != null) {
            System.setProperty("quarkus.http.port", port.toString());
        }
        Quarkus.run(DaemonApplication.class, (code, failure) -> {
            if (failure != null) {
                System.err.println("slopewatch serve: could not start: " + rootMessage(failure));
            }
            System.exit(code);
        });
        return 0;
    }

    static String rootMessage(Throwable t) {
        Throwable root = t;
        while (root.getCause() != null && root.getCause() != root) {
            root = root.getCause();
        }
        return root.getMessage() == null ? root.toString() : root.getMessage();
    }
}
