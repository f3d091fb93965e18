package org.slopewatch.ops;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;

import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.awaitility.Awaitility;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.slopewatch.delivery.ClosedPort;
import org.slopewatch.delivery.SmtpTestResource;
import org.slopewatch.delivery.TestHttpReceiver;

/**
 * Health on a daemon whose policy ({@code policies/health.yaml}) has every channel configured:
 * {@code desk-chat} at a real HTTP receiver, {@code risk-email} at the GreenMail SMTP server, and
 * {@code desk-pager} at a loopback port nothing listens on. With both curves quoted and nothing
 * sent yet, everything is UP; once a notice goes to the pager, its refused connections make the
 * delivery check DOWN after the third attempt (the default threshold), while readiness stays UP.
 * Answers are read as the MicroProfile Health protocol lays them out ({@link HealthAnswer}).
 */
@QuarkusTest
@TestProfile(HealthConfiguredDeskTest.Configured.class)
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class HealthConfiguredDeskTest {

    private static final Duration PATIENCE = Duration.ofSeconds(60);
    static TestHttpReceiver chat;

    /** Every channel of the policy configured, short retries so that three attempts take about a second. */
    public static final class Configured implements QuarkusTestProfile {

        @Override
        public Map<String, String> getConfigOverrides() {
            if (chat == null) {
                chat = TestHttpReceiver.start();
            }
            Path dir = Path.of("target", "test-data", "health-configured-" + UUID.randomUUID()).toAbsolutePath();
            Path policy = dir.resolve("policy.yaml");
            try {
                Files.createDirectories(dir);
                Files.copy(Path.of("src/test/resources/policies/health.yaml"), policy);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            Map<String, String> config = new LinkedHashMap<>();
            config.put("slopewatch.data-dir", dir.resolve("data").toString());
            config.put("slopewatch.ingest.policy", policy.toString());
            config.put("slopewatch.ingest.curves", "GOVT-A,GOVT-B");
            config.put("slopewatch.channels.desk-chat.type", "chat-webhook");
            config.put("slopewatch.channels.desk-chat.url", chat.url("/hooks/desk"));
            config.put("slopewatch.channels.risk-email.type", "email");
            config.put("slopewatch.channels.risk-email.to", SmtpTestResource.RISK);
            config.put("slopewatch.channels.desk-pager.type", "chat-webhook");
            config.put("slopewatch.channels.desk-pager.url", "http://127.0.0.1:" + ClosedPort.find() + "/hooks/pager");
            config.put("slopewatch.channels.desk-pager.timeout", "1s");
            config.put("slopewatch.delivery.retry.base", "200ms");
            config.put("slopewatch.delivery.retry.cap", "400ms");
            config.put("slopewatch.delivery.retry.max-age", "10m");
            config.put("slopewatch.delivery.retry.jitter", "0");
            config.put("slopewatch.alerts.delivery-poll", "100ms");
            config.put("slopewatch.alerts.reload-check", "0s");
            return config;
        }
    }

    @AfterAll
    static void closeReceiver() {
        if (chat != null) {
            chat.close();
        }
    }

    @Test
    @Order(1)
    void everythingConfiguredAndQuotedIsUp() {
        post("GOVT-A", "2026-03-02", 450);
        post("GOVT-B", "2026-03-02", 455);

        HealthAnswer overall = HealthAnswer.of("/q/health");
        for (String check : List.of("journal", "feed freshness", "alert channels", "alert deliveries", "policy reload")) {
            assertThat(overall.checkStatus(check)).as("%s in %s", check, overall).isEqualTo("UP");
        }
        assertThat(overall.status()).isEqualTo("UP");
        assertThat(overall.httpStatus()).isEqualTo(200);
        assertThat(overall.data("alert channels", "inversion-confirmed")).isEqualTo("critical: reaches the desk on desk-chat, risk-email");
        assertThat(overall.data("alert deliveries", "attempts")).isEqualTo("none since start-up");
        assertThat(HealthAnswer.of("/q/health/well").httpStatus()).isEqualTo(200);
    }

    @Test
    @Order(2)
    void aChannelWhoseAttemptsAreRefusedShowsAsFailingAfterItsThirdAttempt() {
        // 10Y below 3M: GOVT-A's 10Y-3M enters INVERTED, and first-inversion goes to the log and the pager
        post("GOVT-A", "2026-03-03", 380);

        Awaitility.await("the pager's attempts failing in the wellness group").atMost(PATIENCE)
                .until(() -> "DOWN".equals(HealthAnswer.of("/q/health/well").checkStatus("alert deliveries")));
        HealthAnswer overall = HealthAnswer.of("/q/health");
        assertThat(overall.status()).as("%s", overall).isEqualTo("DOWN");
        assertThat(overall.httpStatus()).isEqualTo(503);
        String pager = overall.data("alert deliveries", "desk-pager");
        assertThat(pager).as("named, with the count").startsWith("failing: ").contains("in a row not delivered");
        int attempts = Integer.parseInt(pager.substring("failing: ".length(), pager.indexOf(' ', "failing: ".length())));
        assertThat(attempts).as("the default threshold is three attempts in a row").isGreaterThanOrEqualTo(3);
        assertThat(pager).as("the open health answer names no address").doesNotContain("127.0.0.1");
        assertThat(overall.data("alert deliveries", "log")).startsWith("delivering");
        assertThat(HealthAnswer.of("/q/health/ready").httpStatus()).as("quotes are still taken").isEqualTo(200);
    }

    private static void post(String curve, String date, int tenYearBp) {
        given().contentType("application/json")
                .body("{\"curve\":\"" + curve + "\",\"date\":\"" + date + "\",\"unit\":\"bp\",\"yields\":{\"1M\":410,\"3M\":400,"
                        + "\"6M\":400,\"1Y\":405,\"2Y\":420,\"5Y\":435,\"10Y\":" + tenYearBp + ",\"30Y\":460}}")
                .post("/api/quotes").then().statusCode(200);
    }
}
