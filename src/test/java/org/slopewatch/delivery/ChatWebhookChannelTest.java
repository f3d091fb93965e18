package org.slopewatch.delivery;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.time.Duration;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Alert;

/** The chat webhook against a real HTTP server: what each answer comes to, and what the receiver gets. */
class ChatWebhookChannelTest {

    private static final ObjectMapper JSON = new ObjectMapper();

    private TestHttpReceiver receiver;

    @BeforeEach
    void start() {
        receiver = TestHttpReceiver.start();
    }

    @AfterEach
    void stop() {
        receiver.close();
    }

    private ChatWebhookChannel channel(ChatWebhookChannel.Format format) {
        return new ChatWebhookChannel("desk-chat", receiver.url("/hooks/desk"), format, Duration.ofSeconds(5));
    }

    @Test
    void twoHundredIsDeliveredAndTheTextBodyHoldsSubjectTextLinkAndCautionLast() throws Exception {
        receiver.answer(200, "ok");

        DeliveryOutcome outcome = channel(ChatWebhookChannel.Format.TEXT).deliver(TestAlerts.confirmed());

        assertThat(outcome).isEqualTo(new DeliveryOutcome.Delivered("chat-webhook 'desk-chat': HTTP 200"));
        assertThat(receiver.requests()).hasSize(1);
        TestHttpReceiver.Request request = receiver.requests().get(0);
        assertThat(request.contentType()).startsWith("application/json");
        JsonNode body = JSON.readTree(request.body());
        assertThat(body.size()).as("a plain {\"text\": ...} body, nothing else").isEqualTo(1);
        String text = body.get("text").asText();
        assertThat(text).startsWith("[CRITICAL] GOVT-A 10Y-3M CONFIRMED\n\n")
                .contains("inverted for the whole of 2026Q2")
                .contains("Dashboard: " + TestAlerts.DASHBOARD)
                .endsWith(Alert.CAUTION);
        assertThat(text.indexOf(Alert.CAUTION)).as("the caution appears once").isEqualTo(text.lastIndexOf(Alert.CAUTION));
    }

    @Test
    void alertJsonSendsTheWholeAlertInSnakeCaseWithIsoDates() throws Exception {
        channel(ChatWebhookChannel.Format.ALERT_JSON).deliver(TestAlerts.confirmed());

        JsonNode body = JSON.readTree(receiver.requests().get(0).body());
        assertThat(body.get("id").asText()).isEqualTo("govt-a-10y3m/confirmation/2026-03-31/firing/1");
        assertThat(body.get("spread_id").asText()).isEqualTo("GOVT-A:10Y-3M");
        assertThat(body.get("market_date").asText()).isEqualTo("2026-06-30");
        assertThat(body.get("created_at").asText()).isEqualTo("2026-06-30T21:05:00Z");
        assertThat(body.get("severity").asText()).isEqualTo("critical");
        assertThat(body.get("kind").asText()).isEqualTo("firing");
        assertThat(body.get("facts").get(1).get("label").asText()).isEqualTo("days inverted");
        assertThat(body.get("facts").get(1).get("value").asText()).isEqualTo("92");
        assertThat(body.get("caution").asText()).isEqualTo(Alert.CAUTION);
    }

    @Test
    void fiveHundredIsRetriedWithTheStatusInTheReason() {
        receiver.answer(500, "upstream broke");

        DeliveryOutcome outcome = channel(ChatWebhookChannel.Format.TEXT).deliver(TestAlerts.confirmed());

        assertThat(outcome).isEqualTo(new DeliveryOutcome.RetryLater("chat-webhook 'desk-chat': HTTP 500: upstream broke"));
    }

    @Test
    void tooManyRequestsIsRetried() {
        receiver.answer(429, "slow down");

        assertThat(channel(ChatWebhookChannel.Format.TEXT).deliver(TestAlerts.confirmed()))
                .isEqualTo(new DeliveryOutcome.RetryLater("chat-webhook 'desk-chat': HTTP 429: slow down"));
    }

    @Test
    void notFoundFailsForGoodWithTheResponseBody() {
        receiver.answer(404, "no_such_webhook");

        assertThat(channel(ChatWebhookChannel.Format.TEXT).deliver(TestAlerts.confirmed()))
                .isEqualTo(new DeliveryOutcome.FailedForGood("chat-webhook 'desk-chat': HTTP 404: no_such_webhook"));
    }

    @Test
    void aLongResponseBodyIsCutInTheReason() {
        receiver.answer(400, "x".repeat(5000));

        DeliveryOutcome outcome = channel(ChatWebhookChannel.Format.TEXT).deliver(TestAlerts.confirmed());

        assertThat(outcome).isInstanceOf(DeliveryOutcome.FailedForGood.class);
        String reason = ((DeliveryOutcome.FailedForGood) outcome).reason();
        assertThat(reason).startsWith("chat-webhook 'desk-chat': HTTP 400: xxx").endsWith("…");
        assertThat(reason.length()).as("the body is cut to %d characters", ChatWebhookChannel.BODY_CHARS)
                .isLessThan(ChatWebhookChannel.BODY_CHARS + 50);
    }

    @Test
    void aRedirectIsNotFollowedAndFailsForGood() {
        receiver.answer(301, "moved");

        assertThat(channel(ChatWebhookChannel.Format.TEXT).deliver(TestAlerts.confirmed()))
                .isInstanceOf(DeliveryOutcome.FailedForGood.class);
        assertThat(receiver.requests()).as("one request, no second one to a redirect target").hasSize(1);
    }

    @Test
    void noAnswerWithinTheTimeoutIsRetried() {
        receiver.hang();
        ChatWebhookChannel impatient = new ChatWebhookChannel("desk-chat", receiver.url("/hooks/desk"), ChatWebhookChannel.Format.TEXT,
                Duration.ofMillis(300));

        DeliveryOutcome outcome = impatient.deliver(TestAlerts.confirmed());

        assertThat(outcome).isEqualTo(new DeliveryOutcome.RetryLater("chat-webhook 'desk-chat': no answer within 300 ms"));
        assertThat(receiver.requests()).as("the receiver did get the request; it just never answered").hasSize(1);
    }

    @Test
    void aRefusedConnectionIsRetried() {
        ChatWebhookChannel nowhere = new ChatWebhookChannel("desk-chat", "http://127.0.0.1:" + ClosedPort.find() + "/hooks/desk",
                ChatWebhookChannel.Format.TEXT, Duration.ofSeconds(5));

        assertThat(nowhere.deliver(TestAlerts.confirmed()))
                .isEqualTo(new DeliveryOutcome.RetryLater("chat-webhook 'desk-chat': connection refused"));
    }
}
