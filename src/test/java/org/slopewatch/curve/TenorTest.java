package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Source: the accepted tenor range 1W–52W, 1M–24M, 1Y–30Y stated for the project's quote format. */
class TenorTest {

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"0Y", "31Y", "10X", "abc", "25M", "53W", ""})
    void rejectsBadTenorsNamingTheValue(String text) {
        assertThatThrownBy(() -> Tenor.parse(text))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("'" + text + "'");
    }

    @Test
    void twelveMonthsIsOneYear() {
        assertThat(Tenor.parse("12M")).isEqualTo(Tenor.parse("1Y"));
        assertThat(Tenor.parse("12M").compareTo(Tenor.years(1))).isZero();
        assertThat(Tenor.parse("24m")).hasToString("2Y");
    }

    @Test
    void ordersByMaturity() {
        // 13 weeks = 91/365 = 0.2493 y sorts just before 3 months = 0.25 y
        assertThat(Tenor.parse("13W")).isLessThan(Tenor.parse("3M"));
        assertThat(Tenor.parse("18M")).isGreaterThan(Tenor.years(1)).isLessThan(Tenor.years(2));
        assertThat(Tenor.parse(" 10y ").years()).isEqualTo(10.0);
    }
}
