package org.slopewatch.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import org.junit.jupiter.api.Test;
import org.slopewatch.monitor.SpreadState;

/** The alerting part of a policy: channels and alert rules, and every mistake at its position. */
class AlertSectionTest {

    private static final String WATCH = """
            watch:
              - spread: 10Y-3M
                confirm: [quarter-average]
            """;

    private static String problems(String yaml) {
        return catchThrowableOfType(PolicyException.class, () -> PolicyParser.parse("p.yaml", yaml)).getMessage();
    }

    /*
     * Safe outbound calls: a policy file cannot say where a channel points, so it cannot send the
     * desk's alerts to a host of its choosing; a URL in it is refused at load with its position.
     */
    @Test
    void aPolicyNamingAHostForAChannelIsRejectedAtLoad() {
        String message = problems(WATCH + """
                channels:
                  desk-chat: { type: chat-webhook, url: "https://collector.example.net/hooks/abc" }
                alerts: []
                """);
        assertThat(message).contains("p.yaml:").contains("unknown key 'url' in channel 'desk-chat' (known: type)");
    }

    @Test
    void theShippedDefaultPolicyHasTheFourAlertsTheDeskSignedOff() throws IOException, PolicyException {
        Policy p = PolicyParser.parse("default.yaml", Files.readString(Path.of("alert-rules/default.yaml")));
        assertThat(p.alerts()).extracting(AlertRule::name)
                .containsExactly("inversion-confirmed", "first-inversion", "resteepening", "stale-feed");
        AlertRule confirmed = p.alerts().get(0);
        assertThat(confirmed.when()).isEqualTo(new AlertTrigger.EntersState(SpreadState.CONFIRMED));
        assertThat(confirmed.severity()).isEqualTo(Severity.CRITICAL);
        assertThat(confirmed.standingEvery()).isEqualTo(Duration.ofDays(1));
        assertThat(confirmed.closingNotice()).isTrue();
        assertThat(p.alerts().get(1).severity()).isEqualTo(Severity.INFO);
        assertThat(p.alerts().get(2).severity()).isEqualTo(Severity.WARNING);
        assertThat(p.alerts().get(3).when()).isEqualTo(new AlertTrigger.FeedStale());
        assertThat(p.channels()).extracting(ChannelDeclaration::name).containsExactly("log", "desk-chat", "risk-email");
    }

    @Test
    void everyTriggerParses() throws PolicyException {
        // a probability-above rule needs a model for each spread it covers (here every watched one)
        Policy p = PolicyParser.parse("p.yaml", WATCH + """
                probability:
                  10Y-3M: { alpha: -0.5333, beta: -0.6330, horizon-months: 12, source: "Estrella and Trubin (2006) (from memory)" }
                alerts:
                  - { name: a, when: { enters-state: inverted }, severity: info, channels: [log] }
                  - { name: b, when: { inverted-for-days: 180 }, severity: warning, channels: [log], standing-every: 4h }
                  - { name: c, when: { probability-above: 0.5 }, severity: critical, channels: [log], standing-every: 0 }
                  - { name: d, when: { feed-stale: true }, severity: warning, channels: [log], standing-every: 30m }
                  - { name: e, when: { spread-below-bp: -50 }, spreads: [10Y-3M], severity: warning, channels: [log] }
                """);
        assertThat(p.alerts()).extracting(AlertRule::when).containsExactly(new AlertTrigger.EntersState(SpreadState.INVERTED),
                new AlertTrigger.InvertedForDays(180), new AlertTrigger.ProbabilityAbove(0.5), new AlertTrigger.FeedStale(),
                new AlertTrigger.SpreadBelow(-50));
        assertThat(p.alerts()).extracting(AlertRule::standingEvery).containsExactly(Duration.ZERO, Duration.ofHours(4), Duration.ZERO,
                Duration.ofMinutes(30), Duration.ZERO);
    }

    @Test
    void unknownChannelsSpreadsAndKeysAreReported() {
        String message = problems(WATCH + """
                alerts:
                  - name: a
                    when: { enters-state: CONFIRMED }
                    spreads: [10Y-2Y]
                    severity: critical
                    channels: [pager]
                    escalate: true
                """);
        assertThat(message).contains("p.yaml:7:15: unknown spread '10Y-2Y': not watched by this policy (watched: 10Y-3M)")
                .contains("p.yaml:9:16: unknown channel 'pager' (declared: log)")
                .contains("p.yaml:10:5: unknown key 'escalate' in an alert rule");
    }

