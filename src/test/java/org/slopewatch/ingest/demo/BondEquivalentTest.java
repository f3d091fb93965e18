package org.slopewatch.ingest.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.slopewatch.curve.BillConversion;

/** The demo's yields are on the same basis as a converted bill quote and a note's semiannual yield. */
class BondEquivalentTest {

    @Test
    void billMaturitiesAgreeWithTheTreasuryConversionOfTheSamePrice() {
        for (int days : new int[] {28, 91, 182, 273, 364}) {
            for (double price : new double[] {0.999, 0.985, 0.95}) {
                double discountRate = (1 - price) * 360 / days;
                assertThat(BondEquivalent.fromPrice(price, days / 365.0))
                        .as("%d-day bill at price %s", days, price)
                        .isCloseTo(BillConversion.bondEquivalent(discountRate, days), within(1e-12));
            }
        }
    }

    @Test
    void beyondOneYearTheYieldCompoundsSemiannually() {
        double price = Math.pow(1 + 0.043 / 2, -2 * 10);
        assertThat(BondEquivalent.fromPrice(price, 10)).isCloseTo(0.043, within(1e-14));
        assertThat(BondEquivalent.fromPrice(Math.pow(1 + 0.05 / 2, -3), 1.5)).isCloseTo(0.05, within(1e-14));
    }

    @Test
    void theYieldIsContinuousWhereTheConventionsMeet() {
        for (double boundary : new double[] {0.5, 1.0}) {
            double price = Math.exp(-0.04 * boundary);
            double below = BondEquivalent.fromPrice(price, boundary - 1e-9);
            double above = BondEquivalent.fromPrice(price, boundary + 1e-9);
            assertThat(above).as("yield either side of %s years", boundary).isCloseTo(below, within(1e-7));
        }
    }

    @Test
    void aNonPositivePriceOrMaturityIsRejected() {
        assertThatThrownBy(() -> BondEquivalent.fromPrice(0, 1)).hasMessageContaining("price");
        assertThatThrownBy(() -> BondEquivalent.fromPrice(0.9, 0)).hasMessageContaining("maturity");
    }
}
