package org.slopewatch.ingest.kafka;

import static org.assertj.core.api.Assertions.assertThat;
import static org.slopewatch.ingest.kafka.KafkaRuns.CURVES;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.apache.kafka.clients.producer.KafkaProducer;
import org.awaitility.Awaitility;
import org.junit.jupiter.api.Test;
import org.slopewatch.delivery.TestHttpReceiver;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.testsupport.DaemonProcess;
import org.slopewatch.testsupport.JournalContents;
import org.slopewatch.testsupport.PostgresServer;
import org.slopewatch.testsupport.PostgresServer.TestDatabase;

/**
 * Two daemons on one consumer group and one PostgreSQL journal, the packaged application run as
 * operators run it, against the real broker and database: they split the curves, one is stopped
 * in the middle of the stream, the other takes its curves over, and in the end the journal holds
 * every transition, spell and notice exactly once, and the chat receiver got each notice once.
 *
 * <p>"Exactly once" is judged against a third daemon, alone on its own topic and database, that
 * takes the same quotes without interruption: the pair's journal must equal the single
 * instance's, row for row, apart from timestamps and row ids.
 *
 * <p>What people set holds on both: a quiet period on the rule {@code first-inversion} is set
 * through the first instance of the pair (and, the same, on the single instance) before the quotes
 * come, so the notices the second decides must be held back as the single instance's are, and the
 * second lists it at once; a what-if accepted by the first is read, done, from the second.
 *
 * <p>A second check: a policy reload asked of one instance of a pair reaches the other, each
 * reading its own copy of the file as two pods read a mounted ConfigMap.
 */
class TwoInstancesIT {

    private static final int BUSINESS_DAYS = 650;        // about 30 months: the scripted cycle inverts, confirms and re-steepens
    private static final int DAYS_PER_SECOND = 30;
    private static final Duration READY = Duration.ofSeconds(120);
    private static final ObjectMapper JSON = new ObjectMapper();
    private static final HttpClient HTTP = HttpClient.newHttpClient();

