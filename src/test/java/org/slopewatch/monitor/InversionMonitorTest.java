package org.slopewatch.monitor;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;
import org.slopewatch.spread.SpreadKey;

/** The state machine, table-driven with explicit market dates. */
class InversionMonitorTest {

    private static final SpreadKey KEY = new SpreadKey("GOVT-A", "10Y-3M");

    /** Feeds (date, bp) pairs and collects every event. */
    private static final class Run {
        final InversionMonitor monitor;
        final MonitorState state;
        final List<MonitorEvent> events = new ArrayList<>();
        long seq;

        Run(MonitorDefinition d) {
            monitor = new InversionMonitor(d);
            state = monitor.newState(KEY);
        }

        Run feed(String date, double bp) {
            events.addAll(monitor.observe(state, new Observation(LocalDate.parse(date), bp, ++seq)));
            return this;
        }

        List<String> transitions() {
            return events.stream().filter(e -> e instanceof Transition).map(e -> (Transition) e)
                    .map(t -> t.date() + " " + t.from() + "->" + t.to()).toList();
        }

        List<Spell> spells() {
            return events.stream().filter(e -> e instanceof Spell).map(e -> (Spell) e).toList();
        }

        Transition lastTransition() {
            Transition last = null;
            for (MonitorEvent e : events) {
                if (e instanceof Transition t) {
                    last = t;
                }
            }
            return last;
        }
    }

    private static MonitorDefinition rules(double entry, double exit, int exitObs, int hold, PersistenceTest... tests) {
        return new MonitorDefinition(entry, exit, exitObs, hold, List.of(tests));
    }

    @Test
    void aShortDipIsASpellThatEndsUnconfirmed() {
        Run r = new Run(rules(0, 0, 1, 90, new DaysInverted(90)))
                .feed("2026-03-02", 12).feed("2026-03-03", -4).feed("2026-03-04", -6).feed("2026-03-05", 3);
        assertThat(r.transitions()).containsExactly("2026-03-03 NORMAL->INVERTED", "2026-03-05 INVERTED->NORMAL");
        Spell s = r.spells().get(0);
        assertThat(s.start()).isEqualTo("2026-03-03");
        assertThat(s.end()).isEqualTo("2026-03-05");
        assertThat(s.wasConfirmed()).isFalse();
        assertThat(s.durationDays()).isEqualTo(2);
        assertThat(s.observations()).isEqualTo(3);
        assertThat(s.deepestBp()).isEqualTo(-6);
        assertThat(s.deepestDate()).isEqualTo("2026-03-04");
        // area below 0 bp, each depth held until the next observation: 4·1 + 6·1 = 10 bp·days
        assertThat(s.invertedAreaBpDays()).isEqualTo(10.0);
        assertThat(r.state.state()).isEqualTo(SpreadState.NORMAL);
    }

    @Test
    void daysInvertedCountsCalendarDaysSoMonthlyDataWorks() {
        Run r = new Run(rules(0, 0, 1, 365, new DaysInverted(90)))
                .feed("2026-01-01", -10).feed("2026-02-01", -12).feed("2026-03-01", -15).feed("2026-04-01", -9);
        // 2026-01-01 to 2026-04-01 is 90 calendar days: confirmed on the fourth month, not before
        assertThat(r.transitions()).containsExactly("2026-01-01 NORMAL->INVERTED", "2026-04-01 INVERTED->CONFIRMED");
        Transition t = r.lastTransition();
        assertThat(t.evidence().test()).isEqualTo("days-inverted");
        assertThat(t.evidence().measured()).isEqualTo(90);
        assertThat(t.reason()).isEqualTo("inverted for 90 days >= 90 days (since 2026-01-01)");
    }

    @Test
    void quarterAverageConfirmsOnTheFirstObservationOfTheNextQuarter() {
        Run r = new Run(rules(0, 0, 1, 365, new QuarterAverage(0)))
                .feed("2026-04-01", -10).feed("2026-05-01", -20).feed("2026-06-01", -25.2).feed("2026-07-01", -5);
        assertThat(r.transitions()).containsExactly("2026-04-01 NORMAL->INVERTED", "2026-07-01 INVERTED->CONFIRMED");
        Transition t = r.lastTransition();
        // (-10 - 20 - 25.2) / 3 = -18.4
        assertThat(t.toString()).isEqualTo("GOVT-A 10Y-3M INVERTED -> CONFIRMED on 2026-07-01: quarter average -18.4 bp < 0 bp (2026Q2)");
        assertThat(t.evidence().window()).isEqualTo("2026Q2");
        assertThat(t.sequence()).isEqualTo(4);
    }

