package org.slopewatch.ingest.kafka;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeSet;
import java.util.UUID;
import org.apache.kafka.clients.producer.KafkaProducer;
import org.junit.jupiter.api.Test;
import org.slopewatch.delivery.TestHttpReceiver;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.testsupport.DaemonProcess;
import org.slopewatch.testsupport.JournalContents;
import org.slopewatch.testsupport.PostgresServer;
import org.slopewatch.testsupport.PostgresServer.TestDatabase;

/**
 * Crash recovery with Kafka and PostgreSQL: a packaged daemon is killed with SIGKILL at random
 * moments while quotes stream in, and started again each time. In the end its journal must equal
 * that of a daemon that took the same quotes without interruption (transitions, spells, notices,
 * deliveries), every notice must have reached the chat receiver, and a notice may reach it twice
 * only when a kill fell between the post and its record: at most one extra post per kill, since
 * a channel's worker has one delivery in flight at a time.
 *
 * <p>The short form (CI) kills twice; {@code bench/faults/crash.sh} runs the long form
 * ({@code -Dslopewatch.faults.kills=10}). {@code -Dslopewatch.faults.seed=N} repeats a run's
 * moments. The figures go to {@code target/faults/crash.txt}.
 */
class CrashIT {

    private static final int KILLS = Integer.getInteger("slopewatch.faults.kills", 2);
    private static final long SEED = Long.getLong("slopewatch.faults.seed", new Random().nextLong());
    private static final int DAYS_PER_SECOND = 30;
    private static final Duration READY = Duration.ofSeconds(120);

    @Test
    void aDaemonKilledAtRandomMomentsEndsWhereAnUninterruptedOneDoes() throws Exception {
        String run = "crash-" + UUID.randomUUID().toString().substring(0, 8);
        String crashTopic = "slopewatch.quotes." + run + ".killed";
        String soloTopic = "slopewatch.quotes." + run + ".solo";
        KafkaRuns.createTopics(crashTopic, soloTopic);
        // long enough that the kills are spread over the stream: about 12 s of quotes per kill at least
        int businessDays = Math.max(650, KILLS * 12 * DAYS_PER_SECOND);
        List<QuoteMessage> quotes = KafkaRuns.scenarioQuotes(11, businessDays);
        TreeSet<Integer> killAt = killMoments(quotes.size());
        System.out.printf("crash test: %d kill(s), seed %d (-Dslopewatch.faults.seed=%d repeats the moments), %d quotes%n", KILLS, SEED,
                SEED, quotes.size());

        List<DaemonProcess> lives = new ArrayList<>();
        try (TestDatabase crashJournal = PostgresServer.freshDatabase(); TestDatabase soloJournal = PostgresServer.freshDatabase();
             TestHttpReceiver chat = TestHttpReceiver.start();
             DaemonProcess solo = KafkaRuns.start(run + "-solo", soloTopic, soloJournal, chat.url("/solo/hook"));
             KafkaProducer<String, String> producer = KafkaRuns.producer()) {
            lives.add(KafkaRuns.start(run + "-life-0", crashTopic, crashJournal, chat.url("/killed/hook")).awaitReady(READY));
            solo.awaitReady(READY);

            int perTick = KafkaRuns.CURVES.size() * DAYS_PER_SECOND / 10;
            for (int i = 0; i < quotes.size(); i++) {
                KafkaRuns.send(producer, quotes.get(i), crashTopic, soloTopic);
                if (i % perTick == perTick - 1) {
                    producer.flush();
                    Thread.sleep(100);
                }
                if (killAt.contains(i)) {
                    // the next life starts at once, while quotes keep coming: it may itself be killed starting up
                    lives.get(lives.size() - 1).kill();
                    lives.add(KafkaRuns.start(run + "-life-" + lives.size(), crashTopic, crashJournal, chat.url("/killed/hook")));
                }
            }
            producer.flush();
            DaemonProcess last = lives.get(lives.size() - 1).awaitReady(READY);

            // a delivery claimed by a killed life waits out its two-minute claim before the next life takes it
            KafkaRuns.awaitSettled(Duration.ofMinutes(6), quotes.size(), crashJournal, soloJournal);

            JournalContents killed = KafkaRuns.contents(crashJournal);
            JournalContents uninterrupted = KafkaRuns.contents(soloJournal);
            Map<String, Long> received = chat.noticesReceived("/killed/hook");
            Map<String, Long> receivedUninterrupted = chat.noticesReceived("/solo/hook");
            long extraPosts = received.values().stream().mapToLong(n -> n - 1).sum();
            String figures = String.format("kills=%d seed=%d quotes=%d transitions=%d spells=%d notices=%d posts=%d extra_posts=%d "
                            + "restarts_rebuilt_from=%s", KILLS, SEED, quotes.size(), killed.transitions().size(), killed.spells().size(),
                    killed.alerts().size(), received.values().stream().mapToLong(Long::longValue).sum(), extraPosts, rebuilds(lives));
            System.out.println("crash test: " + figures);
            report(figures);

            assertThat(uninterrupted.transitions()).anyMatch(t -> t.contains(" | CONFIRMED | "));
            assertThat(last.isAlive()).isTrue();
            killed.assertEndsAs(uninterrupted, quotes.size());
            assertThat(received.keySet()).as("every notice reached the receiver").isEqualTo(receivedUninterrupted.keySet());
            assertThat(extraPosts).as("posts beyond the first, at most one per kill").isLessThanOrEqualTo(KILLS);
        } finally {
            lives.forEach(DaemonProcess::close);
        }
    }

    /** KILLS distinct quote positions between 10 % and 90 % of the stream, from the seed. */
    private static TreeSet<Integer> killMoments(int quotes) {
        Random random = new Random(SEED);
        TreeSet<Integer> at = new TreeSet<>();
        while (at.size() < KILLS) {
            at.add(quotes / 10 + random.nextInt(quotes * 8 / 10));
        }
        return at;
    }

    /** How many journalled quote messages each restarted life rebuilt from, as its log says. */
    private static List<String> rebuilds(List<DaemonProcess> lives) {
        List<String> out = new ArrayList<>();
        for (DaemonProcess life : lives.subList(1, lives.size())) {
            String log = life.logText();
            int i = log.indexOf("rebuilt from ");
            out.add(i < 0 ? "killed before start-up finished" : log.substring(i + 13, log.indexOf(' ', i + 13)));
        }
        return out;
    }

    private static void report(String figures) throws IOException {
        Path file = Path.of("target", "faults", "crash.txt");
        Files.createDirectories(file.getParent());
        Files.writeString(file, figures + System.lineSeparator());
    }
}
