package org.slopewatch.ingest.kafka;

import static org.assertj.core.api.Assertions.assertThat;

import com.icegreen.greenmail.util.GreenMail;
import com.icegreen.greenmail.util.ServerSetup;
import jakarta.mail.internet.MimeMessage;
import java.io.IOException;
import java.net.ServerSocket;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.UUID;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.apache.kafka.clients.producer.KafkaProducer;
import org.awaitility.Awaitility;
import org.junit.jupiter.api.Test;
import org.slopewatch.delivery.TestHttpReceiver;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.testsupport.DaemonProcess;
import org.slopewatch.testsupport.JournalContents;
import org.slopewatch.testsupport.PostgresServer;
import org.slopewatch.testsupport.PostgresServer.TestDatabase;
import org.slopewatch.testsupport.TcpProxy;

/**
 * Outages of everything the daemon depends on, with the packaged daemon on Kafka: the database
 * unreachable when it starts and again in the middle of the stream, the chat receiver down and the
 * SMTP server unreachable, each for a while (the database and the mail server through TCP proxies
 * that are cut and restored). The daemon
 * must wait rather than die, be not ready while the journal is out of reach, leave quotes on
 * Kafka until they are journalled, and in the end hold exactly what an undisturbed daemon on the
 * same quotes holds, with every notice delivered by chat and by mail.
 *
 * <p>The short form (CI) keeps each outage to {@code slopewatch.faults.outage-seconds} (15 s);
 * {@code bench/faults/outages.sh} runs it with 300 s, the five minutes the reliability notes report.
 */
class OutageIT {

    private static final int OUTAGE_SECONDS = Integer.getInteger("slopewatch.faults.outage-seconds", 15);
    private static final int BUSINESS_DAYS = 650;
    private static final int DAYS_PER_SECOND = 30;
    private static final Duration READY = Duration.ofSeconds(180);
    private static final String MAIL_TO = "risk@desk.example";

    @Test
    void nothingIsLostWhileTheDatabaseTheChatServiceAndTheMailServerAreAway() throws Exception {
        String run = "outage-" + UUID.randomUUID().toString().substring(0, 8);
        String outageTopic = "slopewatch.quotes." + run + ".outages";
        String calmTopic = "slopewatch.quotes." + run + ".calm";
        KafkaRuns.createTopics(outageTopic, calmTopic);
        List<QuoteMessage> quotes = KafkaRuns.scenarioQuotes(13, BUSINESS_DAYS);
        GreenMail smtp = new GreenMail(new ServerSetup(freePort(), "127.0.0.1", ServerSetup.PROTOCOL_SMTP));
        GreenMail calmSmtp = new GreenMail(new ServerSetup(freePort(), "127.0.0.1", ServerSetup.PROTOCOL_SMTP));
        smtp.start();
        calmSmtp.start();

        try (TestDatabase journal = PostgresServer.freshDatabase(); TestDatabase calmJournal = PostgresServer.freshDatabase();
             TcpProxy database = TcpProxy.to("127.0.0.1", port(journal.url()));
             TcpProxy mail = TcpProxy.to("127.0.0.1", smtp.getSmtp().getPort());
             TestHttpReceiver chat = TestHttpReceiver.start();
             TestHttpReceiver calmChat = TestHttpReceiver.start();
             KafkaProducer<String, String> producer = KafkaRuns.producer()) {
            // 1. the database is away when the daemon starts: it waits, and is not ready
            database.cut();
            Map<String, String> settings = withMail(KafkaRuns.settings(outageTopic, journal, chat.url("/outages/hook")), mail.port());
            settings.put("slopewatch.journal.url", journal.url().replace(":" + port(journal.url()) + "/", ":" + database.port() + "/"));
            try (DaemonProcess daemon = DaemonProcess.start(run + "-outages", settings, KafkaRuns.secrets(journal));
                 DaemonProcess calm = DaemonProcess.start(run + "-calm", withMail(KafkaRuns.settings(calmTopic, calmJournal,
                         calmChat.url("/calm/hook")), calmSmtp.getSmtp().getPort()), KafkaRuns.secrets(calmJournal))) {
                Awaitility.await("the daemon saying it waits for the journal").atMost(Duration.ofSeconds(90))
                        .until(() -> daemon.logText().contains("not reachable at start"));
                assertThat(daemon.isAlive()).as("alive, waiting for the journal").isTrue();
                assertThat(daemon.isReady()).isFalse();
                database.restore();
                daemon.awaitReady(READY);
                calm.awaitReady(READY);

                // 2. quotes flow; the chat receiver, the database and the mail server go away in turn
                int perTick = KafkaRuns.CURVES.size() * DAYS_PER_SECOND / 10;
                boolean sawNotReady = false;
                long chatDownAt = 0;
                long dbDownAt = 0;
                long mailDownAt = 0;
                for (int i = 0; i < quotes.size(); i++) {
                    KafkaRuns.send(producer, quotes.get(i), outageTopic, calmTopic);
                    if (i % perTick == perTick - 1) {
                        producer.flush();
                        Thread.sleep(100);
                        long now = System.nanoTime();
                        if (dbDownAt != 0 && !daemon.isReady()) {
                            sawNotReady = true;
                        }
                        if (chatDownAt != 0 && seconds(now - chatDownAt) >= OUTAGE_SECONDS) {
                            chat.restart();
                            chatDownAt = 0;
                        }
                        if (dbDownAt != 0 && seconds(now - dbDownAt) >= Math.min(OUTAGE_SECONDS, 30)) {
                            database.restore();
                            dbDownAt = -1;
                        }
                        if (mailDownAt != 0 && seconds(now - mailDownAt) >= OUTAGE_SECONDS) {
                            mail.restore();
                            mailDownAt = -1;
                        }
                    }
                    if (i == quotes.size() / 5) {
                        chat.stop();
                        chatDownAt = System.nanoTime();
                    }
                    if (i == quotes.size() / 4) {
                        mail.cut();
                        mailDownAt = System.nanoTime();
                    }
                    if (i == quotes.size() / 3) {
                        database.cut();
                        dbDownAt = System.nanoTime();
                    }
                }
                producer.flush();
                // whatever is still away comes back now (a short stream, a long outage)
                if (chatDownAt > 0) {
                    Thread.sleep(Math.max(0, OUTAGE_SECONDS * 1000L - (System.nanoTime() - chatDownAt) / 1_000_000));
                    chat.restart();
                }
                if (dbDownAt > 0) {
                    Thread.sleep(Math.max(0, Math.min(OUTAGE_SECONDS, 30) * 1000L - (System.nanoTime() - dbDownAt) / 1_000_000));
                    database.restore();
                }
                if (mailDownAt > 0) {
                    Thread.sleep(Math.max(0, OUTAGE_SECONDS * 1000L - (System.nanoTime() - mailDownAt) / 1_000_000));
                    mail.restore();
                }

                KafkaRuns.awaitSettled(Duration.ofMinutes(4), quotes.size(), journal, calmJournal);

                JournalContents disturbed = KafkaRuns.contents(journal);
                JournalContents undisturbed = KafkaRuns.contents(calmJournal);
                Map<String, Long> chatPosts = chat.noticesReceived("/outages/hook");
                Set<String> mailed = subjects(smtp);
                String figures = String.format("outage_seconds=%d quotes=%d transitions=%d notices=%d chat_posts=%d mails=%d "
                                + "not_ready_seen=%s journal_waits_logged=%d", OUTAGE_SECONDS, quotes.size(), disturbed.transitions().size(),
                        disturbed.alerts().size(), chatPosts.values().stream().mapToLong(Long::longValue).sum(), mailed.size(),
                        sawNotReady, count(daemon.logText(), "journal unreachable"));
                System.out.println("outage test: " + figures);
                Path file = Path.of("target", "faults", "outages.txt");
                Files.createDirectories(file.getParent());
                Files.writeString(file, figures + System.lineSeparator());

                assertThat(daemon.isAlive()).isTrue();
                assertThat(sawNotReady).as("not ready while the journal was out of reach").isTrue();
                disturbed.assertEndsAs(undisturbed, quotes.size());
                assertThat(disturbed.deliveries()).noneMatch(d -> d.endsWith(" | FAILED"));
                assertThat(chatPosts.keySet()).as("every notice reached the chat receiver")
                        .isEqualTo(calmChat.noticesReceived("/calm/hook").keySet());
                assertThat(mailed).as("every notice for the mail channel arrived").isEqualTo(subjects(calmSmtp))
                        .isEqualTo(expectedMailTitles(undisturbed)).isNotEmpty();
            }
        } finally {
            smtp.stop();
            calmSmtp.stop();
        }
    }

