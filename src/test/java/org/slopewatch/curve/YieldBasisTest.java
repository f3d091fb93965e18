package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * The basis every reader of quotes parses and converts through. Source of the values: the U.S.
 * Treasury's formula for the bond-equivalent yield of a bill of at most 182 days,
 * {@code BEY = 365·d / (360 − d·t)} (from memory; also recorded in the shared reference notes);
 * the spellings are those of the JSON quote's {@code basis} field (docs/api.md).
 */
class YieldBasisTest {

    @Test
    void theSpellingsAreTheJsonQuotesAndNothingMeansBondEquivalent() {
        assertThat(YieldBasis.parse("discount")).isEqualTo(YieldBasis.DISCOUNT);
        assertThat(YieldBasis.parse(" bond-equivalent ")).isEqualTo(YieldBasis.BOND_EQUIVALENT);
        assertThat(YieldBasis.parse(null)).isEqualTo(YieldBasis.BOND_EQUIVALENT);
        assertThat(YieldBasis.parse("")).isEqualTo(YieldBasis.BOND_EQUIVALENT);
        assertThatThrownBy(() -> YieldBasis.parse("Discount")).hasMessage("unknown basis 'Discount' (accepted: bond-equivalent, discount)");
    }

    @Test
    void aThreeMonthBillAt5And15Point5PercentDiscountIs13And86BpHigherOnTheBondEquivalentBasis() {
        // 365·0.05 / (360 − 0.05·91) = 18.25 / 355.45 = 5.13434 %: 13.43 bp above the discount rate
        double at5 = YieldBasis.DISCOUNT.toBondEquivalentBp(500, Tenor.weeks(13));
        assertThat(at5).isCloseTo(10_000 * 365 * 0.05 / (360 - 0.05 * 91), within(1e-9));
        assertThat(at5 - 500).isCloseTo(13, within(0.5));
        // 365·0.155 / (360 − 0.155·91) = 56.575 / 345.895 = 16.3561 %: 85.61 bp above
        double at15 = YieldBasis.DISCOUNT.toBondEquivalentBp(1550, Tenor.months(3));
        assertThat(at15).isCloseTo(10_000 * 365 * 0.155 / (360 - 0.155 * 91), within(1e-9));
        assertThat(at15 - 1550).isCloseTo(86, within(0.5));
        assertThat(YieldBasis.BOND_EQUIVALENT.toBondEquivalentBp(1550, Tenor.months(3))).isEqualTo(1550);
    }

    @Test
    void aDiscountRateExistsOnlyForBillsOfAtMost364Days() {
        YieldBasis.DISCOUNT.check(Tenor.weeks(52)); // 364 days
        assertThatThrownBy(() -> YieldBasis.DISCOUNT.check(Tenor.years(1))).hasMessage("discount basis applies to bills up to 52W, not 1Y");
        assertThatThrownBy(() -> YieldBasis.DISCOUNT.toBondEquivalentBp(400, Tenor.years(10)))
                .hasMessage("discount basis applies to bills up to 52W, not 10Y");
        YieldBasis.BOND_EQUIVALENT.check(Tenor.years(10));
    }

    @Test
    void theAliasesPutTheWeeklyBillsOnTheMonthPoints() {
        assertThat(TenorAliases.canonical(Tenor.weeks(13))).isEqualTo(Tenor.months(3));
        assertThat(TenorAliases.canonical(Tenor.weeks(26))).isEqualTo(Tenor.months(6));
        assertThat(TenorAliases.canonical(Tenor.weeks(52))).isEqualTo(Tenor.years(1));
        assertThat(TenorAliases.canonical(Tenor.weeks(4))).isEqualTo(Tenor.weeks(4));
        assertThat(TenorAliases.canonical(Tenor.years(2))).isEqualTo(Tenor.years(2));
    }
}
