package org.slopewatch.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.Semaphore;
import java.util.concurrent.TimeUnit;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.slopewatch.testsupport.DaemonProcess;

/**
 * Soak: the packaged daemon ({@code serve}, embedded transport, the shipped default policy, H2
 * journal on disk) takes quotes at a steady rate over HTTP for a while; the heap after a full
 * collection must stay flat and no backlog may build. Quotes are tenors: each message is a
 * snapshot of 11 tenors, sent 50 to a request, so 5,000 quotes/s is one request every 110 ms.
 * Forty curves are quoted as a live feed does ({@link SoakFeed}): each re-quotes its current
 * market date about 11 times a second (57 snapshots per date), and the date moves on every 5 s, a
 * compressed market clock that ends on today. New dates are few on purpose: the daemon keeps each
 * curve's history (about 0.8 KB per curve and date), which is growth by design, not a leak.
 *
 * <p>Requests go out on schedule whether or not earlier ones are answered (at most 64 in flight),
 * as a feed does not wait. Every 5 s a sampler runs {@code jcmd PID GC.run} (a full collection) and
 * reads the heap in use from {@code /q/metrics}. A leak of only 100 bytes per quote would grow the
 * heap by 30 MB a minute at this rate, so the bound on the heap's least-squares slope over the second
 * half (after start-up and the JIT) is {@code slopewatch.faults.soak-heap-mb-per-min}, 20 by default.
 * A backlog shows as the age of an answer (from the moment its request was due) growing with time:
 * a daemon that keeps only 95 % of the pace adds 3 s per minute. The age's slope over the second
 * half must stay under 3 s per minute, everything must be answered within 30 s of the last send,
 * and every message must be accepted.
 *
 * <p>The short form (CI) runs 40 s ({@code -Dslopewatch.faults.soak-seconds}); {@code
 * bench/faults/soak.sh} runs the long form, 600 s. The figures go to {@code target/faults/soak.txt}.
 * {@code -Dslopewatch.faults.soak-near-zero=true} puts every third curve near inversion, so that
 * revisions of the current date also start and end spells.
 */
class SoakIT {

    private static final int SECONDS = Integer.getInteger("slopewatch.faults.soak-seconds", 40);
    private static final int QUOTES_PER_SECOND = Integer.getInteger("slopewatch.faults.soak-rate", 5_000);
    private static final double HEAP_SLOPE_BOUND_MB_PER_MIN = Double.parseDouble(
            System.getProperty("slopewatch.faults.soak-heap-mb-per-min", "20"));
    private static final int SNAPSHOTS_PER_REQUEST = 50;
    private static final int QUOTES_PER_DAY = Integer.getInteger("slopewatch.faults.soak-quotes-per-day", 57);
    private static final boolean NEAR_ZERO = Boolean.getBoolean("slopewatch.faults.soak-near-zero");
    private static final int IN_FLIGHT = 64;
    private static final long SAMPLE_EVERY_MS = 5_000;
    private static final List<String> CURVES = IntStream.rangeClosed(1, Integer.getInteger("slopewatch.faults.soak-curves", 40))
            .mapToObj(i -> String.format(Locale.ROOT, "GOVT-%02d", i)).toList();

    /** One heap reading after a full collection. */
    record HeapSample(double seconds, double usedMb) {
    }

    /** One request: when it was due, how late it went, and the age of its answer counted from when it was due. */
    record Sent(double dueSeconds, double lagSeconds, double ageMs) {
    }

