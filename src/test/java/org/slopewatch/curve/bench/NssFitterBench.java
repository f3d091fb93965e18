package org.slopewatch.curve.bench;

import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.slopewatch.curve.BaselineNssFitter;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.NelsonSiegelSvensson;
import org.slopewatch.curve.NssFit;
import org.slopewatch.curve.NssFitter;
import org.slopewatch.curve.Tenor;

/**
 * Time per fit of an 11-point snapshot, the cost the near-term forward spread adds to every
 * snapshot, for the fit as it is ({@link NssFitter}) and as it was before its decay grid was kept
 * per set of maturities ({@link BaselineNssFitter}, the baseline measured in the same run).
 * Not a test (surefire excludes bench/); run with JMH from the test classpath.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(2)
public class NssFitterBench {

    private static final String[] TENORS = {"1M", "3M", "6M", "1Y", "2Y", "3Y", "5Y", "7Y", "10Y", "20Y", "30Y"};
    static final int CURVES = 1_000;

    private CurveSnapshot exact;
    private CurveSnapshot noisy;
    private CurveSnapshot[] random;

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
        // seeded random curves over the ranges of NssFitterAgainstBaselineTest, 2 bp noise
        Random rnd = new Random(20_261_205L);
        random = new CurveSnapshot[CURVES];
        for (int k = 0; k < CURVES; k++) {
            NelsonSiegelSvensson c = new NelsonSiegelSvensson(100 + 800 * rnd.nextDouble(), -400 + 700 * rnd.nextDouble(),
                    -500 + 1000 * rnd.nextDouble(), -500 + 1000 * rnd.nextDouble(), 0.2 + 4.8 * rnd.nextDouble(),
                    2 + 23 * rnd.nextDouble());
            Map<Tenor, Double> yields = new LinkedHashMap<>();
            for (String text : TENORS) {
                Tenor tenor = Tenor.parse(text);
                yields.put(tenor, c.zeroRate(tenor.years()) + 2.0 * rnd.nextGaussian());
            }
            random[k] = CurveSnapshot.of("BENCH", LocalDate.of(2024, 1, 2), yields);
        }
    }

    /** The seeded random curves of {@link #randomCurves}, for {@link NssFitCpuTime}. */
    CurveSnapshot[] randomSnapshots() {
        return random;
    }

    @Benchmark
    public NssFit exactPoints() {
        return NssFitter.fitDetailed(exact).orElseThrow();
    }

    @Benchmark
    public NssFit exactPointsBaseline() {
        return BaselineNssFitter.fitDetailed(exact).orElseThrow();
    }

    @Benchmark
    public NssFit noisyPoints() {
        return NssFitter.fitDetailed(noisy).orElseThrow();
    }

    @Benchmark
    public NssFit noisyPointsBaseline() {
        return BaselineNssFitter.fitDetailed(noisy).orElseThrow();
    }

    @Benchmark
    @OperationsPerInvocation(CURVES)
    public double randomCurves() {
        double sum = 0;
        for (CurveSnapshot snapshot : random) {
            sum += NssFitter.fitDetailed(snapshot).orElseThrow().rmseBp();
        }
        return sum;
    }

    @Benchmark
    @OperationsPerInvocation(CURVES)
    public double randomCurvesBaseline() {
        double sum = 0;
        for (CurveSnapshot snapshot : random) {
            sum += BaselineNssFitter.fitDetailed(snapshot).orElseThrow().rmseBp();
        }
        return sum;
    }

    public static void main(String[] args) throws RunnerException {
        new Runner(new OptionsBuilder().include(NssFitterBench.class.getSimpleName()).build()).run();
    }
}
