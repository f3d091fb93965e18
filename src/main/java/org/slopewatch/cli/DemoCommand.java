package org.slopewatch.cli;

import io.quarkus.runtime.Quarkus;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
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

    @Option(names = "--port", paramLabel = "PORT", defaultValue = "8080", description = "HTTP port (default: ${DEFAULT-VALUE}).")
    int port;

    @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "Scenario seed (default: ${DEFAULT-VALUE}).")
    long seed;

    private static String newToken() {
        byte[] bytes = new byte[24];
        new java.security.SecureRandom().nextBytes(bytes);
        return "demo-" + java.util.Base64.getUrlEncoder().withoutPadding().encodeToString(bytes);
    }

    @Override
    public Integer call() throws IOException {
        Path dir = data != null ? data : Files.createTempDirectory("slopewatch-demo-");
        Files.createDirectories(dir);
        System.setProperty("slopewatch.data-dir", dir.toAbsolutePath().toString());
        System.setProperty("slopewatch.demo.enabled", "true");
        System.setProperty("slopewatch.demo.seed", Long.toString(seed));
        // the scenario's market clock runs ahead of the calendar: its dates are not "too far in the future"
        System.setProperty("slopewatch.ingest.max-days-ahead", "36500");
        System.setProperty("slopewatch.ingest.curves", "GOVT-A,GOVT-B");
        System.setProperty("quarkus.http.port", Integer.toString(port));
        // a local demo: anyone on this machine may read; changing anything (posting quotes,
        // acknowledging, muting) takes the token printed here, made afresh for each run
        String token = newToken();
        System.setProperty("slopewatch.security.write-tokens", token);
        System.setProperty("slopewatch.security.open-reads", "true");
        System.out.println("slopewatch demo: journal in " + dir.toAbsolutePath());
        System.out.println("slopewatch demo: write token for this run (POST /api/quotes, acknowledge, mute): " + token);
        System.out.println("  e.g. curl -H 'Authorization: Bearer " + token + "' -X POST localhost:" + port + "/api/policy/reload");
        Quarkus.run(DaemonApplication.class, (code, failure) -> {
            if (failure != null) {
                System.err.println("slopewatch demo: could not start: " + ServeCommand.rootMessage(failure));
            }
            System.exit(code);
        });
        return 0;
    }
}