    @Test
    void aQuarterThatAveragesBelowZeroDoesNotConfirmASpellThatAlreadyEnded() {
        Run r = new Run(rules(0, 0, 1, 365, new QuarterAverage(0)))
                .feed("2026-04-01", -40).feed("2026-05-01", -20).feed("2026-06-01", 5).feed("2026-07-01", 5);
        assertThat(r.transitions()).containsExactly("2026-04-01 NORMAL->INVERTED", "2026-06-01 INVERTED->NORMAL");
    }

    @Test
    void hysteresisBandAndExitRunKeepASpellFromFlapping() {
        Run r = new Run(rules(0, 10, 2, 365, new DaysInverted(30)))
                .feed("2026-01-01", -5)   // enters
                .feed("2026-01-02", 5)    // in the band: not back above exit
                .feed("2026-01-03", 12)   // first observation at or above exit
                .feed("2026-01-04", -1)   // run broken
                .feed("2026-01-05", 10)
                .feed("2026-01-06", 11);  // second in a row: spell over
        assertThat(r.transitions()).containsExactly("2026-01-01 NORMAL->INVERTED", "2026-01-06 INVERTED->NORMAL");
        assertThat(r.spells()).singleElement().satisfies(s -> assertThat(s.observations()).isEqualTo(6));
    }

    @Test
    void reSteepeningHoldsThenReturnsToNormal() {
        Run r = new Run(rules(0, 0, 1, 30, new DaysInverted(10)))
                .feed("2026-01-01", -5).feed("2026-01-11", -7)   // confirmed after 10 days
                .feed("2026-01-20", 4)                           // re-steepens
                .feed("2026-02-18", 6)                           // 29 days: still holding
                .feed("2026-02-19", 6);                          // 30 days: hold over
        assertThat(r.transitions()).containsExactly("2026-01-01 NORMAL->INVERTED", "2026-01-11 INVERTED->CONFIRMED",
                "2026-01-20 CONFIRMED->RESTEEPENING", "2026-02-19 RESTEEPENING->NORMAL");
        assertThat(r.spells()).singleElement().satisfies(s -> {
            assertThat(s.confirmed()).isEqualTo("2026-01-11");
            assertThat(s.confirmedBy()).isEqualTo("days-inverted");
            assertThat(s.end()).isEqualTo("2026-01-20");
        });
    }

    @Test
    void aNewInversionDuringTheHoldStartsANewSpell() {
        Run r = new Run(rules(0, 0, 1, 365, new DaysInverted(10)))
                .feed("2026-01-01", -5).feed("2026-01-11", -7).feed("2026-01-20", 4).feed("2026-02-01", -3);
        assertThat(r.transitions()).endsWith("2026-02-01 RESTEEPENING->INVERTED");
        assertThat(r.lastTransition().spellId()).isEqualTo(2);
        assertThat(r.state.openSpell().id()).isEqualTo(2);
    }

    @Test
    void rollingAverageWaitsForAWholeWindowOfHistory() {
        Run r = new Run(rules(0, 0, 1, 365, new RollingAverage(5, -2)));
        r.feed("2026-01-01", -20);                 // one value would decide alone: too early
        assertThat(r.transitions()).containsExactly("2026-01-01 NORMAL->INVERTED");
        r.feed("2026-01-02", -1).feed("2026-01-03", -1).feed("2026-01-04", -1);
        assertThat(r.transitions()).hasSize(1);
        r.feed("2026-01-05", -1);                  // window 01-01..01-05 complete: (-20-1-1-1-1)/5 = -4.8 < -2
        assertThat(r.transitions()).last().isEqualTo("2026-01-05 INVERTED->CONFIRMED");
        assertThat(r.lastTransition().evidence().measured()).isCloseTo(-4.8, Offset.offset(1e-12));
    }

