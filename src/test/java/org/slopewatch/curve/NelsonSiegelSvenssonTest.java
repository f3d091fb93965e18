package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.analysis.integration.SimpsonIntegrator;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Sources: the Svensson (1994) zero-rate and forward-rate formulas (from memory, see
 * {@link SvenssonFormula}); for continuously compounded zero rates y(t) the instantaneous forward
 * is f(t) = d[t·y(t)]/dt and the forward over [t1, t2] is the average of f over it (standard
 * definitions, from memory). Worked values computed by hand in the comments.
 */
class NelsonSiegelSvenssonTest {

    private static final NelsonSiegelSvensson CURVE = new NelsonSiegelSvensson(450, -150, 200, -100, 1.5, 8);
    private static final NelsonSiegelSvensson INVERTED = new NelsonSiegelSvensson(380, 160, -90, 60, 0.7, 4);

    /*
     * At t = 1.5 (so x1 = t/τ1 = 1 and x2 = t/τ2 = 0.1875), by hand:
     *   e^(−1) = 0.3678794,  g1 = 1 − 0.3678794 = 0.6321206
     *   e^(−0.1875) = 0.8290291,  g2 = (1 − 0.8290291)/0.1875 = 0.9118448
     *   y = 450 − 150·0.6321206 + 200·(0.6321206 − 0.3678794) − 100·(0.9118448 − 0.8290291)
     *     = 450 − 94.81809 + 52.84824 − 8.28157 = 399.74858
     *   f = 450 − 150·0.3678794 + 200·1·0.3678794 − 100·0.1875·0.8290291
     *     = 450 − 55.18191 + 73.57588 − 15.54430 = 452.84967
     */
    @Test
    void zeroAndForwardMatchHandWorkedValues() {
        assertThat(CURVE.zeroRate(1.5)).as("Svensson zero rate at 1.5y, hand-worked").isCloseTo(399.74858, within(1e-4));
        assertThat(CURVE.instantaneousForward(1.5)).as("Svensson forward at 1.5y, hand-worked").isCloseTo(452.84967, within(1e-4));
    }

    @ParameterizedTest(name = "t={0}")
    @ValueSource(doubles = {0.02, 0.25, 1.0, 1.5, 3.7, 10.0, 30.0})
    void zeroRateFollowsThePublishedFormula(double t) {
        SvenssonFormula formula = new SvenssonFormula(450, -150, 200, -100, 1.5, 8);
        assertThat(CURVE.zeroRate(t)).as("Svensson (1994) zero rate").isCloseTo(formula.zero(t), within(1e-9));
    }

    /*
     * Central difference of t·y(t) with h = 1e-5: truncation h²·|f''|/6, with |f''| up to about
     * 1,000 bp/y² near the short end of a 0.7-year hump, is about 2e-8 bp; rounding is about
     * 1e-16·30·500/1e-5 ≈ 1.5e-7 bp. 1e-6 bp leaves room and still catches any wrong term (the
     * smallest term in play is worth several bp).
     */
    @ParameterizedTest(name = "t={0}")
    @ValueSource(doubles = {0.05, 0.25, 0.7, 1.5, 2.0, 4.0, 8.0, 15.0, 29.0})
    void instantaneousForwardIsTheDerivativeOfTimesZero(double t) {
        double h = 1e-5;
        for (NelsonSiegelSvensson c : new NelsonSiegelSvensson[] {CURVE, INVERTED}) {
            double derivative = ((t + h) * c.zeroRate(t + h) - (t - h) * c.zeroRate(t - h)) / (2 * h);
            assertThat(c.instantaneousForward(t)).as("f(t) = d[t·y(t)]/dt for %s", c).isCloseTo(derivative, within(1e-6));
        }
    }

    @Test
    void forwardRateIsTheAverageInstantaneousForward() {
        // tight tolerances: the default relative accuracy (1e-6) would allow 5e-4 bp of slack
        SimpsonIntegrator simpson = new SimpsonIntegrator(1e-13, 1e-10, 3, 64);
        double[][] periods = {{0.25, 0.5}, {1.5, 1.75}, {2, 10}, {0, 1}};
        for (double[] p : periods) {
            double integral = simpson.integrate(1_000_000, CURVE::instantaneousForward, p[0], p[1]);
            assertThat(CURVE.forwardRate(p[0], p[1])).as("forward over [%s, %s] = mean of f", p[0], p[1])
                    .isCloseTo(integral / (p[1] - p[0]), within(1e-6));
        }
    }

    @Test
    void flatParametersGiveTheLevelEverywhere() {
        NelsonSiegelSvensson flat = new NelsonSiegelSvensson(425, 0, 0, 0, 1.2, 6);
        for (double t : new double[] {0.0, 0.1, 1.5, 10, 30}) {
            assertThat(flat.zeroRate(t)).as("zero at %s", t).isEqualTo(425.0);
            assertThat(flat.instantaneousForward(t)).as("forward at %s", t).isEqualTo(425.0);
        }
        assertThat(flat.forwardRate(1.5, 1.75)).isCloseTo(425.0, within(1e-9));
    }

    @Test
    void shortEndTendsToLevelPlusSlope() {
        // as t → 0 every loading → 1 and every hump → 0 (Nelson and Siegel 1987, from memory)
        assertThat(CURVE.zeroRate(1e-9)).isCloseTo(450 - 150, within(1e-6));
        assertThat(CURVE.zeroRate(0)).isEqualTo(300.0);
        assertThat(CURVE.instantaneousForward(0)).isEqualTo(300.0);
    }

    @Test
    void loadingSeriesJoinsTheClosedForm() {
        // (1 − e^(−x))/x = 1 − x/2 + x²/6 − …; at the switch point both must agree to rounding
        double x = 1e-6;
        assertThat(NelsonSiegelSvensson.loading(x * 0.999)).isCloseTo(-Math.expm1(-x * 0.999) / (x * 0.999), within(1e-15));
        assertThat(NelsonSiegelSvensson.loading(x * 1.001)).isCloseTo(1 - x * 1.001 / 2, within(1e-12));
    }

    @Test
    void rejectsNonPositiveDecay() {
        assertThatThrownBy(() -> new NelsonSiegelSvensson(400, 0, 0, 0, 0, 1)).hasMessageContaining("tau1=0.0");
        assertThatThrownBy(() -> new NelsonSiegelSvensson(400, 0, 0, 0, 1, Double.NaN)).hasMessageContaining("tau2=NaN");
        assertThatThrownBy(() -> CURVE.forwardRate(2, 1)).hasMessageContaining("2.0 .. 1.0");
    }
}
