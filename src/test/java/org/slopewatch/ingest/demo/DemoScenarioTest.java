package org.slopewatch.ingest.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.util.Iterator;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;

/** The feed's shape and determinism; the story it tells is checked through the engine in {@link DemoStoryTest}. */
class DemoScenarioTest {

    private static final LocalDate START = LocalDate.of(2026, 1, 5);
    private static final Tenor M3 = Tenor.months(3);
    private static final Tenor Y2 = Tenor.years(2);
    private static final Tenor Y10 = Tenor.years(10);

    @Test
    void everyBusinessDayCarriesOneSnapshotPerCurveWithTheElevenTenors() {
        LocalDate expected = START;
        Iterator<DemoDay> run = DemoScenario.standard(1, START).iterator();
        for (int i = 0; i < 60; i++) {
            DemoDay day = run.next();
            assertThat(day.index()).isEqualTo(i);
            assertThat(day.date()).as("business day %d", i).isEqualTo(expected);
            assertThat(day.snapshots()).extracting(CurveSnapshot::curve).containsExactly("GOVT-A", "GOVT-B");
            for (CurveSnapshot s : day.snapshots()) {
                assertThat(s.date()).isEqualTo(day.date());
                assertThat(s.asMap().keySet()).containsExactlyElementsOf(DemoScenario.TENORS);
                s.asMap().values().forEach(bp -> assertThat(bp).as("a yield the ingest would accept").isPositive()
                        .isLessThan(YieldBounds.DEFAULT.maxBp()));
            }
            expected = expected.plusDays(expected.getDayOfWeek() == DayOfWeek.FRIDAY ? 3 : 1);
        }
    }

    @Test
    void aStartOnAWeekendMovesToTheFollowingMonday() {
        DemoScenario s = DemoScenario.standard(1, LocalDate.of(2026, 1, 3));
        assertThat(s.start()).isEqualTo(LocalDate.of(2026, 1, 5));
        assertThat(s.snapshots(1).get(0).date()).isEqualTo(LocalDate.of(2026, 1, 5));
    }

    @Test
    void theSameSeedGivesIdenticalSnapshotsAndEachRunStartsAfresh() {
        DemoScenario first = DemoScenario.standard(42, START);
        List<CurveSnapshot> a = first.snapshots(600);
        assertThat(DemoScenario.standard(42, START).snapshots(600)).as("a second scenario with seed 42").isEqualTo(a);
        assertThat(first.snapshots(600)).as("a second run of the same scenario").isEqualTo(a);
        assertThat(first.days().limit(600).flatMap(d -> d.snapshots().stream()).toList()).as("the stream form").isEqualTo(a);
    }

    @Test
    void differentSeedsGiveDifferentNumbersOnTheSameDates() {
        List<CurveSnapshot> one = DemoScenario.standard(1, START).snapshots(50);
        List<CurveSnapshot> two = DemoScenario.standard(2, START).snapshots(50);
        for (int i = 0; i < one.size(); i++) {
            assertThat(two.get(i).date()).isEqualTo(one.get(i).date());
            assertThat(two.get(i).asMap()).as("%s on %s under seeds 1 and 2", one.get(i).curve(), one.get(i).date())
                    .isNotEqualTo(one.get(i).asMap());
        }
    }

    @Test
    void quotesAreTheSnapshotsPointByPoint() {
        DemoDay day = DemoScenario.standard(3, START).iterator().next();
        List<DemoQuote> quotes = day.quotes();
        assertThat(quotes).hasSize(2 * DemoScenario.TENORS.size());
        for (DemoQuote q : quotes) {
            CurveSnapshot s = day.snapshots().stream().filter(x -> x.curve().equals(q.curve())).findFirst().orElseThrow();
            assertThat(q.date()).isEqualTo(day.date());
            assertThat(q.yieldBp()).isEqualTo(s.yieldBp(q.tenor()));
            assertThat(q.yieldPercent()).isEqualTo(q.yieldBp() / 100);
        }
    }

    /**
     * Three years in, both scripts are over: for ten more years both curves slope upwards every
     * day, and their average spreads sit near the model's curve with the factors and the gap at rest.
     */
    @Test
    void afterTheScriptTheCurvesKeepGoingAroundANormalUpwardSlope() {
        int scriptEnd = 3 * 261;
        int end = 13 * 261;
        for (long seed = 1; seed <= 20; seed++) {
            DemoScenario scenario = DemoScenario.standard(seed, START);
            double[][] sums = new double[2][2];
            int n = 0;
            Iterator<DemoDay> run = scenario.iterator();
            for (int d = 0; d < end; d++) {
                DemoDay day = run.next();
                if (d < scriptEnd) {
                    continue;
                }
                n++;
                for (int c = 0; c < 2; c++) {
                    CurveSnapshot s = day.snapshots().get(c);
                    double tenThree = s.yieldBp(Y10) - s.yieldBp(M3);
                    double tenTwo = s.yieldBp(Y10) - s.yieldBp(Y2);
                    assertThat(tenThree).as("seed %d %s 10Y-3M on %s", seed, s.curve(), day.date()).isGreaterThan(0);
                    assertThat(tenTwo).as("seed %d %s 10Y-2Y on %s", seed, s.curve(), day.date()).isGreaterThan(0);
                    sums[c][0] += tenThree;
                    sums[c][1] += tenTwo;
                }
            }
            for (int c = 0; c < 2; c++) {
                DemoCurve curve = scenario.curves().get(c);
                double restThree = restingYieldBp(curve, Y10) - restingYieldBp(curve, M3);
                double restTwo = restingYieldBp(curve, Y10) - restingYieldBp(curve, Y2);
                assertThat(restThree).as("%s resting 10Y-3M", curve.name()).isGreaterThan(50);
                assertThat(sums[c][0] / n).as("seed %d %s average 10Y-3M over ten years", seed, curve.name())
                        .isBetween(restThree - 30, restThree + 30);
                assertThat(sums[c][1] / n).as("seed %d %s average 10Y-2Y over ten years", seed, curve.name())
                        .isBetween(restTwo - 20, restTwo + 20);
            }
        }
    }

    @Test
    void aScenarioNeedsDistinctCurves() {
        assertThatThrownBy(() -> new DemoScenario(1, START, List.of())).hasMessageContaining("at least one curve");
        assertThatThrownBy(() -> new DemoScenario(1, START, List.of(DemoCurve.tightening(), DemoCurve.tightening())))
                .hasMessageContaining("distinct");
    }

    private static double restingYieldBp(DemoCurve curve, Tenor tenor) {
        return BondEquivalent.fromPrice(curve.model().bondPrice(tenor.years(), 0, 0, 0), tenor.years()) * 10_000;
    }
}