    @Test
    void twoInstancesSplitTheCurvesHandThemOverAndJournalAndSendEachNoticeOnce() throws Exception {
        String run = "it-" + UUID.randomUUID().toString().substring(0, 8);
        String pairTopic = "slopewatch.quotes." + run + ".pair";
        String soloTopic = "slopewatch.quotes." + run + ".solo";
        KafkaRuns.createTopics(pairTopic, soloTopic);
        List<QuoteMessage> quotes = KafkaRuns.scenarioQuotes(7, BUSINESS_DAYS);

        try (TestDatabase pairJournal = PostgresServer.freshDatabase(); TestDatabase soloJournal = PostgresServer.freshDatabase();
             TestHttpReceiver chat = TestHttpReceiver.start();
             Instance first = Instance.start(run + "-pair-1", pairTopic, pairJournal, chat.url("/pair/hook"));
             Instance second = Instance.start(run + "-pair-2", pairTopic, pairJournal, chat.url("/pair/hook"));
             Instance solo = Instance.start(run + "-solo", soloTopic, soloJournal, chat.url("/solo/hook"));
             KafkaProducer<String, String> producer = KafkaRuns.producer()) {
            first.daemon.awaitReady(READY);
            second.daemon.awaitReady(READY);
            solo.daemon.awaitReady(READY);
            Awaitility.await("both instances of the pair hold partitions").atMost(Duration.ofSeconds(90)).until(
                    () -> first.daemon.logText().contains("quotes partitions assigned")
                            && second.daemon.logText().contains("quotes partitions assigned"));

            // a quiet period through the first instance only (and the same on the single one): the second
            // took its partitions, and rebuilt from the journal, before it was set
            String quiet = JSON.writeValueAsString(Map.of("rule", "first-inversion", "until",
                    Instant.now().plus(2, ChronoUnit.HOURS).truncatedTo(ChronoUnit.SECONDS).toString(),
                    "note", "desk offsite", "set_by", "it-desk"));
            assertThat(first.send("POST", "/api/quiet-periods", quiet).statusCode()).isEqualTo(201);
            assertThat(solo.send("POST", "/api/quiet-periods", quiet).statusCode()).isEqualTo(201);
            JsonNode listed = JSON.readTree(second.send("GET", "/api/quiet-periods", null).body());
            assertThat(listed.findValuesAsText("set_by")).as("the second instance lists the quiet period set through the first")
                    .containsExactly("it-desk");

            int stopAt = quotes.size() * 2 / 5;
            int perTick = CURVES.size() * DAYS_PER_SECOND / 10;
            for (int i = 0; i < quotes.size(); i++) {
                KafkaRuns.send(producer, quotes.get(i), pairTopic, soloTopic);
                if (i % perTick == perTick - 1) {
                    producer.flush();
                    Thread.sleep(100);
                }
                if (i == stopAt) {
                    producer.flush();
                    // the split is real: each instance of the pair has taken quotes of its own curves
                    Awaitility.await("each instance of the pair took quotes").atMost(Duration.ofSeconds(60))
                            .until(() -> accepted(first.daemon) > 0 && accepted(second.daemon) > 0);
                    whatIfAcceptedByOneIsReadFromTheOther(first, second);
                    first.daemon.stop();
                }
            }
            producer.flush();

            KafkaRuns.awaitSettled(Duration.ofMinutes(3), quotes.size(), pairJournal, soloJournal);

            JournalContents pair = KafkaRuns.contents(pairJournal);
            JournalContents single = KafkaRuns.contents(soloJournal);

            // the scenario is worth checking: it inverts, confirms and re-steepens, and alerts go out
            assertThat(single.transitions()).anyMatch(t -> t.contains(" | CONFIRMED | ")).anyMatch(t -> t.contains(" | RESTEEPENING | "));
            assertThat(single.alerts()).anyMatch(a -> a.startsWith("inversion-confirmed~"));
            // the stopped instance's curves went on: the survivor took them over after the stop
            assertThat(second.daemon.logText().split("quotes partitions assigned", -1).length - 1)
                    .as("partition assignments seen by the surviving instance").isGreaterThanOrEqualTo(2);
            assertThat(first.daemon.isAlive()).isFalse();
            // the quiet period was exercised: first-inversion notices were decided and held back
            assertThat(single.alerts()).anyMatch(a -> a.startsWith("first-inversion~") && a.contains("quiet period 1 on rule first-inversion"));
            // and rebuilt at most those: the curves the stopped instance had moved on since the survivor last
            // followed them from the journal (none when it had just caught up), never every curve
            java.util.regex.Matcher assigned = java.util.regex.Pattern.compile("quotes partitions assigned \\[[^\\]]*\\]: (\\d+) curve\\(s\\) rebuilt")
                    .matcher(second.daemon.logText());
            int rebuilt = -1;
            while (assigned.find()) {
                rebuilt = Integer.parseInt(assigned.group(1));
            }
            assertThat(rebuilt).as("curves the surviving instance rebuilt when it took the stopped one's over")
                    .isBetween(0, CURVES.size() - 1);

            pair.assertEndsAs(single, quotes.size());

            Map<String, Long> pairSent = chat.noticesReceived("/pair/hook");
            Map<String, Long> soloSent = chat.noticesReceived("/solo/hook");
            assertThat(pairSent).as("notice id → posts the chat receiver got from the pair").isNotEmpty()
                    .allSatisfy((id, n) -> assertThat(n).as(id).isEqualTo(1L));
            assertThat(pairSent.keySet()).isEqualTo(soloSent.keySet());
        }
    }

    @Test
    void aReloadAcceptedOnOneInstanceReachesTheOther() throws Exception {
        String run = "it-" + UUID.randomUUID().toString().substring(0, 8);
        String topic = "slopewatch.quotes." + run + ".fleet";
        KafkaRuns.createTopics(topic);
        Path dir = Files.createDirectories(Path.of("target/it-data/" + run).toAbsolutePath());
        String before = Files.readString(Path.of("alert-rules/default.yaml"));
        // a change of content, hence of hash, that every instance can take: the policy itself stays valid
        String after = before + "\n# the desk's edit of " + run + "\n";

        try (TestDatabase journal = PostgresServer.freshDatabase(); TestHttpReceiver chat = TestHttpReceiver.start()) {
            Map<String, String> firstSettings = reloadSettings(topic, journal, chat, dir.resolve("first/default.yaml"), before);
            Map<String, String> secondSettings = reloadSettings(topic, journal, chat, dir.resolve("second/default.yaml"), before);
            try (DaemonProcess first = DaemonProcess.start(run + "-fleet-1", firstSettings, KafkaRuns.secrets(journal));
                 DaemonProcess second = DaemonProcess.start(run + "-fleet-2", secondSettings, KafkaRuns.secrets(journal))) {
                first.awaitReady(READY);
                second.awaitReady(READY);
                // the ConfigMap reaches both machines; only the first is asked to reload
                Files.writeString(dir.resolve("first/default.yaml"), after);
                Files.writeString(dir.resolve("second/default.yaml"), after);
                HttpResponse<String> reload = HTTP.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + first.port()
                        + "/api/policy/reload")).header("Authorization", "Bearer " + DaemonProcess.writeToken(firstSettings))
                        .POST(HttpRequest.BodyPublishers.noBody()).build(), HttpResponse.BodyHandlers.ofString());
                assertThat(reload.statusCode()).as(reload.body()).isEqualTo(200);
                assertThat(reload.body()).contains("\"applied\"").contains(sha256(after));

