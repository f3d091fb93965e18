package org.slopewatch.cli;

import io.quarkus.runtime.Quarkus;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Properties;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/** {@code slopewatch demo}: the daemon on embedded defaults with the built-in scenario feed. */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Runs the daemon on embedded defaults (in-process channels, HTTP ingest, an H2 journal in a fresh "
                + "temporary directory) with a built-in scenario: an invented curve GOVT-A through a tightening cycle, whose "
                + "10Y-3M and 10Y-2Y invert, are confirmed and re-steepen within about two minutes, and GOVT-B, which never inverts.",
                "The scenario runs on its own accelerated market clock, ahead of the calendar."})
final class DemoCommand implements Callable<Integer> {

    /**
     * Bounds of --pace: below a millisecond per market day the feed would only run as fast as the
     * pipeline takes its batches anyway; above an hour per day nothing would seem to move.
     */
    static final double MIN_PACE = 0.001;
    static final double MAX_PACE = 3600;

    @Option(names = "--data", paramLabel = "DIR", description = "Keep the journal in DIR (default: a fresh temporary directory); "
            + "run again with the same DIR to resume where the demo stopped.")
    Path data;

    @Option(names = "--port", paramLabel = "PORT", description = "HTTP port (default: the configured one, quarkus.http.port or "
            + "QUARKUS_HTTP_PORT, else 8080).")
    Integer port;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "Scenario seed (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--pace", paramLabel = "SECONDS", description = "Wall-clock seconds per market day of the scripted cycle "
            + "(default: 0.25, from slopewatch.demo.fast-days-per-second; a confirmed inversion then stays on screen for over a "
            + "minute). Larger is slower, e.g. --pace=1 for a talk, 0.05 for a quick look.")
    Double pace;

    @Spec
    CommandSpec spec;

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
        if (pace != null) {
            settings.setProperty("slopewatch.demo.fast-days-per-second", Double.toString(1 / pace));
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
        if (pace != null && !(pace >= MIN_PACE && pace <= MAX_PACE)) {
            throw new ParameterException(spec.commandLine(), "--pace must be between " + MIN_PACE + " and " + MAX_PACE
                    + " seconds per market day, got " + pace);
        }
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
