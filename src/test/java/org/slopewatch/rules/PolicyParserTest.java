package org.slopewatch.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.slopewatch.monitor.DaysInverted;
import org.slopewatch.monitor.QuarterAverage;
import org.slopewatch.monitor.RollingAverage;
import org.slopewatch.monitor.ShareInverted;
import org.slopewatch.monitor.Watch;

/** Policy files: the shipped default loads; each mistake is reported at its line and column. */
class PolicyParserTest {

    @Test
    void theShippedDefaultPolicyLoads() throws IOException, PolicyException {
        Path file = Path.of("alert-rules/default.yaml");
        Policy policy = PolicyParser.parse(file.toString(), Files.readString(file));
        assertThat(policy.watches()).extracting(w -> w.spread().name()).containsExactly("10Y-3M", "10Y-2Y", "near-term-forward");
        Watch first = policy.watches().get(0);
        assertThat(first.rules().tests()).containsExactly(new QuarterAverage(0), new DaysInverted(90));
        assertThat(first.rules().exitAboveBp()).isEqualTo(5);
        assertThat(first.rules().exitObservations()).isEqualTo(5);
        assertThat(first.curves()).isEmpty();
    }

    @Test
    void everyTestFormParses() throws PolicyException {
        Policy p = PolicyParser.parse("p.yaml", """
                watch:
                  - spread: 10Y-3M~
                    curves: [GOVT-A, GOVT-B]
                    enter-below-bp: -5
                    confirm:
                      - quarter-average
                      - days-inverted: { days: 60 }
                      - rolling-average: { days: 90 }
                      - share-inverted: { days: 90, share: 0.75 }
                """);
        Watch w = p.watches().get(0);
        assertThat(w.spread().name()).isEqualTo("10Y-3M~");
        assertThat(w.curves()).containsExactlyInAnyOrder("GOVT-A", "GOVT-B");
        // thresholds left out default to the entry threshold
        assertThat(w.rules().tests()).containsExactly(new QuarterAverage(-5), new DaysInverted(60), new RollingAverage(90, -5),
                new ShareInverted(90, 0.75));
        assertThat(w.rules().exitAboveBp()).isEqualTo(-5);
    }

    private static String problems(String yaml) {
        return catchThrowableOfType(PolicyException.class, () -> PolicyParser.parse("p.yaml", yaml)).getMessage();
    }

    @Test
    void unknownKeysAreReportedWhereTheyAre() {
        assertThat(problems("""
                watch:
                  - spread: 10Y-3M
                    treshold: 5
                    confirm: [quarter-average]
                """)).isEqualTo("p.yaml:3:5: unknown key 'treshold' in a watch entry (known: spread, curves, enter-below-bp, "
                + "exit-at-or-above-bp, exit-after-observations, hold-days, confirm)");
        assertThat(problems("watching: []\n")).startsWith("p.yaml:1:1: unknown key 'watching'");
    }

    @Test
    void wrongTypesAreReported() {
        assertThat(problems("""
                watch:
                  - spread: 10Y-3M
                    hold-days: a year
                    enter-below-bp: [1]
                    confirm: [quarter-average]
                """)).contains("p.yaml:3:16: 'hold-days' must be a whole number, got 'a year'")
                .contains("p.yaml:4:21: 'enter-below-bp' must be a number, got a list");
        assertThat(problems("watch: 10Y-3M\n")).isEqualTo("p.yaml:1:8: 'watch' must be a list");
    }

    @Test
    void unknownSpreadsAndTestsAreReported() {
        assertThat(problems("""
                watch:
                  - spread: 10Y-3Q
                    confirm: [quarter-average, monthly-average]
                """)).contains("p.yaml:2:13: unknown tenor '3Q'")
                .contains("p.yaml:3:32: unknown persistence test 'monthly-average'");
    }

    @Test
    void impossibleThresholdsAreReported() {
        String message = problems("""
                watch:
                  - spread: 10Y-2Y
                    enter-below-bp: 0
                    exit-at-or-above-bp: -10
                    exit-after-observations: 0
                    confirm:
                      - share-inverted: { days: 90, share: 1.5 }
                      - days-inverted: { days: 0 }
                """);
        assertThat(message).contains("p.yaml:4:26: impossible thresholds: exit-at-or-above-bp (-10.0) is below enter-below-bp (0.0)")
                .contains("p.yaml:5:30: 'exit-after-observations' must be at least 1, got 0")
                .contains("p.yaml:7:44: impossible threshold: 'share' must be above 0 and at most 1, got 1.5")
                .contains("p.yaml:8:32: 'days' must be at least 1, got 0");
    }

    /* Thresholds are compared to six decimals of a bp (shares to six decimals) within 10^7 bp (docs/policy.md); beyond that, a problem at the key. */
    @Test
    void thresholdsBeyondWhatTheMonitorComparesAreReported() {
        String message = problems("""
                watch:
                  - spread: 10Y-2Y
                    enter-below-bp: 1e300
                    confirm:
                      - quarter-average: { below-bp: -1e300 }
                      - share-inverted: { days: 90, share: 0.0000001 }
                  - spread: 10Y-3M
                    exit-at-or-above-bp: 20000000
                    confirm: [days-inverted:90]
                """);
        assertThat(message).contains("p.yaml:3:21: 'enter-below-bp' must be at most 10000000 bp in size, got 1.0E300")
                .contains("p.yaml:5:38: 'below-bp' must be at most 10000000 bp in size, got -1.0E300")
                .contains("p.yaml:6:44: impossible threshold: 'share' is compared to six decimals and must be at least 0.000001, got 1.0E-7")
                .contains("p.yaml:8:26: 'exit-at-or-above-bp' must be at most 10000000 bp in size, got 2.0E7");
        assertThatThrownBy(() -> PersistenceForms.parse("rolling-average:30", 2e7))
                .hasMessage("entry threshold must be at most 10000000 bp in size, got 2.0E7");
    }

    @Test
    void missingPartsAreReported() {
        assertThat(problems("watch:\n  - confirm: [quarter-average]\n")).isEqualTo("p.yaml:2:5: a watch entry needs 'spread' (for example 10Y-3M)");
        assertThat(problems("watch:\n  - spread: 10Y-3M\n")).startsWith("p.yaml:2:5: a watch entry needs 'confirm'");
        assertThat(problems("# nothing\n")).isEqualTo("p.yaml:1:1: empty policy: expected a 'watch' list");
    }

    @Test
    void brokenYamlIsReportedWithItsPosition() {
        assertThatThrownBy(() -> PolicyParser.parse("p.yaml", "watch:\n  - spread: [10Y-3M\n"))
                .isInstanceOf(PolicyException.class).hasMessageStartingWith("p.yaml:3:1: not valid YAML");
    }
}
