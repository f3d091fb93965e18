package org.slopewatch.ingest.demo;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.rules.PolicyParser;

/**
 * Stopping the demo in the middle of its inversion and starting it again on the same journal
 * loses nothing: the feed resumes after the last journalled day and the end state and the
 * journalled transitions equal those of an uninterrupted run.
 */
class DemoRestartTest {

    private static final Clock CLOCK = Clock.fixed(Instant.parse("2030-01-01T00:00:00Z"), ZoneOffset.UTC);
    private static final int DAYS = 320;

    @TempDir
    Path dir;

    @Test
    void aRestartDuringTheDemoLosesNothing() throws Exception {
        var watches = PolicyParser.parse("default.yaml", Files.readString(Path.of("alert-rules/default.yaml"))).watches();
        DemoFeed feed = new DemoFeed(DemoScenario.standard(1, LocalDate.of(2026, 1, 5)));

        try (AgroalDataSource straight = open("straight"); AgroalDataSource restarted = open("restarted")) {
            QuotePipeline uninterrupted = pipeline(watches, straight);
            feed.play(null, DAYS, i -> { }, b -> uninterrupted.process(List.of(b)));

            QuotePipeline first = pipeline(watches, restarted);
            LocalDate stoppedAt = feed.play(null, 150, i -> { }, b -> first.process(List.of(b)));   // mid-inversion
            QuotePipeline second = pipeline(watches, restarted);                                       // rebuilt from the journal
            LocalDate resumeAfter = second.latestCurves().stream().map(CurveSnapshot::date).max(LocalDate::compareTo).orElseThrow();
            assertThat(resumeAfter).isEqualTo(stoppedAt);
            feed.play(resumeAfter, DAYS - 150, i -> { }, b -> second.process(List.of(b)));

            assertThat(second.spreads()).isEqualTo(uninterrupted.spreads());
            assertThat(transitions(restarted)).isEqualTo(transitions(straight))
                    .anyMatch(t -> t.contains("GOVT-A:10Y-3M") && t.contains("->CONFIRMED"));
        }
    }

    private AgroalDataSource open(String name) {
        return JournalDatabase.open("jdbc:h2:mem:demo-restart-" + name + "-" + System.nanoTime() + ";DB_CLOSE_DELAY=-1", "sa", "", 2);
    }

    private static QuotePipeline pipeline(List<org.slopewatch.monitor.Watch> watches, AgroalDataSource ds) {
        QuotePipeline p = new QuotePipeline(watches, new JournalWriter(ds, CLOCK), new JournalReader(ds), PipelineListener.NONE, CLOCK);
        p.recover();
        return p;
    }

    private static List<String> transitions(AgroalDataSource ds) {
        return new JournalReader(ds).transitions(null, LocalDate.of(2000, 1, 1), LocalDate.of(2100, 1, 1), true, 10_000).stream()
                .map(t -> t.spreadId() + " " + t.date() + " " + t.from() + "->" + t.to() + " seq " + t.seq()).toList();
    }
}
