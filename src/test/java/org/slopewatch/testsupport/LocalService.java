package org.slopewatch.testsupport;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.InetAddress;
import java.net.ServerSocket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.function.Function;
import java.util.stream.Stream;

/**
 * Starts one of the {@code .ci/*.sh} services for this JVM when CI has not started it already,
 * and stops it when the JVM exits. The same script CI runs, so that a developer's
 * {@code ./mvnw verify} tests against the same real server as CI does.
 *
 * <p>The outcome is kept in a system property rather than a static field: Quarkus tests load
 * test classes in more than one class loader, and the service must start once per JVM.
 */
final class LocalService {

    // a cold start downloads the broker's jars or installs PostgreSQL
    private static final long START_TIMEOUT_MINUTES = 10;
    private static final long STOP_TIMEOUT_SECONDS = 60;

    private LocalService() {
    }

    /**
     * Runs {@code .ci/<script> start} with the given environment unless this JVM did already, and
     * registers {@code .ci/<script> stop} to run at exit, which also removes the service's state
     * directory.
     *
     * @param name   names the service in messages
     * @param env    the script's settings, given a new state directory under the temporary
     *               directory (the postgres user must reach it); the script's output goes to a log
     *               file there, kept when something went wrong
     * @param advice what a developer can do instead, shown when the start fails
     */
    static synchronized void startOnce(String name, String script, Function<Path, Map<String, String>> env, String advice) {
        String property = "slopewatch.test.started." + script;
        String earlier = System.getProperty(property);
        if (earlier != null) {
            if (earlier.startsWith("failed:")) {
                throw new IllegalStateException(earlier.substring("failed:".length()));
            }
            return;
        }
        Path root = projectRoot();
        Path scriptPath = root.resolve(".ci").resolve(script);
        Path stateDir = stateDir("slopewatch-" + script.replace(".sh", "") + "-");
        Map<String, String> settings = env.apply(stateDir);
        Path log = stateDir.resolve(script.replace(".sh", "") + "-script.log");
        String failure = run(root, scriptPath, "start", settings, log, START_TIMEOUT_MINUTES * 60);
        if (failure != null) {
            String message = "No " + name + " for the tests: its environment variable is not set and starting one with "
                    + root.relativize(scriptPath) + " failed (" + failure + "). " + advice;
            System.setProperty(property, "failed:" + message);
            throw new IllegalStateException(message);
        }
        System.setProperty(property, "started");
        Runtime.getRuntime().addShutdownHook(new Thread(() -> {
            if (run(root, scriptPath, "stop", settings, log, STOP_TIMEOUT_SECONDS) == null) {
                deleteTree(stateDir);
            }
        }, "stop " + name));
    }

    private static void deleteTree(Path dir) {
        try (Stream<Path> paths = Files.walk(dir)) {
            paths.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException | UncheckedIOException e) {
            // a leftover directory under the temporary directory is harmless
        }
    }

    private static Path stateDir(String prefix) {
        try {
            return Files.createTempDirectory(prefix);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** Null when the script succeeded, else what went wrong with the tail of its output. */
    private static String run(Path root, Path script, String command, Map<String, String> env, Path log, long timeoutSeconds) {
        if (!Files.isRegularFile(script)) {
            return script + " does not exist";
        }
        ProcessBuilder pb = new ProcessBuilder(List.of("bash", script.toString(), command)).directory(root.toFile())
                .redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.appendTo(log.toFile()))
                .redirectInput(ProcessBuilder.Redirect.from(new java.io.File("/dev/null")));
        pb.environment().putAll(env);
        try {
            Process p = pb.start();
            if (!p.waitFor(timeoutSeconds, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                return "'" + command + "' did not finish within " + timeoutSeconds + " s; output in " + log + tail(log);
            }
            return p.exitValue() == 0 ? null
                    : "'" + command + "' exited with " + p.exitValue() + "; output in " + log + tail(log);
        } catch (IOException e) {
            return "cannot run bash: " + e.getMessage();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return "interrupted";
        }
    }

    private static String tail(Path log) {
        try {
            List<String> lines = Files.readAllLines(log, StandardCharsets.UTF_8);
            return ":\n  " + String.join("\n  ", lines.subList(Math.max(0, lines.size() - 15), lines.size()));
        } catch (IOException e) {
            return "";
        }
    }

    /** The directory holding {@code .ci/}: the working directory of a Maven test run, or one above it. */
    static Path projectRoot() {
        Path dir = Path.of(System.getProperty("user.dir")).toAbsolutePath();
        for (Path d = dir; d != null; d = d.getParent()) {
            if (Files.isDirectory(d.resolve(".ci"))) {
                return d;
            }
        }
        throw new IllegalStateException("cannot find the project's .ci directory above " + dir);
    }

    /** A port on 127.0.0.1 that nothing listens on right now. */
    static int freePort() {
        try (ServerSocket s = new ServerSocket(0, 1, InetAddress.getLoopbackAddress())) {
            return s.getLocalPort();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot find a free port on 127.0.0.1", e);
        }
    }

    static String env(String name) {
        String v = System.getenv(name);
        return v == null || v.isBlank() ? null : v.strip();
    }
}
