package org.slopewatch.pipeline;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The stale-feed rule, with explicit instants (business hours: Monday to Friday, as {@link BusinessHoursTest} checks). */
class FeedFreshnessTest {

    private static final List<String> CURVES = List.of("GOVT-A", "GOVT-B");
    // Wednesday 2026-12-02 16:00 UTC; a quote at 09:00 the same day is 7 business hours old
    private static final Instant NOW = Instant.parse("2026-12-02T16:00:00Z");
    private static final Instant MORNING = Instant.parse("2026-12-02T09:00:00Z");
    private static final Instant LUNCH = Instant.parse("2026-12-02T13:00:00Z");

    @Test
    void quietTimeRunsFromTheLastQuoteOrFromStartUpForACurveNeverHeardFrom() {
        Map<String, FeedFreshness.CurveFeed> feeds = FeedFreshness.assess(CURVES, Map.of("GOVT-A", MORNING), LUNCH, NOW, 4,
                CurveOwnership.ALL);

        assertThat(feeds.get("GOVT-A").quietBusinessHours()).isEqualTo(7.0);
        assertThat(feeds.get("GOVT-A").stale()).isTrue();
        assertThat(feeds.get("GOVT-B").lastQuote()).isNull();
        assertThat(feeds.get("GOVT-B").quietSince()).isEqualTo(LUNCH);
        assertThat(feeds.get("GOVT-B").stale()).as("3 business hours since start-up, limit 4").isFalse();
        assertThat(FeedFreshness.staleSince(feeds)).containsEntry("GOVT-A", LocalDate.of(2026, 12, 2)).containsEntry("GOVT-B", null);
    }

    @Test
    void aCurveWithNoQuoteAtAllIsNeverQuotedFromTheStartThoughNotYetStale() {
        Map<String, FeedFreshness.CurveFeed> feeds = FeedFreshness.assess(CURVES, Map.of("GOVT-A", LUNCH), LUNCH, LUNCH.plusSeconds(60), 4,
                CurveOwnership.ALL);

        assertThat(feeds.get("GOVT-B").neverQuoted()).as("no quote in the journal").isTrue();
        assertThat(feeds.get("GOVT-B").stale()).as("one minute since start-up, limit 4 business hours").isFalse();
        assertThat(feeds.get("GOVT-A").neverQuoted()).isFalse();
        assertThat(FeedFreshness.assess(CURVES, Map.of(), LUNCH, NOW, 4, "GOVT-A"::equals).get("GOVT-B").neverQuoted())
                .as("a curve another instance owns is that instance's to report").isFalse();
    }

    @Test
    void aCurveOwnedByAnotherInstanceIsNeverStaleHereAndNoRuleHereDecidesOnIt() {
        CurveOwnership onlyB = "GOVT-B"::equals;

        Map<String, FeedFreshness.CurveFeed> feeds = FeedFreshness.assess(CURVES, Map.of("GOVT-A", MORNING, "GOVT-B", MORNING), MORNING,
                NOW, 4, onlyB);

        assertThat(feeds.get("GOVT-A").ownedHere()).isFalse();
        assertThat(feeds.get("GOVT-A").stale()).isFalse();
        assertThat(feeds.get("GOVT-B").stale()).isTrue();
        assertThat(FeedFreshness.staleSince(feeds)).containsOnlyKeys("GOVT-B");
    }
}
