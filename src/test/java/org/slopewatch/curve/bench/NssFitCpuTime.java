package org.slopewatch.curve.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import java.util.Locale;
import org.slopewatch.curve.BaselineNssFitter;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.NssFit;
import org.slopewatch.curve.NssFitter;

/**
 * The random-curve work of {@link NssFitterBench} measured in the benchmark thread's CPU time
 * instead of wall time: microseconds of CPU per fit, for the fit, for the previous fit (the kept
 * grid with the baseline's descent, {@link BaselineNssFitter#fitDetailedWithKeptGrid}) and for the
 * baseline fit, in rotating passes over the same 1,000 curves, so that a busy neighbour slows all. On a shared
 * machine a thread waiting for a core loses wall time but not CPU time, so the ratio moves less
 * with the load than JMH's. Also checks, before timing, that the fit is no worse than the baseline on
 * any curve (sum of squares within 1e-5 relative, the slack NssFitterAgainstBaselineTest allows its
 * flattest fits), and counts the curves where it is lower.
 *
 * <p>Usage: {@code NssFitCpuTime [WARMUP [PASSES]]}; prints one line per measured pass and the medians.
 */
public final class NssFitCpuTime {

    private NssFitCpuTime() {
    }

    public static void main(String[] args) {
        int warmups = args.length > 0 ? Integer.parseInt(args[0]) : 20;
        int passes = args.length > 1 ? Integer.parseInt(args[1]) : 20;
        ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        NssFitterBench bench = new NssFitterBench();
        bench.setUp();
        CurveSnapshot[] curves = bench.randomSnapshots();
        int lower = 0;
        for (CurveSnapshot curve : curves) {
            NssFit now = NssFitter.fitDetailed(curve).orElseThrow();
            NssFit before = BaselineNssFitter.fitDetailed(curve).orElseThrow();
            if (now.rmseBp() > before.rmseBp() * (1 + 5e-6) + 1e-6) { // RMSE: half the sum of squares' slack
                throw new IllegalStateException("the fit is worse than the baseline on " + curve);
            }
            lower += now.rmseBp() < before.rmseBp() * (1 - 5e-7) ? 1 : 0;
        }
        System.out.printf(Locale.ROOT, "%d curves: the fit no worse than the baseline on any, lower on %d%n", curves.length, lower);
        double[][] times = new double[3][passes];
        double sink = 0;
        for (int pass = -warmups; pass < passes; pass++) {
            // rotate which goes first, so that none always follows another's garbage
            for (int turn = 0; turn < 3; turn++) {
                int which = Math.floorMod(pass + turn, 3);
                long start = threads.getCurrentThreadCpuTime();
                for (CurveSnapshot curve : curves) {
                    sink += (which == 0 ? NssFitter.fitDetailed(curve) : which == 1 ? BaselineNssFitter.fitDetailedWithKeptGrid(curve)
                            : BaselineNssFitter.fitDetailed(curve)).orElseThrow().rmseBp();
                }
                if (pass >= 0) {
                    times[which][pass] = (threads.getCurrentThreadCpuTime() - start) / 1e3 / curves.length;
                }
            }
            if (pass >= 0) {
                System.out.printf(Locale.ROOT, "pass %d: fit %.2f µs, previous %.2f µs, baseline %.2f µs%n", pass, times[0][pass],
                        times[1][pass], times[2][pass]);
            }
        }
        double f = median(times[0]);
        double p = median(times[1]);
        double b = median(times[2]);
        System.out.printf(Locale.ROOT, "median CPU µs per fit: fit %.2f (min %.2f, max %.2f), previous (kept grid, old descent) %.2f"
                        + " (min %.2f, max %.2f), baseline %.2f (min %.2f, max %.2f)%n",
                f, min(times[0]), max(times[0]), p, min(times[1]), max(times[1]), b, min(times[2]), max(times[2]));
        System.out.printf(Locale.ROOT, "fit ÷ previous %.3f (speed-up %.2f), fit ÷ baseline %.3f (speed-up %.2f) (checksum %.6f)%n",
                f / p, p / f, f / b, b / f, sink);
    }

    private static double median(double[] values) {
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        int n = sorted.length;
        return n % 2 == 1 ? sorted[n / 2] : (sorted[n / 2 - 1] + sorted[n / 2]) / 2;
    }

    private static double min(double[] values) {
        return Arrays.stream(values).min().orElse(Double.NaN);
    }

    private static double max(double[] values) {
        return Arrays.stream(values).max().orElse(Double.NaN);
    }
}
