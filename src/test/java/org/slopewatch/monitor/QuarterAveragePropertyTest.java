package org.slopewatch.monitor;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.assertj.core.data.Offset;
import org.slopewatch.spread.SpreadKey;

/**
 * The monitor's quarter averages equal a brute-force recomputation (group by calendar quarter,
 * sum, divide) for random daily series with gaps of up to three weeks, whatever the rules.
 */
class QuarterAveragePropertyTest {

    record Step(int gapDays, double valueBp) {
    }

    @Property(tries = 300)
    void quarterAveragesMatchBruteForce(@ForAll("starts") LocalDate start, @ForAll("series") List<Step> steps,
                                        @ForAll("definitions") MonitorDefinition rules) {
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

        Map<Quarter, double[]> brute = new LinkedHashMap<>();
        for (int i = 0; i < steps.size(); i++) {
            double[] acc = brute.computeIfAbsent(Quarter.of(dates.get(i)), k -> new double[2]);
            acc[0] += steps.get(i).valueBp();
            acc[1]++;
        }
        // the last quarter has not been closed by a later observation
        brute.remove(Quarter.of(dates.get(dates.size() - 1)));
        // a series starting after its first quarter's first month has not seen that whole quarter
        LocalDate first = dates.get(0);
        if ((first.getMonthValue() - 1) % 3 != 0) {
            brute.remove(Quarter.of(first));
        }

        assertThat(reported.keySet()).as("complete quarters, in order").containsExactlyElementsOf(brute.keySet());
        for (Map.Entry<Quarter, double[]> e : brute.entrySet()) {
            double expected = e.getValue()[0] / e.getValue()[1];
            assertThat(reported.get(e.getKey())).as("average of %s", e.getKey()).isCloseTo(expected, Offset.offset(1e-9));
            assertThat(reportedCounts.get(e.getKey())).isEqualTo((int) e.getValue()[1]);
        }
    }

    @Provide
    Arbitrary<LocalDate> starts() {
        return Arbitraries.integers().between(0, 20_000).map(d -> LocalDate.of(1970, 1, 1).plusDays(d));
    }

    @Provide
    Arbitrary<List<Step>> series() {
        Arbitrary<Integer> gaps = Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(8, Arbitraries.integers().between(1, 3)),
                net.jqwik.api.Tuple.of(1, Arbitraries.integers().between(4, 21)));
        Arbitrary<Double> values = Arbitraries.doubles().between(-300, 300).ofScale(2);
        return Combinators.combine(gaps, values).as(Step::new).list().ofMinSize(1).ofMaxSize(600);
    }

    @Provide
    Arbitrary<MonitorDefinition> definitions() {
        Arbitrary<PersistenceTest> tests = Arbitraries.oneOf(
                Arbitraries.integers().between(-50, 50).map(QuarterAverage::new),
                Arbitraries.integers().between(1, 200).map(DaysInverted::new),
                Arbitraries.integers().between(1, 120).map(w -> new RollingAverage(w, 0)),
                Arbitraries.integers().between(1, 120).map(w -> new ShareInverted(w, 0.75)));
        return Combinators.combine(Arbitraries.integers().between(-30, 0), Arbitraries.integers().between(0, 30),
                        Arbitraries.integers().between(1, 3), Arbitraries.integers().between(0, 200), tests.list().ofMinSize(1).ofMaxSize(3))
                .as((entry, band, exits, hold, t) -> new MonitorDefinition(entry, entry + band, exits, hold, t));
    }
}
