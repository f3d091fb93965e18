package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Sources: U.S. Treasury bill conversion formulas as recorded in /work/shared/data/README.md
 * (price per 100 and the simple form for t ≤ 182 days); the longer-than-half-year form and the
 * equation it solves, P·(1 + (t − y/2)/y·BEY)·(1 + BEY/2) = 100, U.S. Treasury (from memory).
 * Worked examples are computed by hand below.
 */
class BillConversionTest {

    /*
     * 91-day bill at a 5.00 % discount, worked by hand:
     *   d·t      = 0.05 · 91 = 4.55
     *   P        = 100 · (1 − 4.55/360) = 100 − 1.263889 = 98.736111
     *   BEY      = 365 · 0.05 / (360 − 4.55) = 18.25 / 355.45 = 0.0513434
     *              (check: 355.45 · 0.0513434 = 17.7725 + 0.47751 = 18.25001)
     */
    @Test
    void ninetyOneDayBillMatchesHandWorkedExample() {
        assertThat(BillConversion.pricePer100(0.05, 91)).as("price per 100, hand-worked").isCloseTo(98.736111, within(1e-6));
        assertThat(BillConversion.bondEquivalent(0.05, 91)).as("BEY, hand-worked").isCloseTo(0.0513434, within(1e-7));
        assertThat(BillConversion.bondEquivalentBp(500.0, 91)).as("same in basis points").isCloseTo(513.434, within(1e-3));
    }

    /*
     * 364-day bill at a 5.00 % discount, y = 365, worked by hand:
     *   d·t          = 0.05 · 364 = 18.2
     *   P            = 100 · (1 − 18.2/360) = 100 · 341.8/360 = 94.944444
     *   t/y          = 364/365 = 0.997260274
     *   2t/y − 1     = 0.994520548
     *   100/P        = 360/341.8 = 1.053247513,  so 1 − 100/P = −0.053247513
     *   (t/y)²       = 1 − 2·0.002739726 + 0.002739726² = 0.994528054
     *   discriminant = 0.994528054 − 0.994520548 · (−0.053247513)
     *                = 0.994528054 + 0.052955746 = 1.047483800
     *   √            = 1.02346656  (1.0234² = 1.04734756; + 0.00013624 / 2.0468 = + 0.00006656)
     *   numerator    = −1.994520548 + 2.04693312 = 0.052412572
     *   BEY          = 0.052412572 / 0.994520548 = 0.052412572 · 1.005509642 = 0.0527013
     */
    @Test
    void threeHundredSixtyFourDayBillMatchesHandWorkedExample() {
        assertThat(BillConversion.pricePer100(0.05, 364)).as("price per 100, hand-worked").isCloseTo(94.944444, within(1e-6));
        assertThat(BillConversion.bondEquivalent(0.05, 364)).as("BEY by the quadratic form, hand-worked")
                .isCloseTo(0.0527013, within(5e-7));
        assertThat(BillConversion.bondEquivalentBp(500.0, 364)).as("same in basis points").isCloseTo(527.013, within(5e-3));
    }

    @ParameterizedTest(name = "d={0}, t={1}")
    @CsvSource({"0.0001,1", "0.01,28", "0.05,91", "0.0525,120", "0.10,182", "0.18,182", "-0.002,91"})
    void shortBillFollowsThePublishedFormulaAndItsPrice(double d, int t) {
        double price = BillConversion.pricePer100(d, t);
        assertThat(price).as("P = 100·(1 − d·t/360) (U.S. Treasury)").isCloseTo(100 * (1 - d * t / 360.0), within(1e-12));
        double bey = BillConversion.bondEquivalent(d, t);
        assertThat(bey).as("BEY = 365·d/(360 − d·t) (U.S. Treasury)").isCloseTo(365 * d / (360 - d * t), within(1e-14));
        // looser: 100 − P cancels digits for a 1-day bill at 1 bp
        assertThat(bey).as("BEY from the price: (100 − P)/P · 365/t").isCloseTo((100 - price) / price * 365 / t, within(1e-12));
    }

