package org.slopewatch.bench;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Properties;
import java.util.UUID;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.kafka.clients.consumer.ConsumerRecords;
import org.apache.kafka.clients.consumer.KafkaConsumer;
import org.apache.kafka.clients.producer.KafkaProducer;
import org.apache.kafka.clients.producer.ProducerRecord;
import org.apache.kafka.common.serialization.StringDeserializer;
import org.apache.kafka.common.serialization.StringSerializer;

/**
 * Sustained ingest over Kafka with the journal on, next to a bare Kafka consumer reading the
 * same topic in the same run, and the latency from a record's {@code time} to its journalled
 * row at a steady rate below capacity. Not a test; {@code bench/ingest-kafka.sh} runs it.
 *
 * <p>Arguments: bootstrap servers, messages (snapshots of 11 tenors), the daemon's jar, the
 * project directory, the HTTP port for the daemon.
 */
public final class KafkaIngestBench {

    private static final int TENORS = 11;

    public static void main(String[] args) throws Exception {
        String bootstrap = args[0];
        int messages = Integer.parseInt(args[1]);
        Path jar = Path.of(args[2]);
        Path home = Path.of(args[3]);
        int port = Integer.parseInt(args[4]);
        String topic = "bench-quotes-" + UUID.randomUUID();
        List<String> bodies = snapshots(messages, LocalDate.of(2030, 1, 1));

        produce(bootstrap, topic, bodies, 0);
        double bareRate = bareConsumer(bootstrap, topic, messages) * TENORS;

        Path data = Files.createTempDirectory("slopewatch-kafka-bench-");
        String policy = System.getenv().getOrDefault("BENCH_POLICY", "alert-rules/default.yaml");
        // BENCH_JOURNAL_URL (a fresh PostgreSQL database) with BENCH_JOURNAL_USER and BENCH_JOURNAL_PASSWORD; default: H2 in data
        String journalUrl = System.getenv().getOrDefault("BENCH_JOURNAL_URL", "jdbc:h2:file:" + data.resolve("journal")
                + ";DB_CLOSE_ON_EXIT=FALSE");
        String journalUser = System.getenv().getOrDefault("BENCH_JOURNAL_USER", "");
        String journalPassword = System.getenv().getOrDefault("BENCH_JOURNAL_PASSWORD", "");
        ProcessBuilder launch = new ProcessBuilder("java", "-Xmx2g", "-Dslopewatch.home=" + home, "-Dslopewatch.data-dir=" + data,
                "-Dslopewatch.journal.url=" + journalUrl, "-Dslopewatch.journal.username=" + journalUser,
                "-Dslopewatch.ingest.policy=" + home.resolve(policy),
                "-Dslopewatch.ingest.max-days-ahead=36500", "-Dquarkus.http.port=" + port,
                // quotes come from the topic; the daemon still wants a write token to start
                "-Dslopewatch.security.write-tokens=bench-" + java.util.UUID.randomUUID(), "-Dkafka.bootstrap.servers=" + bootstrap,
                // the profile-specific keys, which win over plain ones in the kafka profile
                "-D%kafka.mp.messaging.incoming.quotes.topic=" + topic, "-D%kafka.mp.messaging.incoming.quotes.group.id=bench-" + UUID.randomUUID(),
                "-Dquarkus.log.category.\"org.slopewatch.transitions\".level=WARN",
                "-jar", jar.toString(), "serve", "--kafka")
                .redirectErrorStream(true).redirectOutput(home.resolve("bench/out/ingest-kafka-daemon.log").toFile());
        launch.environment().put("SLOPEWATCH_JOURNAL_PASSWORD", journalPassword);
        Process daemon = launch.start();
        HttpClient http = HttpClient.newHttpClient();
        try {
            // drain: the whole topic, from the daemon's first accepted message to the last
            long first = waitForAccepted(http, port, 1, Duration.ofMinutes(3));
            long done = waitForAccepted(http, port, messages, Duration.ofMinutes(30));
            double daemonRate = (double) messages * TENORS / ((done - first) / 1e9);

            // latency at a steady rate below capacity: time stamp at send, compare with the journal after
            int steady = Math.max(2_000, messages / 20);
            int perSecond = (int) Math.max(100, daemonRate / TENORS / 4);
            List<String> later = snapshots(steady, LocalDate.of(2110, 1, 1));
            produce(bootstrap, topic, later, perSecond);
            waitForAccepted(http, port, messages + steady, Duration.ofMinutes(10));
            daemon.destroy();
            daemon.waitFor();
            double[] latencies = latenciesMs(journalUrl, journalUser, journalPassword, LocalDate.of(2110, 1, 1));
            System.out.printf(Locale.ROOT, "ingest-kafka policy=" + policy + " journal=" + journalUrl.replaceAll("[;?].*", "") + " messages=%d quotes=%d quotes_per_s=%.0f bare_consumer_quotes_per_s=%.0f ratio=%.3f "
                            + "steady_messages=%d steady_rate_msgs_per_s=%d p50_ms=%.1f p99_ms=%.1f%n",
                    messages, (long) messages * TENORS, daemonRate, bareRate, daemonRate / bareRate, steady, perSecond,
                    latencies[0], latencies[1]);
        } finally {
            daemon.destroy();
        }
    }