                // the second checks the journal every second (slopewatch.fleet.check-every below), its own reload check is off
                long asked = System.nanoTime();
                Awaitility.await("the second instance runs what the first accepted").atMost(Duration.ofSeconds(10))
                        .pollInterval(Duration.ofMillis(200)).until(() -> {
                            String check = policyInForce(second);
                            return check.contains("\"status\":\"UP\"") && check.contains(sha256(after)) && !check.contains(sha256(before));
                        });
                long tookMs = (System.nanoTime() - asked) / 1_000_000;
                String well = policyInForce(second);
                assertThat(well).as("both live instances named with the new hash: %s", well)
                        .contains("\"live instances\":2").doesNotContain(sha256(before)).contains(sha256(after));
                assertThat(second.logText()).contains("reloaded: accepted on another instance (sha256 " + sha256(after));
                System.out.printf("the second instance took the reload %d ms after the first answered (checks every 1 s)%n", tookMs);

                // any instance answers every read: each decides its own curves and follows the other's from the journal
                List<QuoteMessage> quotes = KafkaRuns.scenarioQuotes(3, 30);
                try (KafkaProducer<String, String> producer = KafkaRuns.producer()) {
                    for (QuoteMessage q : quotes) {
                        KafkaRuns.send(producer, q, topic);
                    }
                    producer.flush();
                }
                String lastDate = quotes.get(quotes.size() - 1).date().toString();
                Awaitility.await("each instance took quotes of its own curves").atMost(Duration.ofSeconds(60))
                        .until(() -> accepted(first) > 0 && accepted(second) > 0 && accepted(first) + accepted(second) >= quotes.size());
                String[] answers = new String[2];
                Awaitility.await("both instances answer /api/spreads alike, every curve at its last date")
                        .atMost(Duration.ofSeconds(60)).pollInterval(Duration.ofMillis(500)).until(() -> {
                            answers[0] = read(first, firstSettings, "/api/spreads");
                            answers[1] = read(second, secondSettings, "/api/spreads");
                            // the same spreads with the same figures; each lists them in the order it first saw them
                            return sortedItems(answers[0]).equals(sortedItems(answers[1]))
                                    && CURVES.stream().allMatch(c -> answers[0].contains("\"curve\":\"" + c + "\""))
                                    && answers[0].split(lastDate, -1).length - 1 >= CURVES.size();
                        });
            }
        }
    }

    private static Map<String, String> reloadSettings(String topic, TestDatabase journal, TestHttpReceiver chat, Path policy, String text)
            throws Exception {
        Files.createDirectories(policy.getParent());
        Files.writeString(policy, text);
        // the chat URL is a secret, masked in every log line, so its path holds no word the test looks for in the log
        Map<String, String> s = KafkaRuns.settings(topic, journal, chat.url("/fleet/hook"));
        s.put("slopewatch.ingest.policy", policy.toString());
        s.put("slopewatch.alerts.reload-check", "0s");
        s.put("slopewatch.fleet.check-every", "1s");
        s.put("slopewatch.fleet.live-within", "10s");
        return s;
    }

    /** The {@code policy in force} check of {@code /q/health/well} as JSON text: status and data. */
    private static String policyInForce(DaemonProcess instance) throws Exception {
        String body = HTTP.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + instance.port() + "/q/health/well")).build(),
                HttpResponse.BodyHandlers.ofString()).body();
        com.fasterxml.jackson.databind.JsonNode checks = new com.fasterxml.jackson.databind.ObjectMapper().readTree(body).path("checks");
        for (com.fasterxml.jackson.databind.JsonNode check : checks) {
            if ("policy in force".equals(check.path("name").asText())) {
                return check.toString();
            }
        }
        throw new AssertionError("no policy in force check in " + body);
    }

    /** SHA-256 (FIPS 180-4) of the text's UTF-8 bytes, by the JDK. */
    private static String sha256(String text) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(text.getBytes(java.nio.charset.StandardCharsets.UTF_8)));
    }

    private static List<String> sortedItems(String jsonArray) throws Exception {
        List<String> items = new java.util.ArrayList<>();
        JSON.readTree(jsonArray).forEach(n -> items.add(n.toString()));
        java.util.Collections.sort(items);
        return items;
    }

    private static String read(DaemonProcess instance, Map<String, String> settings, String path) throws Exception {
        return HTTP.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + instance.port() + path))
                .header("Authorization", "Bearer " + DaemonProcess.writeToken(settings)).timeout(Duration.ofSeconds(30)).build(),
                HttpResponse.BodyHandlers.ofString()).body();
    }

    private static double accepted(DaemonProcess instance) {
        return instance.counter("slopewatch_quotes_accepted_total");
    }

    /** A what-if on a history sent along, accepted by {@code accepting}: {@code other} answers for it, done. */
    private static void whatIfAcceptedByOneIsReadFromTheOther(Instance accepting, Instance other) throws Exception {
        String policy = java.nio.file.Files.readString(java.nio.file.Path.of("src/test/resources/policies/whatif-30-days.yaml"));
        String csv = "date,3M,10Y\n2026-01-02,5.00,4.80\n2026-01-05,5.00,4.80\n2026-02-02,5.00,4.80\n2026-02-03,5.00,4.90\n";
        HttpResponse<String> started = accepting.send("POST", "/api/what-if",
                JSON.writeValueAsString(Map.of("policy", policy, "history", csv, "curve", "GOVT-B")));
        assertThat(started.statusCode()).as(started.body()).isEqualTo(202);
        String location = started.headers().firstValue("Location").orElseThrow();
        String path = URI.create(location).getPath();
        JsonNode job = Awaitility.await("the other instance reads the what-if done").atMost(Duration.ofSeconds(30))
                .pollInterval(Duration.ofMillis(200)).until(() -> {
                    HttpResponse<String> r = other.send("GET", path, null);
                    assertThat(r.statusCode()).as("GET %s on the instance that did not accept it: %s", path, r.body()).isEqualTo(200);
                    return JSON.readTree(r.body());
                }, j -> !j.get("state").asText().equals("running"));
        assertThat(job.get("state").asText()).as(job.toString()).isEqualTo("done");
        assertThat(job.get("progress").get("done").asLong()).isEqualTo(4);
        // the policy tried confirms after 30 days inverted (policies/whatif-30-days.yaml): 2 February, the first date 30 days on
        assertThat(job.get("result").get("would_fire").findValuesAsText("market_date")).containsExactly("2026-01-02", "2026-02-02");
    }

    /** A daemon of the test, with the write token its API takes. */
    private record Instance(DaemonProcess daemon, String token) implements AutoCloseable {

        static Instance start(String name, String topic, TestDatabase journal, String chatUrl) {
            Map<String, String> settings = KafkaRuns.settings(topic, journal, chatUrl);
            return new Instance(DaemonProcess.start(name, settings, KafkaRuns.secrets(journal)), DaemonProcess.writeToken(settings));
        }

        HttpResponse<String> send(String method, String path, String json) throws Exception {
            HttpRequest.Builder b = HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + daemon.port() + path))
                    .header("Authorization", "Bearer " + token).timeout(Duration.ofSeconds(30));
            if (json == null) {
                b.method(method, HttpRequest.BodyPublishers.noBody());
            } else {
                b.header("Content-Type", "application/json").method(method, HttpRequest.BodyPublishers.ofString(json));
            }
            return HTTP.send(b.build(), HttpResponse.BodyHandlers.ofString());
        }

        @Override
        public void close() {
            daemon.close();
        }
    }
}
