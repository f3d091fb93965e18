package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.slopewatch.monitor.DaysInverted;
import org.slopewatch.monitor.PersistenceTest;
import org.slopewatch.monitor.QuarterAverage;
import org.slopewatch.monitor.RollingAverage;
import org.slopewatch.monitor.ShareInverted;
import org.slopewatch.monitor.Watch;
import org.slopewatch.rules.PolicyException;
import picocli.CommandLine;

/**
 * A persistence test means the same and is refused in the same words whether it is written on
 * replay's command line ({@code --persistence days-inverted:90}) or in a policy file, as the same
 * text ({@code - days-inverted:90}) or as a mapping ({@code - days-inverted: { days: 90 }}).
 * The meaning of each form is the one docs/replay.md and alert-rules/README.md give.
 */
class ReplayPersistenceFormsTest {

    private static final String ENTRY_BP = "-7";

    @TempDir
    Path dir;

    static Stream<Arguments> acceptedForms() {
        // text, the same test in the mapping spelling, and the test both mean (thresholds left out are the entry threshold)
        return Stream.of(
                Arguments.of("quarter-average", "quarter-average: { below-bp: -7 }", new QuarterAverage(-7)),
                Arguments.of("days-inverted:90", "days-inverted: { days: 90 }", new DaysInverted(90)),
                Arguments.of("days-inverted:1", "days-inverted: { days: 1 }", new DaysInverted(1)),
                Arguments.of("rolling-average:180", "rolling-average: { days: 180 }", new RollingAverage(180, -7)),
                Arguments.of("share-inverted:120:0.8", "share-inverted: { days: 120, share: 0.8 }", new ShareInverted(120, 0.8)),
                Arguments.of("share-inverted:60:1", "share-inverted: { days: 60, share: 1 }", new ShareInverted(60, 1)));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("acceptedForms")
    void eachAcceptedFormGivesTheSameTestFromTheCommandLineAndFromAPolicy(String text, String mapping, PersistenceTest meant)
            throws IOException, PolicyException {
        Watch fromCommandLine = watch("--spread", "10Y-3M", "--entry-bp", ENTRY_BP, "--persistence", text);
        Watch fromPolicyText = watch("--policy", policy(text).toString());
        Watch fromPolicyMapping = watch("--policy", policy(mapping).toString());

        assertThat(fromCommandLine.rules().tests()).containsExactly(meant);
        // the whole definition: the command line's defaults for exit, exit observations and hold are the policy's
        assertThat(fromPolicyText.rules()).isEqualTo(fromCommandLine.rules());
        assertThat(fromPolicyMapping.rules()).isEqualTo(fromCommandLine.rules());
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"weekly-average", "Quarter-Average", "days-inverted", "days-inverted:0", "days-inverted:x", "days-inverted:+90",
            "days-inverted:90:", "days-inverted:90:1", "quarter-average:5", "rolling-average:-3", "share-inverted:90",
            "share-inverted:90:1.5", "share-inverted:0:0.5", "share-inverted:90:.8"})
    void eachBadFormIsRefusedInTheSameWordsFromTheCommandLineAndFromAPolicy(String text) throws IOException {
        Path csv = history();
        CliRun commandLine = CliRun.of("replay", csv.toString(), "--spread", "10Y-3M", "--entry-bp", ENTRY_BP, "--persistence", text);
        // quoted, so that YAML reads the item as this text whatever it holds ("days-inverted:90:" would be a key)
        CliRun policyFile = CliRun.of("replay", csv.toString(), "--policy", policy("\"" + text + "\"").toString());

        assertThat(commandLine.exitCode()).as(commandLine.err()).isEqualTo(2);
        assertThat(policyFile.exitCode()).as(policyFile.err()).isEqualTo(2);
        assertThat(commandLine.out()).isEmpty();
        assertThat(policyFile.out()).isEmpty();
        String said = commandLine.err().strip();
        assertThat(said).startsWith("slopewatch replay: ").contains("'" + text + "'").doesNotContain("\n");
        // the policy's problem is placed on its confirm item (line 5, column 9), and says the same
        assertThat(policyFile.err().strip()).isEqualTo(dir.resolve("p.yaml") + ":5:9: " + said.substring("slopewatch replay: ".length()));
    }

    @ParameterizedTest(name = "{1}")
    @CsvSource(delimiter = '|', quoteCharacter = '"', value = {
            "days-inverted:0       | days-inverted: { days: 0 }                 | 5:32 | 'days' must be at least 1, got 0",
            "rolling-average:-3    | rolling-average: { days: -3 }              | 5:34 | 'days' must be at least 1, got -3",
            "share-inverted:90:1.5 | share-inverted: { days: 90, share: 1.5 }   | 5:44 | impossible threshold: 'share' must be above 0 and at most 1, got 1.5",
            "days-inverted         | days-inverted: {}                          | 5:9  | 'days-inverted' needs 'days'",
            "share-inverted:90     | share-inverted: { days: 90 }               | 5:9  | 'share-inverted' needs 'share' (a fraction such as 0.8)",
            "days-inverted:x       | days-inverted: { days: x }                 | 5:32 | 'days' must be a whole number, got 'x'",
            "weekly-average        | weekly-average: { days: 5 }                | 5:9  | unknown persistence test 'weekly-average' "
                    + "(expected quarter-average, days-inverted:DAYS, rolling-average:DAYS or share-inverted:DAYS:SHARE)",
    })
    void theMappingSpellingIsRefusedInTheSameWordsAtTheParameter(String text, String mapping, String at, String words) throws IOException {
        Path csv = history();
        CliRun commandLine = CliRun.of("replay", csv.toString(), "--spread", "10Y-3M", "--entry-bp", ENTRY_BP, "--persistence", text);
        CliRun policyFile = CliRun.of("replay", csv.toString(), "--policy", policy(mapping).toString());

        assertThat(commandLine.exitCode()).isEqualTo(2);
        assertThat(policyFile.exitCode()).isEqualTo(2);
        assertThat(commandLine.err()).contains(words);
        assertThat(policyFile.err().strip()).isEqualTo(dir.resolve("p.yaml") + ":" + at + ": " + words);
    }

    /** The one watch the command line (without FILE: only what to watch is read) asks for. */
    private static Watch watch(String... args) throws IOException, PolicyException {
        ReplayCommand replay = new ReplayCommand();
        new CommandLine(replay).parseArgs(args);
        List<Watch> watches = replay.watches(new PrintWriter(Writer.nullWriter()));
        assertThat(watches).hasSize(1);
        return watches.get(0);
    }

    /** A policy watching 10Y-3M with the command line's entry threshold and one confirm item (line 5, column 9). */
    private Path policy(String confirmItem) throws IOException {
        Path file = dir.resolve("p.yaml");
        Files.writeString(file, "watch:\n  - spread: 10Y-3M\n    enter-below-bp: " + ENTRY_BP + "\n    confirm:\n      - " + confirmItem + "\n");
        return file;
    }

    private Path history() throws IOException {
        Path file = dir.resolve("h.csv");
        Files.writeString(file, "date,3M,10Y\n2026-01-02,4.1,4.0\n");
        return file;
    }
}