    /*
     * At 182 days the two forms answer slightly different questions (simple interest against one
     * semiannual period with a stub of t − y/2 = −0.5 day), so they differ by about
     * 2 · (0.5/365) · r · r/2: at r = 10 % that is 0.14 bp, at 5 % 0.03 bp.
     */
    @ParameterizedTest(name = "d={0}")
    @ValueSource(doubles = {0.001, 0.01, 0.05, 0.10})
    void twoFormsAgreeAtOneHundredEightyTwoDays(double d) {
        double simple = BillConversion.simpleForm(d, 182, 365);
        double longer = BillConversion.longerForm(d, 182, 365);
        assertThat(longer).as("quadratic form at the half-year boundary within 0.25 bp of the simple form")
                .isCloseTo(simple, within(0.25e-4));
    }

    /*
     * Substitute back. Expanding P·(1 + (t/y − 1/2)·r)·(1 + r/2) = 100 and multiplying by 4/P gives
     * (2t/y − 1)·r² + 4(t/y)·r + 4(1 − 100/P) = 0, whose positive root is the published formula;
     * so the returned yield must make the left side 100.
     */
    @ParameterizedTest(name = "d={0}, t={1}, y={2}")
    @CsvSource({"0.005,183,365", "0.05,183,365", "0.05,200,365", "0.0475,273,365", "0.15,300,365",
            "0.05,364,365", "0.05,364,366", "0.08,184,366", "0.20,364,365", "-0.003,364,365"})
    void longerFormSolvesTheEquationItComesFrom(double d, int t, int y) {
        double price = BillConversion.pricePer100(d, t);
        double r = BillConversion.bondEquivalent(d, t, y);
        double value = price * (1 + ((double) t - y / 2.0) / y * r) * (1 + r / 2);
        assertThat(value).as("P·(1 + (t − y/2)/y·BEY)·(1 + BEY/2) = 100").isCloseTo(100.0, within(1e-9));
    }

    /*
     * In a 366-day year a 183-day bill sits exactly on the half year, where the stub term vanishes and
     * both equations read P·(1 + r/2) = 100, i.e. r = 2·(100/P − 1). Without the y-based simple form
     * the quadratic would divide by 2t/y − 1 = 0 here.
     */
    @Test
    void halfYearInLeapYearSatisfiesBothEquations() {
        double price = BillConversion.pricePer100(0.05, 183);
        double r = BillConversion.bondEquivalent(0.05, 183, 366);
        assertThat(r).as("r = 2·(100/P − 1)").isCloseTo(2 * (100 / price - 1), within(1e-14));
        assertThat(price * (1 + r * 183 / 366.0)).as("simple interest over t/y").isCloseTo(100.0, within(1e-9));
    }

    @Test
    void rejectsNonFiniteRatesNamingTheValue() {
        assertThatThrownBy(() -> BillConversion.bondEquivalent(Double.NaN, 91)).hasMessageContaining("NaN");
        assertThatThrownBy(() -> BillConversion.bondEquivalentBp(Double.POSITIVE_INFINITY, 91)).hasMessageContaining("Infinity");
        assertThatThrownBy(() -> BillConversion.pricePer100(Double.NEGATIVE_INFINITY, 91)).hasMessageContaining("-Infinity");
    }

    @ParameterizedTest(name = "days={0}")
    @ValueSource(ints = {0, -1, 365, 1000})
    void rejectsDaysOutsideBillRangeNamingTheValue(int days) {
        assertThatThrownBy(() -> BillConversion.bondEquivalent(0.05, days))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("got " + days);
    }

    @Test
    void rejectsDiscountGivingNonPositivePrice() {
        // 100 % over 360 days leaves nothing to pay; 400 % over 100 days would be a negative price
        assertThatThrownBy(() -> BillConversion.pricePer100(1.0, 360))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("discount rate 1.0").hasMessageContaining("non-positive");
        assertThatThrownBy(() -> BillConversion.bondEquivalentBp(40_000.0, 100))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("discount rate 4.0");
    }

    @Test
    void rejectsOtherDayCountYears() {
        assertThatThrownBy(() -> BillConversion.bondEquivalent(0.05, 91, 360)).hasMessageContaining("got 360");
    }
}