    private static Set<String> subjects(GreenMail smtp) throws Exception {
        Set<String> out = new TreeSet<>();
        for (MimeMessage m : smtp.getReceivedMessages()) {
            out.add(m.getSubject());
        }
        return out;
    }

    private static Set<String> expectedMailTitles(JournalContents journal) {
        Set<String> ids = journal.deliveries().stream().filter(d -> d.contains(" | risk-email | ")).map(d -> d.split(" \\| ")[0])
                .collect(Collectors.toSet());
        return journal.alerts().stream().filter(a -> ids.contains(a.split(" \\| ")[0])).map(a -> a.split(" \\| ")[9])
                .collect(Collectors.toCollection(TreeSet::new));
    }

    private static Map<String, String> withMail(Map<String, String> settings, int smtpPort) {
        settings.put("slopewatch.channels.risk-email.type", "email");
        settings.put("slopewatch.channels.risk-email.to", MAIL_TO);
        settings.put("quarkus.mailer.mock", "false");
        settings.put("quarkus.mailer.host", "127.0.0.1");
        settings.put("quarkus.mailer.port", Integer.toString(smtpPort));
        settings.put("quarkus.mailer.from", "slopewatch@desk.example");
        settings.put("quarkus.mailer.timeout", "5s");
        // retries soon after a service returns, so that the test need not wait out the default schedule
        settings.put("slopewatch.delivery.retry.base", "1s");
        settings.put("slopewatch.delivery.retry.cap", "5s");
        return settings;
    }

    private static int port(String jdbcUrl) {
        Matcher m = Pattern.compile("//[^:/]+:(\\d+)/").matcher(jdbcUrl);
        if (!m.find()) {
            throw new IllegalArgumentException("no port in " + jdbcUrl);
        }
        return Integer.parseInt(m.group(1));
    }

    private static int freePort() throws IOException {
        try (ServerSocket s = new ServerSocket(0)) {
            return s.getLocalPort();
        }
    }

    private static long seconds(long nanos) {
        return nanos / 1_000_000_000L;
    }

    private static long count(String text, String what) {
        return Arrays.stream(text.split("\n")).filter(l -> l.contains(what)).count();
    }
}
