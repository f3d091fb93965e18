package org.slopewatch.cli;

import io.quarkus.runtime.Quarkus;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Properties;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code slopewatch demo}: the daemon on embedded defaults with the built-in scenario feed. */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Runs the daemon on embedded defaults (in-process channels, HTTP ingest, an H2 journal in a fresh "
                + "temporary directory) with a built-in scenario: an invented curve GOVT-A through a tightening cycle, whose "
                + "10Y-3M and 10Y-2Y invert, are confirmed and re-steepen within about a minute, and GOVT-B, which never inverts.",
                "The scenario runs on its own accelerated market clock, ahead of the calendar."})
final class DemoCommand implements Callable<Integer> {

    @Option(names = "--data", paramLabel = "DIR", description = "Keep the journal in DIR (default: a fresh temporary directory); "
            + "run again with the same DIR to resume where the demo stopped.")
    Path data;

    @Option(names = "--port", paramLabel = "PORT", description = "HTTP port (default: the configured one, quarkus.http.port or "
            + "QUARKUS_HTTP_PORT, else 8080).")
    Integer port;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "Scenario seed (default: ${DEFAULT-VALUE}).")
    long seed;

    private static String newToken() {
        byte[] bytes = new byte[24];
        new java.security.SecureRandom().nextBytes(bytes);
        return "demo-" + java.util.Base64.getUrlEncoder().withoutPadding().encodeToString(bytes);
    }

    /**
     * What the demo sets on top of the configuration. The HTTP port only when {@code --port} is
     * given, so that {@code quarkus.http.port} and {@code QUARKUS_HTTP_PORT} apply as they do to
     * {@code serve}.
     */
    Properties settings(Path dir, String token) {
        Properties settings = new Properties();
        settings.setProperty("slopewatch.data-dir", dir.toAbsolutePath().toString());
        settings.setProperty("slopewatch.demo.enabled", "true");
        settings.setProperty("slopewatch.demo.seed", Long.toString(seed));
        // the scenario's market clock runs ahead of the calendar: its dates are not "too far in the future"
        settings.setProperty("slopewatch.ingest.max-days-ahead", "36500");
        settings.setProperty("slopewatch.ingest.curves", "GOVT-A,GOVT-B");
        if (port != null) {
            settings.setProperty("quarkus.http.port", port.toString());
        }
        // a local demo: anyone on this machine may read; changing anything (posting quotes,
        // acknowledging, quiet periods) takes the token printed here, made afresh for each run
        settings.setProperty("slopewatch.security.write-tokens", token);
        settings.setProperty("slopewatch.security.open-reads", "true");
        return settings;
    }

    /** The port the daemon will listen on, in the order the configuration reads it (8080 is the shipped default). */
    int announcedPort() {
        if (port != null) {
            return port;
        }
        String configured = System.getProperty("quarkus.http.port", System.getenv("QUARKUS_HTTP_PORT"));
        return configured == null || configured.isBlank() ? 8080 : Integer.parseInt(configured.strip());
    }

    @Override
    public Integer call() throws IOException {
        Path dir = data != null ? data : Files.createTempDirectory("slopewatch-demo-");
        Files.createDirectories(dir);
        String token = newToken();
        settings(dir, token).forEach((key, value) -> System.setProperty((String) key, (String) value));
        System.out.println("slopewatch demo: journal in " + dir.toAbsolutePath());
        System.out.println("slopewatch demo: write token for this run (POST /api/quotes, acknowledge, quiet periods): " + token);
        System.out.println("  e.g. curl -H 'Authorization: Bearer " + token + "' -X POST localhost:" + announcedPort() + "/api/policy/reload");
        Quarkus.run(DaemonApplication.class, (code, failure) -> {
            if (failure != null) {
                System.err.println("slopewatch demo: could not start: " + ServeCommand.rootMessage(failure));
            }
            System.exit(code);
        });
        return 0;
    }
}
