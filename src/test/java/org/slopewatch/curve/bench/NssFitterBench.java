package org.slopewatch.curve.bench;

import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.NelsonSiegelSvensson;
import org.slopewatch.curve.NssFit;
import org.slopewatch.curve.NssFitter;
import org.slopewatch.curve.Tenor;

/**
 * Time per fit of an 11-point snapshot, the cost the near-term forward spread adds to every
 * snapshot. Not a test (surefire excludes bench/); run the main method from the test classpath.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class NssFitterBench {

    private static final String[] TENORS = {"1M", "3M", "6M", "1Y", "2Y", "3Y", "5Y", "7Y", "10Y", "20Y", "30Y"};

    private CurveSnapshot exact;
    private CurveSnapshot noisy;

    @org.openjdk.jmh.annotations.Setup
    public void setUp() {
        NelsonSiegelSvensson truth = new NelsonSiegelSvensson(450, -150, 200, -100, 1.5, 8);
        Map<Tenor, Double> clean = new LinkedHashMap<>();
        Map<Tenor, Double> bumped = new LinkedHashMap<>();
        for (int i = 0; i < TENORS.length; i++) {
            Tenor tenor = Tenor.parse(TENORS[i]);
            double y = truth.zeroRate(tenor.years());
            clean.put(tenor, y);
            bumped.put(tenor, y + 3.0 * Math.sin(7.0 * i)); // fixed, irregular: a fit that cannot be exact
        }
        exact = CurveSnapshot.of("BENCH", LocalDate.of(2024, 1, 2), clean);
        noisy = CurveSnapshot.of("BENCH", LocalDate.of(2024, 1, 2), bumped);
    }

    @Benchmark
    public NssFit exactPoints() {
        return NssFitter.fitDetailed(exact).orElseThrow();
    }

    @Benchmark
    public NssFit noisyPoints() {
        return NssFitter.fitDetailed(noisy).orElseThrow();
    }

    public static void main(String[] args) throws RunnerException {
        new Runner(new OptionsBuilder().include(NssFitterBench.class.getSimpleName()).build()).run();
    }
}
