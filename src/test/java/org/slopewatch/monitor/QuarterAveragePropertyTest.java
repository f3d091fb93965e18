package org.slopewatch.monitor;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slopewatch.spread.SpreadKey;
import org.slopewatch.testsupport.Gen;
import org.slopewatch.testsupport.PropertyCheck;

/**
 * The monitor's quarter averages equal a brute-force recomputation (group by calendar quarter,
 * sum, divide) for random daily series with gaps of up to three weeks, whatever the rules:
 * 300 random samples a run ({@link PropertyCheck}, which prints the seed of a failing one).
 *
 * <p>Reference: decimal arithmetic, {@link BigDecimal} on the generated values (two decimals of a
 * basis point): the exact sum divided by the count to six decimals, half to even, which is the
 * resolution the monitor states ({@code Resolution.BASIS_POINTS}); the reported average must be that
 * decimal's double exactly.
 */
class QuarterAveragePropertyTest {

    record Step(int gapDays, double valueBp) {
    }

    record Sample(LocalDate start, List<Step> steps, MonitorDefinition rules) {
    }

    @Test
    void quarterAveragesMatchBruteForce() {
        Gen<Sample> samples = r -> new Sample(starts().next(r), series().next(r), definitions().next(r));
        PropertyCheck.forAll(300, samples, s -> check(s.start(), s.steps(), s.rules()));
    }

    private static void check(LocalDate start, List<Step> steps, MonitorDefinition rules) {
        InversionMonitor monitor = new InversionMonitor(rules);
        MonitorState state = monitor.newState(new SpreadKey("TEST", "10Y-3M"));
        Map<Quarter, Double> reported = new LinkedHashMap<>();
        Map<Quarter, Integer> reportedCounts = new LinkedHashMap<>();
        List<LocalDate> dates = new ArrayList<>();
        LocalDate date = start;
        for (Step s : steps) {
            date = date.plusDays(s.gapDays());
            dates.add(date);
            for (MonitorEvent e : monitor.observe(state, new Observation(date, s.valueBp(), dates.size()))) {
                if (e instanceof QuarterSummary q) {
                    assertThat(reported).as("each quarter is reported once").doesNotContainKey(q.quarter());
                    reported.put(q.quarter(), q.averageBp());
                    reportedCounts.put(q.quarter(), q.observations());
                }
            }
        }

        Map<Quarter, BigDecimal[]> brute = new LinkedHashMap<>();
        for (int i = 0; i < steps.size(); i++) {
            BigDecimal[] acc = brute.computeIfAbsent(Quarter.of(dates.get(i)), k -> new BigDecimal[] {BigDecimal.ZERO, BigDecimal.ZERO});
            acc[0] = acc[0].add(BigDecimal.valueOf(steps.get(i).valueBp()));
            acc[1] = acc[1].add(BigDecimal.ONE);
        }
        // the last quarter has not been closed by a later observation
        brute.remove(Quarter.of(dates.get(dates.size() - 1)));
        // a series starting after its first quarter's first month has not seen that whole quarter
        LocalDate first = dates.get(0);
        if ((first.getMonthValue() - 1) % 3 != 0) {
            brute.remove(Quarter.of(first));
        }

        assertThat(reported.keySet()).as("complete quarters, in order").containsExactlyElementsOf(brute.keySet());
        for (Map.Entry<Quarter, BigDecimal[]> e : brute.entrySet()) {
            double expected = e.getValue()[0].divide(e.getValue()[1], 6, RoundingMode.HALF_EVEN).doubleValue();
            assertThat(reported.get(e.getKey())).as("average of %s", e.getKey()).isEqualTo(expected);
            assertThat(reportedCounts.get(e.getKey())).isEqualTo(e.getValue()[1].intValueExact());
        }
    }

    private static Gen<LocalDate> starts() {
        return Gen.ints(0, 20_000).map(d -> LocalDate.of(1970, 1, 1).plusDays(d));
    }

    private static Gen<List<Step>> series() {
        Gen<Integer> gaps = Gen.frequency(8, Gen.ints(1, 3), 1, Gen.ints(4, 21));
        Gen<Double> values = Gen.doubles(-300, 300, 2);
        Gen<Step> step = r -> new Step(gaps.next(r), values.next(r));
        return step.list(1, 600);
    }

    private static Gen<MonitorDefinition> definitions() {
        Gen<PersistenceTest> tests = Gen.oneOf(
                Gen.ints(-50, 50).map(QuarterAverage::new),
                Gen.ints(1, 200).map(DaysInverted::new),
                Gen.ints(1, 120).map(w -> new RollingAverage(w, 0)),
                Gen.ints(1, 120).map(w -> new ShareInverted(w, 0.75)));
        Gen<Integer> entries = Gen.ints(-30, 0);
        Gen<Integer> bands = Gen.ints(0, 30);
        Gen<Integer> exits = Gen.ints(1, 3);
        Gen<Integer> holds = Gen.ints(0, 200);
        Gen<List<PersistenceTest>> testLists = tests.list(1, 3);
        return r -> {
            int entry = entries.next(r);
            return new MonitorDefinition(entry, entry + bands.next(r), exits.next(r), holds.next(r), testLists.next(r));
        };
    }
}
