package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code vet-policy}: a valid directory passes, a bad file fails with positions and a non-zero exit. */
class VetPolicyCommandTest {

    @TempDir
    Path dir;

    @Test
    void theShippedPolicyDirectoryIsValid() {
        CliRun run = CliRun.of("vet-policy", "alert-rules");
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).isEqualTo("alert-rules/default.yaml: policy sound: 3 spread(s), 4 alert rule(s), 3 channel(s)"
                + System.lineSeparator());
        assertThat(run.err()).as("no warnings for the shipped policy").isEmpty();
    }

    @Test
    void aBadFileFailsWithEveryProblemAndItsPosition() throws IOException {
        Files.copy(Path.of("alert-rules/default.yaml"), dir.resolve("a-good.yaml"));
        Files.writeString(dir.resolve("b-bad.yml"), """
                watch:
                  - spread: 10Y-3M
                    exit-at-or-above-bp: -3
                    confirm: [quarter-average]
                alerts:
                  - { name: x, when: { enters-state: CONFIRMED }, severity: critical, channels: [pager] }
                """);
        Files.writeString(dir.resolve("notes.txt"), "not a policy");
        CliRun run = CliRun.of("vet-policy", dir.toString());
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.out()).contains("a-good.yaml: policy sound: 3 spread(s)");
        assertThat(run.err()).contains(dir.resolve("b-bad.yml") + ":3:26: impossible thresholds")
                .contains(dir.resolve("b-bad.yml") + ":6:82: unknown channel 'pager'").doesNotContain("notes.txt");
    }

    @Test
    void probabilityModelsAreCheckedWithTheirPositions() throws IOException {
        Files.writeString(dir.resolve("good.yaml"), """
                watch:
                  - spread: 10Y-3M
                    confirm: [quarter-average]
                probability:
                  10Y-3M: { alpha: -0.5333, beta: -0.6330, horizon-months: 12, source: "Estrella and Trubin (2006) (from memory)" }
                alerts:
                  - { name: odds, when: { probability-above: 0.3 }, severity: warning, channels: [log] }
                """);
        CliRun good = CliRun.of("vet-policy", dir.resolve("good.yaml").toString());
        assertThat(good.exitCode()).as(good.err()).isZero();
        assertThat(good.out()).contains("policy sound: 1 spread(s), 1 alert rule(s), 1 channel(s)");

        Files.writeString(dir.resolve("bad.yaml"), """
                watch:
                  - spread: 10Y-3M
                    confirm: [quarter-average]
                  - spread: 10Y-2Y
                    confirm: [quarter-average]
                probability:
                  10Y-3M: { alpha: .inf, beta: -0.6330, horizon-months: 12 }
                  10Y-1Y: { alpha: -1, beta: -1, horizon-months: 12, source: fit }
                alerts:
                  - { name: odds, when: { probability-above: 0.3 }, spreads: [10Y-2Y], severity: warning, channels: [log] }
                """);
        CliRun bad = CliRun.of("vet-policy", dir.resolve("bad.yaml").toString());
        assertThat(bad.exitCode()).isEqualTo(2);
        String file = dir.resolve("bad.yaml").toString();
        assertThat(bad.err()).contains(file + ":7:20: 'alpha' must be a finite number, got '.inf'")
                .contains(file + ":7:11: the probability model for 10Y-3M needs 'source'")
                .contains(file + ":8:3: unknown spread '10Y-1Y' in 'probability': not watched by this policy")
                .contains(file + ":10:63: 'probability-above' needs a probability model for spread '10Y-2Y'");
        assertThat(bad.out()).isEmpty();
    }

    @Test
    void aDirectoryWithoutPoliciesOrAMissingPathIsAnError() {
        assertThat(CliRun.of("vet-policy", dir.toString()).exitCode()).isEqualTo(2);
        CliRun missing = CliRun.of("vet-policy", dir.resolve("nope").toString());
        assertThat(missing.exitCode()).isEqualTo(1);
        assertThat(missing.err()).contains("cannot read");
    }
}
