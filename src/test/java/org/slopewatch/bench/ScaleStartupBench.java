package org.slopewatch.bench;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.slopewatch.testsupport.DaemonProcess;

/**
 * Start-up of the packaged daemon on a journal of history, next to its baseline in the same run:
 * the same daemon, settings and JVM options started on an empty (migrated) journal. For each
 * journal and round, the baseline starts first, then the journal; each is timed from launching
 * the JVM to the first 200 of {@code /q/health/ready} (polled every 20 ms), its log gives the
 * messages replayed and the time {@code recover()} took, and {@code jcmd GC.class_histogram}
 * (a full collection first) gives the live heap once it is ready, and {@code /proc} the CPU time
 * the process used to get there. Then it is stopped (SIGTERM). Third, the same journal is started
 * with {@code checkpoint-every=0}, which reads no checkpoint: every quote replayed, as before
 * checkpoints existed.
 *
 * <p>Arguments: ROUNDS BASELINE_DIR JOURNAL_DIR:CURVES... Each directory holds {@code journal.mv.db}
 * and {@code scale-policy.yaml} as {@link ScaleJournalBuilder} writes them. JVM options of the
 * daemons: the system property {@code scale.daemon.jvm} (default {@code -Xmx6g}). A directory with a
 * {@code journal-url.txt} names a PostgreSQL journal instead of its H2 file. With
 * {@code -Dscale.whole-replay=false} the third start (every quote replayed) is left out, for
 * journals whose whole replay would take longer than the run can afford; its fields then read -1.
 */
public final class ScaleStartupBench {

