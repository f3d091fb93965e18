package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.List;
import org.junit.jupiter.api.Test;

class MonthlyAveragerTest {

    private static SpreadObservation obs(String date, double pct) {
        return new SpreadObservation(LocalDate.parse(date), pct);
    }

    @Test
    void averagesEachCalendarMonthInMonthOrder() {
        // Given out of order and across a year end; averages worked by hand:
        // 2023-12: (0.30 + 0.10) / 2 = 0.20;  2024-01: (-0.20 - 0.40 + 0.00) / 3 = -0.20;  2024-03: 0.50
        List<MonthlyAverage> months = MonthlyAverager.average(List.of(
                obs("2024-01-31", -0.40), obs("2023-12-01", 0.30), obs("2024-03-15", 0.50),
                obs("2024-01-02", -0.20), obs("2023-12-29", 0.10), obs("2024-01-15", 0.00)));

        assertThat(months).extracting(MonthlyAverage::month)
                .as("calendar months in order; February has no observation and is absent, not zero")
                .containsExactly(YearMonth.of(2023, 12), YearMonth.of(2024, 1), YearMonth.of(2024, 3));
        assertThat(months).extracting(MonthlyAverage::count).containsExactly(2, 3, 1);
        assertThat(months.get(0).averagePct()).isCloseTo(0.20, within(1e-12));
        assertThat(months.get(1).averagePct()).isCloseTo(-0.20, within(1e-12));
        assertThat(months.get(2).averagePct()).isCloseTo(0.50, within(1e-12));
    }

    @Test
    void monthlyDataPassThroughUnchanged() {
        // The Treasury reference file holds monthly averages already (see its README): one
        // observation a month must come back as itself. 10Y-1Y for 1953-04: 2.83 - 2.36 = 0.47.
        List<MonthlyAverage> months = MonthlyAverager.average(ReferenceFiles.tenYearMinusOneYear());
        assertThat(months).hasSize(558);
        assertThat(months.get(0).month()).isEqualTo(YearMonth.of(1953, 4));
        assertThat(months.get(0).averagePct()).isCloseTo(0.47, within(1e-12));
        assertThat(months).allSatisfy(m -> assertThat(m.count()).isEqualTo(1));
    }

    @Test
    void aNaNSpreadIsRejectedWithItsDate() {
        assertThatThrownBy(() -> MonthlyAverager.average(List.of(obs("2024-01-02", 0.1), obs("2024-01-03", Double.NaN))))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("2024-01-03")
                .hasMessageContaining("NaN");
    }
}
