package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import org.junit.jupiter.api.Test;

/**
 * The fetches of pulled sources, the same checks on H2 and PostgreSQL: every fetch is kept, newest
 * first; the validators a conditional GET sends back are those of the last publication read whole,
 * which a 304, a failure or a refusal leaves as they were (RFC 9110, 13.1.1 and 13.1.3: the entity tag
 * and the modification date of the representation held).
 */
abstract class SourceFetchesChecks extends AlertJournalFixture {

    @Test
    void theValidatorsAreThoseOfTheLastPublicationRead() {
        SourceFetches store = new SourceFetches(database(), clock);
        Instant t = Instant.parse("2026-06-12T21:30:00Z");

        assertThat(store.validators("treasury-par")).isEmpty();
        store.record(new SourceFetches.Fetch("treasury-par", "GOVT-A", t, 200, "forwarded", 10, 0, 0, 0, null, "\"v1\"",
                "Fri, 12 Jun 2026 21:00:00 GMT"));
        store.record(new SourceFetches.Fetch("treasury-par", "GOVT-A", t.plusSeconds(3600), 304, "not-modified", 0, 0, 0, 0,
                "not modified", null, null));
        store.record(new SourceFetches.Fetch("treasury-par", "GOVT-A", t.plusSeconds(7200), null, "failed", 0, 0, 0, 0,
                "could not connect", null, null));
        store.record(new SourceFetches.Fetch("treasury-par", "GOVT-A", t.plusSeconds(10800), 200, "refused", 0, 0, 0, 1,
                "refused: treasury-par:1:1: missing column 'date'", "\"broken\"", null));
        store.record(new SourceFetches.Fetch("other", "GOVT-B", t, 200, "forwarded", 1, 0, 0, 0, null, "\"o1\"", null));

        assertThat(store.validators("treasury-par")).contains(new SourceFetches.Validators("\"v1\"", "Fri, 12 Jun 2026 21:00:00 GMT"));
        assertThat(store.recent("treasury-par", 10)).extracting(SourceFetches.Fetch::outcome)
                .containsExactly("refused", "failed", "not-modified", "forwarded");
        SourceFetches.Fetch failed = store.recent("treasury-par", 10).get(1);
        assertThat(failed.httpStatus()).as("no answer, no status").isNull();
        assertThat(failed.startedAt()).isEqualTo(t.plusSeconds(7200));
        assertThat(store.recent("treasury-par", 2)).hasSize(2);
    }
}