    @Test
    void rollingWindowDropsObservationsOlderThanTheWindow() {
        Run r = new Run(rules(0, 0, 1, 365, new RollingAverage(3, -10)));
        r.feed("2026-01-01", 50).feed("2026-01-02", 50).feed("2026-01-03", -5).feed("2026-01-04", -5).feed("2026-01-05", -5);
        // on 01-05 the window holds 01-03..01-05 only: average -5, not below -10
        assertThat(r.transitions()).containsExactly("2026-01-03 NORMAL->INVERTED");
        r.feed("2026-01-06", -30);  // window 01-04..01-06: (-5-5-30)/3 = -13.3
        assertThat(r.transitions()).last().isEqualTo("2026-01-06 INVERTED->CONFIRMED");
    }

    @Test
    void shareInvertedCountsObservationsBelowEntryInTheWindow() {
        Run r = new Run(rules(0, 0, 2, 365, new ShareInverted(10, 0.8)));
        r.feed("2026-01-01", 5);
        for (int d = 2; d <= 9; d++) {
            r.feed("2026-01-0" + d, -3);
        }
        // on 01-09 the window has not covered 10 days yet
        assertThat(r.transitions()).containsExactly("2026-01-02 NORMAL->INVERTED");
        r.feed("2026-01-10", 4);  // 01-01..01-10: 8 of 10 below = 80 %
        assertThat(r.transitions()).last().isEqualTo("2026-01-10 INVERTED->CONFIRMED");
        assertThat(r.lastTransition().reason()).isEqualTo("80% of 10 observations inverted over 10 days >= 80%");
    }

    @Test
    void observationsMustArriveInDateOrder() {
        Run r = new Run(MonitorDefinition.quarterAverageAtZero()).feed("2026-01-02", 1);
        assertThatThrownBy(() -> r.feed("2026-01-02", 2)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("must arrive in date order");
        assertThatThrownBy(() -> r.feed("2026-01-01", 2)).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void aRejectedObservationLeavesTheStateAsItWas() {
        // the monitor works out epoch days once per month: an earlier date in the same month, in an
        // earlier month and in an earlier quarter must each be refused before anything changes
        Run r = new Run(MonitorDefinition.quarterAverageAtZero()).feed("2026-03-30", -4).feed("2026-04-02", -6).feed("2026-04-20", -8);
        assertThatThrownBy(() -> r.feed("2026-04-10", 50)).hasMessageContaining("must arrive in date order");
        assertThatThrownBy(() -> r.feed("2026-03-31", 50)).hasMessageContaining("must arrive in date order");
        assertThatThrownBy(() -> r.feed("2025-12-31", 50)).hasMessageContaining("must arrive in date order");
        assertThat(r.state.lastDate()).isEqualTo("2026-04-20");
        assertThat(r.state.quarterToDateAverageBp()).isEqualTo(-7.0);
        assertThat(r.state.daysInverted()).isEqualTo(21);
        r.feed("2026-04-21", -10).feed("2026-07-01", 3);
        assertThat(r.events.stream().filter(e -> e instanceof QuarterSummary).map(e -> (QuarterSummary) e))
                .singleElement().satisfies(q -> {
                    assertThat(q.quarter().toString()).isEqualTo("2026Q2");
                    assertThat(q.averageBp()).isEqualTo(-8.0); // (-6 - 8 - 10) / 3
                });
    }

    @Test
    void aSeriesStartingMidQuarterDoesNotReportThatQuarter() {
        Run r = new Run(MonitorDefinition.quarterAverageAtZero())
                .feed("2026-02-15", -50).feed("2026-03-15", -50).feed("2026-04-15", 10).feed("2026-07-01", 10);
        assertThat(r.events.stream().filter(e -> e instanceof QuarterSummary).map(e -> ((QuarterSummary) e).quarter().toString()))
                .containsExactly("2026Q2");
        assertThat(r.transitions()).doesNotContain("2026-04-15 INVERTED->CONFIRMED");
    }

    @Test
    void impossibleDefinitionsAreRejected() {
        assertThatThrownBy(() -> rules(0, -5, 1, 0, new QuarterAverage(0))).hasMessageContaining("must not be below the entry");
        assertThatThrownBy(() -> rules(0, 0, 0, 0, new QuarterAverage(0))).hasMessageContaining("at least 1");
        assertThatThrownBy(() -> rules(0, 0, 1, 0)).hasMessageContaining("at least one persistence test");
        assertThatThrownBy(() -> new ShareInverted(10, 1.5)).hasMessageContaining("(0, 1]");
    }
}
