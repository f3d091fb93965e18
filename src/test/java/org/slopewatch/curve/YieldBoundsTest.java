package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/** Source: 1 % = 100 bp and 1 (decimal) = 10,000 bp, by definition of the basis point. */
class YieldBoundsTest {

    @Test
    void convertsEachUnitToBasisPoints() {
        assertThat(YieldBounds.DEFAULT.toBasisPoints(4.215, YieldUnit.PERCENT)).isCloseTo(421.5, within(1e-9));
        assertThat(YieldBounds.DEFAULT.toBasisPoints(0.04215, YieldUnit.DECIMAL)).isCloseTo(421.5, within(1e-9));
        assertThat(YieldBounds.DEFAULT.toBasisPoints(421.5, YieldUnit.BASIS_POINTS)).isEqualTo(421.5);
    }

    @Test
    void basisPointValueSentAsPercentIsRejected() {
        // 421.5 meant as bp but labelled percent would be 42,150 bp: a unit mistake, not a yield
        assertThatThrownBy(() -> YieldBounds.DEFAULT.toBasisPoints(421.5, YieldUnit.PERCENT))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("421.5 percent")
                .hasMessageContaining("check the unit");
    }

    @Test
    void nonFiniteIsRejected() {
        assertThatThrownBy(() -> YieldBounds.DEFAULT.toBasisPoints(Double.NaN, YieldUnit.BASIS_POINTS)).hasMessageContaining("NaN");
    }
}
