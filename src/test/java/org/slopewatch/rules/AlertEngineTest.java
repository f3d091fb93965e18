package org.slopewatch.rules;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.slopewatch.monitor.SpreadState;

/** Notices over time, read like a timeline: opening notice, quiet, standing notice, closing notice. */
class AlertEngineTest {

    private static final AlertRule CONFIRMED = new AlertRule("inversion-confirmed", new AlertTrigger.EntersState(SpreadState.CONFIRMED),
            Set.of(), Severity.CRITICAL, List.of("log"), Duration.ofHours(24), true, "{curve} {spread} confirmed at {value} bp: {reason}");
    private static final AlertRule FIRST = new AlertRule("first-inversion", new AlertTrigger.EntersState(SpreadState.INVERTED),
            Set.of(), Severity.INFO, List.of("log"), Duration.ZERO, false, "{curve} {spread} inverted");

    private static final Instant T0 = Instant.parse("2026-09-21T16:00:00Z");

    private static AlertCondition confirmed(boolean holds) {
        return new AlertCondition("inversion-confirmed", "GOVT-A:10Y-3M", holds, holds ? LocalDate.of(2026, 9, 21) : null,
                Map.of("curve", "GOVT-A", "spread", "10Y-3M", "value", "-18.4", "reason", "quarter average -18.4 bp < 0 bp (2026Q3)"));
    }

    @Test
    void firstNoticeThenQuietThenRepeatThenResolve() {
        AlertEngine engine = new AlertEngine(List.of(CONFIRMED));
        List<AlertDecision> t0 = engine.decide(List.of(confirmed(true)), T0);
        assertThat(t0).singleElement().satisfies(d -> {
            assertThat(d.notice()).isEqualTo(Alert.Kind.OPENING);
            assertThat(d.why()).isEqualTo("the condition now holds");
            assertThat(d.id()).isEqualTo("inversion-confirmed~GOVT-A:10Y-3M~2026-09-21~1");
            assertThat(d.message()).isEqualTo("GOVT-A 10Y-3M confirmed at -18.4 bp: quarter average -18.4 bp < 0 bp (2026Q3)");
        });
        assertThat(engine.decide(List.of(confirmed(true)), T0.plus(Duration.ofHours(23)))).as("within the standing interval").isEmpty();
        assertThat(engine.decide(List.of(confirmed(true)), T0.plus(Duration.ofHours(24)))).singleElement().satisfies(d -> {
            assertThat(d.notice()).isEqualTo(Alert.Kind.STANDING);
            assertThat(d.id()).endsWith("~2");
        });
        assertThat(engine.decide(List.of(confirmed(false)), T0.plus(Duration.ofHours(30)))).singleElement().satisfies(d -> {
            assertThat(d.notice()).isEqualTo(Alert.Kind.CLOSING);
            assertThat(d.why()).isEqualTo("the condition no longer holds");
            assertThat(d.id()).isEqualTo("inversion-confirmed~GOVT-A:10Y-3M~2026-09-21~3");
        });
        assertThat(engine.openEpisodes()).isEmpty();
    }

    @Test
    void theSameConditionsGiveTheSameIdsSoARestartCannotDuplicate() {
        List<AlertDecision> a = new AlertEngine(List.of(CONFIRMED)).decide(List.of(confirmed(true)), T0);
        List<AlertDecision> b = new AlertEngine(List.of(CONFIRMED)).decide(List.of(confirmed(true)), T0.plusSeconds(90));
        assertThat(b.get(0).id()).isEqualTo(a.get(0).id());
    }

    @Test
    void aRestoredEpisodeContinuesInsteadOfStartingAgain() {
        AlertEngine engine = new AlertEngine(List.of(CONFIRMED));
        engine.restore("inversion-confirmed", "GOVT-A:10Y-3M", new AlertEngine.Episode(LocalDate.of(2026, 9, 21), T0, 2));
        assertThat(engine.decide(List.of(confirmed(true)), T0.plus(Duration.ofHours(1)))).as("no second opening notice").isEmpty();
        assertThat(engine.decide(List.of(confirmed(true)), T0.plus(Duration.ofHours(24)))).singleElement()
                .satisfies(d -> assertThat(d.id()).isEqualTo("inversion-confirmed~GOVT-A:10Y-3M~2026-09-21~3"));
    }

    @Test
    void newRulesKeepTheEpisodesOfRulesThatStay() {
        AlertEngine engine = new AlertEngine(List.of(CONFIRMED));
        engine.decide(List.of(confirmed(true)), T0);
        assertThat(engine.withRules(List.of(CONFIRMED)).openEpisodes()).hasSize(1);
        assertThat(engine.withRules(List.of()).openEpisodes()).as("rule removed: its episode goes").isEmpty();
    }

    @Test
    void silencingStopsRepeatsButStillResolves() {
        AlertEngine engine = new AlertEngine(List.of(CONFIRMED));
        engine.decide(List.of(confirmed(true)), T0);
        engine.silence("inversion-confirmed", "GOVT-A:10Y-3M");
        assertThat(engine.decide(List.of(confirmed(true)), T0.plus(Duration.ofDays(3)))).isEmpty();
        assertThat(engine.decide(List.of(confirmed(false)), T0.plus(Duration.ofDays(4))))
                .extracting(AlertDecision::notice).containsExactly(Alert.Kind.CLOSING);
    }

    @Test
    void aRuleWithoutRepeatOrResolveSpeaksOnce() {
        AlertEngine engine = new AlertEngine(List.of(FIRST));
        AlertCondition inverted = new AlertCondition("first-inversion", "GOVT-A:10Y-2Y", true, LocalDate.of(2026, 6, 24),
                Map.of("curve", "GOVT-A", "spread", "10Y-2Y"));
        assertThat(engine.decide(List.of(inverted), T0)).hasSize(1);
        assertThat(engine.decide(List.of(inverted), T0.plus(Duration.ofDays(30)))).isEmpty();
        assertThat(engine.decide(List.of(new AlertCondition("first-inversion", "GOVT-A:10Y-2Y", false, null, Map.of())),
                T0.plus(Duration.ofDays(31)))).isEmpty();
    }
}
