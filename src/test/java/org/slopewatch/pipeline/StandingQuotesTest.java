package org.slopewatch.pipeline;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.time.Clock;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.Tenor;
import org.slopewatch.journal.JournalDatabase;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.monitor.DaysInverted;
import org.slopewatch.monitor.MonitorDefinition;
import org.slopewatch.monitor.Watch;
import org.slopewatch.spread.SpreadDefinition;

/** Which messages of a backfill a journal holds already as they stand, and which go in. */
class StandingQuotesTest {

    private static final LocalDate D1 = LocalDate.of(2026, 3, 2);
    private static final LocalDate D2 = LocalDate.of(2026, 3, 3);

    private static QuoteMessage quote(String curve, LocalDate date, double tenYear) {
        return QuoteMessage.of(curve, date, Map.of(Tenor.months(3), 410.0, Tenor.years(10), tenYear));
    }

    @Test
    void onlyTheLatestQuoteOfACurveAndDateWithTheSameYieldsIsHeld() throws Exception {
        try (AgroalDataSource ds = JournalDatabase.open("jdbc:h2:mem:standing-" + System.nanoTime() + ";DB_CLOSE_DELAY=-1", "sa", "", 2)) {
            JournalReader reader = new JournalReader(ds);
            QuoteMessage first = quote("GOVT-A", D1, 400);
            assertThat(StandingQuotes.notYetJournalled(List.of(first), reader)).as("an empty journal holds nothing").containsExactly(first);

            Clock clock = Clock.systemUTC();
            QuotePipeline pipeline = new QuotePipeline(List.of(new Watch(SpreadDefinition.parse("10Y-3M"),
                    new MonitorDefinition(0, 0, 1, 30, List.of(new DaysInverted(20))), Set.of())), new JournalWriter(ds, clock), reader, PipelineListener.NONE, clock);
            pipeline.recover();
            // D1 sent at 400 then revised to 395: 395 stands
            pipeline.process(List.of(new QuoteBatch("test", List.of(first, quote("GOVT-A", D1, 395), quote("GOVT-A", D2, 402)), List.of())));

            assertThat(StandingQuotes.notYetJournalled(List.of(
                    quote("GOVT-A", D1, 395),   // as it stands: held
                    quote("GOVT-A", D1, 400),   // as it was first sent, since revised: sending it is a revision again
                    quote("GOVT-A", D2, 402),   // held
                    quote("GOVT-B", D2, 402),   // another curve: not held
                    quote("GOVT-A", D2, 401)), reader))
                    .containsExactly(quote("GOVT-A", D1, 400), quote("GOVT-B", D2, 402), quote("GOVT-A", D2, 401));

            // in one run, a later file's same date is compared with what the earlier one sends, not with the journal as it was
            assertThat(StandingQuotes.notYetJournalled(List.of(
                    quote("GOVT-A", D2, 399),   // changes D2
                    quote("GOVT-A", D2, 402),   // and back to what the journal held: must go in too
                    quote("GOVT-A", D2, 402)), reader))  // the same again: nothing new
                    .containsExactly(quote("GOVT-A", D2, 399), quote("GOVT-A", D2, 402));
        }
    }
}
