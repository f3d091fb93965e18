package org.slopewatch.bench;

import java.io.IOException;
import java.io.PrintWriter;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.slopewatch.monitor.InversionMonitor;
import org.slopewatch.monitor.MonitorState;
import org.slopewatch.monitor.Observation;

/**
 * The work of {@link MonitorBench} measured in the benchmark thread's CPU time instead of wall time:
 * observations per CPU-second of that thread. On a shared machine a thread waiting for a core
 * loses wall time but not CPU time, so this figure moves less with the neighbours' load (shared
 * caches and the JIT's own start still move it). It gives context to the JMH figure, which is the
 * one the target is judged by.
 *
 * <p>Same series, rules and baseline as {@link MonitorBench}; warm-up passes, then measured
 * passes, monitor and baseline alternating. Usage: {@code MonitorCpuTime RESULTS [WARMUP [PASSES]]}.
 */
public final class MonitorCpuTime {

    private MonitorCpuTime() {
    }

    public static void main(String[] args) throws IOException {
        Path results = Path.of(args[0]);
        int warmups = args.length > 1 ? Integer.parseInt(args[1]) : 30;
        int passes = args.length > 2 ? Integer.parseInt(args[2]) : 20;
        ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        if (!threads.isCurrentThreadCpuTimeSupported()) {
            throw new IllegalStateException("this JVM cannot measure a thread's CPU time");
        }
        Observation[] series = MonitorBench.series();
        InversionMonitor monitor = new InversionMonitor(MonitorBench.RULES);
        double[] averages = new double[series.length / 60 + 2];
        double[] monitorRates = new double[passes];
        double[] baselineRates = new double[passes];
        long sink = 0;
        for (int pass = -warmups; pass < passes; pass++) {
            long start = threads.getCurrentThreadCpuTime();
            MonitorState state = monitor.newState(MonitorBench.SPREAD);
            for (Observation o : series) {
                sink += monitor.observe(state, o).size();
            }
            long monitorNanos = threads.getCurrentThreadCpuTime() - start;
            start = threads.getCurrentThreadCpuTime();
            sink += MonitorBench.plainQuarterAverages(series, averages);
            long baselineNanos = threads.getCurrentThreadCpuTime() - start;
            if (pass >= 0) {
                monitorRates[pass] = series.length / (monitorNanos / 1e9);
                baselineRates[pass] = series.length / (baselineNanos / 1e9);
            }
        }
        List<String> lines = new ArrayList<>();
        lines.add("cpu.warmups=" + warmups);
        lines.add("cpu.passes=" + passes);
        describe(lines, "cpu.observe", monitorRates);
        describe(lines, "cpu.quarterAveragesPlainLoop", baselineRates);
        lines.add("cpu.sink=" + sink); // keeps the work observable
        Files.createDirectories(results.toAbsolutePath().getParent());
        try (PrintWriter w = new PrintWriter(Files.newBufferedWriter(results, StandardCharsets.UTF_8))) {
            lines.forEach(w::println);
        }
        lines.forEach(System.out::println);
    }

    private static void describe(List<String> lines, String key, double[] rates) {
        lines.add(key + ".median=" + String.format(Locale.ROOT, "%.0f", ReplayBench.median(rates)));
        lines.add(key + ".min=" + String.format(Locale.ROOT, "%.0f", Arrays.stream(rates).min().orElseThrow()));
        lines.add(key + ".max=" + String.format(Locale.ROOT, "%.0f", Arrays.stream(rates).max().orElseThrow()));
    }
}
