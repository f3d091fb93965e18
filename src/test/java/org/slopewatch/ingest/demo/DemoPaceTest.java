package org.slopewatch.ingest.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.smallrye.config.WithDefault;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.monitor.MonitorEvent;
import org.slopewatch.monitor.SignalEngine;
import org.slopewatch.monitor.SpreadState;
import org.slopewatch.monitor.Transition;
import org.slopewatch.rules.PolicyParser;

/**
 * The demo's pace on the wall clock: with the shipped defaults, a person watching the dashboard
 * sees each of GOVT-A's confirmed inversions for at least a minute before it re-steepens. The
 * days and values of the scenario are DemoStoryTest's; only the time between them is checked here.
 */
class DemoPaceTest {

    /** Long enough to look at the confirmed card, read it and point at it. */
    private static final Duration ON_SCREEN = Duration.ofSeconds(60);

    @Test
    void withTheShippedDefaultsEachConfirmedInversionOfSeedOneStaysOnScreenForAtLeastAMinute() throws Exception {
        DemoPace pace = shippedPace();
        var watches = PolicyParser.parse("default.yaml", Files.readString(Path.of("alert-rules/default.yaml"))).watches();
        SignalEngine engine = new SignalEngine(watches);
        Map<LocalDate, Long> index = new HashMap<>();
        List<Transition> transitions = new ArrayList<>();
        Iterator<DemoDay> days = DemoScenario.standard(1, LocalDate.of(2026, 1, 5)).iterator();
        long sequence = 0;
        for (int d = 0; d < 800; d++) {
            DemoDay day = days.next();
            index.put(day.date(), day.index());
            for (CurveSnapshot s : day.snapshots()) {
                for (MonitorEvent e : engine.onSnapshot(s, ++sequence)) {
                    if (e instanceof Transition t) {
                        transitions.add(t);
                    }
                }
            }
        }
        for (String spread : List.of("10Y-3M", "10Y-2Y", "near-term-forward")) {
            List<Transition> ts = transitions.stream().filter(t -> t.spread().curve().equals("GOVT-A") && t.spread().spread().equals(spread)).toList();
            Transition confirmed = ts.stream().filter(t -> t.to() == SpreadState.CONFIRMED).findFirst().orElseThrow();
            Transition resteepened = ts.stream().filter(t -> t.from() == SpreadState.CONFIRMED).findFirst().orElseThrow();
            Duration shown = pace.between(index.get(confirmed.date()), index.get(resteepened.date()));
            assertThat(shown).as("GOVT-A %s is CONFIRMED from %s to %s: %s s on screen at %s", spread, confirmed.date(), resteepened.date(),
                    shown.toMillis() / 1000.0, pace).isGreaterThanOrEqualTo(ON_SCREEN);
        }
    }

    @Test
    void theScriptedCycleGoesAtItsPaceAndTheDaysAfterItAtTheirs() {
        DemoPace pace = new DemoPace(520, 4, 0.5);
        assertThat(pace.before(0)).isEqualTo(Duration.ofMillis(250));
        assertThat(pace.before(519)).isEqualTo(Duration.ofMillis(250));
        assertThat(pace.before(520)).as("after the cycle, one day every 2 s").isEqualTo(Duration.ofSeconds(2));
        assertThat(pace.between(518, 521)).as("days 519, 520 and 521").isEqualTo(Duration.ofMillis(250 + 2000 + 2000));
        assertThat(pace.between(5, 5)).isEqualTo(Duration.ZERO);
    }

    @Test
    void aPaceThatCannotBeKeptIsRefused() {
        assertThatThrownBy(() -> new DemoPace(520, 0, 0.5)).hasMessageContaining("positive");
        assertThatThrownBy(() -> new DemoPace(520, 4, Double.NaN)).hasMessageContaining("positive");
        assertThatThrownBy(() -> new DemoPace(520, Double.POSITIVE_INFINITY, 0.5)).hasMessageContaining("finite");
        assertThatThrownBy(() -> new DemoPace(-1, 4, 0.5)).hasMessageContaining("fewer than 0");
    }

    /** The pace as the daemon reads it when nothing overrides it: the defaults DemoConfig declares. */
    static DemoPace shippedPace() throws NoSuchMethodException {
        return new DemoPace(Integer.parseInt(shipped("fastDays")), Double.parseDouble(shipped("fastDaysPerSecond")),
                Double.parseDouble(shipped("laterDaysPerSecond")));
    }

    static String shipped(String method) throws NoSuchMethodException {
        return DemoConfig.class.getMethod(method).getAnnotation(WithDefault.class).value();
    }
}
