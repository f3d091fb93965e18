package org.slopewatch.ingest.kafka;

import static org.assertj.core.api.Assertions.assertThat;
import static org.slopewatch.ingest.kafka.KafkaRuns.CURVES;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.time.Duration;
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
 * <p>A second check: a policy reload asked of one instance of a pair reaches the other, each
 * reading its own copy of the file as two pods read a mounted ConfigMap.
 */
class TwoInstancesIT {

    private static final int BUSINESS_DAYS = 650;        // about 30 months: the scripted cycle inverts, confirms and re-steepens
    private static final int DAYS_PER_SECOND = 30;
    private static final Duration READY = Duration.ofSeconds(120);

    @Test
    void twoInstancesSplitTheCurvesHandThemOverAndJournalAndSendEachNoticeOnce() throws Exception {
        String run = "it-" + UUID.randomUUID().toString().substring(0, 8);
        String pairTopic = "slopewatch.quotes." + run + ".pair";
        String soloTopic = "slopewatch.quotes." + run + ".solo";
        KafkaRuns.createTopics(pairTopic, soloTopic);
        List<QuoteMessage> quotes = KafkaRuns.scenarioQuotes(7, BUSINESS_DAYS);

        try (TestDatabase pairJournal = PostgresServer.freshDatabase(); TestDatabase soloJournal = PostgresServer.freshDatabase();
             TestHttpReceiver chat = TestHttpReceiver.start();
             DaemonProcess first = KafkaRuns.start(run + "-pair-1", pairTopic, pairJournal, chat.url("/pair/hook"));
             DaemonProcess second = KafkaRuns.start(run + "-pair-2", pairTopic, pairJournal, chat.url("/pair/hook"));
             DaemonProcess solo = KafkaRuns.start(run + "-solo", soloTopic, soloJournal, chat.url("/solo/hook"));
             KafkaProducer<String, String> producer = KafkaRuns.producer()) {
            first.awaitReady(READY);
            second.awaitReady(READY);
            solo.awaitReady(READY);
            Awaitility.await("both instances of the pair hold partitions").atMost(Duration.ofSeconds(90)).until(
                    () -> first.logText().contains("quotes partitions assigned") && second.logText().contains("quotes partitions assigned"));

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
                            .until(() -> accepted(first) > 0 && accepted(second) > 0);
                    first.stop();
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
            assertThat(second.logText().split("quotes partitions assigned", -1).length - 1)
                    .as("partition assignments seen by the surviving instance").isGreaterThanOrEqualTo(2);
            assertThat(first.isAlive()).isFalse();

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
            }
        }
    }

    private static final HttpClient HTTP = HttpClient.newHttpClient();

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

    private static double accepted(DaemonProcess instance) {
        return instance.counter("slopewatch_quotes_accepted_total");
    }
}
