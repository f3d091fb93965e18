package org.slopewatch.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.UUID;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.Collectors;
import org.assertj.core.api.SoftAssertions;
import org.awaitility.Awaitility;
import org.junit.jupiter.api.Test;
import org.slopewatch.delivery.TestHttpReceiver;
import org.slopewatch.ingest.kafka.QuoteJson;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.testsupport.DaemonProcess;
import org.slopewatch.testsupport.JournalContents;
import org.slopewatch.testsupport.ScenarioQuotes;

/**
 * Crash recovery on the embedded defaults ({@code serve}: HTTP into the in-process channel, the H2
 * file journal): a client posts snapshot messages with ids, 20 to a request, each request again
 * until it is answered 200, as a client that must not lose a quote does; the daemon is killed with
 * SIGKILL at moments drawn from a printed seed, while requests are in flight, and started again.
 *
 * <p>What an answer of 200 promises is checked after each kill, on the journal file itself before
 * the next life opens it: every message acknowledged before the kill must be there. In the end,
 * after the client has sent everything once more (as one unsure of what was taken would), every
 * message must be journalled exactly once, and the journal must conclude what an undisturbed
 * daemon on the same requests concluded, row for row (transitions, spells, notices, deliveries).
 * Each notice must reach the chat receiver, and a kill may add at most one post: a channel's
 * worker has one delivery in flight, and a kill between its post and its record repeats it.
 *
 * <p>The short form (CI) kills three times; {@code bench/faults/crash.sh embedded} runs the long
 * form ({@code -Dslopewatch.faults.kills=10}). {@code -Dslopewatch.faults.seed=N} repeats a run's
 * moments. The figures go to {@code target/faults/embedded-crash.txt}.
 */
class EmbeddedCrashIT {

    private static final int KILLS = Integer.getInteger("slopewatch.faults.kills", 3);
    private static final long SEED = Long.getLong("slopewatch.faults.seed", new Random().nextLong());
    private static final List<String> CURVES = List.of("GOVT-A", "GOVT-B", "GOVT-C");
    private static final int BUSINESS_DAYS = 650;
    private static final int PER_REQUEST = 20;
    private static final Duration READY = Duration.ofSeconds(120);
    private static final Duration STALLED = Duration.ofSeconds(90);
    private static final ObjectMapper JSON = new ObjectMapper();

    /** One request: its body and the ids of the messages in it. */
    record Request(String body, List<String> ids) {
    }

    /**
     * What the journal held after one kill, against what had been answered 200 before it; {@code lost}
     * are the messages acknowledged and missing that were not missing after an earlier kill already.
     */
    record AfterKill(int requestsAnswered, int acknowledged, int journalled, Set<String> lost, Set<String> seenWithoutQuote) {
    }

