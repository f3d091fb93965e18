package org.slopewatch.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * Sources: the definition of the derivative (central differences) for the Golub–Pereyra
 * Jacobian; the published Svensson (1994) formula ({@link SvenssonFormula}, from memory) for
 * the betas solved at known decay parameters.
 */
class NssProfileTest {

    private static final double[] YEARS = {1 / 12.0, 0.25, 0.5, 1, 2, 3, 5, 7, 10, 20, 30};

    @Test
    void betasAtTheTrueDecayParametersAreTheTrueBetas() {
        SvenssonFormula truth = new SvenssonFormula(450, -150, 200, -100, 1.5, 8);
        NssProfile profile = new NssProfile(YEARS, sample(truth), true);

        NelsonSiegelSvensson curve = profile.curve(new double[] {Math.log(1.5), Math.log(8)});

        assertThat(curve.beta0()).isCloseTo(450, within(1e-8));
        assertThat(curve.beta1()).isCloseTo(-150, within(1e-8));
        assertThat(curve.beta2()).isCloseTo(200, within(1e-8));
        assertThat(curve.beta3()).isCloseTo(-100, within(1e-8));
    }

    /*
     * Central differences with h = 1e-5 in ln τ: truncation O(h²) and rounding about
     * 1e-16·500/1e-5 = 5e-9 bp, against derivatives of order 1–100 bp; 1e-5 relative catches a
     * dropped or mis-signed term of the Jacobian, which changes it by far more.
     */
    @Test
    void jacobianMatchesNumericalDerivative() {
        // noisy data, so that the residual term of the Jacobian matters
        SvenssonFormula truth = new SvenssonFormula(420, 120, -80, 50, 0.9, 6);
        double[] yields = sample(truth);
        for (int i = 0; i < yields.length; i++) {
            yields[i] += (i % 3 - 1) * 3.0;
        }
        check(new NssProfile(YEARS, yields, true), new double[] {Math.log(1.3), Math.log(11)});
        check(new NssProfile(YEARS, yields, true), new double[] {Math.log(0.4), Math.log(3)});
        check(new NssProfile(YEARS, yields, false), new double[] {Math.log(2.2)});
    }

    private static void check(NssProfile profile, double[] at) {
        double h = 1e-5;
        double[][] jacobian = new double[YEARS.length][at.length];
        profile.cost(at);
        profile.jacobian(jacobian);
        for (int j = 0; j < at.length; j++) {
            double[] up = at.clone();
            double[] down = at.clone();
            up[j] += h;
            down[j] -= h;
            // the fitted yield at a quoted maturity is the fitted curve's zero rate there
            NelsonSiegelSvensson plus = profile.curve(up);
            NelsonSiegelSvensson minus = profile.curve(down);
            for (int i = 0; i < YEARS.length; i++) {
                double numeric = (plus.zeroRate(YEARS[i]) - minus.zeroRate(YEARS[i])) / (2 * h);
                assertThat(jacobian[i][j]).as("∂ŷ(%s)/∂ln τ%d", YEARS[i], j + 1)
                        .isCloseTo(numeric, within(1e-5 * Math.max(1.0, Math.abs(numeric))));
            }
        }
    }

    @Test
    void costIsTheSumOfSquaredResidualsOfTheFittedCurve() {
        SvenssonFormula truth = new SvenssonFormula(420, 120, -80, 50, 0.9, 6);
        double[] yields = sample(truth);
        yields[4] += 5.0;
        NssProfile profile = new NssProfile(YEARS, yields, true);
        double[] at = {Math.log(1.1), Math.log(7)};
        double cost = profile.cost(at);
        NelsonSiegelSvensson curve = profile.curve(at);
        double sum = 0.0;
        for (int i = 0; i < YEARS.length; i++) {
            double r = yields[i] - curve.zeroRate(YEARS[i]);
            sum += r * r;
        }
        assertThat(cost).isCloseTo(sum, within(1e-9 * Math.max(1.0, sum)));
    }

    @Test
    void clampKeepsDecayInRange() {
        NssProfile profile = new NssProfile(YEARS, new double[YEARS.length], true);
        double[] clamped = {Double.NaN, 40.0};
        profile.clamp(clamped);
        assertThat(Math.exp(clamped[0])).as("1M/1.7933 = 0.046 < 0.05: floor applies").isCloseTo(0.05, within(1e-12));
        assertThat(Math.exp(clamped[1])).isCloseTo(50.0, within(1e-9));
    }

    @Test
    void decayFloorRisesWithTheShortestMaturity() {
        NssProfile fromOneYear = new NssProfile(new double[] {1, 3, 5, 10}, new double[4], false);
        assertThat(fromOneYear.minTau()).as("1Y / 1.7933").isCloseTo(0.55763, within(1e-5));
        double[] clamped = {Math.log(0.1)};
        fromOneYear.clamp(clamped);
        assertThat(Math.exp(clamped[0])).isCloseTo(0.55763, within(1e-5));
    }

    /*
     * The hump loading h(x) = (1 − e^(−x))/x − e^(−x) has h'(x) = 0 where e^(−x)·(1 + x + x²) = 1
     * (differentiate and multiply by x²); at x = 1.7933, by hand: e^(−1.7933) = 0.16641,
     * 1 + 1.7933 + 3.21593 = 6.00923, product 1.00000.
     */
    @Test
    void humpPeakConstantIsWhereTheHumpPeaks() {
        double x = NssProfile.HUMP_PEAK_X;
        assertThat(Math.exp(-x) * (1 + x + x * x)).isCloseTo(1.0, within(1e-4));
        assertThat(hump(x)).isGreaterThan(hump(x - 0.01)).isGreaterThan(hump(x + 0.01));
    }

    private static double hump(double x) {
        return (1 - Math.exp(-x)) / x - Math.exp(-x);
    }

    private static double[] sample(SvenssonFormula truth) {
        double[] y = new double[YEARS.length];
        for (int i = 0; i < YEARS.length; i++) {
            y[i] = truth.zero(YEARS[i]);
        }
        return y;
    }
}
