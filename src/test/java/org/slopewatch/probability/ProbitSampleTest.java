package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.YearMonth;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class ProbitSampleTest {

    /** One recession: peak 2001-03, trough 2001-11, i.e. months 2001-04 .. 2001-11 (NBER, from memory). */
    private static final RecessionCalendar CAL = new RecessionCalendar(
            List.of(new Recession(YearMonth.of(2001, 3), YearMonth.of(2001, 11))));

    private static List<MonthlyAverage> months(String first, int count) {
        List<MonthlyAverage> out = new ArrayList<>();
        YearMonth m = YearMonth.parse(first);
        for (int i = 0; i < count; i++) {
            out.add(new MonthlyAverage(m.plusMonths(i), 0.1 * i, 1));
        }
        return out;
    }

    @Test
    void targetLooksHorizonMonthsAheadAndTheLastHMonthsAreDropped() {
        // 2000-01 .. 2002-12 (36 months), h = 12: rows 2000-01 .. 2001-12 (24 months).
        ProbitSample sample = ProbitSample.build(months("2000-01", 36), CAL, 12);
        assertThat(sample.size()).isEqualTo(24);
        assertThat(sample.rows().get(sample.size() - 1).month()).isEqualTo(YearMonth.of(2001, 12));
        // y = 1 for m + 12 in 2001-04 .. 2001-11, i.e. m in 2000-04 .. 2000-11: eight months
        assertThat(sample.recessionAheadCount()).isEqualTo(8);
        assertThat(sample.rows()).filteredOn(SampleMonth::recessionAhead).extracting(SampleMonth::month)
                .first().isEqualTo(YearMonth.of(2000, 4));
        assertThat(sample.rows()).filteredOn(SampleMonth::recessionAhead).extracting(SampleMonth::month)
                .last().isEqualTo(YearMonth.of(2000, 11));
    }

    @Test
    void horizonZeroAsksAboutTheMonthItself() {
        ProbitSample sample = ProbitSample.build(months("2001-01", 12), CAL, 0);
        assertThat(sample.size()).isEqualTo(12);
        assertThat(sample.recessionAheadCount()).isEqualTo(8);
    }

    @Test
    void unorderedMonthsAreRefused() {
        List<MonthlyAverage> m = new ArrayList<>(months("2000-01", 3));
        m.add(new MonthlyAverage(YearMonth.of(2000, 2), 0.0, 1));
        assertThatThrownBy(() -> ProbitSample.build(m, CAL, 1))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("2000-02 follows 2000-03");
    }
}
