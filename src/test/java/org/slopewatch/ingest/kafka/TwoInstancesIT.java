package org.slopewatch.ingest.kafka;

import static org.assertj.core.api.Assertions.assertThat;
import static org.slopewatch.ingest.kafka.KafkaRuns.CURVES;

import java.time.Duration;
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
            // and rebuilt only those: the curves the stopped instance had moved on, from their checkpoints and the quotes after
            java.util.regex.Matcher tookOver = java.util.regex.Pattern.compile("took over (\\d+) curve\\(s\\)").matcher(second.logText());
            int rebuilt = 0;
            while (tookOver.find()) {
                rebuilt = Integer.parseInt(tookOver.group(1));
            }
            assertThat(rebuilt).as("curves the surviving instance rebuilt when it took the stopped one's over")
                    .isBetween(1, CURVES.size() - 1);

            pair.assertEndsAs(single, quotes.size());

            Map<String, Long> pairSent = chat.noticesReceived("/pair/hook");
            Map<String, Long> soloSent = chat.noticesReceived("/solo/hook");
            assertThat(pairSent).as("notice id → posts the chat receiver got from the pair").isNotEmpty()
                    .allSatisfy((id, n) -> assertThat(n).as(id).isEqualTo(1L));
            assertThat(pairSent.keySet()).isEqualTo(soloSent.keySet());
        }
    }

    private static double accepted(DaemonProcess instance) {
        return instance.counter("slopewatch_quotes_accepted_total");
    }
}
