package org.slopewatch.alerting;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import org.junit.jupiter.api.Test;
import org.slopewatch.alerting.ChannelFailures.Outcome;

/**
 * When a channel counts as failing, as a timeline with explicit instants. The schedule follows the
 * shipped retry policy (base 30 s doubling to a cap of 30 min, {@code slopewatch.delivery.retry.*},
 * jitter left out): attempts at t, t+30 s, t+90 s, t+210 s. Threshold 3 attempts, window 1 h (the
 * defaults of {@code slopewatch.health.*}).
 */
class ChannelFailuresTest {

    private static final Instant T = Instant.parse("2026-06-30T21:05:00Z");
    private static final Duration WITHIN = Duration.ofHours(1);
    private static final int AFTER = 3;

    private static ChannelFailures.Run run(ChannelFailures f, String channel) {
        return f.runs().stream().filter(r -> r.channel().equals(channel)).findFirst().orElseThrow();
    }

    @Test
    void threeRefusedAttemptsInARowAreAnOutageAndOneDeliveryEndsIt() {
        ChannelFailures f = new ChannelFailures();
        f.attempted("desk-chat", Outcome.RETRY, T);
        f.attempted("desk-chat", Outcome.RETRY, T.plusSeconds(30));
        assertThat(run(f, "desk-chat").failing(T.plusSeconds(31), WITHIN, AFTER)).as("two refusals are a blip").isFalse();

        f.attempted("desk-chat", Outcome.RETRY, T.plusSeconds(90));
        ChannelFailures.Run three = run(f, "desk-chat");
        assertThat(three.failing(T.plusSeconds(91), WITHIN, AFTER)).isTrue();
        assertThat(three.undelivered()).isEqualTo(3);
        assertThat(three.since()).isEqualTo(T);
        assertThat(three.latest()).isEqualTo(T.plusSeconds(90));

        f.attempted("desk-chat", Outcome.DELIVERED, T.plusSeconds(210));
        assertThat(run(f, "desk-chat").failing(T.plusSeconds(211), WITHIN, AFTER)).isFalse();
        assertThat(run(f, "desk-chat").undelivered()).isZero();
    }

    @Test
    void aDeliveryGivenUpOnFailsTheChannelAtOnce() {
        ChannelFailures f = new ChannelFailures();
        f.attempted("desk-chat", Outcome.FAILED, T); // e.g. 404: the webhook is gone

        assertThat(run(f, "desk-chat").failing(T.plusSeconds(1), WITHIN, AFTER)).isTrue();
        assertThat(run(f, "desk-chat").lost()).isEqualTo(1);
    }

    @Test
    void aRunWhoseLatestAttemptIsOlderThanTheWindowNoLongerCounts() {
        ChannelFailures f = new ChannelFailures();
        for (int i = 0; i < 3; i++) {
            f.attempted("risk-email", Outcome.RETRY, T.plusSeconds(30L * i));
        }
        Instant latest = T.plusSeconds(60);

        assertThat(run(f, "risk-email").failing(latest.plus(WITHIN), WITHIN, AFTER)).as("exactly the window: still counts").isTrue();
        assertThat(run(f, "risk-email").failing(latest.plus(WITHIN).plusSeconds(1), WITHIN, AFTER)).isFalse();
    }

    @Test
    void channelsAreJudgedApart() {
        ChannelFailures f = new ChannelFailures();
        for (int i = 0; i < 3; i++) {
            f.attempted("desk-pager", Outcome.RETRY, T.plusSeconds(i));
            f.attempted("log", Outcome.DELIVERED, T.plusSeconds(i));
        }

        assertThat(f.runs()).extracting(ChannelFailures.Run::channel).containsExactly("desk-pager", "log");
        assertThat(run(f, "desk-pager").failing(T.plusSeconds(3), WITHIN, AFTER)).isTrue();
        assertThat(run(f, "log").failing(T.plusSeconds(3), WITHIN, AFTER)).isFalse();
    }
}
