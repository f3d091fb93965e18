package org.slopewatch.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.Resolution;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;

/**
 * A CSV body says the basis of its bills as a file does, and the daemon takes them as it takes a
 * JSON quote with {@code "basis":"discount"}: converted to a bond-equivalent yield. A body sorted by
 * curve and then date is taken like one sorted by date.
 *
 * <p>Expected values: the U.S. Treasury's formula for the bond-equivalent yield of a bill of at
 * most 182 days, {@code BEY = 365·d / (360 − d·t)} (from memory; also recorded in the shared
 * reference notes), worked by hand beside each check.
 */
class CsvQuoteDecoderBasisTest {

    private static final LocalDate TODAY = LocalDate.of(2026, 6, 15);
    private final IngestRules rules = new IngestRules(Set.of("GOVT-A", "GOVT-B"), YieldBounds.DEFAULT, 3,
            Clock.fixed(TODAY.atStartOfDay().toInstant(ZoneOffset.UTC), ZoneOffset.UTC));
    private final CsvQuoteDecoder csv = new CsvQuoteDecoder(new QuoteDecoder(rules), rules);

    private QuoteBatch decode(String body) {
        return csv.decode("csv", body.getBytes(StandardCharsets.UTF_8), null, null, null);
    }

    @Test
    void billsOnADiscountBasisAreTakenAsTheirBondEquivalentYields() {
        QuoteBatch batch = decode("""
                date,curve,tenor,yield,basis
                2026-06-01,GOVT-A,13W,15.50,discount
                2026-06-01,GOVT-A,10Y,14.00,
                """);
        assertThat(batch.rejects()).isEmpty();
        QuoteMessage m = batch.messages().get(0);
        // 91 days at 15.50 %: 365·0.155 / (360 − 0.155·91) = 56.575 / 345.895 = 16.3561 %, taken at the 3M point
        assertThat(m.yieldsBp().keySet()).containsExactly(Tenor.months(3), Tenor.years(10));
        assertThat(m.yieldsBp().get(Tenor.months(3))).isCloseTo(1635.61, within(0.01));
        // the same quote sent as JSON is converted by the same rule (equal once in a snapshot, which takes yields to 1e-6 bp)
        QuoteMessage json = new QuoteDecoder(rules).decode("http",
                "{\"curve\":\"GOVT-A\",\"tenor\":\"13W\",\"date\":\"2026-06-01\",\"yield\":15.50,\"basis\":\"discount\"}").messages().get(0);
        assertThat(Resolution.BASIS_POINTS.round(json.yieldsBp().get(Tenor.weeks(13))))
                .isEqualTo(Resolution.BASIS_POINTS.round(m.yieldsBp().get(Tenor.months(3))));
    }

    @Test
    void aBodySortedByCurveThenDateIsTakenWhole() {
        QuoteBatch batch = decode("""
                date,curve,tenor,yield
                2026-06-01,GOVT-A,10Y,4.0
                2026-06-02,GOVT-A,10Y,4.1
                2026-06-01,GOVT-B,10Y,4.2
                2026-06-02,GOVT-B,10Y,4.3
                """);
        assertThat(batch.rejects()).isEmpty();
        assertThat(batch.messages()).extracting(m -> m.curve() + " " + m.date()).containsExactlyInAnyOrder(
                "GOVT-A 2026-06-01", "GOVT-A 2026-06-02", "GOVT-B 2026-06-01", "GOVT-B 2026-06-02");
    }

    @Test
    void aBasisThatCannotApplyRefusesTheBodyAtItsLineAndColumn() {
        QuoteBatch batch = decode("date,curve,tenor,yield,basis\n2026-06-01,GOVT-A,10Y,4.0,discount\n");
        assertThat(batch.messages()).isEmpty();
        // "2026-06-01,GOVT-A,10Y,4.0," is 26 characters: the basis starts at 27
        assertThat(batch.rejects()).singleElement().satisfies(r ->
                assertThat(r.detail()).isEqualTo("request:2:27: discount basis applies to bills up to 52W, not 10Y"));
    }
}