    @Test
    void everyAcknowledgedQuoteSurvivesAKillAndTheRunEndsWhereAnUndisturbedOneDoes() throws Exception {
        String run = "embedded-crash-" + UUID.randomUUID().toString().substring(0, 8);
        List<QuoteMessage> quotes = ScenarioQuotes.tightening(CURVES, 17, BUSINESS_DAYS);
        List<Request> requests = requests(quotes);
        TreeMap<Integer, Integer> kills = killMoments(requests.size());
        System.out.printf("embedded crash test: %d kill(s), seed %d (-Dslopewatch.faults.seed=%d repeats the moments), %d messages "
                + "in %d requests%n", KILLS, SEED, SEED, quotes.size(), requests.size());
        Path killedData = Path.of("target", "it-data", run + "-killed").toAbsolutePath();
        Path soloData = Path.of("target", "it-data", run + "-solo").toAbsolutePath();

        List<AfterKill> afterKills = new ArrayList<>();
        int[] resent = new int[2];
        List<DaemonProcess> lives = new ArrayList<>();
        try (TestHttpReceiver chat = TestHttpReceiver.start()) {
            Map<String, String> killedSettings = DaemonProcess.scenarioSettings(killedData, CURVES, chat.url("/killed/hook"));
            // a delivery claimed by a killed life is the next life's after 10 s rather than two minutes
            killedSettings.put("slopewatch.alerts.delivery-claim", "10s");
            Map<String, String> soloSettings = DaemonProcess.scenarioSettings(soloData, CURVES, chat.url("/solo/hook"));
            try (DaemonProcess solo = DaemonProcess.startEmbedded(run + "-solo", soloSettings)) {
                lives.add(DaemonProcess.startEmbedded(run + "-life-0", killedSettings));
                Feed soloFeed = new Feed("undisturbed", requests, DaemonProcess.writeToken(soloSettings));
                Feed feed = new Feed("killed", requests, DaemonProcess.writeToken(killedSettings));
                soloFeed.target(solo.awaitReady(READY));
                feed.target(lives.get(0).awaitReady(READY));
                Thread soloSender = soloFeed.start();
                Thread sender = feed.start();

                for (Map.Entry<Integer, Integer> kill : kills.entrySet()) {
                    feed.awaitAnswered(kill.getKey() + 1);
                    Thread.sleep(kill.getValue());
                    DaemonProcess dying = lives.get(lives.size() - 1);
                    feed.target(null); // no new request: the one in flight, if any, meets the kill
                    dying.kill();
                    Set<String> acknowledged = feed.acknowledgedOnceIdle();
                    Set<String> journalled = JournalContents.quoteIds(h2Url(killedData), "", "");
                    Set<String> lost = new TreeSet<>(acknowledged);
                    lost.removeAll(journalled);
                    afterKills.forEach(earlier -> lost.removeAll(earlier.lost()));
                    afterKills.add(new AfterKill(feed.answered(), acknowledged.size(), journalled.size(), lost,
                            JournalContents.seenWithoutQuote(h2Url(killedData), "", "")));
                    System.out.printf("embedded crash test: kill %d after %d request(s) answered: %d message(s) acknowledged in all, "
                            + "%d journalled, %d acknowledged since the last kill but not journalled%n", afterKills.size(),
                            feed.answered(), acknowledged.size(), journalled.size(), lost.size());
                    DaemonProcess next = DaemonProcess.startEmbedded(run + "-life-" + lives.size(), killedSettings);
                    lives.add(next);
                    feed.target(next.awaitReady(READY));
                }
                feed.finish(sender);
                soloFeed.finish(soloSender);

                // everything once more, as a client unsure of what was taken would send it
                DaemonProcess last = lives.get(lives.size() - 1);
                resent = feed.resend(last);
                awaitDeliveriesSettled(chat, last, solo);
                last.stop();
                solo.stop();
            } finally {
                lives.forEach(DaemonProcess::close);
            }

            JournalContents killed = JournalContents.read(h2Url(killedData), "", "");
            JournalContents undisturbed = JournalContents.read(h2Url(soloData), "", "");
            Set<String> journalledIds = JournalContents.quoteIds(h2Url(killedData), "", "");
            Set<String> missing = quotes.stream().map(QuoteMessage::id).filter(id -> !journalledIds.contains(id))
                    .collect(Collectors.toCollection(TreeSet::new));
            Map<String, Long> received = chat.noticesReceived("/killed/hook");
            Map<String, Long> receivedUndisturbed = chat.noticesReceived("/solo/hook");
            long posts = received.values().stream().mapToLong(Long::longValue).sum();
            long postsUndisturbed = receivedUndisturbed.values().stream().mapToLong(Long::longValue).sum();
            Set<String> lost = afterKills.stream().flatMap(k -> k.lost().stream()).collect(Collectors.toCollection(TreeSet::new));
            Set<String> seenWithoutQuote = afterKills.stream().flatMap(k -> k.seenWithoutQuote().stream())
                    .collect(Collectors.toCollection(TreeSet::new));
            seenWithoutQuote.addAll(JournalContents.seenWithoutQuote(h2Url(killedData), "", ""));
            String figures = String.format("kills=%d seed=%d messages=%d requests=%d acknowledged_before_each_kill=%s "
                            + "lost_at_each_kill=%s seen_without_quote=%d resent_accepted=%d resent_duplicates=%d journalled=%d "
                            + "distinct=%d missing_after_resend=%d transitions=%d (undisturbed %d) spells=%d (%d) notices=%d (%d) posts=%d "
                            + "posts_undisturbed=%d", KILLS, SEED,
                    quotes.size(), requests.size(),
                    afterKills.stream().map(k -> Integer.toString(k.acknowledged())).toList(),
                    afterKills.stream().map(k -> Integer.toString(k.lost().size())).toList(), seenWithoutQuote.size(), resent[0], resent[1],
                    killed.quotes(),
                    killed.distinctQuoteIds(), missing.size(), killed.transitions().size(), undisturbed.transitions().size(),
                    killed.spells().size(), undisturbed.spells().size(), killed.alerts().size(), undisturbed.alerts().size(), posts,
                    postsUndisturbed);
            System.out.println("embedded crash test: " + figures);
            report(figures);

            assertThat(undisturbed.transitions()).as("the scenario confirms an inversion").anyMatch(t -> t.contains(" | CONFIRMED | "));
            SoftAssertions promises = new SoftAssertions();
            promises.assertThat(lost).as("messages answered 200 before a kill and missing from the journal after it").isEmpty();
            promises.assertThat(seenWithoutQuote).as("ids journalled as seen, after a kill or at the end, without their quote").isEmpty();
            promises.assertThat(missing).as("messages missing from the journal after everything was sent again").isEmpty();
            promises.assertThat(received.keySet()).as("every notice reached the receiver").isEqualTo(receivedUndisturbed.keySet());
            promises.assertThat(posts - postsUndisturbed).as("posts beyond the undisturbed run's, at most one per kill")
                    .isLessThanOrEqualTo(KILLS);
            promises.assertAll();
            killed.assertEndsAs(undisturbed, quotes.size());
        }
    }

