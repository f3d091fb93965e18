package org.slopewatch.ingest.pull;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.awaitility.Awaitility.await;

import com.sun.net.httpserver.HttpExchange;
import com.sun.net.httpserver.HttpServer;
import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import jakarta.inject.Inject;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.Executors;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.Tenor;
import org.slopewatch.journal.SourceFetches;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.pipeline.QuotePipeline;

/**
 * A daemon pulling five sources from a JDK {@code HttpServer} on 127.0.0.1 started by this test: the
 * Treasury-layout publication of {@code GOVT-A} (an inverted 10Y-3M held for two weeks, which the
 * test policy confirms after five days), and four sources of {@code GOVT-B} that fail each their
 * own way: nobody listening, an answer slower than the time-out, a body that is no publication, a
 * body cut short of its announced length. Nothing is posted by hand.
 */
@QuarkusTest
@TestProfile(PulledSourceTest.Pulled.class)
class PulledSourceTest {

    static final Fixtures SERVER = new Fixtures();

    public static final class Pulled implements QuarkusTestProfile {

        @Override
        public Map<String, String> getConfigOverrides() {
            Path dir = Path.of("target", "test-data", "pulled-" + UUID.randomUUID()).toAbsolutePath();
            Map<String, String> config = new HashMap<>();
            config.put("slopewatch.data-dir", dir.resolve("data").toString());
            config.put("slopewatch.ingest.policy", Path.of("src/test/resources/policies/pulled.yaml").toAbsolutePath().toString());
            config.put("slopewatch.ingest.curves", "GOVT-A,GOVT-B");
            config.put("slopewatch.delivery.retry.base", "100ms");
            config.put("slopewatch.delivery.retry.cap", "200ms");
            config.put("slopewatch.delivery.retry.max-age", "1s");
            config.put("slopewatch.delivery.retry.jitter", "0");
            config.put("slopewatch.sources.govt-a.url", SERVER.url("/govt-a/par.csv"));
            config.put("slopewatch.sources.govt-a.curve", "GOVT-A");
            config.put("slopewatch.sources.down.url", "http://127.0.0.1:" + closedPort() + "/par.csv");
            config.put("slopewatch.sources.down.curve", "GOVT-B");
            config.put("slopewatch.sources.slow.url", SERVER.url("/slow.csv"));
            config.put("slopewatch.sources.slow.curve", "GOVT-B");
            config.put("slopewatch.sources.slow.timeout", "300ms");
            config.put("slopewatch.sources.garbage.url", SERVER.url("/garbage.csv"));
            config.put("slopewatch.sources.garbage.curve", "GOVT-B");
            config.put("slopewatch.sources.cut.url", SERVER.url("/cut.csv"));
            config.put("slopewatch.sources.cut.curve", "GOVT-B");
            return config;
        }
    }

    @Inject
    QuotePipeline pipeline;
    @Inject
    SourceFetches fetches;
    @Inject
    SourceSchedule schedule;

