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
 * operators run it, against the real broker and database: they split the curves, one is killed
 * (SIGKILL, a crash) in the middle of the stream, the other takes its curves over within
 * {@link #TAKEOVER_WITHIN}, rebuilding at most those (its assignment's log line says how many), and
 * decides what they come to afterwards; in the end the journal holds every transition, spell and
 * notice exactly once, and the chat receiver got every notice.
 *
 * <p>"Exactly once" is judged against a third daemon, alone on its own topic and database, that
 * takes the same quotes without interruption: the pair's journal must equal the single
 * instance's, row for row, apart from timestamps and row ids. As in {@link CrashIT}, a notice may
 * reach the receiver twice only when the kill fell between its post and its record: at most one
 * extra post. The time from the kill to the survivor's assignment is printed, with how many curves
 * it rebuilt.
 *
 * <p>What people set holds on both: a quiet period on the rule {@code first-inversion} is set
 * through the first instance of the pair (and, the same, on the single instance) before the quotes
 * come, so the notices the second decides must be held back as the single instance's are, and the
 * second lists it at once; a what-if accepted by the first is read, done, from the second. An
 * acknowledgement likewise: every daemon runs the shipped policy with {@code inversion-confirmed}
 * repeating its standing notice every {@link #STANDING} rather than every day; once every 10Y-3M and
 * 10Y-2Y is confirmed, each open episode but one is acknowledged through the instance of the pair
 * that does not own its curve (and on the single instance), and none of them may get a standing
 * notice, while the one left alone gets its standing notice in both runs, which shows the interval
 * was long enough for one; it is then acknowledged too, so that both runs stay equal.
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
    /** How often {@code inversion-confirmed} repeats a standing notice in the first check (the shipped policy: a day). */
    private static final Duration STANDING = Duration.ofSeconds(30);
    private static final String CONFIRMED_RULE = "inversion-confirmed";
    /**
     * How soon the survivor must hold a killed instance's partitions: the session time-out of
     * {@link KafkaRuns#SESSION_TIMEOUT_MS} (6 s) and the rebalance and rebuild after it, with room for a
     * busy shared machine; with the Kafka consumer's default session time-out of 45 s (from memory)
     * it could not.
     */
    private static final Duration TAKEOVER_WITHIN = Duration.ofSeconds(30);

    @Test
    void twoInstancesSplitTheCurvesHandThemOverAndJournalAndSendEachNoticeOnce() throws Exception {
        String run = "it-" + UUID.randomUUID().toString().substring(0, 8);
        String pairTopic = "slopewatch.quotes." + run + ".pair";
        String soloTopic = "slopewatch.quotes." + run + ".solo";
        KafkaRuns.createTopics(pairTopic, soloTopic);
        List<QuoteMessage> quotes = KafkaRuns.scenarioQuotes(7, BUSINESS_DAYS);

        Path policy = standingEvery(run, STANDING);

        try (TestDatabase pairJournal = PostgresServer.freshDatabase(); TestDatabase soloJournal = PostgresServer.freshDatabase();
             TestHttpReceiver chat = TestHttpReceiver.start();
             Instance first = Instance.start(run + "-pair-1", pairTopic, pairJournal, chat.url("/pair/hook"), policy);
             Instance second = Instance.start(run + "-pair-2", pairTopic, pairJournal, chat.url("/pair/hook"), policy);
             Instance solo = Instance.start(run + "-solo", soloTopic, soloJournal, chat.url("/solo/hook"), policy);
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

            // a third of the way in every 10Y-3M and 10Y-2Y has been confirmed and none has re-steepened yet
            int ackAt = quotes.size() / 3;
            int killAt = quotes.size() * 2 / 5;
            int perTick = CURVES.size() * DAYS_PER_SECOND / 10;
            Acknowledged acknowledged = null;
            Instant killed = null;
            for (int i = 0; i < quotes.size(); i++) {
                KafkaRuns.send(producer, quotes.get(i), pairTopic, soloTopic);
                if (i % perTick == perTick - 1) {
                    producer.flush();
                    Thread.sleep(100);
                }
                if (i == ackAt) {
                    producer.flush();
                    acknowledged = acknowledgementsThroughTheOtherInstanceHold(first, second, solo, pairJournal, soloJournal, chat, i + 1);
                }
                if (i == killAt) {
                    producer.flush();
                    // the split is real: each instance of the pair has taken quotes of its own curves
                    Awaitility.await("each instance of the pair took quotes").atMost(Duration.ofSeconds(60))
                            .until(() -> accepted(first.daemon) > 0 && accepted(second.daemon) > 0);
                    whatIfAcceptedByOneIsReadFromTheOther(first, second);
                    killed = Instant.now();
                    first.daemon.kill();
                }
            }
            producer.flush();

            // a delivery claimed by the killed instance waits out its two-minute claim before the survivor takes it
            KafkaRuns.awaitSettled(Duration.ofMinutes(6), quotes.size(), pairJournal, soloJournal);

            JournalContents pair = KafkaRuns.contents(pairJournal);
            JournalContents single = KafkaRuns.contents(soloJournal);

            // the scenario is worth checking: it inverts, confirms and re-steepens, and alerts go out
            assertThat(single.transitions()).anyMatch(t -> t.contains(" | CONFIRMED | ")).anyMatch(t -> t.contains(" | RESTEEPENING | "));
            assertThat(single.alerts()).anyMatch(a -> a.startsWith("inversion-confirmed~"));
            // the killed instance's curves went on: the survivor took them over after the kill
            assertThat(first.daemon.isAlive()).isFalse();
            assertThat(acknowledged.curvesOf(first)).as("curves the killed instance owned").isNotEmpty();
            for (Map.Entry<String, String> owned : acknowledged.ownerByEpisode().entrySet()) {
                if (owned.getValue().equals(first.name())) {
                    String closing = owned.getKey() + (owned.getKey().equals(acknowledged.control()) ? "~3" : "~2");
                    assertThat(second.daemon.logText()).as("the survivor decided %s, of a curve the killed instance owned", closing)
                            .contains("alert id=" + closing + " rule=");
                }
            }
            Takeover takeover = Takeover.after(killed, second.daemon.logText());
            System.out.printf("takeover: the survivor held all %d partitions %d ms after the kill (session time-out %s ms), "
                            + "%d curve(s) rebuilt from the journal; the killed instance owned %s%n", KafkaRuns.PARTITIONS,
                    takeover.millisAfterKill(), KafkaRuns.SESSION_TIMEOUT_MS, takeover.rebuilt(), acknowledged.curvesOf(first));
            assertThat(takeover.partitions()).as("partitions the survivor holds after the kill").isEqualTo(KafkaRuns.PARTITIONS);
            // the broker notices the crash after the session time-out; the rebalance and the rebuild follow
            assertThat(takeover.millisAfterKill()).as("milliseconds from the kill to the survivor's assignment")
                    .isBetween(0L, TAKEOVER_WITHIN.toMillis());
            // and rebuilt at most the killed instance's curves: those it had moved on since the survivor last followed them
            // from the journal (none when it had just caught up), never every curve
            assertThat(takeover.rebuilt()).as("curves the surviving instance rebuilt when it took the killed one's over")
                    .isBetween(0, acknowledged.curvesOf(first).size());
            // the quiet period was exercised: first-inversion notices were decided and held back
            assertThat(single.alerts()).anyMatch(a -> a.startsWith("first-inversion~") && a.contains("quiet period 1 on rule first-inversion"));

            pair.assertEndsAs(single, quotes.size());
            // the acknowledged episodes went from their opening notice to their closing one, the other had its standing notice between
            for (String episode : acknowledged.early()) {
                assertThat(kindOf(pair, episode + "~2")).as("notice 2 of %s, acknowledged through the instance not owning it", episode)
                        .isEqualTo("CLOSING");
            }
            assertThat(kindOf(pair, acknowledged.control() + "~2")).as("notice 2 of %s, acknowledged late", acknowledged.control())
                    .isEqualTo("STANDING");
            assertThat(kindOf(pair, acknowledged.control() + "~3")).isEqualTo("CLOSING");

            Map<String, Long> pairSent = chat.noticesReceived("/pair/hook");
            Map<String, Long> soloSent = chat.noticesReceived("/solo/hook");
            long extraPosts = pairSent.values().stream().mapToLong(n -> n - 1).sum();
            System.out.printf("notices: %d posted by the pair (%d beyond the first), %d by the single instance%n", pairSent.size(), extraPosts,
                    soloSent.size());
            assertThat(pairSent.keySet()).as("every notice reached the receiver from the pair").isNotEmpty().isEqualTo(soloSent.keySet());
            assertThat(extraPosts).as("posts beyond the first, at most one for the kill").isLessThanOrEqualTo(1);
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

    /**
     * The shipped policy with {@code inversion-confirmed}'s standing notices every {@code every}
     * rather than every day, so that an acknowledgement has a standing notice to stop within the run.
     */
    private static Path standingEvery(String run, Duration every) throws Exception {
        String shipped = Files.readString(Path.of("alert-rules/default.yaml"));
        String daily = "standing-every: 1d";
        assertThat(shipped.split(daily, -1).length - 1).as("inversion-confirmed alone repeats daily in the shipped policy").isEqualTo(1);
        Path policy = Path.of("target/it-data/" + run + "/standing-" + every.toSeconds() + "s.yaml").toAbsolutePath();
        Files.createDirectories(policy.getParent());
        Files.writeString(policy, shipped.replace(daily, "standing-every: " + every.toSeconds() + "s"));
        return policy;
    }

    /**
     * The acknowledgements of the first check: the episodes acknowledged early ({@code rule~subject~since}), the one left
     * to send its standing notice first, and which instance of the pair decided each episode's opening notice.
     */
    private record Acknowledged(List<String> early, String control, Map<String, String> ownerByEpisode) {

        /** The curves whose notices the instance decided. */
        java.util.SortedSet<String> curvesOf(Instance instance) {
            java.util.SortedSet<String> curves = new java.util.TreeSet<>();
            ownerByEpisode.forEach((episode, owner) -> {
                if (owner.equals(instance.name())) {
                    curves.add(episode.split("~")[1].split(":")[0]);
                }
            });
            return curves;
        }
    }

    /**
     * An acknowledgement posted to the instance that does not own the curve stops the owner's standing notices of that
     * episode. Once both runs have taken the {@code sent} quotes sent so far, every open {@code inversion-confirmed}
     * episode but the latest opened is acknowledged, in the pair through the instance that did not decide its opening
     * notice (its log says which did), and on the single instance; then, while no quote comes: the episode left alone
     * gets its standing notice {@link #STANDING} after its opening one, in both runs, and the acknowledged ones, every
     * one of them opened before it and past its own interval, get none. The last is then acknowledged too (the same
     * way), so that both runs go on alike.
     */
    private static Acknowledged acknowledgementsThroughTheOtherInstanceHold(Instance first, Instance second, Instance solo,
                                                                            TestDatabase pairJournal, TestDatabase soloJournal,
                                                                            TestHttpReceiver chat, int sent) throws Exception {
        Awaitility.await("both runs took the quotes sent so far").atMost(Duration.ofSeconds(120)).pollInterval(Duration.ofMillis(500))
                .until(() -> KafkaRuns.contents(pairJournal).quotes() == sent && KafkaRuns.contents(soloJournal).quotes() == sent);
        List<String[]> openings = KafkaRuns.contents(soloJournal).alerts().stream().map(a -> a.split(" \\| "))
                .filter(a -> a[1].equals(CONFIRMED_RULE) && a[4].equals("1")).toList();
        assertThat(openings).as("open %s episodes: every 10Y-3M and 10Y-2Y confirmed", CONFIRMED_RULE).hasSize(CURVES.size() * 2);
        assertThat(alertIds(KafkaRuns.contents(pairJournal))).as("the pair decided the same opening notices")
                .containsAll(openings.stream().map(a -> a[0]).toList());
        assertThat(alertIds(KafkaRuns.contents(pairJournal))).as("and no standing notice yet")
                .noneMatch(id -> id.startsWith(CONFIRMED_RULE + "~") && id.endsWith("~2"));

        // the episode opened last (latest market date) is left alone for a while; the others are acknowledged now
        String[] last = openings.stream().max(java.util.Comparator.comparing((String[] a) -> a[7]).thenComparing(a -> a[0])).orElseThrow();
        String control = episode(last[0]);
        List<String> early = openings.stream().filter(a -> a != last).map(a -> episode(a[0])).toList();

        Map<String, String> owners = new java.util.TreeMap<>();
        for (String[] opening : openings) {
            // the instance that decided a notice logs it as queued or held back ("alert id=... rule=..."); the other never does
            String decided = "alert id=" + opening[0] + " rule=";
            Awaitility.await("one instance of the pair logs deciding " + opening[0]).atMost(Duration.ofSeconds(30))
                    .until(() -> first.daemon.logText().contains(decided) || second.daemon.logText().contains(decided));
            assertThat(first.daemon.logText().contains(decided) && second.daemon.logText().contains(decided))
                    .as("both instances of the pair decided %s", opening[0]).isFalse();
            owners.put(episode(opening[0]), first.daemon.logText().contains(decided) ? first.name() : second.name());
        }
        Instant due = Instant.MIN;
        Map<String, Integer> through = new java.util.TreeMap<>();
        for (String episode : early) {
            Instance other = owners.get(episode).equals(first.name()) ? second : first;
            for (Instance instance : List.of(other, solo)) {
                Instant opened = Instant.parse(ack(instance, episode + "~1").get("created_at").asText());
                due = opened.plus(STANDING).isAfter(due) ? opened.plus(STANDING) : due;
            }
            through.merge(other.name(), 1, Integer::sum);
        }
        assertThat(through).as("acknowledgements through each instance of the pair, for curves the other owns").hasSize(2);

        String controlStanding = control + "~2";
        long waitFrom = System.nanoTime();
        Awaitility.await("the standing notice of " + control + ", not acknowledged, in both runs")
                .atMost(STANDING.plusSeconds(90)).pollInterval(Duration.ofMillis(500))
                .until(() -> "STANDING".equals(kindOf(KafkaRuns.contents(pairJournal), controlStanding))
                        && "STANDING".equals(kindOf(KafkaRuns.contents(soloJournal), controlStanding)));
        // past every acknowledged episode's own interval, with two evaluations (one a second) to spare
        Instant checkAfter = due.plusSeconds(2);
        Awaitility.await("every acknowledged episode past its standing interval").atMost(STANDING.plusSeconds(90))
                .pollInterval(Duration.ofMillis(200)).until(() -> Instant.now().isAfter(checkAfter));
        List<String> pairIds = alertIds(KafkaRuns.contents(pairJournal));
        List<String> soloIds = alertIds(KafkaRuns.contents(soloJournal));
        Map<String, Long> posted = chat.noticesReceived("/pair/hook");
        for (String episode : early) {
            assertThat(pairIds).as("a notice after the opening one of %s, owned by %s and acknowledged through the other instance",
                    episode, owners.get(episode)).doesNotContain(episode + "~2");
            assertThat(soloIds).as("a notice after the opening one of %s on the single instance", episode).doesNotContain(episode + "~2");
            assertThat(posted).as("posts of %s's standing notice from the pair", episode).doesNotContainKey(episode + "~2");
        }
        System.out.printf("acknowledgements: %d episodes acknowledged through the instance not owning their curve %s; "
                        + "%s, left alone, got its standing notice %d ms into the wait in both runs, the acknowledged none%n",
                early.size(), through, control, (System.nanoTime() - waitFrom) / 1_000_000);

        Instance controlOther = owners.get(control).equals(first.name()) ? second : first;
        ack(controlOther, controlStanding);
        ack(solo, controlStanding);
        return new Acknowledged(early, control, owners);
    }

    /** Acknowledges a notice through {@code instance}; the alert as it now stands. */
    private static JsonNode ack(Instance instance, String alertId) throws Exception {
        HttpResponse<String> r = instance.send("POST", "/api/alerts/" + alertId + "/ack",
                JSON.writeValueAsString(Map.of("by", "it-desk", "note", "seen, the desk is on it")));
        assertThat(r.statusCode()).as("ack of %s through %s: %s", alertId, instance.name(), r.body()).isEqualTo(200);
        return JSON.readTree(r.body());
    }

    /** {@code rule~subject~since} of a notice id {@code rule~subject~since~n}. */
    private static String episode(String alertId) {
        return alertId.substring(0, alertId.lastIndexOf('~'));
    }

    private static List<String> alertIds(JournalContents journal) {
        return journal.alerts().stream().map(a -> a.split(" \\| ")[0]).toList();
    }

    /** The journalled kind of a notice ({@code OPENING}, {@code STANDING}, {@code CLOSING}), or null when there is none. */
    private static String kindOf(JournalContents journal, String alertId) {
        return journal.alerts().stream().map(a -> a.split(" \\| ")).filter(a -> a[0].equals(alertId)).map(a -> a[5]).findFirst()
                .orElse(null);
    }

    /**
     * The survivor's first assignment after a kill, from its log: when (the log line's time, the daemon's local time on
     * this machine), how many partitions, and how many curves it rebuilt.
     */
    private record Takeover(long millisAfterKill, int partitions, int rebuilt) {

        private static final java.util.regex.Pattern ASSIGNED = java.util.regex.Pattern.compile(
                "(?m)^(\\d{4}-\\d{2}-\\d{2} \\d{2}:\\d{2}:\\d{2},\\d{3}) .*quotes partitions assigned \\[([^\\]]*)\\]: (\\d+) curve\\(s\\) rebuilt");
        private static final java.time.format.DateTimeFormatter LOG_TIME = java.time.format.DateTimeFormatter.ofPattern(
                "yyyy-MM-dd HH:mm:ss,SSS");

        static Takeover after(Instant killed, String log) {
            java.util.regex.Matcher m = ASSIGNED.matcher(log);
            while (m.find()) {
                Instant at = java.time.LocalDateTime.parse(m.group(1), LOG_TIME).atZone(java.time.ZoneId.systemDefault()).toInstant();
                if (!at.isBefore(killed.truncatedTo(ChronoUnit.MILLIS))) {
                    return new Takeover(Duration.between(killed, at).toMillis(), m.group(2).split(",").length, Integer.parseInt(m.group(3)));
                }
            }
            throw new AssertionError("the survivor logged no assignment after the kill at " + killed);
        }
    }

    /** A daemon of the test, with the write token its API takes. */
    private record Instance(DaemonProcess daemon, String token) implements AutoCloseable {

        static Instance start(String name, String topic, TestDatabase journal, String chatUrl, Path policy) {
            Map<String, String> settings = KafkaRuns.settings(topic, journal, chatUrl);
            settings.put("slopewatch.ingest.policy", policy.toString());
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

        String name() {
            return daemon.name();
        }

        @Override
        public void close() {
            daemon.close();
        }
    }
}