    private static final Pattern REBUILT = Pattern.compile("rebuilt from (\\d+) journalled quote message\\(s\\) in (\\d+) ms");
    private static final HttpClient HTTP = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(2)).build();

    /** In a journal's directory: the JDBC URL of a PostgreSQL journal built there ({@link ScaleJournalBuilder}), user and password {@code sw}. */
    static final String JOURNAL_URL_FILE = "journal-url.txt";

    private static final boolean WHOLE_REPLAY = Boolean.parseBoolean(System.getProperty("scale.whole-replay", "true"));

    public static void main(String[] args) throws Exception {
        int rounds = Integer.parseInt(args[0]);
        Path baseline = Path.of(args[1]).toAbsolutePath();
        List<String> jvm = List.of(System.getProperty("scale.daemon.jvm", "-Xmx6g").split(" "));
        for (int round = 1; round <= rounds; round++) {
            for (int i = 2; i < args.length; i++) {
                String[] item = args[i].split(":");
                Path dir = Path.of(item[0]).toAbsolutePath();
                int curves = Integer.parseInt(item[1]);
                Start base = start("scale-baseline-" + curves, baseline, curves, jvm, Map.of());
                Start full = start("scale-" + dir.getFileName(), dir, curves, jvm, Map.of());
                // the same journal started without reading its checkpoints: every quote replayed, as before they existed
                Start whole = WHOLE_REPLAY ? start("scale-" + dir.getFileName() + "-whole", dir, curves, jvm,
                        Map.of("slopewatch.ingest.checkpoint-every", "0")) : new Start(-1, -1, -1, -1, -1);
                System.out.printf(Locale.ROOT, "scale-startup round=%d journal=%s curves=%d spreads=%d messages=%d "
                                + "ready_s=%.3f baseline_ready_s=%.3f ratio=%.2f extra_s=%.3f cpu_s=%.2f baseline_cpu_s=%.2f cpu_ratio=%.2f recover_ms=%d baseline_recover_ms=%d "
                                + "messages_per_s_recover=%.0f messages_per_s_extra=%.0f heap_live_bytes=%d baseline_heap_live_bytes=%d "
                                + "per_spread_bytes=%.0f without_checkpoints_messages=%d without_checkpoints_ready_s=%.3f "
                                + "without_checkpoints_ratio=%.2f without_checkpoints_heap_live_bytes=%d load=%s%n",
                        round, dir.getFileName(), curves, curves * ScaleScenario.SPREADS.length, full.messages, full.readySeconds,
                        base.readySeconds, full.readySeconds / base.readySeconds, full.readySeconds - base.readySeconds, full.cpuSeconds,
                        base.cpuSeconds, full.cpuSeconds / base.cpuSeconds, full.recoverMillis,
                        base.recoverMillis, full.messages / (full.recoverMillis / 1e3),
                        full.messages / (full.readySeconds - base.readySeconds), full.liveBytes, base.liveBytes,
                        (full.liveBytes - base.liveBytes) / (double) (curves * ScaleScenario.SPREADS.length), whole.messages,
                        whole.readySeconds, whole.readySeconds / base.readySeconds, whole.liveBytes, load());
            }
        }
    }

    private record Start(double readySeconds, double cpuSeconds, long messages, long recoverMillis, long liveBytes) {
    }

    private static Start start(String name, Path dir, int curves, List<String> jvm, Map<String, String> extra) throws Exception {
        Map<String, String> settings = new HashMap<>(extra);
        settings.put("slopewatch.data-dir", dir.toString());
        Path postgres = dir.resolve(JOURNAL_URL_FILE);
        Map<String, String> environment = new HashMap<>();
        if (Files.isRegularFile(postgres)) {
            settings.put("slopewatch.journal.url", Files.readString(postgres).strip());
            settings.put("slopewatch.journal.username", "sw");
            environment.put("SLOPEWATCH_JOURNAL_PASSWORD", "sw");
        }
        settings.put("slopewatch.ingest.policy", dir.resolve("scale-policy.yaml").toString());
        settings.put("slopewatch.ingest.curves", String.join(",", ScaleScenario.curves(Math.max(1, curves))));
        settings.put("slopewatch.security.write-tokens", "scale-bench-" + Long.toHexString(System.nanoTime()));
        settings.put("quarkus.log.category.\"org.slopewatch.transitions\".level", "WARN");
        long t0 = System.nanoTime();
        try (DaemonProcess daemon = DaemonProcess.start(name, jvm, List.of("serve"), settings, environment)) {
            while (!ready(daemon)) {
                if (!daemon.isAlive()) {
                    throw new IllegalStateException(name + " exited:\n" + daemon.logTail());
                }
                if (System.nanoTime() - t0 > Duration.ofMinutes(30).toNanos()) {
                    throw new IllegalStateException(name + " not ready in 30 minutes:\n" + daemon.logTail());
                }
                Thread.sleep(20);
            }
            double seconds = (System.nanoTime() - t0) / 1e9;
            double cpu = cpuSeconds(daemon.pid());
            Matcher m = REBUILT.matcher(daemon.logText());
            if (!m.find()) {
                throw new IllegalStateException(name + ": no recovery line in its log:\n" + daemon.logTail());
            }
            long live = liveHeap(daemon.pid());
            daemon.stop();
            return new Start(seconds, cpu, Long.parseLong(m.group(1)), Long.parseLong(m.group(2)), live);
        }
    }

    private static boolean ready(DaemonProcess daemon) throws InterruptedException {
        try {
            return HTTP.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + daemon.port() + "/q/health/ready"))
                    .timeout(Duration.ofSeconds(5)).build(), HttpResponse.BodyHandlers.discarding()).statusCode() == 200;
        } catch (java.io.IOException e) {
            return false;
        }
    }

    /** Total bytes of live objects, from the last line of {@code jcmd PID GC.class_histogram} (which collects first). */
    static long liveHeap(long pid) throws Exception {
        Process p = new ProcessBuilder("jcmd", Long.toString(pid), "GC.class_histogram").redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        p.waitFor();
        Matcher m = Pattern.compile("(?m)^Total\\s+(\\d+)\\s+(\\d+)\\s*$").matcher(out);
        if (!m.find()) {
            throw new IllegalStateException("unexpected jcmd output: " + out.substring(0, Math.min(500, out.length())));
        }
        return Long.parseLong(m.group(2));
    }

    /**
     * CPU time the process has used (user + system, all threads: JIT, GC, H2 and the main thread),
     * from {@code /proc/PID/stat} in clock ticks of 1/100 s. A daemon waiting for a core on a shared
     * machine loses wall time, not CPU time, so this moves less with the neighbours' load.
     */
    static double cpuSeconds(long pid) throws Exception {
        String stat = Files.readString(Path.of("/proc", Long.toString(pid), "stat"));
        String[] f = stat.substring(stat.lastIndexOf(')') + 2).split(" ");
        return (Long.parseLong(f[11]) + Long.parseLong(f[12])) / 100.0;
    }

    static String load() throws Exception {
        String[] f = Files.readString(Path.of("/proc/loadavg")).split(" ");
        return f[0] + "/" + f[1] + "/" + f[2];
    }
}