    /**
     * The start-up fetch feeds the pipeline and the policy confirms the inversion; the next fetch sends the entity tag
     * back and a 304 changes nothing; a publication that changed a past value is a revision of that date alone.
     */
    @Test
    void aPublicationFeedsThePipelineThenA304ChangesNothingThenAChangedPastValueIsARevision() throws Exception {
        // 10Y-3M on every date of the fixture: 4.20 % - 4.50 % = -30 bp, below zero from 2026-06-01 to 2026-06-12
        await().atMost(Duration.ofSeconds(30)).untilAsserted(() -> assertThat(spread("GOVT-A")).extracting(SpreadStatus::state)
                .as("ten business days below zero pass the five-day test of the policy").isEqualTo(SpreadState.CONFIRMED));
        SourceFetches.Fetch first = fetches.recent("govt-a", 10).get(0);
        assertThat(first.outcome()).isEqualTo("forwarded");
        assertThat(first.httpStatus()).isEqualTo(200);
        assertThat(first.datesNew()).as("the fixture's dates, all new").isEqualTo(10);
        assertThat(first.datesRevised() + first.datesUnchanged() + first.rejected()).isZero();
        assertThat(first.etag()).isEqualTo("\"v1\"");

        schedule.pullNow("govt-a");
        // RFC 9110, 13.1.2: If-None-Match carries the entity tag of the representation held; 15.4.5: 304, nothing to transfer
        assertThat(SERVER.ifNoneMatch).last().isEqualTo("\"v1\"");
        SourceFetches.Fetch second = fetches.recent("govt-a", 10).get(0);
        assertThat(second.outcome()).isEqualTo("not-modified");
        assertThat(second.httpStatus()).isEqualTo(304);
        assertThat(second.datesNew() + second.datesRevised() + second.datesUnchanged()).isZero();

        SERVER.publish("/sources/govt-a-par-v2.csv", "\"v2\"");
        schedule.pullNow("govt-a");
        SourceFetches.Fetch third = fetches.recent("govt-a", 10).get(0);
        assertThat(third.outcome()).isEqualTo("forwarded");
        assertThat(third.datesRevised()).as("2026-06-03's 10Y moved from 4.20 to 4.60").isEqualTo(1);
        assertThat(third.datesNew()).isZero();
        assertThat(third.datesUnchanged()).isEqualTo(9);
        assertThat(pipeline.curve("GOVT-A", LocalDate.of(2026, 6, 3)).yieldBp(Tenor.parse("10Y")))
                .as("4.60 percent in bp, to within the rounding of a percent times 100").isCloseTo(460.0, within(1e-9));

        schedule.pullNow("govt-a");
        assertThat(SERVER.ifNoneMatch).last().as("the validators of the publication read last").isEqualTo("\"v2\"");
        assertThat(fetches.recent("govt-a", 1).get(0).outcome()).isEqualTo("not-modified");
    }

    @Test
    void aSourceNobodyAnswersIsRetriedJournalledCountedAndUnwell() {
        // retry every 100 ms to 200 ms for at most 1 s: more than one attempt, each journalled
        await().atMost(Duration.ofSeconds(20)).until(() -> fetches.recent("down", 10).size() >= 2);
        for (SourceFetches.Fetch f : fetches.recent("down", 10)) {
            assertThat(f.outcome()).isEqualTo("failed");
            assertThat(f.httpStatus()).as("no answer, no status").isNull();
            assertThat(f.detail()).isEqualTo("could not connect");
        }
        String health = given().get("/q/health/well").then().statusCode(503).extract().asString();
        assertThat(health).contains("pulled sources").contains("\"down\": \"failing: no answer yet, failures in a row")
                .as("the open answer gives no reason").doesNotContain("could not connect");
        String metrics = given().get("/q/metrics").then().statusCode(200).extract().asString();
        assertThat(metrics).containsPattern("slopewatch_source_fetch_failures_total\\{source=\"down\"} [1-9]");
        assertThat(metrics).contains("slopewatch_source_fetch_failures_total{source=\"govt-a\"} 0.0");
        assertThat(noQuotes("GOVT-B")).isTrue();
    }

    @Test
    void anAnswerSlowerThanTheTimeOutIsAFailure() {
        await().atMost(Duration.ofSeconds(20)).until(() -> !fetches.recent("slow", 1).isEmpty());
        SourceFetches.Fetch f = fetches.recent("slow", 1).get(0);
        assertThat(f.outcome()).isEqualTo("failed");
        assertThat(f.detail()).isEqualTo("no answer within 0.3s");
        assertThat(noQuotes("GOVT-B")).isTrue();
    }

    @Test
    void aBodyThatIsNoPublicationIsRefusedWholeAndJournalled() {
        await().atMost(Duration.ofSeconds(20)).until(() -> !fetches.recent("garbage", 1).isEmpty());
        SourceFetches.Fetch f = fetches.recent("garbage", 1).get(0);
        assertThat(f.outcome()).isEqualTo("refused");
        assertThat(f.httpStatus()).isEqualTo(200);
        assertThat(f.rejected()).isEqualTo(1);
        assertThat(f.detail()).as("the reader names the source, line and column").startsWith("refused: garbage:1:1: ");
        assertThat(f.datesNew() + f.datesRevised() + f.datesUnchanged()).isZero();
        assertThat(f.etag()).as("a refused body's validators are not kept: the next fetch asks for it whole").isNull();
        assertThat(noQuotes("GOVT-B")).isTrue();
    }

