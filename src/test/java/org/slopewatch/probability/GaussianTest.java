package org.slopewatch.probability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.assertj.core.api.Assertions.withinPercentage;

import org.junit.jupiter.api.Test;

/**
 * Tail behaviour of the normal helpers. Expected values from R 4.2.2 ({@code pnorm}, {@code dnorm},
 * {@code qnorm}), run while writing this test; each call is named beside its value.
 */
class GaussianTest {

    @Test
    void logCdfIsFiniteAndAccurateWhereCdfUnderflows() {
        // R: pnorm(-40, log.p = TRUE) = -804.6084420137538 (Φ(−40) itself is below the smallest double)
        assertThat(Gaussian.logCdf(-40.0)).isCloseTo(-804.6084420137538, withinPercentage(1e-10));
        // R: pnorm(-38, log.p = TRUE) = -726.5572160188201 (just past the switch to the series)
        assertThat(Gaussian.logCdf(-38.0)).isCloseTo(-726.5572160188201, withinPercentage(1e-10));
        // R: pnorm(-30, log.p = TRUE) = -454.32124395634321 (direct branch)
        assertThat(Gaussian.logCdf(-30.0)).isCloseTo(-454.32124395634321, withinPercentage(1e-10));
    }

    @Test
    void logCdfKeepsTheUpperTailMass() {
        // R: pnorm(10, log.p = TRUE) = -7.6198530241605269e-24; log(Φ(10)) would round to 0
        assertThat(Gaussian.logCdf(10.0)).isCloseTo(-7.6198530241605269e-24, withinPercentage(1e-6));
    }

    @Test
    void cdfInTheLowerTail() {
        // R: pnorm(-8) = 6.2209605742717849e-16
        assertThat(Gaussian.cdf(-8.0)).isCloseTo(6.2209605742717849e-16, withinPercentage(1e-8));
    }

    @Test
    void inverseMillsRatioOnBothSidesOfTheSwitch() {
        // R: dnorm(-20) / pnorm(-20) = 20.049753068527853
        assertThat(Gaussian.inverseMillsRatio(-20.0)).isCloseTo(20.049753068527853, withinPercentage(1e-10));
        // R: exp(dnorm(-50, log = TRUE) - pnorm(-50, log.p = TRUE)) = 50.019984031902176
        assertThat(Gaussian.inverseMillsRatio(-50.0)).isCloseTo(50.019984031902176, withinPercentage(1e-10));
        // φ(z)/Φ(z) → 0 for large z: no 0/0 even where φ underflows
        assertThat(Gaussian.inverseMillsRatio(45.0)).isEqualTo(0.0);
    }

    @Test
    void inverseCdfAtNinetyFivePercent() {
        // R: qnorm(0.95) = 1.6448536269514715
        assertThat(Gaussian.inverseCdf(0.95)).isCloseTo(1.6448536269514715, within(1e-12));
    }
}
