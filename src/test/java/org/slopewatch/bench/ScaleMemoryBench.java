package org.slopewatch.bench;

import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.slopewatch.curve.CurveBook;
import org.slopewatch.monitor.SignalEngine;

/**
 * Memory per spread of the daemon's in-memory state, in one benchmark JVM: what
 * {@code QuotePipeline.recover()} rebuilds (the {@link CurveBook} and a {@link SignalEngine} with a
 * track per watched spread per curve) from the scenario's history, fed day by day, every curve
 * each day. The live heap after a full collection is measured first with no curves (the
 * baseline: the same JVM, classes loaded, engine and book empty), then after each checkpoint of
 * history; memory per spread = (live heap − baseline) ÷ spreads. The time spent feeding, between
 * the measurements, gives the rebuild rate without any journal reading.
 *
 * <p>Arguments: CURVES YEARS_CHECKPOINT... (ascending, e.g. {@code 1000 1 10 20 40}), then
 * optionally {@code --histogram FILE} to write the live-object histogram ({@code jcmd}) at the
 * last checkpoint, and {@code --memory-days N} to hold what the daemon holds with
 * {@code slopewatch.ingest.memory-days=N} (each curve let go of before N days after every message,
 * as the daemon does after each step); without it the whole history is held, as offline replay
 * holds it. Run with a heap large enough for the state (bench/scale.sh gives -Xmx).
 */
public final class ScaleMemoryBench {

    public static void main(String[] args) throws Exception {
        int curves = Integer.parseInt(args[0]);
        List<String> rest = Arrays.asList(args).subList(1, args.length);
        Path histogram = null;
        int memoryDays = Integer.MAX_VALUE;
        int days = rest.indexOf("--memory-days");
        if (days >= 0) {
            memoryDays = Integer.parseInt(rest.get(days + 1));
            rest = new java.util.ArrayList<>(rest);
            rest.remove(days + 1);
            rest.remove(days);
        }
        int flag = rest.indexOf("--histogram");
        if (flag >= 0) {
            histogram = Path.of(rest.get(flag + 1));
            rest = rest.subList(0, flag);
        }
        double[] checkpoints = rest.stream().mapToDouble(Double::parseDouble).toArray();
        double years = checkpoints[checkpoints.length - 1];
        List<LocalDate> businessDays = ScaleScenario.businessDays(years);
        ScaleScenario.CurveWalk[] walks = ScaleScenario.walks(curves);
        CurveBook book = new CurveBook();
        SignalEngine engine = new SignalEngine(ScaleScenario.watches());
        int spreads = curves * ScaleScenario.SPREADS.length;

        long baseline = liveHeap();
        System.out.printf(Locale.ROOT, "scale-memory curves=0 spreads=0 heap_live_bytes=%d (baseline)%n", baseline);
        long feedNanos = 0;
        long messages = 0;
        long sequence = 0;
        int next = 0;
        for (double checkpoint : checkpoints) {
            // the checkpoint's history is the last `checkpoint` years of the span, i.e. from this day on
            int upTo = businessDays.size() - ScaleScenario.businessDays(years - checkpoint).size();
            if (checkpoint == years) {
                upTo = businessDays.size();
            }
            long t0 = System.nanoTime();
            for (; next < upTo; next++) {
                LocalDate day = businessDays.get(next);
                for (ScaleScenario.CurveWalk walk : walks) {
                    var m = walk.next(day);
                    engine.onSnapshot(book.apply(m.curve(), m.date(), m.yieldsBp()), ++sequence);
                    if (memoryDays != Integer.MAX_VALUE) {
                        book.letGoBefore(m.curve(), memoryDays);
                        engine.letGoBefore(m.curve(), memoryDays);
                    }
                }
            }
            feedNanos += System.nanoTime() - t0;
            messages = (long) next * curves;
            long live = liveHeap();
            int held = engine.tracks().isEmpty() ? 0 : engine.tracks().get(0).size();
            System.out.printf(Locale.ROOT, "scale-memory curves=%d spreads=%d years=%s memory_days=%s business_days=%d observations_per_spread=%d "
                            + "heap_live_bytes=%d baseline_bytes=%d per_spread_bytes=%.0f per_spread_per_observation_bytes=%.1f "
                            + "tracks=%d feed_messages_per_s=%.0f%n",
                    curves, spreads, checkpoint, memoryDays == Integer.MAX_VALUE ? "all" : memoryDays, next, held, live, baseline,
                    (live - baseline) / (double) spreads,
                    (live - baseline) / (double) spreads / Math.max(1, held), engine.tracks().size(), messages / (feedNanos / 1e9));
        }
        if (histogram != null) {
            Process p = new ProcessBuilder("jcmd", Long.toString(ProcessHandle.current().pid()), "GC.class_histogram").redirectErrorStream(true)
                    .start();
            byte[] out = p.getInputStream().readAllBytes();
            p.waitFor();
            Files.write(histogram, out);
            String[] lines = new String(out, StandardCharsets.UTF_8).split("\n");
            System.out.println(String.join("\n", Arrays.asList(lines).subList(0, Math.min(16, lines.length))));
            System.out.println(lines[lines.length - 1]);
        }
        // keep the state reachable until every measurement is taken
        System.out.println("scale-memory done tracks=" + engine.tracks().size() + " curves_in_book=" + book.latest().size());
    }

    /** Used heap after full collections (System.gc() is a full, stop-the-world collection in G1 unless disabled). */
    static long liveHeap() throws InterruptedException {
        long used = Long.MAX_VALUE;
        for (int i = 0; i < 3; i++) {
            System.gc();
            Thread.sleep(100);
            used = Math.min(used, ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed());
        }
        return used;
    }
}
