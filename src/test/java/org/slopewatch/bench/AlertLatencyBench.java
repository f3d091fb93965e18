package org.slopewatch.bench;

import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.DayOfWeek;
import java.time.Duration;
import java.time.LocalDate;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.UUID;
import org.slopewatch.delivery.TestHttpReceiver;
import org.slopewatch.testsupport.DaemonProcess;

/**
 * Latency from a quote's arrival to its alert at a local chat receiver, next to a plain HTTP POST
 * of the same size to the same receiver, measured in the same run and interleaved. Not a test
 * (surefire excludes bench/); {@code bench/alert-latency.sh} builds and runs it.
 *
 * <p>It starts a {@link TestHttpReceiver} and the packaged daemon ({@code serve}, embedded
 * transport, H2 journal in a fresh directory, full JIT) with {@code bench/latency-policy.yaml},
 * under which each inverted day of GOVT-A's 10Y-3M starts a spell and makes one notice, posted in
 * the {@code alert-json} format to the receiver. Each round posts one inverted snapshot and
 * measures from just before sending it to the moment the receiver has read the notice whose
 * {@code market_date} is that day; then posts a normal snapshot (ending the spell, no notice); and
 * the baseline: the benchmark itself posts a body as long as the notices to the same receiver, from
 * just before sending to the moment the receiver has read it. The order of the two alternates by
 * round, and rounds are spaced, so that neither always follows the other.
 *
 * <p>Arguments: measured rounds (500), warm-up rounds (150), pause between rounds in ms (20),
 * result file (bench/out/alert-latency.txt, key=value lines).
 */
public final class AlertLatencyBench {

    private static final Duration WAIT = Duration.ofSeconds(30);

