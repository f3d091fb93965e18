package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code check-rules}: a valid directory passes, a bad file fails with positions and a non-zero exit. */
class CheckRulesCommandTest {

    @TempDir
    Path dir;

    @Test
    void theShippedPolicyDirectoryIsValid() {
        CliRun run = CliRun.of("check-rules", "alert-rules");
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).contains("alert-rules/default.yaml: ok: 3 spread(s) watched, 3 channel(s), 4 alert rule(s)");
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
        CliRun run = CliRun.of("check-rules", dir.toString());
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.out()).contains("a-good.yaml: ok");
        assertThat(run.err()).contains(dir.resolve("b-bad.yml") + ":3:26: impossible thresholds")
                .contains(dir.resolve("b-bad.yml") + ":6:82: unknown channel 'pager'").doesNotContain("notes.txt");
    }

    @Test
    void aDirectoryWithoutPoliciesOrAMissingPathIsAnError() {
        assertThat(CliRun.of("check-rules", dir.toString()).exitCode()).isEqualTo(2);
        CliRun missing = CliRun.of("check-rules", dir.resolve("nope").toString());
        assertThat(missing.exitCode()).isEqualTo(1);
        assertThat(missing.err()).contains("cannot read");
    }
}