    @Test
    void aSteadyFeedLeavesTheHeapFlatAndBuildsNoBacklog() throws Exception {
        String token = "soak-" + UUID.randomUUID();
        Path data = Path.of("target", "test-data", "soak-" + UUID.randomUUID().toString().substring(0, 8)).toAbsolutePath();
        Files.createDirectories(data);
        long tickNanos = Math.round(SNAPSHOTS_PER_REQUEST * SoakFeed.TENORS.length * 1e9 / QUOTES_PER_SECOND);
        long requests = (TimeUnit.SECONDS.toNanos(SECONDS) + tickNanos - 1) / tickNanos;
        SoakFeed feed = new SoakFeed(CURVES, LocalDate.now(ZoneOffset.UTC), requests * SNAPSHOTS_PER_REQUEST, QUOTES_PER_DAY, NEAR_ZERO, 7);
        System.out.printf(Locale.ROOT, "soak: %d s at %,d quotes/s (a request of %d snapshots every %.1f ms), %d curves from %s, "
                        + "each date quoted %d time(s)%n", SECONDS, QUOTES_PER_SECOND, SNAPSHOTS_PER_REQUEST, tickNanos / 1e6, CURVES.size(),
                feed.firstDay(), QUOTES_PER_DAY);

        try (DaemonProcess daemon = DaemonProcess.start("soak", List.of("-Xmx512m"), List.of("serve"), Map.of(
                "slopewatch.security.write-tokens", token,
                "slopewatch.home", Path.of("").toAbsolutePath().toString(),
                "slopewatch.data-dir", data.toString(),
                "slopewatch.ingest.curves", String.join(",", CURVES),
                "quarkus.log.category.\"org.slopewatch.transitions\".level", "WARN",
                "quarkus.log.category.\"org.slopewatch.alerting\".level", "WARN"), Map.of())) {
            daemon.awaitReady(Duration.ofSeconds(120));
            HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
            URI quotes = URI.create("http://127.0.0.1:" + daemon.port() + "/api/quotes");
            List<HeapSample> heap = new CopyOnWriteArrayList<>();
            List<Sent> sent = new CopyOnWriteArrayList<>();
            List<String> failures = new CopyOnWriteArrayList<>();
            Semaphore inFlight = new Semaphore(IN_FLIGHT);
            long start = System.nanoTime();
            ScheduledExecutorService sampler = Executors.newSingleThreadScheduledExecutor();
            sampler.scheduleWithFixedDelay(() -> heap.add(heapAfterGc(daemon, start)), 0, SAMPLE_EVERY_MS, TimeUnit.MILLISECONDS);
            long end = start + TimeUnit.SECONDS.toNanos(SECONDS);
            long messages = 0;
            try {
                for (long due = start; due < end; due += tickNanos) {
                    long wait = due - System.nanoTime();
                    if (wait > 0) {
                        TimeUnit.NANOSECONDS.sleep(wait);
                    }
                    String body = feed.batch(SNAPSHOTS_PER_REQUEST);
                    inFlight.acquire();
                    long dueAt = due;
                    long t0 = System.nanoTime();
                    messages += SNAPSHOTS_PER_REQUEST;
                    http.sendAsync(HttpRequest.newBuilder(quotes).timeout(Duration.ofSeconds(60))
                            .header("Content-Type", "application/json").header("Authorization", "Bearer " + token)
                            .POST(HttpRequest.BodyPublishers.ofString(body)).build(), HttpResponse.BodyHandlers.ofString())
                            .whenComplete((answer, error) -> {
                                long t1 = System.nanoTime();
                                inFlight.release();
                                if (error != null || answer.statusCode() != 200) {
                                    failures.add(error != null ? error.toString() : answer.statusCode() + " " + answer.body());
                                }
                                sent.add(new Sent((dueAt - start) / 1e9, (t0 - dueAt) / 1e9, (t1 - dueAt) / 1e6));
                            });
                }
                boolean drained = inFlight.tryAcquire(IN_FLIGHT, 30, TimeUnit.SECONDS);
                assertThat(drained).as("every request answered within 30 s of the last send").isTrue();
            } finally {
                sampler.shutdown();
                sampler.awaitTermination(30, TimeUnit.SECONDS);
            }
            assertThat(failures).as("requests not answered with 200").isEmpty();
            heap.add(heapAfterGc(daemon, start));
            double accepted = daemon.counter("slopewatch_quotes_accepted_total");
            Figures figures = Figures.of(SECONDS, QUOTES_PER_SECOND, messages, accepted, heap, sent, (System.nanoTime() - start) / 1e9);
            Path report = Path.of("target", "faults", "soak.txt");
            Files.createDirectories(report.getParent());
            Files.writeString(report, figures.text());
            System.out.print(figures.text());

            assertThat(accepted).as("every snapshot sent is accepted (slopewatch_quotes_accepted_total counts messages)")
                    .isEqualTo((double) messages);
            assertThat(figures.ageSlopeSecondsPerMinute()).as("growth of the answers' age over the second half, s per minute: "
                    + "a daemon that cannot keep up answers later and later").isLessThan(3.0);
            assertThat(figures.secondHalfSamples()).as("heap samples in the second half").isGreaterThanOrEqualTo(3);
            assertThat(figures.heapSlopeMbPerMinute()).as("heap after a full collection over the second half, MB per minute "
                    + "(a leak of 100 bytes per quote would be 30 MB per minute at 5,000 quotes/s)").isLessThan(HEAP_SLOPE_BOUND_MB_PER_MIN);
        } finally {
            deleteTree(data);
        }
    }