    /** The messages in order, {@value #PER_REQUEST} to a request, as JSON arrays of snapshots. */
    private static List<Request> requests(List<QuoteMessage> quotes) {
        List<Request> out = new ArrayList<>();
        for (int i = 0; i < quotes.size(); i += PER_REQUEST) {
            List<QuoteMessage> part = quotes.subList(i, Math.min(quotes.size(), i + PER_REQUEST));
            out.add(new Request(part.stream().map(QuoteJson::encode).collect(Collectors.joining(",", "[", "]")),
                    part.stream().map(QuoteMessage::id).toList()));
        }
        return out;
    }

    /** KILLS distinct request positions between 10 % and 90 % of the stream, each with a pause of 0 to 49 ms, from the seed. */
    private static TreeMap<Integer, Integer> killMoments(int requests) {
        Random random = new Random(SEED);
        TreeMap<Integer, Integer> at = new TreeMap<>();
        while (at.size() < KILLS) {
            at.put(requests / 10 + random.nextInt(requests * 8 / 10), random.nextInt(50));
        }
        return at;
    }

    private static String h2Url(Path dataDir) {
        return "jdbc:h2:file:" + dataDir.resolve("journal");
    }

    /**
     * Waits until neither daemon has a delivery waiting and the receiver has heard nothing new for a
     * few seconds. A delivery claimed by a killed life waits out its claim first.
     */
    private static void awaitDeliveriesSettled(TestHttpReceiver chat, DaemonProcess... daemons) {
        int[] heard = {-1};
        long[] quietSince = {System.nanoTime()};
        Awaitility.await("no delivery waiting, and the receiver quiet for 3 s").atMost(Duration.ofMinutes(4))
                .pollInterval(Duration.ofMillis(500)).until(() -> {
                    int now = chat.requests().size();
                    if (now != heard[0]) {
                        heard[0] = now;
                        quietSince[0] = System.nanoTime();
                    }
                    boolean empty = true;
                    for (DaemonProcess d : daemons) {
                        empty &= d.metric("slopewatch_alert_backlog", "") == 0;
                    }
                    return empty && System.nanoTime() - quietSince[0] > 3_000_000_000L;
                });
    }