    /* The month a probability-above rule reads, as alert-rules/README.md defines it: the last complete one unless the rule says to-date. */
    @Test
    void probabilityAboveReadsTheLastCompleteMonthUnlessItAsksForTheMonthSoFar() throws PolicyException {
        Policy p = PolicyParser.parse("p.yaml", WATCH + """
                probability:
                  10Y-3M: { alpha: -0.5333, beta: -0.6330, horizon-months: 12, source: "Estrella and Trubin (2006) (from memory)" }
                alerts:
                  - { name: a, when: { probability-above: 0.5 }, severity: warning, channels: [log] }
                  - { name: b, when: { probability-above: { level: 0.3, month: complete } }, severity: warning, channels: [log] }
                  - { name: c, when: { probability-above: { level: 0.3, month: to-date } }, severity: warning, channels: [log] }
                  - { name: d, when: { probability-above: { level: 0.3 } }, severity: warning, channels: [log] }
                """);
        assertThat(p.alerts()).extracting(AlertRule::when).containsExactly(
                new AlertTrigger.ProbabilityAbove(0.5, ProbabilityMonth.COMPLETE),
                new AlertTrigger.ProbabilityAbove(0.3, ProbabilityMonth.COMPLETE),
                new AlertTrigger.ProbabilityAbove(0.3, ProbabilityMonth.TO_DATE),
                new AlertTrigger.ProbabilityAbove(0.3, ProbabilityMonth.COMPLETE));
        assertThat(new AlertTrigger.ProbabilityAbove(0.5)).isEqualTo(new AlertTrigger.ProbabilityAbove(0.5, ProbabilityMonth.COMPLETE));

        // columns counted by hand: "  - { name: a, when: { probability-above: " is 42 characters, the value starts at 43
        String message = problems(WATCH + """
                probability:
                  10Y-3M: { alpha: -0.5333, beta: -0.6330, horizon-months: 12, source: "Estrella and Trubin (2006) (from memory)" }
                alerts:
                  - { name: a, when: { probability-above: { month: to-date } }, severity: warning, channels: [log] }
                  - { name: b, when: { probability-above: { level: 0.3, month: yesterday } }, severity: warning, channels: [log] }
                  - { name: c, when: { probability-above: { level: 1.5, month: to-date } }, severity: warning, channels: [log] }
                  - { name: d, when: { probability-above: { level: 0.3, months: 2 } }, severity: warning, channels: [log] }
                """);
        assertThat(message).contains("p.yaml:7:43: 'probability-above' needs 'level' (a probability between 0 and 1)")
                .contains("p.yaml:8:64: unknown month 'yesterday' for 'probability-above' (known: complete, the default, and to-date)")
                .contains("p.yaml:9:52: impossible threshold: 'probability-above' is a probability between 0 and 1 (exclusive), got 1.5")
                .contains("p.yaml:10:57: unknown key 'months' in 'probability-above' (known: level, month)");
    }

    @Test
    void wrongTypesAndImpossibleThresholdsAreReported() {
        String message = problems(WATCH + """
                channels:
                  pager: { type: sms }
                alerts:
                  - { name: a, when: { probability-above: 1.5 }, severity: loud, channels: [log], standing-every: soon }
                  - { name: b, when: { inverted-for-days: 0 }, severity: info, channels: [log], closing-notice: maybe }
                  - { name: c, when: { enters-state: CONFIRMED, spread-below-bp: -5 }, severity: info, channels: [log] }
                  - { name: d, when: { enters-state: UPSIDE-DOWN }, severity: info, channels: [log], message: "{spread} {colour}" }
                """);
        assertThat(message).contains("p.yaml:5:18: unknown channel type 'sms' for channel 'pager' (known: chat-webhook, email, stream, log)")
                .contains("p.yaml:7:43: impossible threshold: 'probability-above' is a probability between 0 and 1 (exclusive), got 1.5")
                .contains("p.yaml:7:60: unknown severity 'loud' (known: info, warning, critical)")
                .contains("p.yaml:7:99: 'standing-every' must be a duration such as 30s, 30m, 4h or 1d (0 for never), got 'soon'")
                .contains("p.yaml:8:43: impossible threshold: 'inverted-for-days' must be at least 1, got 0")
                .contains("'closing-notice' must be true or false, got 'maybe'")
                .contains("p.yaml:9:22: 'when' takes exactly one condition")
                .contains("unknown state 'UPSIDE-DOWN'")
                .contains("unknown placeholder {colour} in 'message'");
    }
}
