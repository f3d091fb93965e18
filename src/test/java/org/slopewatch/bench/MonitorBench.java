package org.slopewatch.bench;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.profile.GCProfiler;
import org.openjdk.jmh.results.Result;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.CommandLineOptionException;
import org.openjdk.jmh.runner.options.CommandLineOptions;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.slopewatch.curve.Resolution;
import org.slopewatch.monitor.DaysInverted;
import org.slopewatch.monitor.InversionMonitor;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.MonitorEvent;
import org.slopewatch.monitor.MonitorState;
import org.slopewatch.monitor.Observation;
import org.slopewatch.monitor.QuarterAverage;
import org.slopewatch.monitor.QuarterSummary;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.monitor.Transition;
import org.slopewatch.spread.SpreadKey;

/**
 * Observations per second of {@link InversionMonitor#observe}, one thread, over a long daily
 * series fed in date order into a fresh state per invocation, with the rules of the first entry of
 * {@code alert-rules/default.yaml} (enter below 0 bp, exit at or above 5 bp after 5 observations,
 * hold 365 days, confirm by quarter average below 0 bp or 90 days inverted).
 *
 * <p>The baseline is a plain loop over the same observations computing the same quarter averages
 * (sum and count per calendar quarter, no state machine): what any monitor must at least do.
 * The set-up checks that both produce exactly the same averages, so the two measure the same work.
 *
 * <p>Five warm-up iterations rather than the usual three: on a busy two-core machine the C2 compile
 * of {@code observe} (with the rarely taken formatting of reasons) can take seconds, and an
 * iteration measured before it finishes reports the interpreter, not the monitor.
 *
 * <p>Two forks, because the JIT does not compile the loop the same way every time (in some JVMs it
 * inlines {@code observe} into the loop, in others not), and a figure should not rest on one draw.
 * Each fork runs on a fixed, pre-touched heap ({@code -Xms2g -Xmx2g -XX:+AlwaysPreTouch}), for both
 * benchmarks alike. With the default growing heap each new young-generation region is memory the
 * kernel hands out and zeroes on first touch; on this machine those page faults took about a third of
 * the monitor's time (the monitor allocates its events, the plain loop allocates nothing), which
 * measured the heap's growth in a two-second iteration rather than the monitor.
 *
 * <p>Not a test (surefire excludes bench/). {@code bench/run.sh} runs the main method, which
 * writes the figures to the file named by its first argument; further arguments go to JMH.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 5, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 2, jvmArgsAppend = {"-Xms2g", "-Xmx2g", "-XX:+AlwaysPreTouch"})
public class MonitorBench {

    /** Business days in the series: from 1962 to the 97th century, which no date arithmetic minds. */
    static final int OBSERVATIONS = 2_000_000;
    static final LocalDate FIRST_DAY = LocalDate.of(1962, 1, 2);
    static final long SEED = 19620102L;

    static final SpreadKey SPREAD = new SpreadKey("BENCH", "10Y-3M");

    /** The first entry of alert-rules/default.yaml. */
    static final MonitorDefinition RULES = new MonitorDefinition(0, 5, 5, 365,
            List.of(new QuarterAverage(0), new DaysInverted(90)));

    private final InversionMonitor monitor = new InversionMonitor(RULES);
    private Observation[] series;
    private double[] quarterAverages;

    @Setup
    public void setUp() {
        series = series();
        quarterAverages = new double[OBSERVATIONS / 60 + 2];
        double[] expected = monitorQuarterAverages(monitor, series);
        int closed = plainQuarterAverages(series, quarterAverages);
        if (closed != expected.length || !Arrays.equals(expected, Arrays.copyOf(quarterAverages, closed))) {
            throw new IllegalStateException("the baseline's quarter averages differ from the monitor's: "
                    + closed + " vs " + expected.length + " quarters");
        }
    }

    @Benchmark
    @OperationsPerInvocation(OBSERVATIONS)
    public long observe() {
        MonitorState state = monitor.newState(SPREAD);
        long events = 0;
        for (Observation o : series) {
            events += monitor.observe(state, o).size();
        }
        return events + state.spellCount();
    }

    @Benchmark
    @OperationsPerInvocation(OBSERVATIONS)
    public int quarterAveragesPlainLoop() {
        return plainQuarterAverages(series, quarterAverages);
    }

    /**
     * Sum and count per calendar quarter; a quarter's average is written when the next one starts. Summed in
     * steps of the resolution and divided once, as the monitor does, so that both give the same exact averages.
     */
    static int plainQuarterAverages(Observation[] observations, double[] averages) {
        int quarter = Integer.MIN_VALUE;
        long sum = 0;
        int count = 0;
        int closed = 0;
        for (Observation o : observations) {
            LocalDate d = o.date();
            int q = d.getYear() * 4 + (d.getMonthValue() - 1) / 3;
            if (q != quarter) {
                if (count > 0) {
                    averages[closed++] = Resolution.BASIS_POINTS.average(sum, count);
                }
                quarter = q;
                sum = 0;
                count = 0;
            }
            sum += Resolution.BASIS_POINTS.units(o.valueBp());
            count++;
        }
        return closed;
    }

    static double[] monitorQuarterAverages(InversionMonitor monitor, Observation[] observations) {
        MonitorState state = monitor.newState(SPREAD);
        List<Double> out = new ArrayList<>();
        for (Observation o : observations) {
            for (MonitorEvent e : monitor.observe(state, o)) {
                if (e instanceof QuarterSummary q) {
                    out.add(q.averageBp());
                }
            }
        }
        return out.stream().mapToDouble(Double::doubleValue).toArray();
    }

    /** The benchmark's series: business days from 1962-01-02, values from {@link SpreadWalk}. */
    static Observation[] series() {
        SpreadWalk walk = new SpreadWalk(SEED);
        Observation[] out = new Observation[OBSERVATIONS];
        LocalDate day = FIRST_DAY;
        for (int i = 0; i < OBSERVATIONS; i++) {
            out[i] = new Observation(day, walk.next(), i + 1);
            day = SpreadWalk.nextBusinessDay(day);
        }
        return out;
    }

    /** What the series looks like to the monitor, so the report can show it is not a trivial input. */
    static List<String> describeSeries() {
        Observation[] s = series();
        InversionMonitor m = new InversionMonitor(RULES);
        MonitorState state = m.newState(SPREAD);
        long inverted = 0;
        long quarters = 0;
        long transitions = 0;
        long confirmations = 0;
        for (Observation o : s) {
            if (o.valueBp() < RULES.entryBelowBp()) {
                inverted++;
            }
            for (MonitorEvent e : m.observe(state, o)) {
                if (e instanceof QuarterSummary) {
                    quarters++;
                } else if (e instanceof Transition t) {
                    transitions++;
                    if (t.to() == SpreadState.CONFIRMED) {
                        confirmations++;
                    }
                }
            }
        }
        return List.of(
                "series.observations=" + s.length,
                "series.first=" + s[0].date(),
                "series.last=" + s[s.length - 1].date(),
                "series.inverted_share=" + String.format(Locale.ROOT, "%.4f", (double) inverted / s.length),
                "series.spells=" + state.spellCount(),
                "series.confirmations=" + confirmations,
                "series.transitions=" + transitions,
                "series.quarters=" + quarters);
    }

    public static void main(String[] args) throws RunnerException, CommandLineOptionException, IOException {
        Path out = args.length > 0 ? Path.of(args[0]) : null;
        String[] jmhArgs = args.length > 0 ? Arrays.copyOfRange(args, 1, args.length) : new String[0];
        Collection<RunResult> results = new Runner(new OptionsBuilder()
                .parent(new CommandLineOptions(jmhArgs))
                .include(MonitorBench.class.getName() + "\\.")
                .addProfiler(GCProfiler.class)
                .build()).run();
        if (out == null) {
            return;
        }
        List<String> lines = new ArrayList<>(describeSeries());
        for (RunResult r : results) {
            String name = r.getParams().getBenchmark();
            String key = name.substring(name.lastIndexOf('.') + 1);
            Result<?> primary = r.getPrimaryResult();
            lines.add(key + ".score=" + fixed(primary.getScore()));
            lines.add(key + ".error=" + fixed(primary.getScoreError()));
            lines.add(key + ".unit=" + primary.getScoreUnit());
            lines.add(key + ".min=" + fixed(primary.getStatistics().getMin()));
            lines.add(key + ".max=" + fixed(primary.getStatistics().getMax()));
            lines.add(key + ".iterations=" + primary.getStatistics().getN());
            Result<?> alloc = r.getSecondaryResults().get("gc.alloc.rate.norm");
            if (alloc != null) {
                lines.add(key + ".alloc=" + String.format(Locale.ROOT, "%.3f", alloc.getScore()));
                lines.add(key + ".alloc_unit=" + alloc.getScoreUnit());
            }
        }
        Files.createDirectories(out.toAbsolutePath().getParent());
        try (PrintWriter w = new PrintWriter(Files.newBufferedWriter(out, StandardCharsets.UTF_8))) {
            lines.forEach(w::println);
        }
    }

    private static String fixed(double v) {
        return String.format(Locale.ROOT, "%.1f", v);
    }
}
