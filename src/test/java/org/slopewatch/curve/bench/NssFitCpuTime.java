package org.slopewatch.curve.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import java.util.Locale;
import org.slopewatch.curve.BaselineNssFitter;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.NssFitter;

/**
 * The random-curve work of {@link NssFitterBench} measured in the benchmark thread's CPU time
 * instead of wall time: microseconds of CPU per fit, for the fit and for the baseline fit, in
 * alternating passes over the same 1,000 curves, so that a busy neighbour slows both. On a shared
 * machine a thread waiting for a core loses wall time but not CPU time, so the ratio moves less
 * with the load than JMH's. Also checks, before timing, that both fits agree on every curve.
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
        for (CurveSnapshot curve : curves) {
            if (!NssFitter.fitDetailed(curve).equals(BaselineNssFitter.fitDetailed(curve))) {
                throw new IllegalStateException("the fits differ on " + curve);
            }
        }
        double[] fit = new double[passes];
        double[] baseline = new double[passes];
        double sink = 0;
        for (int pass = -warmups; pass < passes; pass++) {
            // alternate which goes first, so that neither always follows the other's garbage
            boolean fitFirst = (pass & 1) == 0;
            long a = 0;
            long b = 0;
            for (int half = 0; half < 2; half++) {
                long start = threads.getCurrentThreadCpuTime();
                if ((half == 0) == fitFirst) {
                    for (CurveSnapshot curve : curves) {
                        sink += NssFitter.fitDetailed(curve).orElseThrow().rmseBp();
                    }
                    a = threads.getCurrentThreadCpuTime() - start;
                } else {
                    for (CurveSnapshot curve : curves) {
                        sink += BaselineNssFitter.fitDetailed(curve).orElseThrow().rmseBp();
                    }
                    b = threads.getCurrentThreadCpuTime() - start;
                }
            }
            if (pass >= 0) {
                fit[pass] = a / 1e3 / curves.length;
                baseline[pass] = b / 1e3 / curves.length;
                System.out.printf(Locale.ROOT, "pass %d: fit %.2f µs, baseline %.2f µs, ratio %.3f%n", pass, fit[pass],
                        baseline[pass], fit[pass] / baseline[pass]);
            }
        }
        double f = median(fit);
        double b = median(baseline);
        System.out.printf(Locale.ROOT, "median CPU µs per fit: fit %.2f (min %.2f, max %.2f), baseline %.2f (min %.2f, max %.2f);"
                        + " fit ÷ baseline %.3f, speed-up %.2f (checksum %.6f)%n",
                f, min(fit), max(fit), b, min(baseline), max(baseline), f / b, b / f, sink);
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