    private static void report(String figures) throws IOException {
        Path file = Path.of("target", "faults", "embedded-crash.txt");
        Files.createDirectories(file.getParent());
        Files.writeString(file, figures + System.lineSeparator());
    }

    /**
     * A client: sends the requests in order to a daemon's current life, each again (every 100 ms)
     * until it is answered 200, and remembers which messages were acknowledged.
     */
    private static final class Feed implements Runnable {

        private final HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(2)).build();
        private final String name;
        private final List<Request> requests;
        private final String token;
        private final Set<String> acknowledged = ConcurrentHashMap.newKeySet();
        private final AtomicInteger answered = new AtomicInteger();
        private volatile DaemonProcess target;
        // the life a request is on its way to, null between requests
        private volatile DaemonProcess posting;
        private volatile String lastProblem = "none";
        private volatile Throwable failure;

        Feed(String name, List<Request> requests, String token) {
            this.name = name;
            this.requests = requests;
            this.token = token;
        }

        Thread start() {
            Thread t = new Thread(this, "feed-" + name);
            t.setDaemon(true);
            t.start();
            return t;
        }

        void target(DaemonProcess daemon) {
            target = daemon;
        }

        int answered() {
            return answered.get();
        }

        @Override
        public void run() {
            try {
                for (Request r : requests) {
                    while (true) {
                        DaemonProcess d = target;
                        if (d != null) {
                            posting = d;
                            HttpResponse<String> answer = post(d, r.body());
                            if (answer != null && answer.statusCode() == 200) {
                                acknowledged.addAll(r.ids());
                                posting = null;
                                answered.incrementAndGet();
                                break;
                            }
                            posting = null;
                            if (answer != null) {
                                lastProblem = answer.statusCode() + " " + answer.body();
                            }
                        }
                        Thread.sleep(100);
                    }
                }
            } catch (Throwable e) {
                failure = e;
            }
        }

        /** The messages acknowledged so far, once no request is in flight (call with no target set). */
        Set<String> acknowledgedOnceIdle() {
            Awaitility.await(name + ": the request in flight at the kill ends").atMost(Duration.ofSeconds(70))
                    .pollInterval(Duration.ofMillis(10)).until(() -> posting == null);
            return Set.copyOf(acknowledged);
        }

        void awaitAnswered(int n) {
            Awaitility.await(name + ": " + n + " request(s) answered 200 (last problem: " + lastProblem + ")").atMost(STALLED)
                    .pollInterval(Duration.ofMillis(5)).until(() -> failure != null || answered.get() >= n);
            if (failure != null) {
                throw new AssertionError(name + " feed failed", failure);
            }
        }

        void finish(Thread sender) throws InterruptedException {
            awaitAnswered(requests.size());
            sender.join(10_000);
        }

        /** Sends every request once more; returns the messages accepted and counted as duplicates. */
        int[] resend(DaemonProcess daemon) throws Exception {
            int[] counts = new int[2];
            for (Request r : requests) {
                HttpResponse<String> answer = post(daemon, r.body());
                assertThat(answer).as(name + ": an answer to a request sent again").isNotNull();
                assertThat(answer.statusCode()).as(name + ": request sent again: " + answer.body()).isEqualTo(200);
                JsonNode body = JSON.readTree(answer.body());
                counts[0] += body.path("accepted").asInt();
                counts[1] += body.path("duplicates").asInt();
            }
            return counts;
        }

        /** The answer, or null when none came (the daemon not listening, or killed mid-request). */
        private HttpResponse<String> post(DaemonProcess d, String body) throws InterruptedException {
            try {
                return http.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + d.port() + "/api/quotes"))
                        .timeout(Duration.ofSeconds(60)).header("Content-Type", "application/json")
                        .header("Authorization", "Bearer " + token).POST(HttpRequest.BodyPublishers.ofString(body)).build(),
                        HttpResponse.BodyHandlers.ofString());
            } catch (IOException e) {
                lastProblem = e.toString();
                return null;
            }
        }
    }
}