    private static HeapSample heapAfterGc(DaemonProcess daemon, long start) {
        try {
            Process jcmd = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "jcmd").toString(),
                    Long.toString(daemon.pid()), "GC.run").redirectErrorStream(true).start();
            jcmd.getInputStream().readAllBytes();
            if (!jcmd.waitFor(60, TimeUnit.SECONDS) || jcmd.exitValue() != 0) {
                throw new IllegalStateException("jcmd GC.run failed on " + daemon.pid());
            }
            double used = daemon.metric("jvm_memory_used_bytes", "area=\"heap\"");
            return new HeapSample((System.nanoTime() - start) / 1e9, used / (1024 * 1024));
        } catch (IOException e) {
            throw new IllegalStateException("cannot run jcmd", e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }

    /** What a run measured, and the text written to {@code target/faults/soak.txt}. */
    record Figures(int seconds, int rate, long messages, double accepted, List<HeapSample> heap, List<Sent> sent, double elapsed) {

        static Figures of(int seconds, int rate, long messages, double accepted, List<HeapSample> heap, List<Sent> sent, double elapsed) {
            return new Figures(seconds, rate, messages, accepted, List.copyOf(heap), List.copyOf(sent), elapsed);
        }

        List<HeapSample> secondHalf() {
            return heap.stream().filter(h -> h.seconds() >= seconds / 2.0).toList();
        }

        int secondHalfSamples() {
            return secondHalf().size();
        }

        /** Least-squares slope of heap after GC against time over the second half, MB per minute. */
        double heapSlopeMbPerMinute() {
            List<HeapSample> h = secondHalf();
            return slopePerMinute(h.stream().mapToDouble(HeapSample::seconds).toArray(), h.stream().mapToDouble(HeapSample::usedMb).toArray());
        }

        /** Least-squares slope of the answers' age against their due time over the second half, seconds per minute. */
        double ageSlopeSecondsPerMinute() {
            List<Sent> h = sent.stream().filter(s -> s.dueSeconds() >= seconds / 2.0).toList();
            return slopePerMinute(h.stream().mapToDouble(Sent::dueSeconds).toArray(), h.stream().mapToDouble(s -> s.ageMs() / 1000).toArray());
        }

        private static double slopePerMinute(double[] t, double[] y) {
            double mt = Arrays.stream(t).average().orElse(0);
            double my = Arrays.stream(y).average().orElse(0);
            double num = 0;
            double den = 0;
            for (int i = 0; i < t.length; i++) {
                num += (t[i] - mt) * (y[i] - my);
                den += (t[i] - mt) * (t[i] - mt);
            }
            return den == 0 ? Double.NaN : 60 * num / den;
        }

        double maxLagSecondHalf() {
            return sent.stream().filter(s -> s.dueSeconds() >= seconds / 2.0).mapToDouble(Sent::lagSeconds).max().orElse(0);
        }

        private double[] latencies(boolean secondHalf) {
            double[] l = sent.stream().filter(s -> (s.dueSeconds() >= seconds / 2.0) == secondHalf).mapToDouble(Sent::ageMs).toArray();
            Arrays.sort(l);
            return l;
        }

        private static double rank(double[] sorted, double p) {
            return sorted.length == 0 ? Double.NaN : sorted[Math.max(0, (int) Math.ceil(p * sorted.length) - 1)];
        }

        String text() {
            double[] first = latencies(false);
            double[] second = latencies(true);
            StringBuilder b = new StringBuilder();
            b.append(String.format(Locale.ROOT, "seconds=%d%nquotes_per_s_target=%d%nmessages_sent=%d%nquotes_sent=%d%nmessages_accepted=%.0f%n",
                    seconds, rate, messages, messages * SoakFeed.TENORS.length, accepted));
            b.append(String.format(Locale.ROOT, "quotes_per_s_achieved=%.0f%n", messages * SoakFeed.TENORS.length / elapsed));
            b.append(String.format(Locale.ROOT, "lag_max_s_second_half=%.3f%nlag_max_s=%.3f%n", maxLagSecondHalf(),
                    sent.stream().mapToDouble(Sent::lagSeconds).max().orElse(0)));
            b.append(String.format(Locale.ROOT, "answer_age_slope_s_per_min_second_half=%.3f (bound 3)%n", ageSlopeSecondsPerMinute()));
            b.append(String.format(Locale.ROOT, "answer_age_ms_first_half_p50=%.1f p99=%.1f max=%.1f%n", rank(first, 0.5), rank(first, 0.99),
                    rank(first, 1)));
            b.append(String.format(Locale.ROOT, "answer_age_ms_second_half_p50=%.1f p99=%.1f max=%.1f%n", rank(second, 0.5), rank(second, 0.99),
                    rank(second, 1)));
            b.append(String.format(Locale.ROOT, "heap_after_gc_mb_first=%.1f min=%.1f max=%.1f last=%.1f%n", heap.get(0).usedMb(),
                    heap.stream().mapToDouble(HeapSample::usedMb).min().orElse(0), heap.stream().mapToDouble(HeapSample::usedMb).max().orElse(0),
                    heap.get(heap.size() - 1).usedMb()));
            b.append(String.format(Locale.ROOT, "heap_slope_mb_per_min_second_half=%.2f (bound %.0f, %d samples)%n", heapSlopeMbPerMinute(),
                    HEAP_SLOPE_BOUND_MB_PER_MIN, secondHalfSamples()));
            b.append("heap_samples_s_mb=");
            heap.forEach(h -> b.append(String.format(Locale.ROOT, "%.0f:%.1f ", h.seconds(), h.usedMb())));
            b.append(System.lineSeparator());
            b.append("load_average=").append(loadAverage()).append(System.lineSeparator());
            return b.toString();
        }
    }

    private static String loadAverage() {
        try {
            return String.join(" ", Arrays.copyOf(Files.readString(Path.of("/proc/loadavg")).split(" "), 3));
        } catch (IOException e) {
            return "unknown";
        }
    }

    private static void deleteTree(Path root) throws IOException {
        if (!Files.exists(root)) {
            return;
        }
        try (var paths = Files.walk(root)) {
            paths.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }
}