    public static void main(String[] args) throws Exception {
        int rounds = args.length > 0 ? Integer.parseInt(args[0]) : 500;
        int warmups = args.length > 1 ? Integer.parseInt(args[1]) : 150;
        long pauseMillis = args.length > 2 ? Long.parseLong(args[2]) : 20;
        Path out = Path.of(args.length > 3 ? args[3] : "bench/out/alert-latency.txt");
        String token = "bench-" + UUID.randomUUID();
        Path data = Files.createTempDirectory("slopewatch-latency-");
        String before = loadAverage();

        try (TestHttpReceiver receiver = TestHttpReceiver.start();
             DaemonProcess daemon = DaemonProcess.start("alert-latency", List.of("-Xmx1g"), List.of("serve"),
                     settings(token, data, receiver.url("/chat/bench")), Map.of())) {
            daemon.awaitReady(Duration.ofSeconds(120));
            HttpClient quotes = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
            // the same client as the daemon's chat channel: HTTP/1.1, and the receiver closes each connection
            HttpClient plain = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).version(HttpClient.Version.HTTP_1_1).build();
            Rounds run = new Rounds(receiver, quotes, plain, "http://127.0.0.1:" + daemon.port() + "/api/quotes", token);

            int noticeBytes = 0;
            LocalDate day = LocalDate.of(2040, 1, 1);
            long[] alert = new long[rounds];
            long[] post = new long[rounds];
            for (int r = -warmups; r < rounds; r++) {
                day = nextBusinessDay(day);
                LocalDate inverted = day;
                day = nextBusinessDay(day);
                boolean alertFirst = (r & 1) == 0;
                long a = 0;
                long p = 0;
                if (alertFirst) {
                    a = run.quoteToAlert(inverted);
                    run.post(snapshot(day, 30), null);
                }
                // the baseline's body is as long as the last notice (the first round, before any notice, sends 1,000 bytes)
                p = run.plainPost(Math.max(1000, noticeBytes));
                if (!alertFirst) {
                    a = run.quoteToAlert(inverted);
                    run.post(snapshot(day, 30), null);
                }
                noticeBytes = run.lastNoticeBytes;
                if (r >= 0) {
                    alert[r] = a;
                    post[r] = p;
                }
                Thread.sleep(pauseMillis);
            }
            String after = loadAverage();
            Arrays.sort(alert);
            Arrays.sort(post);
            double ratio99 = (double) percentile(alert, 0.99) / percentile(post, 0.99);
            String result = String.format(Locale.ROOT, """
                            rounds=%d
                            warmups=%d
                            pause_ms=%d
                            notice_bytes=%d
                            alert_p50_ms=%.3f
                            alert_p99_ms=%.3f
                            alert_max_ms=%.3f
                            post_p50_ms=%.3f
                            post_p99_ms=%.3f
                            post_max_ms=%.3f
                            ratio_p50=%.2f
                            ratio_p99=%.2f
                            ratio_max=%.2f
                            load_before=%s
                            load_after=%s
                            """, rounds, warmups, pauseMillis, noticeBytes, ms(percentile(alert, 0.5)), ms(percentile(alert, 0.99)),
                    ms(alert[rounds - 1]), ms(percentile(post, 0.5)), ms(percentile(post, 0.99)), ms(post[rounds - 1]),
                    (double) percentile(alert, 0.5) / percentile(post, 0.5), ratio99, (double) alert[rounds - 1] / post[rounds - 1],
                    before, after);
            Files.createDirectories(out.toAbsolutePath().getParent());
            Files.writeString(out, result);
            System.out.print(result);
            System.out.printf(Locale.ROOT, "quote-to-alert p99 is %.2f times the plain POST's (target: at most 3)%n", ratio99);
        } finally {
            deleteTree(data);
        }
    }

    /** The three timed operations and what they need. */
    private static final class Rounds {

        private final TestHttpReceiver receiver;
        private final HttpClient quotes;
        private final HttpClient plain;
        private final URI quoteUrl;
        private final String token;
        private final URI baselineUrl;
        int lastNoticeBytes;

        Rounds(TestHttpReceiver receiver, HttpClient quotes, HttpClient plain, String quoteUrl, String token) {
            this.receiver = receiver;
            this.quotes = quotes;
            this.plain = plain;
            this.quoteUrl = URI.create(quoteUrl);
            this.token = token;
            this.baselineUrl = URI.create(receiver.url("/baseline"));
        }

        /** Nanoseconds from just before the inverted snapshot is sent to the receiver's reading of its notice. */
        long quoteToAlert(LocalDate inverted) throws Exception {
            String marker = "\"market_date\":\"" + inverted + "\"";
            int from = receiver.requests().size();
            long start = System.nanoTime();
            var answer = quotes.sendAsync(request(snapshot(inverted, -30)), HttpResponse.BodyHandlers.ofString());
            TestHttpReceiver.Request notice = await(from, r -> r.path().equals("/chat/bench") && r.body().contains(marker), "the notice of " + inverted);
            check(answer.get(WAIT.toSeconds(), java.util.concurrent.TimeUnit.SECONDS), inverted);
            lastNoticeBytes = notice.body().getBytes(StandardCharsets.UTF_8).length;
            return notice.receivedNanos() - start;
        }

        /** Nanoseconds from just before a body of that many bytes is posted to the receiver to its reading of it. */
        long plainPost(int bytes) throws Exception {
            String id = UUID.randomUUID().toString();
            String body = "{\"id\":\"" + id + "\",\"text\":\"";
            body = body + "x".repeat(Math.max(0, bytes - body.length() - 2)) + "\"}";
            int from = receiver.requests().size();
            long start = System.nanoTime();
            HttpResponse<Void> r = plain.send(HttpRequest.newBuilder(baselineUrl).timeout(WAIT)
                    .header("Content-Type", "application/json; charset=utf-8").POST(HttpRequest.BodyPublishers.ofString(body)).build(),
                    HttpResponse.BodyHandlers.discarding());
            if (r.statusCode() != 200) {
                throw new IllegalStateException("the receiver answered " + r.statusCode());
            }
            TestHttpReceiver.Request got = await(from, q -> q.path().equals("/baseline") && q.body().contains(id), "the plain post");
            return got.receivedNanos() - start;
        }

        void post(String body, LocalDate day) throws Exception {
            check(quotes.send(request(body), HttpResponse.BodyHandlers.ofString()), day);
        }

        private HttpRequest request(String body) {
            return HttpRequest.newBuilder(quoteUrl).timeout(WAIT).header("Content-Type", "application/json")
                    .header("Authorization", "Bearer " + token).POST(HttpRequest.BodyPublishers.ofString(body)).build();
        }

        private static void check(HttpResponse<String> answer, LocalDate day) {
            if (answer.statusCode() != 200 || !answer.body().contains("\"accepted\":1")) {
                throw new IllegalStateException("the quote of " + day + " was answered " + answer.statusCode() + ": " + answer.body());
            }
        }

        /** The first request from index {@code from} on that matches; the receiver timed it, so polling adds nothing to the figure. */
        private TestHttpReceiver.Request await(int from, java.util.function.Predicate<TestHttpReceiver.Request> wanted, String what)
                throws InterruptedException {
            long deadline = System.nanoTime() + WAIT.toNanos();
            while (System.nanoTime() < deadline) {
                List<TestHttpReceiver.Request> all = receiver.requests();
                for (int i = from; i < all.size(); i++) {
                    if (wanted.test(all.get(i))) {
                        return all.get(i);
                    }
                }
                Thread.sleep(0, 200_000);
            }
            throw new IllegalStateException(what + " did not arrive within " + WAIT);
        }
    }

    private static Map<String, String> settings(String token, Path data, String chatUrl) {
        Map<String, String> s = new HashMap<>();
        s.put("slopewatch.security.write-tokens", token);
        s.put("slopewatch.home", Path.of("").toAbsolutePath().toString());
        s.put("slopewatch.data-dir", data.toString());
        s.put("slopewatch.ingest.max-days-ahead", "36500");
        s.put("slopewatch.ingest.policy", Path.of("bench", "latency-policy.yaml").toAbsolutePath().toString());
        s.put("slopewatch.channels.bench-chat.type", "chat-webhook");
        s.put("slopewatch.channels.bench-chat.url", chatUrl);
        s.put("slopewatch.channels.bench-chat.format", "alert-json");
        s.put("slopewatch.delivery.allowed-hosts", "127.0.0.1");
        s.put("quarkus.log.category.\"org.slopewatch.transitions\".level", "WARN");
        s.put("quarkus.log.category.\"org.slopewatch.alerting\".level", "WARN");
        return s;
    }

    /** A GOVT-A snapshot whose 10Y-3M is {@code spreadBp}. */
    static String snapshot(LocalDate day, double spreadBp) {
        return String.format(Locale.ROOT, "{\"curve\":\"GOVT-A\",\"date\":\"%s\",\"unit\":\"bp\",\"yields\":{\"3M\":400.0,\"2Y\":395.0,\"10Y\":%.1f}}",
                day, 400.0 + spreadBp);
    }

    private static LocalDate nextBusinessDay(LocalDate d) {
        LocalDate next = d.plusDays(1);
        while (next.getDayOfWeek() == DayOfWeek.SATURDAY || next.getDayOfWeek() == DayOfWeek.SUNDAY) {
            next = next.plusDays(1);
        }
        return next;
    }

    /** Nearest rank on a sorted array. */
    static long percentile(long[] sorted, double p) {
        int rank = (int) Math.ceil(p * sorted.length);
        return sorted[Math.max(0, Math.min(sorted.length - 1, rank - 1))];
    }

    private static double ms(long nanos) {
        return nanos / 1e6;
    }

    private static String loadAverage() {
        try {
            String[] f = Files.readString(Path.of("/proc/loadavg")).split(" ");
            return f[0] + " " + f[1] + " " + f[2];
        } catch (IOException e) {
            return "unknown";
        }
    }

    private static void deleteTree(Path root) throws IOException {
        try (var paths = Files.walk(root)) {
            paths.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }
}
