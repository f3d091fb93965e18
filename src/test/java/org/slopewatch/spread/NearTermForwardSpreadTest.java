package org.slopewatch.spread;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.Tenor;

/**
 * Sources: the near-term forward spread as defined in DESIGN.md (Domain notes): the 3-month rate
 * six quarters ahead minus the current 3-month rate; the Nelson–Siegel (1987) formula (from
 * memory) for the upward-sloping test curve, with its forward worked by hand below.
 */
class NearTermForwardSpreadTest {

    private static final LocalDate DATE = LocalDate.of(2023, 3, 31);
    private final NearTermForwardSpread spread = new NearTermForwardSpread();

    @Test
    void flatCurveHasNoSpread() {
        CurveSnapshot flat = snapshot(t -> 400.0, "3M", "6M", "1Y", "2Y", "5Y", "10Y");
        assertThat(spread.valueBp(flat)).as("forward equals spot on a flat curve").isCloseTo(0.0, within(1e-6));
    }

    /*
     * Nelson–Siegel with b0 = 600, b1 = −250, b2 = 0, τ = 2: y(t) = 600 − 250·(1 − e^(−t/2))/(t/2),
     * rising from 350 towards 600. Instantaneous forward f(t) = 600 − 250·e^(−t/2), so the forward
     * over [1.5, 1.75] is 600 − 250·2·(e^(−0.75) − e^(−0.875))/0.25, by hand:
     *   e^(−0.75) = 0.4723666,  e^(−0.875) = 0.4168620,  difference 0.0555046
     *   forward = 600 − 500·0.0555046/0.25 = 600 − 111.0092 = 488.9908
     *   3M: e^(−0.125) = 0.8824969, (1 − 0.8824969)/0.125 = 0.9400248, y = 600 − 235.0062 = 364.9938
     *   spread = 488.9908 − 364.9938 = 123.9970 bp
     */
    @Test
    void upwardCurveHasPositiveSpreadMatchingHandWorkedForward() {
        CurveSnapshot upward = snapshot(t -> 600 - 250 * (1 - Math.exp(-t / 2)) / (t / 2),
                "3M", "6M", "1Y", "2Y", "3Y", "5Y", "7Y", "10Y");
        double value = spread.valueBp(upward);
        assertThat(value).as("upward curve: forward above spot").isPositive();
        assertThat(value).as("hand-worked forward minus 3M").isCloseTo(123.9970, within(2e-3));
    }

    @Test
    void invertedCurveHasNegativeSpread() {
        CurveSnapshot inverted = snapshot(t -> 350 + 150 * (1 - Math.exp(-t / 2)) / (t / 2),
                "3M", "6M", "1Y", "2Y", "5Y", "10Y");
        assertThat(spread.valueBp(inverted)).as("falling curve: forward below spot").isNegative();
    }

    @Test
    void withoutThreeMonthQuoteThereIsNoValue() {
        CurveSnapshot noBill = snapshot(t -> 400 + 10 * t, "6M", "1Y", "2Y", "5Y", "10Y", "30Y");
        assertThat(spread.valueBp(noBill)).isNaN();
    }

    @Test
    void withTooFewPointsForAFitThereIsNoValue() {
        CurveSnapshot sparse = snapshot(t -> 400 + 10 * t, "3M", "2Y", "10Y");
        assertThat(spread.valueBp(sparse)).isNaN();
    }

    private static CurveSnapshot snapshot(java.util.function.DoubleUnaryOperator yieldAtYears, String... tenors) {
        Map<Tenor, Double> yields = new LinkedHashMap<>();
        for (String text : tenors) {
            Tenor tenor = Tenor.parse(text);
            yields.put(tenor, yieldAtYears.applyAsDouble(tenor.years()));
        }
        return CurveSnapshot.of("GOVT-A", DATE, yields);
    }
}
