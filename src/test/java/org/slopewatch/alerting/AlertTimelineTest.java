package org.slopewatch.alerting;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.equalTo;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import jakarta.mail.internet.MimeMessage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.DayOfWeek;
import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
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
import org.slopewatch.delivery.SmtpTestResource;
import org.slopewatch.delivery.TestHttpReceiver;

/**
 * The alert timeline end to end, on a running daemon with a real HTTP receiver for the chat
 * webhook and the real GreenMail SMTP server: quotes in over HTTP, a calendar quarter inverted,
 * the confirmation at the chat receiver through an outage (500, a hung request, refused
 * connections) exactly once by id, the same alert in the mailbox, an acknowledgement stopping the
 * standing notices, the closing notice after re-steepening; then a quiet period, and hot reload of the policy
 * (an invalid file rejected with its position while the old policy runs on, a valid one applied).
 *
 * <p>Source of the rule checked: the confirmation rule of the policy under test (a calendar
 * quarter whose average spread is below zero), applied to a quarter of quotes built to average
 * −20 bp, so the confirmation must come on the first business day after the quarter.
 */
@QuarkusTest
@TestProfile(AlertTimelineTest.Timeline.class)
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class AlertTimelineTest {

    private static final Duration PATIENCE = Duration.ofSeconds(60);
    private static final ObjectMapper JSON = new ObjectMapper();
    static TestHttpReceiver chat;
    static Path policyFile;

    /** Channels pointing at the receiver and GreenMail, short retry and evaluation intervals, a policy file of our own. */
    public static final class Timeline implements QuarkusTestProfile {

        @Override
        public Map<String, String> getConfigOverrides() {
            if (chat == null) {
                chat = TestHttpReceiver.start();
            }
            String run = UUID.randomUUID().toString().substring(0, 8);
            Path dir = Path.of(".", "target", "test-data", "timeline-" + run); // H2 wants an explicit ./ for a relative path
            try {
                Files.createDirectories(dir);
                policyFile = dir.resolve("policy.yaml");
                Files.copy(Path.of("src/test/resources/policies/timeline.yaml"), policyFile);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            Map<String, String> config = new LinkedHashMap<>();
            config.put("slopewatch.data-dir", dir.toString());
            config.put("slopewatch.ingest.policy", policyFile.toString());
            config.put("slopewatch.channels.desk-chat.type", "chat-webhook");
            config.put("slopewatch.channels.desk-chat.url", chat.url("/hooks/desk"));
            config.put("slopewatch.channels.desk-chat.format", "alert-json");
            config.put("slopewatch.channels.desk-chat.timeout", "1s");
            config.put("slopewatch.channels.risk-email.type", "email");
            config.put("slopewatch.channels.risk-email.to", SmtpTestResource.RISK);
            config.put("slopewatch.delivery.retry.base", "200ms");
            config.put("slopewatch.delivery.retry.cap", "1s");
            config.put("slopewatch.delivery.retry.max-age", "2m");
            config.put("slopewatch.delivery.retry.jitter", "0");
            config.put("slopewatch.alerts.evaluate-every", "200ms");
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
    void confirmationReachesChatThroughAnOutageAndTheMailboxAndAckStopsStandingNotices() throws Exception {
        // the first quarter of 2026, inverted by 20 bp every business day
        post(days("GOVT-A", LocalDate.of(2026, 1, 2), LocalDate.of(2026, 3, 31), -20.0));
        String firstInversion = "first-inversion~GOVT-A:10Y-3M~2026-01-02~1";
        Awaitility.await("first inversion at the chat receiver").atMost(PATIENCE)
                .until(() -> acceptedIds().contains(firstInversion));

        // the chat service now fails: a 500, then a request it never answers, then it goes away
        chat.answer(500, "internal error").hang();
        post(days("GOVT-A", LocalDate.of(2026, 4, 1), LocalDate.of(2026, 4, 3), -20.0));
        String confirmed = "inversion-confirmed~GOVT-A:10Y-3M~2026-04-01~1";
        Awaitility.await("the 500 and then the hung request timed out").atMost(PATIENCE).until(() -> attempts(confirmed, "desk-chat") >= 2);
        chat.stop();
        // on a loaded machine the next attempt may reach the receiver while it is closing (no answer
        // rather than refused); the outage lasts until an attempt has been refused outright
        Awaitility.await("an attempt refused while the receiver is down").atMost(PATIENCE)
                .until(() -> attemptDetails(confirmed).stream().anyMatch(d -> d.contains("connection refused")));
        chat.restart();
        Awaitility.await("the confirmation delivered on desk-chat").atMost(PATIENCE)
                .until(() -> "DELIVERED".equals(deliveryStatus(confirmed, "desk-chat")));
        assertThat(acceptedIds().stream().filter(confirmed::equals)).as("taken by the receiver exactly once").hasSize(1);
        assertThat(attempts(confirmed, "desk-chat")).as("500, time-out, refused, then delivered").isGreaterThanOrEqualTo(4);
        List<String> details = attemptDetails(confirmed);
        assertThat(details.get(0)).startsWith("retry: ").contains("HTTP 500");
        assertThat(details.get(1)).startsWith("retry: ").contains("no answer within 1000 ms");
        assertThat(details.subList(2, details.size() - 1)).as("retries while the receiver was down")
                .allMatch(d -> d.startsWith("retry: ")).anyMatch(d -> d.contains("connection refused"));
        assertThat(details.get(details.size() - 1)).startsWith("delivered: ");
        JsonNode body = JSON.readTree(chat.accepted().stream().filter(r -> r.body().contains(confirmed)).findFirst().orElseThrow().body());
        assertThat(body.get("severity").asText()).isEqualTo("critical");
        assertThat(body.get("kind").asText()).isEqualTo("opening");
        assertThat(body.get("text").asText()).contains("confirmed inverted").contains("The spell began on 2026-01-02")
                .contains("not investment advice");

        // the same alert in the mailbox of the real SMTP server
        String subject = "GOVT-A:10Y-3M confirmed inverted at -20.0 bp \u2014 opening notice, critical";
        Awaitility.await("the confirmation in the mailbox").atMost(PATIENCE).until(() -> mail(subject) != null);
        MimeMessage mail = mail(subject);
        // quoted-printable: soft line breaks joined again, so that a phrase reads whole wherever the encoder cut it
        String mailBody = com.icegreen.greenmail.util.GreenMailUtil.getBody(mail).replaceAll("=\r?\n", "");
        // the notice describes the spread as the confirming quote left it (2026-04-01, 89 days after
        // 2026-01-02), not as the rest of its batch did: notices must not depend on batching
        assertThat(mailBody).contains("Quarter to date: average -20.0 bp over 1 observations").contains("days inverted: 89 (without a break since 2026-01-02)")
                .contains("not investment advice");
        assertThat(mail.getAllRecipients()[0].toString()).isEqualTo(SmtpTestResource.RISK);

        // standing notices every two seconds until someone acknowledges
        Awaitility.await("a standing notice").atMost(PATIENCE).until(() -> notices("inversion-confirmed") >= 2);
        given().contentType("application/json").body("{\"by\":\"desk-lead\",\"note\":\"seen, escalated\"}")
                .post("/api/alerts/" + confirmed + "/ack")
                .then().statusCode(200).body("acks[0].by", equalTo("desk-lead"));
        long afterAck = notices("inversion-confirmed");
        Thread.sleep(5_000); // two and a half standing intervals
        assertThat(notices("inversion-confirmed")).as("no standing notices after the acknowledgement").isEqualTo(afterAck);
        assertThat(alerts().get("open").findValuesAsText("acknowledged")).contains("true");

        // the spread re-steepens: the condition clears and the closing notice still comes
        post(days("GOVT-A", LocalDate.of(2026, 4, 6), LocalDate.of(2026, 4, 17), 30.0));
        Awaitility.await("the closing notice").atMost(PATIENCE).until(() -> alerts().get("recent").findValuesAsText("kind").contains("closing"));

        String metrics = given().get("/q/metrics").then().statusCode(200).extract().asString();
        assertThat(metrics).contains("slopewatch_alerts_total{kind=\"opening\",quieted=\"false\",rule=\"inversion-confirmed\",severity=\"critical\"}")
                .containsPattern("slopewatch_alert_attempts_total\\{channel=\"desk-chat\",outcome=\"retry\",rule=\"inversion-confirmed\"");
    }

    @Test
    @Order(2)
    void aRuleInAQuietPeriodIsJournalledButNotSent() throws IOException {
        given().contentType("application/json")
                .body("{\"rule\":\"first-inversion\",\"lasts\":\"PT1H\",\"note\":\"GOVT-B feed under test\",\"set_by\":\"ops\"}")
                .post("/api/quiet-periods").then().statusCode(201).body("rule", equalTo("first-inversion")).body("set_by", equalTo("ops"));
        post(days("GOVT-B", LocalDate.of(2026, 5, 4), LocalDate.of(2026, 5, 8), -10.0));
        String id = "first-inversion~GOVT-B:10Y-3M~2026-05-04~1";
        Awaitility.await("the notice held back journalled").atMost(PATIENCE).until(() -> deliveryStatus(id, "desk-chat") != null);
        assertThat(deliveryStatus(id, "desk-chat")).isEqualTo("SKIPPED");
        given().get("/api/alerts/" + id).then().statusCode(200).body("alert.quieted_by", containsString("set by ops"));
        assertThat(acceptedIds()).doesNotContain(id);
        given().contentType("application/json").body("{\"rule\":\"no-such-rule\",\"lasts\":\"PT1H\",\"note\":\"x\",\"set_by\":\"ops\"}")
                .post("/api/quiet-periods").then().statusCode(400);
    }

    @Test
    @Order(3)
    void anInvalidPolicyIsRejectedWithItsPositionAndAValidOneApplied() throws IOException {
        String good = Files.readString(policyFile);
        String before = given().get("/api/alerts").then().extract().path("recent[0].policy_hash");
        Files.writeString(policyFile, good.replace("severity: info", "severity: loud"));
        given().post("/api/policy/reload").then().statusCode(422).body("result", equalTo("rejected"))
                .body("detail", containsString("policy.yaml:27:15: unknown severity 'loud'"));
        assertThat(given().get("/q/metrics").then().extract().asString()).contains("slopewatch_policy_reloads_total{outcome=\"rejected\"}");

        Files.writeString(policyFile, good.replace("went below zero", "dipped below zero"));
        given().post("/api/policy/reload").then().statusCode(200).body("result", equalTo("applied"));
        given().post("/api/policy/reload").then().statusCode(200).body("result", equalTo("unchanged"));
        given().delete("/api/quiet-periods/1?lifted_by=ops").then().statusCode(204);
        post(days("GOVT-B", LocalDate.of(2026, 6, 1), LocalDate.of(2026, 6, 12), 40.0));
        post(days("GOVT-B", LocalDate.of(2026, 6, 15), LocalDate.of(2026, 6, 16), -5.0));
        String id = "first-inversion~GOVT-B:10Y-3M~2026-06-15~1";
        Awaitility.await("a notice under the reloaded policy").atMost(PATIENCE).until(() -> acceptedIds().contains(id));
        String hash = given().get("/api/alerts/" + id).then().statusCode(200).body("alert.text", containsString("dipped below zero"))
                .extract().path("alert.policy_hash");
        assertThat(hash).as("the alert names the rule set it was decided under").isNotEqualTo(before).hasSize(64);
    }

    // --- helpers ---

    /** Snapshots of 3M and 10Y on business days, 10Y − 3M = spreadBp. */
    private static String days(String curve, LocalDate from, LocalDate to, double spreadBp) {
        List<String> items = new ArrayList<>();
        for (LocalDate d = from; !d.isAfter(to); d = d.plusDays(1)) {
            if (d.getDayOfWeek() == DayOfWeek.SATURDAY || d.getDayOfWeek() == DayOfWeek.SUNDAY) {
                continue;
            }
            items.add("{\"curve\":\"" + curve + "\",\"date\":\"" + d + "\",\"unit\":\"bp\",\"yields\":{\"3M\":500.0,\"10Y\":"
                    + (500.0 + spreadBp) + "}}");
        }
        return "[" + String.join(",", items) + "]";
    }

    private static void post(String body) {
        given().contentType("application/json").body(body).post("/api/quotes").then().statusCode(200);
    }

    private static JsonNode alerts() throws IOException {
        return JSON.readTree(given().get("/api/alerts?limit=1000").then().statusCode(200).extract().asString());
    }

    private static long notices(String rule) throws IOException {
        long n = 0;
        for (JsonNode a : alerts().get("recent")) {
            if (a.get("rule").asText().equals(rule)) {
                n++;
            }
        }
        return n;
    }

    /** The desk-chat attempts of an alert as "outcome: detail", in order. */
    private static List<String> attemptDetails(String id) throws IOException {
        List<String> details = new ArrayList<>();
        var response = given().get("/api/alerts/" + id);
        if (response.statusCode() != 200) {
            return details;
        }
        for (JsonNode a : JSON.readTree(response.asString()).get("attempts")) {
            if (a.get("channel").asText().equals("desk-chat")) {
                details.add(a.get("outcome").asText() + ": " + a.get("detail").asText());
            }
        }
        return details;
    }

    private static String deliveryStatus(String id, String channel) throws IOException {
        JsonNode d = delivery(id, channel);
        return d == null ? null : d.get("status").asText();
    }

    private static int attempts(String id, String channel) throws IOException {
        JsonNode d = delivery(id, channel);
        return d == null ? 0 : d.get("attempts").asInt();
    }

    private static JsonNode delivery(String id, String channel) throws IOException {
        var response = given().get("/api/alerts/" + id);
        if (response.statusCode() != 200) {
            return null;
        }
        for (JsonNode d : JSON.readTree(response.asString()).get("alert").get("deliveries")) {
            if (d.get("channel").asText().equals(channel)) {
                return d;
            }
        }
        return null;
    }

    private static List<String> acceptedIds() {
        List<String> ids = new ArrayList<>();
        for (TestHttpReceiver.Request r : chat.accepted()) {
            try {
                ids.add(JSON.readTree(r.body()).get("id").asText());
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        return ids;
    }


    private static MimeMessage mail(String subject) throws Exception {
        for (MimeMessage m : SmtpTestResource.greenMail.getReceivedMessages()) {
            if (subject.equals(m.getSubject())) {
                return m;
            }
        }
        return null;
    }
}
