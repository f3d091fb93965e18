package org.slopewatch.monitor;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * {@link DecimalText} against the JDK's own {@link java.util.Formatter} ({@code String.format(Locale.ROOT,
 * "%.Nf", v)}), which reasons were written with before and whose output they must keep.
 */
class DecimalTextTest {

    private static void assertSameAsFormatter(double v, int decimals) {
        String expected = String.format(Locale.ROOT, "%." + decimals + "f", v);
        assertThat(DecimalText.append(new StringBuilder(), v, decimals).toString())
                .as("%s with %d decimals, as String.format writes it", v, decimals)
                .isEqualTo(expected);
    }

    @Test
    void randomValuesOfEveryScaleAreWrittenAsTheFormatterWritesThem() {
        Random random = new Random(20261202L);
        for (int i = 0; i < 20_000; i++) {
            double magnitude = Math.pow(10, random.nextInt(12) - 4);
            double v = (random.nextDouble() * 2 - 1) * magnitude;
            for (int decimals = 0; decimals <= 3; decimals++) {
                assertSameAsFormatter(v, decimals);
            }
        }
    }

    @Test
    void valuesOnAndNextToTiesAreRoundedHalfUpOnTheirShortestDecimal() {
        // basis points with two decimals, as yields in percent become: every second-decimal 5 is a tie
        for (int cents = -20_000; cents <= 20_000; cents++) {
            double v = cents / 100.0;
            assertSameAsFormatter(v, 1);
            assertSameAsFormatter(v, 0);
            assertSameAsFormatter(Math.nextUp(v), 1);
            assertSameAsFormatter(Math.nextDown(v), 1);
        }
        // 0.35 is 0.34999999999999997779… in binary; the formatter rounds its shortest decimal, 0.35, up
        assertThat(DecimalText.append(new StringBuilder(), 0.35, 1).toString()).isEqualTo("0.4");
        assertThat(DecimalText.append(new StringBuilder(), 2.5, 0).toString()).isEqualTo("3");
    }

    @Test
    void negativeValuesKeepTheirSignEvenWhenTheyRoundToZero() {
        assertThat(DecimalText.append(new StringBuilder(), -0.04, 1).toString()).isEqualTo("-0.0");
        assertThat(DecimalText.append(new StringBuilder(), -0.0, 1).toString()).isEqualTo("-0.0");
        assertThat(DecimalText.append(new StringBuilder(), 0.0, 1).toString()).isEqualTo("0.0");
        for (double v : new double[] {-0.0, 0.0, -1e-9, 1e-9, -0.049999, 0.05, -0.05, 1e6, -1e6, 123456789.25, -9.95,
                                      Double.MIN_VALUE, Double.MAX_VALUE, Double.NaN, Double.POSITIVE_INFINITY}) {
            for (int decimals = 0; decimals <= 3; decimals++) {
                assertSameAsFormatter(v, decimals);
            }
        }
    }
}