    @Test
    void aBodyCutShortOfItsLengthIsNotForwarded() {
        await().atMost(Duration.ofSeconds(20)).until(() -> !fetches.recent("cut", 1).isEmpty());
        SourceFetches.Fetch f = fetches.recent("cut", 1).get(0);
        assertThat(f.outcome()).isEqualTo("failed");
        assertThat(f.detail()).startsWith("the answer broke off");
        assertThat(noQuotes("GOVT-B")).as("the rows read before the cut are not forwarded").isTrue();
    }

    private SpreadStatus spread(String curve) {
        return pipeline.spreads().stream().filter(s -> s.curve().equals(curve) && s.spread().equals("10Y-3M")).findFirst().orElse(null);
    }

    private boolean noQuotes(String curve) {
        return pipeline.latestCurves().stream().noneMatch(c -> c.curve().equals(curve));
    }

    private static int closedPort() {
        try (ServerSocket s = new ServerSocket(0, 1, InetAddress.getLoopbackAddress())) {
            return s.getLocalPort();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The publications, served on 127.0.0.1 for the life of the test JVM. */
    static final class Fixtures {

        final List<String> ifNoneMatch = new CopyOnWriteArrayList<>();
        private final AtomicReference<String[]> govtA = new AtomicReference<>();
        private final HttpServer server;

        Fixtures() {
            try {
                publish("/sources/govt-a-par-v1.csv", "\"v1\"");
                server = HttpServer.create(new InetSocketAddress(InetAddress.getLoopbackAddress(), 0), 0);
                server.setExecutor(Executors.newCachedThreadPool(r -> {
                    Thread t = new Thread(r, "pulled-source-fixtures");
                    t.setDaemon(true);
                    return t;
                }));
                server.createContext("/govt-a/par.csv", this::govtA);
                server.createContext("/slow.csv", ex -> {
                    sleep(3_000);
                    send(ex, 200, "Date,\"3 Mo\",\"10 Yr\"\n06/01/2026,4.50,4.20\n");
                });
                server.createContext("/garbage.csv", ex -> send(ex, 200, "<html><body>Down for maintenance</body></html>\n"));
                server.createContext("/cut.csv", ex -> {
                    byte[] part = "Date,\"3 Mo\",\"10 Yr\"\n06/01/2026,4.50,4.20\n".getBytes(StandardCharsets.UTF_8);
                    ex.sendResponseHeaders(200, 10_000);
                    OutputStream out = ex.getResponseBody();
                    out.write(part);
                    out.flush();
                    // the connection goes before the 10 000 bytes announced
                    ex.close();
                });
                server.start();
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }

        String url(String path) {
            return "http://127.0.0.1:" + server.getAddress().getPort() + path;
        }

        void publish(String resource, String etag) {
            try (var in = PulledSourceTest.class.getResourceAsStream(resource)) {
                govtA.set(new String[] {new String(in.readAllBytes(), StandardCharsets.UTF_8), etag});
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }

        private void govtA(HttpExchange ex) throws IOException {
            String[] current = govtA.get();
            String asked = ex.getRequestHeaders().getFirst("If-None-Match");
            if (asked != null) {
                ifNoneMatch.add(asked);
            }
            // RFC 9110, 13.1.2: the condition is false when the entity tag asked for is the current one: 304, no body
            if (current[1].equals(asked)) {
                ex.getResponseHeaders().set("ETag", current[1]);
                ex.sendResponseHeaders(304, -1);
                ex.close();
                return;
            }
            ex.getResponseHeaders().set("ETag", current[1]);
            ex.getResponseHeaders().set("Last-Modified", "Fri, 12 Jun 2026 21:00:00 GMT");
            send(ex, 200, current[0]);
        }

        private static void send(HttpExchange ex, int status, String body) throws IOException {
            byte[] bytes = body.getBytes(StandardCharsets.UTF_8);
            ex.getResponseHeaders().set("Content-Type", "text/csv; charset=utf-8");
            ex.sendResponseHeaders(status, bytes.length);
            try (OutputStream out = ex.getResponseBody()) {
                out.write(bytes);
            }
        }

        private static void sleep(long millis) {
            try {
                Thread.sleep(millis);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
    }
}
