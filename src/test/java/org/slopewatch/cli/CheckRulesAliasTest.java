package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code check-rules}, the old name of {@code vet-policy}, kept hidden for one release
 * (vocabulary: deprecation path): a deprecation line on stderr, then what {@code vet-policy}
 * prints, with its exit codes; it is not listed in the usage. Old policy keys are warned about by
 * both names of the command.
 */
class CheckRulesAliasTest {

    @TempDir
    Path dir;

    @Test
    void theOldNameWarnsAndThenDoesWhatVetPolicyDoes() {
        CliRun vet = CliRun.of("vet-policy", "alert-rules");
        CliRun old = CliRun.of("check-rules", "alert-rules");
        assertThat(old.exitCode()).isZero();
        assertThat(old.out()).isEqualTo(vet.out());
        assertThat(old.err()).isEqualTo("slopewatch: 'check-rules' is deprecated and will be removed; use 'vet-policy'"
                + System.lineSeparator());
    }

    @Test
    void theOldNameKeepsTheExitCodes() throws IOException {
        Files.writeString(dir.resolve("bad.yaml"), "watch: 3\n");
        assertThat(CliRun.of("check-rules", dir.toString()).exitCode()).isEqualTo(2).isEqualTo(CliRun.of("vet-policy", dir.toString()).exitCode());
        assertThat(CliRun.of("check-rules", dir.resolve("absent").toString()).exitCode()).isEqualTo(1);
    }

    @Test
    void theOldNameIsNotInTheUsage() {
        CliRun help = CliRun.of("--help");
        assertThat(help.out()).contains("vet-policy").doesNotContain("check-rules");
    }

    @Test
    void oldPolicyKeysAreWarnedAboutWithTheNewKeyAndThePolicyIsSound() throws IOException {
        Path file = dir.resolve("old.yaml");
        Files.writeString(file, Files.readString(Path.of("alert-rules/default.yaml"))
                .replace("standing-every:", "repeat-every:").replace("closing-notice:", "resolve-notice:"));
        CliRun run = CliRun.of("vet-policy", file.toString());
        assertThat(run.exitCode()).isZero();
        assertThat(run.out()).isEqualTo(file + ": policy sound: 3 spread(s), 4 alert rule(s), 3 channel(s)" + System.lineSeparator());
        assertThat(run.err()).contains(file + ":59:5: 'repeat-every' is deprecated, write 'standing-every'")
                .contains(file + ":60:5: 'resolve-notice' is deprecated, write 'closing-notice'");
    }
}
