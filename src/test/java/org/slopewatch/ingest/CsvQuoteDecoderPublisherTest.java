package org.slopewatch.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.history.SeriesMap;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.RejectReason;

/**
 * A CSV body may be a publisher's file as it is published, recognised from its header like a
 * history file: the Treasury's par yield curve (its curve named by {@code ?curve=}), the H.15
 * download, SDMX-CSV through the configured series map. A body that is refused is one
 * {@code malformed} reject at its line and column, and none of its quotes is taken. The layouts
 * are those documented in the history reader's tests (from memory); the yields are invented.
 */
class CsvQuoteDecoderPublisherTest {

    private static final LocalDate TODAY = LocalDate.of(2026, 6, 15);
    private final IngestRules rules = new IngestRules(Set.of("GOVT-A", "GOVT-B"), YieldBounds.DEFAULT, 3,
            Clock.fixed(TODAY.atStartOfDay().toInstant(ZoneOffset.UTC), ZoneOffset.UTC));

    @TempDir
    Path dir;

    private QuoteBatch decode(CsvQuoteDecoder csv, String body, String curve) {
        return csv.decode("csv", body.getBytes(StandardCharsets.UTF_8), null, curve, null);
    }

    @Test
    void theTreasurysParYieldFileIsTakenAsTheCurveTheRequestNames() {
        QuoteBatch batch = decode(new CsvQuoteDecoder(new QuoteDecoder(rules), rules),
                "Date,\"3 Mo\",\"2 Yr\",\"10 Yr\"\n06/12/2026,4.30,3.90,4.24\n06/11/2026,4.31,3.91,4.25\n", "GOVT-A");
        assertThat(batch.rejects()).isEmpty();
        assertThat(batch.messages()).extracting(m -> m.curve() + " " + m.date()).containsExactly("GOVT-A 2026-06-11", "GOVT-A 2026-06-12");
        assertThat(batch.messages().get(1).yieldsBp()).containsOnlyKeys(Tenor.months(3), Tenor.years(2), Tenor.years(10));
    }

    @Test
    void anSdmxBodyIsPlacedByTheConfiguredMapAndRefusedWholeWithoutIt() throws Exception {
        Path file = dir.resolve("map.csv");
        Files.writeString(file, "D.XA.M3,GOVT-A,3M\nD.XA.Y10,GOVT-A,10Y\n");
        String body = """
                DATAFLOW,FREQ,REF_AREA,MATURITY,TIME_PERIOD,OBS_VALUE
                DESK:YIELDS(1.0),D,XA,M3,2026-06-12,4.30
                DESK:YIELDS(1.0),D,XA,Y10,2026-06-12,4.24
                """;
        QuoteBatch mapped = decode(new CsvQuoteDecoder(new QuoteDecoder(rules), rules, SeriesMap.read(file)), body, null);
        assertThat(mapped.rejects()).isEmpty();
        assertThat(mapped.messages()).singleElement().satisfies(m ->
                assertThat(m.yieldsBp()).containsOnlyKeys(Tenor.months(3), Tenor.years(10)));
        QuoteBatch unmapped = decode(new CsvQuoteDecoder(new QuoteDecoder(rules), rules), body, null);
        assertThat(unmapped.messages()).isEmpty();
        assertThat(unmapped.rejects()).singleElement().satisfies(r -> {
            assertThat(r.reason()).isEqualTo(RejectReason.MALFORMED);
            assertThat(r.detail()).startsWith("request:1:1: an SDMX-CSV file needs a series map");
        });
    }

    @Test
    void aHostileH15BodyIsOneRejectAtItsLineAndNothingOfItIsTaken() {
        String body = """
                "Series Description","3-month","10-year"
                "Unit:","Percent:_Per_Year","Percent:_Per_Year"
                "Multiplier:","1","1"
                "Currency:","NA","NA"
                "Unique Identifier: ","H15/H15/RIFLGFCM03_N.B","H15/H15/RIFLGFCY10_N.B"
                "Time Period","RIFLGFCM03_N.B","RIFLGFCY10_N.B"
                2026-06-11,4.31,4.25
                2026-06-12,4.30,4..24
                """;
        QuoteBatch batch = decode(new CsvQuoteDecoder(new QuoteDecoder(rules), rules), body, "GOVT-A");
        assertThat(batch.messages()).isEmpty();
        // "2026-06-12,4.30," is 16 characters: the cell starts at 17
        assertThat(batch.rejects()).singleElement().satisfies(r ->
                assertThat(r.detail()).isEqualTo("request:8:17: unparsable number '4..24' for 10Y"));
    }
}
