package org.slopewatch.delivery;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Alert;
import org.slopewatch.testsupport.MutableClock;

/**
 * A timeline: the chat service fails twice with 500, is then down (connections refused), and
 * comes back. One alert, one channel, one retry policy; the clock jumps to each retry time
 * instead of waiting. The alert arrives exactly once, on the fourth attempt, on the schedule
 * the policy promises (base 30 s doubling, no jitter).
 */
class WebhookOutageTest {

    private static final Instant T0 = Instant.parse("2026-06-30T21:05:00Z");

    /**
     * The smallest dispatcher: attempt, ask the policy, wait (by moving the clock) until the
     * retry time, repeat. Before each attempt the test may change the world. It records one line
     * per attempt.
     */
    private static List<String> dispatch(AlertChannel channel, Alert alert, RetryPolicy policy, MutableClock clock,
                                         List<Consumer<Integer>> beforeAttempt) {
        List<String> timeline = new ArrayList<>();
        Instant first = clock.instant();
        for (int attempt = 1; attempt <= 20; attempt++) {
            if (attempt <= beforeAttempt.size()) {
                beforeAttempt.get(attempt - 1).accept(attempt);
            }
            DeliveryOutcome outcome = channel.deliver(alert);
            RetryDecision decision = policy.decide(outcome, attempt, first);
            String at = "t+" + Duration.between(T0, clock.instant()).toSeconds() + "s";
            timeline.add(at + " attempt " + attempt + ": " + outcome.getClass().getSimpleName() + " -> " + decision.getClass().getSimpleName());
            if (!(decision instanceof RetryDecision.RetryAt retry)) {
                return timeline;
            }
            clock.set(retry.at());
        }
        throw new AssertionError("the policy never stopped: " + timeline);
    }

    @Test
    void theAlertArrivesOnceAfterTheReceiverRecovers() {
        MutableClock clock = new MutableClock(T0);
        RetryPolicy policy = new RetryPolicy(Duration.ofSeconds(30), Duration.ofMinutes(10), Duration.ofHours(2), 0, clock,
                new RetryPolicyTest.FixedDraw(0.5));
        try (TestHttpReceiver receiver = TestHttpReceiver.start()) {
            ChatWebhookChannel channel = new ChatWebhookChannel("desk-chat", receiver.url("/hooks/desk"),
                    ChatWebhookChannel.Format.ALERT_JSON, Duration.ofSeconds(5));
            receiver.answer(500, "maintenance").answer(500, "maintenance");
            Alert alert = TestAlerts.confirmed();

            List<String> timeline = dispatch(channel, alert, policy, clock, List.of(
                    n -> { },                  // 500
                    n -> { },                  // 500
                    n -> receiver.stop(),      // refused
                    n -> receiver.restart())); // 200

            assertThat(timeline).as("attempts, outcomes and decisions in order").containsExactly(
                    "t+0s attempt 1: RetryLater -> RetryAt",
                    "t+30s attempt 2: RetryLater -> RetryAt",
                    "t+90s attempt 3: RetryLater -> RetryAt",
                    "t+210s attempt 4: Delivered -> Done");
            assertThat(receiver.requests()).as("three requests reached the receiver; the refused one never did").hasSize(3);
            assertThat(receiver.accepted()).as("the receiver took the alert exactly once").hasSize(1);
            assertThat(receiver.accepted().get(0).body()).contains("\"id\":\"" + alert.id() + "\"");
        }
    }

    @Test
    void aReceiverThatNeverRecoversIsGivenUpOnAtTheMaximumAge() {
        MutableClock clock = new MutableClock(T0);
        RetryPolicy policy = new RetryPolicy(Duration.ofSeconds(30), Duration.ofMinutes(1), Duration.ofMinutes(5), 0, clock,
                new RetryPolicyTest.FixedDraw(0));
        ChatWebhookChannel nowhere = new ChatWebhookChannel("desk-chat", "http://127.0.0.1:" + ClosedPort.find() + "/hooks/desk",
                ChatWebhookChannel.Format.TEXT, Duration.ofSeconds(5));

        List<String> timeline = dispatch(nowhere, TestAlerts.confirmed(), policy, clock, List.of());

        assertThat(timeline).as("30 s, then 1 min (the cap) between tries, until the next one would pass 5 min").containsExactly(
                "t+0s attempt 1: RetryLater -> RetryAt",
                "t+30s attempt 2: RetryLater -> RetryAt",
                "t+90s attempt 3: RetryLater -> RetryAt",
                "t+150s attempt 4: RetryLater -> RetryAt",
                "t+210s attempt 5: RetryLater -> RetryAt",
                "t+270s attempt 6: RetryLater -> GiveUp");
    }

    @Test
    void aWebhookThatIsGoneIsNotTriedAgain() {
        MutableClock clock = new MutableClock(T0);
        RetryPolicy policy = new RetryPolicy(Duration.ofSeconds(30), Duration.ofMinutes(10), Duration.ofHours(2), 0, clock,
                new RetryPolicyTest.FixedDraw(0));
        try (TestHttpReceiver receiver = TestHttpReceiver.start()) {
            receiver.answer(404, "no such webhook");
            ChatWebhookChannel channel = new ChatWebhookChannel("desk-chat", receiver.url("/hooks/desk"), ChatWebhookChannel.Format.TEXT,
                    Duration.ofSeconds(5));

            assertThat(dispatch(channel, TestAlerts.confirmed(), policy, clock, List.of()))
                    .containsExactly("t+0s attempt 1: FailedForGood -> GiveUp");
            assertThat(receiver.requests()).hasSize(1);
        }
    }
}
