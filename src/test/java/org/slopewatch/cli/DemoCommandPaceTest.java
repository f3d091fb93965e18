package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import io.smallrye.config.WithDefault;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.slopewatch.ingest.demo.DemoConfig;
import picocli.CommandLine;

/**
 * {@code slopewatch demo --pace=SECONDS}: seconds of wall time per market day of the scripted
 * cycle, handed to the feed as days per second; without it the configuration's pace applies.
 */
class DemoCommandPaceTest {

    @Test
    void thePaceInSecondsPerDayBecomesTheFeedsDaysPerSecond() {
        assertThat(parse("--pace=0.5").settings(Path.of("target/demo-x"), "token-for-the-test"))
                .containsEntry("slopewatch.demo.fast-days-per-second", "2.0");
        assertThat(parse("--pace", "2").settings(Path.of("target/demo-x"), "token-for-the-test"))
                .containsEntry("slopewatch.demo.fast-days-per-second", "0.5");
    }

    @Test
    void withoutAPaceTheConfigurationDecides() {
        assertThat(parse().settings(Path.of("target/demo-x"), "token-for-the-test").keySet())
                .as("slopewatch.demo.fast-days-per-second in config/application.properties or the environment still applies")
                .doesNotContain("slopewatch.demo.fast-days-per-second");
    }

    @Test
    void aPaceOutOfRangeIsAUsageErrorBeforeAnythingStarts() {
        for (String pace : new String[] {"0", "-1", "NaN", "Infinity", "3601"}) {
            CliRun run = CliRun.of("demo", "--pace=" + pace);
            assertThat(run.exitCode()).as("--pace=%s", pace).isEqualTo(2);
            assertThat(run.err()).as("--pace=%s", pace).contains("--pace must be between 0.001 and 3600.0 seconds per market day");
            assertThat(run.out()).as("nothing started for --pace=%s", pace).doesNotContain("journal in");
        }
    }

    @Test
    void theHelpGivesTheConfiguredDefaultPace() throws NoSuchMethodException {
        String daysPerSecond = DemoConfig.class.getMethod("fastDaysPerSecond").getAnnotation(WithDefault.class).value();
        double seconds = 1 / Double.parseDouble(daysPerSecond);
        CliRun run = CliRun.of("demo", "--help");
        assertThat(run.exitCode()).isZero();
        assertThat(run.out().replaceAll("\\s+", " ")).contains("--pace=SECONDS").contains("(default: " + seconds + ",");
    }

    private static DemoCommand parse(String... args) {
        DemoCommand demo = new DemoCommand();
        new CommandLine(demo).parseArgs(args);
        return demo;
    }
}
