package org.slopewatch.alerting;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyParser;

/**
 * Which rules reach the desk, on the shipped policy ({@code alert-rules/default.yaml}: the critical
 * {@code inversion-confirmed} to log, desk-chat and risk-email; the info {@code first-inversion} to
 * log and desk-chat; the warnings {@code resteepening} to all three and {@code stale-feed} to the
 * log alone) under the configurations an operator may leave it in.
 */
class ChannelReachTest {

    private static Policy shipped() throws Exception {
        Path file = Path.of("alert-rules/default.yaml");
        return PolicyParser.parse(file.toString(), Files.readAllBytes(file));
    }

    private static Function<String, Optional<String>> configured(Map<String, String> types) {
        return name -> Optional.ofNullable(types.get(name));
    }

    private static ChannelReach.RuleReach rule(ChannelReach reach, String name) {
        return reach.rules().stream().filter(r -> r.rule().equals(name)).findFirst().orElseThrow();
    }

    @Test
    void asShippedOnlyTheCriticalRuleFailsToReachTheDeskForItsLogIsNotEnough() throws Exception {
        ChannelReach reach = ChannelReach.of(shipped(), configured(Map.of("log", "log")));

        assertThat(reach.unconfigured()).extracting(c -> c.name()).containsExactly("desk-chat", "risk-email");
        assertThat(reach.unreached()).extracting(ChannelReach.RuleReach::rule).containsExactly("inversion-confirmed");
        ChannelReach.RuleReach critical = rule(reach, "inversion-confirmed");
        assertThat(critical.unconfigured()).containsExactly("desk-chat", "risk-email");
        assertThat(critical.logOnly()).containsExactly("log");
        assertThat(critical.describe()).isEqualTo("cannot reach the desk: only log remains, a log no one reads in time for a critical "
                + "notice; not configured: desk-chat, risk-email");
        assertThat(rule(reach, "resteepening").delivering()).as("a warning may rest on the log").containsExactly("log");
        assertThat(rule(reach, "stale-feed").describe()).isEqualTo("reaches the desk on log");
    }

    @Test
    void oneRealChannelIsEnoughForTheCriticalRule() throws Exception {
        ChannelReach reach = ChannelReach.of(shipped(), configured(Map.of("log", "log", "risk-email", "email")));

        assertThat(reach.unreached()).isEmpty();
        assertThat(rule(reach, "inversion-confirmed").describe()).isEqualTo("reaches the desk on risk-email; not configured: desk-chat");
        assertThat(rule(reach, "first-inversion").delivering()).containsExactly("log");
    }

    @Test
    void aRuleWhoseEveryChannelIsUnconfiguredReachesNoOneWhateverItsSeverity() throws Exception {
        Policy policy = PolicyParser.parse("info-only.yaml", """
                watch:
                  - spread: 10Y-3M
                    enter-below-bp: 0
                    exit-at-or-above-bp: 5
                    exit-after-observations: 5
                    hold-days: 365
                    confirm:
                      - days-inverted: { days: 90 }
                channels:
                  desk-chat: { type: chat-webhook }
                alerts:
                  - name: first-inversion
                    when: { enters-state: INVERTED }
                    severity: info
                    channels: [desk-chat]
                    message: "{curve} {spread} went below zero"
                """);

        ChannelReach none = ChannelReach.of(policy, configured(Map.of("log", "log")));
        assertThat(none.unreached()).extracting(ChannelReach.RuleReach::rule).containsExactly("first-inversion");
        assertThat(none.unreached().get(0).describe()).isEqualTo("cannot reach the desk: none of its channels is configured (desk-chat)");

        assertThat(ChannelReach.of(policy, configured(Map.of("log", "log", "desk-chat", "chat-webhook"))).unreached()).isEmpty();
    }
}
