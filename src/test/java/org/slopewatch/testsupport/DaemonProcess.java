package org.slopewatch.testsupport;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.UUID;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The packaged daemon ({@code target/quarkus-app/quarkus-run.jar}, built by {@code package}) run as
 * a separate JVM, as an operator runs it: {@code serve --kafka} ({@link #start(String, Map, Map)})
 * or {@code serve} on the embedded defaults ({@link #startEmbedded}), with its settings as system
 * properties. For the integration tests (failsafe, after {@code package}) that need more than one
 * instance at once or must kill one, which a {@code @QuarkusTest} in the test JVM cannot do.
 */
public final class DaemonProcess implements AutoCloseable {

    private static final String WRITE_TOKENS = "slopewatch.security.write-tokens";
    private static final HttpClient HTTP = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(2)).build();

    private final String name;
    private final int port;
    private final Path log;
    private final Process process;

    private DaemonProcess(String name, int port, Path log, Process process) {
        this.name = name;
        this.port = port;
        this.log = log;
        this.process = process;
    }

    /**
     * Starts an instance with {@code serve --kafka} on a free port; its output goes to
     * {@code target/it-logs/NAME.log}.
     *
     * @param settings configuration keys and values, passed as {@code -Dkey=value}
     * @param environment extra environment variables (secrets such as the journal password)
     */
    public static DaemonProcess start(String name, Map<String, String> settings, Map<String, String> environment) {
        return start(name, TEST_JVM, List.of("serve", "--kafka"), settings, environment);
    }

    /**
     * Starts an instance with {@code serve} alone: the embedded transport (HTTP into the in-process
     * channel) and, unless {@code settings} name another, the H2 journal under {@code slopewatch.data-dir}.
     */
    public static DaemonProcess startEmbedded(String name, Map<String, String> settings) {
        return start(name, TEST_JVM, List.of("serve"), settings, Map.of());
    }

    /**
     * The settings the fault tests' daemons share, whatever the transport: the shipped default
     * policy, {@code dataDir} for the data, the curves taken, a chat channel posting alert JSON to
     * {@code chatUrl} (on the loopback address), clock-driven rules evaluated every second, and a
     * write token of its own ({@link #writeToken}). A mutable map, for the caller's additions.
     */
    public static Map<String, String> scenarioSettings(Path dataDir, List<String> curves, String chatUrl) {
        Map<String, String> s = new LinkedHashMap<>();
        s.put("slopewatch.home", Path.of("").toAbsolutePath().toString());
        s.put("slopewatch.data-dir", dataDir.toString());
        s.put("slopewatch.ingest.curves", String.join(",", curves));
        s.put("slopewatch.channels.desk-chat.type", "chat-webhook");
        s.put("slopewatch.channels.desk-chat.url", chatUrl);
        s.put("slopewatch.channels.desk-chat.format", "alert-json");
        s.put("slopewatch.delivery.allowed-hosts", "127.0.0.1");
        s.put("slopewatch.alerts.evaluate-every", "1s");
        s.put(WRITE_TOKENS, UUID.randomUUID().toString());
        return s;
    }

    /** The first write token among {@code settings}, for {@code Authorization: Bearer}. */
    public static String writeToken(Map<String, String> settings) {
        return settings.get(WRITE_TOKENS).split(",")[0].trim();
    }

    /** JVM options of the tests' instances: a small heap, and a quick start rather than peak speed. */
    public static final List<String> TEST_JVM = List.of("-Xmx384m", "-XX:TieredStopAtLevel=1");

    /**
     * As {@link #start(String, Map, Map)} with other JVM options (benchmarks want the full JIT) and
     * launcher arguments (e.g. {@code serve} alone for the embedded transport).
     */
    public static DaemonProcess start(String name, List<String> jvmOptions, List<String> arguments, Map<String, String> settings,
                                      Map<String, String> environment) {
        Path jar = Path.of("target", "quarkus-app", "quarkus-run.jar").toAbsolutePath();
        if (!Files.isRegularFile(jar)) {
            throw new IllegalStateException(jar + " is missing: integration tests run after 'package' (./mvnw verify)");
        }
        int port = freePort();
        Path log = Path.of("target", "it-logs", name + ".log").toAbsolutePath();
        List<String> command = new ArrayList<>();
        command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        command.addAll(jvmOptions);
        Map<String, String> all = new TreeMap<>(settings);
        all.put("quarkus.http.port", Integer.toString(port));
        all.forEach((k, v) -> command.add("-D" + k + "=" + v));
        command.addAll(List.of("-jar", jar.toString()));
        command.addAll(arguments);
        try {
            Files.createDirectories(log.getParent());
            ProcessBuilder builder = new ProcessBuilder(command).redirectErrorStream(true).redirectOutput(log.toFile());
            builder.environment().putAll(environment);
            return new DaemonProcess(name, port, log, builder.start());
        } catch (IOException e) {
            throw new UncheckedIOException("cannot start " + name, e);
        }
    }

    /** The HTTP port it listens on. */
    public int port() {
        return port;
    }

    public String name() {
        return name;
    }

    public Path log() {
        return log;
    }

    /** The process id, for {@code jcmd} and the like. */
    public long pid() {
        return process.pid();
    }

    public boolean isAlive() {
        return process.isAlive();
    }

    /** Waits until {@code /q/health/ready} answers 200; fails with the log's tail if the process dies or time runs out. */
    public DaemonProcess awaitReady(Duration timeout) {
        long deadline = System.nanoTime() + timeout.toNanos();
        while (System.nanoTime() < deadline) {
            if (!process.isAlive()) {
                throw new AssertionError(name + " exited with " + process.exitValue() + " before it was ready:\n" + logTail());
            }
            if (get("/q/health/ready").status() == 200) {
                return this;
            }
            pause(250);
        }
        throw new AssertionError(name + " was not ready within " + timeout + ":\n" + logTail());
    }

    /** Whether {@code /q/health/ready} answers 200 now. */
    public boolean isReady() {
        return get("/q/health/ready").status() == 200;
    }

    /** The sum of a counter over all its series in {@code /q/metrics} (Prometheus text), e.g. {@code slopewatch_quotes_accepted_total}. */
    public double counter(String metric) {
        return sum(metric, "", 0);
    }

    /**
     * The sum of a metric over the series whose labels contain {@code labels}, e.g.
     * {@code jvm_memory_used_bytes} with {@code area="heap"}; NaN when no series matches.
     */
    public double metric(String metric, String labels) {
        return sum(metric, labels, Double.NaN);
    }

    /** The sum of the series of {@code metric} whose labels contain {@code labels}; {@code none} when there is none. */
    private double sum(String metric, String labels, double none) {
        Matcher m = Pattern.compile("(?m)^" + Pattern.quote(metric) + "(?:\\{([^}]*)\\})? ([0-9.eE+-]+)$").matcher(get("/q/metrics").body());
        double sum = 0;
        boolean any = false;
        while (m.find()) {
            if ((m.group(1) == null ? "" : m.group(1)).contains(labels)) {
                sum += Double.parseDouble(m.group(2));
                any = true;
            }
        }
        return any ? sum : none;
    }

    /** SIGTERM: the daemon shuts down in order (leaves the consumer group, finishes the step in progress). */
    public void stop() {
        process.destroy();
        waitForExit();
    }

    /** SIGKILL: no shutdown at all, as a crash. */
    public void kill() {
        process.destroyForcibly();
        waitForExit();
    }

    private void waitForExit() {
        try {
            if (!process.waitFor(60, TimeUnit.SECONDS)) {
                process.destroyForcibly().waitFor(10, TimeUnit.SECONDS);
                throw new AssertionError(name + " did not exit within 60 s:\n" + logTail());
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError("interrupted while waiting for " + name + " to exit", e);
        }
    }

    /** The last 60 lines of the instance's output, for failure messages. */
    public String logTail() {
        try {
            List<String> lines = Files.readAllLines(log);
            return String.join("\n", lines.subList(Math.max(0, lines.size() - 60), lines.size()));
        } catch (IOException e) {
            return "(no log: " + e.getMessage() + ")";
        }
    }

    /** The instance's output so far. */
    public String logText() {
        try {
            return Files.readString(log);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** An HTTP answer; status 0 when nothing answered (not listening yet, or gone). */
    private record Answer(int status, String body) {
    }

    private Answer get(String path) {
        try {
            HttpResponse<String> r = HTTP.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + path))
                    .timeout(Duration.ofSeconds(5)).build(), HttpResponse.BodyHandlers.ofString());
            return new Answer(r.statusCode(), r.body());
        } catch (IOException e) {
            return new Answer(0, "");
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError("interrupted", e);
        }
    }

    @Override
    public void close() {
        if (process.isAlive()) {
            process.destroyForcibly();
            try {
                process.waitFor(10, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
    }

    private static int freePort() {
        try (ServerSocket s = new ServerSocket(0)) {
            return s.getLocalPort();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static void pause(long millis) {
        try {
            Thread.sleep(millis);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError("interrupted", e);
        }
    }
}
