package org.slopewatch.bench;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Clock;
import java.time.DayOfWeek;
import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.ingest.IngestRules;
import org.slopewatch.ingest.QuoteDecoder;
import org.slopewatch.pipeline.QuoteBatch;

/**
 * Sustained ingest over HTTP batches with the journal on, against a running daemon, next to a
 * baseline measured in the same run: decoding the same request bodies and doing nothing else.
 * Not a test (surefire excludes bench/); {@code bench/ingest.sh} starts the daemon and runs it.
 *
 * <p>Arguments: base URL, requests, snapshot messages per request, concurrent clients.
 * Each message is a snapshot of 11 tenors, so quotes = requests × messages × 11.
 */
public final class IngestBench {

    private static final String[] TENORS = {"1M", "3M", "6M", "1Y", "2Y", "3Y", "5Y", "7Y", "10Y", "20Y", "30Y"};

    public static void main(String[] args) throws Exception {
        String base = args.length > 0 ? args[0] : "http://localhost:8080";
        int requests = args.length > 1 ? Integer.parseInt(args[1]) : 200;
        int perRequest = args.length > 2 ? Integer.parseInt(args[2]) : 500;
        int clients = args.length > 3 ? Integer.parseInt(args[3]) : 2;
        List<String> bodies = bodies(requests, perRequest);
        long quotes = (long) requests * perRequest * TENORS.length;

        // baseline: the same bodies decoded in this JVM, nothing else (best of 3 after a warm-up)
        QuoteDecoder decoder = new QuoteDecoder(new IngestRules(Set.of("GOVT-A", "GOVT-B"), YieldBounds.DEFAULT, 36_500, Clock.systemUTC()));
        double decodeRate = 0;
        for (int round = 0; round < 4; round++) {
            long t0 = System.nanoTime();
            long accepted = 0;
            for (String b : bodies) {
                QuoteBatch batch = decoder.decode("http", b);
                accepted += batch.messages().size();
            }
            double seconds = (System.nanoTime() - t0) / 1e9;
            if (accepted != (long) requests * perRequest) {
                throw new IllegalStateException("baseline decoded " + accepted + " messages, expected " + (long) requests * perRequest);
            }
            if (round > 0) {
                decodeRate = Math.max(decodeRate, quotes / seconds);
            }
        }

        HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
        // warm the daemon up with a separate curve history that the measured bodies do not touch
        for (String b : bodies(20, 100)) {
            post(http, base, b.replace("\"date\":\"2", "\"date\":\"1"));
        }
        long[] latencies = new long[requests];
        ExecutorService pool = Executors.newFixedThreadPool(clients);
        long t0 = System.nanoTime();
        List<Future<?>> done = new ArrayList<>();
        for (int i = 0; i < requests; i++) {
            int index = i;
            done.add(pool.submit(() -> {
                long start = System.nanoTime();
                int status = post(http, base, bodies.get(index));
                latencies[index] = System.nanoTime() - start;
                if (status != 200) {
                    throw new IllegalStateException("request " + index + " answered " + status);
                }
                return null;
            }));
        }
        for (Future<?> f : done) {
            f.get();
        }
        double seconds = (System.nanoTime() - t0) / 1e9;
        pool.shutdown();
        Arrays.sort(latencies);
        double httpRate = quotes / seconds;
        System.out.printf(Locale.ROOT, "ingest-http quotes=%d requests=%d messages_per_request=%d clients=%d seconds=%.3f quotes_per_s=%.0f "
                        + "decode_only_quotes_per_s=%.0f ratio=%.3f p50_ms=%.1f p99_ms=%.1f%n",
                quotes, requests, perRequest, clients, seconds, httpRate, decodeRate, httpRate / decodeRate,
                latencies[requests / 2] / 1e6, latencies[(int) Math.min(requests - 1, Math.ceil(requests * 0.99) - 1)] / 1e6);
    }

    private static int post(HttpClient http, String base, String body) throws Exception {
        HttpRequest request = HttpRequest.newBuilder(URI.create(base + "/api/quotes")).header("Content-Type", "application/json")
                .header("Authorization", "Bearer " + System.getenv().getOrDefault("SLOPEWATCH_BENCH_TOKEN", ""))
                .timeout(Duration.ofSeconds(120)).POST(HttpRequest.BodyPublishers.ofString(body)).build();
        return http.send(request, HttpResponse.BodyHandlers.discarding()).statusCode();
    }

    /** Consecutive business days, alternating curves, a snapshot of every tenor per message. */
    public static List<String> bodies(int requests, int perRequest) {
        return bodies(requests, perRequest, LocalDate.of(2030, 1, 1));
    }

    /** As {@link #bodies(int, int)}, from a given first date. */
    public static List<String> bodies(int requests, int perRequest, LocalDate first) {
        List<String> items = items(requests * perRequest, first);
        List<String> out = new ArrayList<>(requests);
        for (int r = 0; r < requests; r++) {
            out.add("[" + String.join(",", items.subList(r * perRequest, (r + 1) * perRequest)) + "]");
        }
        return out;
    }

    /** Snapshot messages: consecutive business days, each on GOVT-A then GOVT-B, every tenor quoted. */
    public static List<String> items(int count, LocalDate first) {
        List<String> out = new ArrayList<>(count);
        LocalDate date = first;
        double level = 400;
        java.util.Random random = new java.util.Random(42);
        for (int m = 0; m < count; m++) {
            String curve = m % 2 == 0 ? "GOVT-A" : "GOVT-B";
            if (m % 2 == 0) {
                do {
                    date = date.plusDays(1);
                } while (date.getDayOfWeek() == DayOfWeek.SATURDAY || date.getDayOfWeek() == DayOfWeek.SUNDAY);
                level += random.nextGaussian() * 3;
            }
            StringBuilder b = new StringBuilder(220);
            b.append("{\"curve\":\"").append(curve).append("\",\"date\":\"").append(date).append("\",\"unit\":\"bp\",\"yields\":{");
            for (int t = 0; t < TENORS.length; t++) {
                double slope = (curve.equals("GOVT-A") ? -40 : 60) * Math.log1p(t) / Math.log(12);
                b.append(t == 0 ? "" : ",").append('"').append(TENORS[t]).append("\":")
                        .append(String.format(Locale.ROOT, "%.1f", level + slope + random.nextGaussian()));
            }
            out.add(b.append("}}").toString());
        }
        return out;
    }
}
