package org.slopewatch.pipeline;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.ingest.IngestRules;
import org.slopewatch.ingest.QuoteDecoder;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.monitor.DaysInverted;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.QuarterAverage;
import org.slopewatch.monitor.Watch;
import org.slopewatch.replay.Replay;
import org.slopewatch.replay.ReplayReport;
import org.slopewatch.spread.SpreadDefinition;

/**
 * The daemon's streaming path (one JSON quote per message, decoded, validated, journalled) and
 * the offline replay give the same transitions for the same input: the Federal Reserve H.15
 * monthly yields 1953-1999 (see reference/README.md).
 */
class StreamingMatchesReplayTest {

    private static final Clock CLOCK = Clock.fixed(Instant.parse("2026-12-01T00:00:00Z"), ZoneOffset.UTC);
    private static final List<Watch> WATCHES = List.of(
            new Watch(SpreadDefinition.parse("10Y-1Y"), new MonitorDefinition(0, 0, 1, 365, List.of(new QuarterAverage(0))), Set.of()),
            new Watch(SpreadDefinition.parse("5Y-1Y"), new MonitorDefinition(0, 10, 2, 180,
                    List.of(new DaysInverted(60), new QuarterAverage(-5))), Set.of()));

    @Test
    void streamingAndReplayAgreeOnTheReferenceData() throws Exception {
        Path file = Path.of(getClass().getClassLoader().getResource("reference/us-cmt-monthly-1953-1999.csv").toURI());

        ReplayReport replay;
        try (InputStream in = Files.newInputStream(file)) {
            replay = new Replay(WATCHES).run("ref", in, new HistoryCsvReader.Options("GOVT-A", YieldUnit.PERCENT, YieldBounds.DEFAULT),
                    null, () -> { });
        }
        List<String> replayed = replay.spreads().stream().flatMap(s -> s.transitions().stream()
                .map(t -> s.id() + " " + t.date() + " " + t.from() + "->" + t.to() + " " + t.reason())).sorted().toList();

        AgroalDataSource ds = JournalDatabase.open("jdbc:h2:mem:streaming-" + System.nanoTime() + ";DB_CLOSE_DELAY=-1", "sa", "", 2);
        try {
            QuotePipeline pipeline = new QuotePipeline(WATCHES, new JournalWriter(ds, CLOCK), new JournalReader(ds),
                    PipelineListener.NONE, CLOCK);
            QuoteDecoder decoder = new QuoteDecoder(new IngestRules(Set.of("GOVT-A"), YieldBounds.DEFAULT, 3, CLOCK));
            List<String> lines = Files.readAllLines(file);
            String[] tenors = lines.get(0).split(",");
            for (String line : lines.subList(1, lines.size())) {
                String[] f = line.split(",");
                // the long leg first, so that each date's spread is first seen without its short leg
                for (int i = f.length - 1; i >= 1; i--) {
                    String json = String.format(Locale.ROOT, "{\"curve\":\"GOVT-A\",\"tenor\":\"%s\",\"date\":\"%s\",\"yield\":%s,\"id\":\"%s-%s\"}",
                            tenors[i], f[0], f[i], f[0], tenors[i]);
                    QuoteBatch batch = decoder.decode("http", json);
                    assertThat(batch.rejects()).isEmpty();
                    pipeline.process(List.of(batch));
                }
            }
            List<String> streamed = new JournalReader(ds).transitions(null, LocalDate.of(1900, 1, 1), LocalDate.of(2100, 1, 1), false, 100_000)
                    .stream().map(t -> t.spreadId() + " " + t.date() + " " + t.from() + "->" + t.to() + " " + t.reason()).sorted().toList();

            assertThat(replayed).as("the reference data produce transitions").hasSizeGreaterThan(20);
            assertThat(streamed).isEqualTo(replayed);
        } finally {
            ds.close();
        }
    }
}