    /** Sends the bodies keyed by curve; with a rate, paced to it, each record's {@code time} set as it leaves. */
    static void produce(String bootstrap, String topic, List<String> bodies, int perSecond) {
        Properties p = new Properties();
        p.put("bootstrap.servers", bootstrap);
        p.put("key.serializer", StringSerializer.class.getName());
        p.put("value.serializer", StringSerializer.class.getName());
        p.put("linger.ms", "5");
        try (KafkaProducer<String, String> producer = new KafkaProducer<>(p)) {
            long start = System.nanoTime();
            for (int i = 0; i < bodies.size(); i++) {
                if (perSecond > 0) {
                    long due = start + (long) (i * 1e9 / perSecond);
                    while (System.nanoTime() < due) {
                        Thread.onSpinWait();
                    }
                }
                String body = bodies.get(i).replace("\"time\":\"T\"", "\"time\":\"" + Instant.now() + "\"");
                producer.send(new ProducerRecord<>(topic, body.contains("GOVT-A") ? "GOVT-A" : "GOVT-B", body));
            }
            producer.flush();
        }
    }

    /** Messages per second a plain consumer reads the topic at, from its first record to the last. */
    static double bareConsumer(String bootstrap, String topic, int messages) {
        Properties p = new Properties();
        p.put("bootstrap.servers", bootstrap);
        p.put("group.id", "bench-bare-" + UUID.randomUUID());
        p.put("auto.offset.reset", "earliest");
        p.put("key.deserializer", StringDeserializer.class.getName());
        p.put("value.deserializer", StringDeserializer.class.getName());
        try (KafkaConsumer<String, String> consumer = new KafkaConsumer<>(p)) {
            consumer.subscribe(List.of(topic));
            long read = 0;
            long first = 0;
            long bytes = 0;
            while (read < messages) {
                ConsumerRecords<String, String> records = consumer.poll(Duration.ofMillis(500));
                if (!records.isEmpty() && first == 0) {
                    first = System.nanoTime();
                }
                for (var r : records) {
                    bytes += r.value().length();
                    read++;
                }
            }
            if (bytes == 0) {
                throw new IllegalStateException("read nothing");
            }
            return messages / ((System.nanoTime() - first) / 1e9);
        }
    }

    private static final Pattern ACCEPTED = Pattern.compile("slopewatch_quotes_accepted_total\\{origin=\"kafka\",?\\} ([0-9.E]+)");

    /** Waits until the daemon has accepted {@code count} messages from Kafka; returns System.nanoTime() then. */
    static long waitForAccepted(HttpClient http, int port, long count, Duration timeout) throws Exception {
        long deadline = System.nanoTime() + timeout.toNanos();
        while (System.nanoTime() < deadline) {
            try {
                String metrics = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/q/metrics")).build(),
                        HttpResponse.BodyHandlers.ofString()).body();
                Matcher m = ACCEPTED.matcher(metrics);
                if (m.find() && Double.parseDouble(m.group(1)) >= count) {
                    return System.nanoTime();
                }
            } catch (java.io.IOException notUpYet) {
                // the daemon is still starting
            }
            Thread.sleep(20);
        }
        throw new IllegalStateException("the daemon did not accept " + count + " messages in " + timeout);
    }

    /** p50 and p99 of (recorded_at − sent_at) in ms for the messages dated from {@code from}. */
    static double[] latenciesMs(String journalUrl, String user, String password, LocalDate from) throws Exception {
        List<Double> ms = new ArrayList<>();
        try (Connection c = DriverManager.getConnection(journalUrl, user, password);
             Statement s = c.createStatement();
             ResultSet rs = s.executeQuery("SELECT sent_at, recorded_at FROM quote WHERE market_date >= DATE '" + from + "'")) {
            while (rs.next()) {
                ms.add(Duration.between(rs.getTimestamp(1).toInstant(), rs.getTimestamp(2).toInstant()).toNanos() / 1e6);
            }
        }
        ms.sort(null);
        return new double[] {ms.get(ms.size() / 2), ms.get((int) Math.ceil(ms.size() * 0.99) - 1)};
    }

    /** Snapshot messages of consecutive business days on two curves, with a {@code time} placeholder. */
    static List<String> snapshots(int count, LocalDate start) {
        List<String> out = new ArrayList<>(count);
        for (String item : IngestBench.items(count, start)) {
            out.add(item.replace("\"unit\":\"bp\"", "\"unit\":\"bp\",\"time\":\"T\""));
        }
        return out;
    }
}
