package org.slopewatch.ingest.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.slopewatch.ingest.demo.TwoFactorModel.Factor;

/**
 * The closed-form bond prices against what they claim to be: the short rate at zero maturity, the
 * stated limit at infinite maturity, and a Monte Carlo estimate of E[exp(−∫r)]. The Monte Carlo
 * case uses volatilities far above the demo's so that the convexity and correlation terms are
 * large enough for a mistake in them to show.
 */
class TwoFactorModelTest {

    /** Deliberately volatile, strongly correlated and with a term premium on both factors. */
    private static final TwoFactorModel STRESSED = new TwoFactorModel(0.03,
            new Factor(0.5, 0.02, 0.01),
            new Factor(0.05, 0.015, 0.02),
            -0.6, 0.3);

    @Test
    void theYieldAtAVanishingMaturityIsTheShortRate() {
        double x1 = 0.012;
        double x2 = -0.004;
        double gap = 0.025;
        double r = 0.03 + gap + x1 + x2;
        assertThat(STRESSED.shortRate(x1, x2, gap)).isCloseTo(r, within(1e-15));
        assertThat(STRESSED.zeroYield(1e-8, x1, x2, gap)).as("y(τ) → r as τ → 0").isCloseTo(r, within(1e-9));
        assertThat(STRESSED.zeroYield(1.0 / 365, x1, x2, gap)).as("a one-day yield is within a basis point of r")
                .isCloseTo(r, within(1e-4));
    }

    @Test
    void longYieldsTendToTheStatedLimitWhateverTheState() {
        // the limit written out independently of the class: φ∞ + θ1 + θ2 − σ1²/(2a1²) − σ2²/(2a2²) − ρσ1σ2/(a1a2)
        double limit = 0.03 + 0.01 + 0.02 - 0.02 * 0.02 / (2 * 0.25) - 0.015 * 0.015 / (2 * 0.0025)
                - (-0.6) * 0.02 * 0.015 / (0.5 * 0.05);
        assertThat(STRESSED.longYieldLimit()).isCloseTo(limit, within(1e-15));
        for (double[] state : new double[][] {{0, 0, 0}, {0.02, -0.01, 0.03}, {-0.01, 0.015, -0.02}}) {
            // the yield approaches its limit like 1/τ, with a constant of order 1/a² for the slow factor
            assertThat(STRESSED.zeroYield(1e9, state[0], state[1], state[2]))
                    .as("the billion-year yield from state (%s, %s, %s)", state[0], state[1], state[2])
                    .isCloseTo(limit, within(1e-8));
        }
    }

    @Test
    void theBondPriceIsTheMonteCarloExpectationOfTheDiscountFactor() {
        double x1 = 0.01;
        double x2 = -0.005;
        double gap = 0.02;
        for (double tau : new double[] {2, 10}) {
            MonteCarlo mc = discountFactor(STRESSED, tau, x1, x2, gap, 20_000, 52, 20260105L);
            double closedForm = STRESSED.bondPrice(tau, x1, x2, gap);
            double tolerance = 4 * mc.standardError() + 1e-5;
            assertThat(mc.mean())
                    .as("E[exp(-∫r)] over %s years by Monte Carlo (%s ± %s) against the closed form %s", tau, mc.mean(),
                            mc.standardError(), closedForm)
                    .isCloseTo(closedForm, within(tolerance));
            // the check has power: dropping the convexity term V(τ)/2 would move the price by more than it tolerates
            double withoutConvexity = closedForm * Math.exp(-STRESSED.variance(tau) / 2);
            assertThat(Math.abs(closedForm - withoutConvexity)).as("convexity effect at %s years", tau)
                    .isGreaterThan(3 * tolerance);
        }
    }

    @Test
    void theExactStepCarriesTheTextbookMeanVarianceAndCovarianceOverAYearOfDailySteps() {
        TwoFactorModel m = STRESSED;
        int paths = 20_000;
        double x10 = 0.02;
        double x20 = -0.01;
        double[] end1 = new double[paths];
        double[] end2 = new double[paths];
        Random random = new Random(7);
        for (int p = 0; p < paths; p++) {
            double[] x = {x10, x20};
            for (int d = 0; d < 365; d++) {
                m.step(x, 1.0 / 365, random);
            }
            end1[p] = x[0];
            end2[p] = x[1];
        }
        // Ornstein–Uhlenbeck over one year from a fixed start, under the simulation measure (mean zero)
        double a1 = 0.5;
        double a2 = 0.05;
        double mean1 = x10 * Math.exp(-a1);
        double mean2 = x20 * Math.exp(-a2);
        double var1 = 0.02 * 0.02 * (1 - Math.exp(-2 * a1)) / (2 * a1);
        double var2 = 0.015 * 0.015 * (1 - Math.exp(-2 * a2)) / (2 * a2);
        double cov = -0.6 * 0.02 * 0.015 * (1 - Math.exp(-(a1 + a2))) / (a1 + a2);
        double m1 = average(end1);
        double m2 = average(end2);
        assertThat(m1).as("mean of the fast factor").isCloseTo(mean1, within(4 * Math.sqrt(var1 / paths)));
        assertThat(m2).as("mean of the slow factor").isCloseTo(mean2, within(4 * Math.sqrt(var2 / paths)));
        double s11 = 0;
        double s22 = 0;
        double s12 = 0;
        for (int p = 0; p < paths; p++) {
            s11 += (end1[p] - m1) * (end1[p] - m1);
            s22 += (end2[p] - m2) * (end2[p] - m2);
            s12 += (end1[p] - m1) * (end2[p] - m2);
        }
        // sampling error of a variance is about √(2/n) ≈ 1 % here
        assertThat(s11 / (paths - 1)).as("variance of the fast factor").isCloseTo(var1, within(0.05 * var1));
        assertThat(s22 / (paths - 1)).as("variance of the slow factor").isCloseTo(var2, within(0.05 * var2));
        assertThat(s12 / (paths - 1)).as("covariance of the factors").isCloseTo(cov, within(0.05 * Math.sqrt(var1 * var2)));
    }

    @Test
    void parametersOutsideTheModelAreRejected() {
        assertThatThrownBy(() -> new Factor(0, 0.01, 0)).hasMessageContaining("speed");
        assertThatThrownBy(() -> new Factor(0.1, -0.01, 0)).hasMessageContaining("volatility");
        Factor f = new Factor(0.1, 0.01, 0);
        assertThatThrownBy(() -> new TwoFactorModel(0.02, f, f, 1.0, 0.5)).hasMessageContaining("correlation");
        assertThatThrownBy(() -> new TwoFactorModel(0.02, f, f, 0, 0)).hasMessageContaining("policy reversion");
        assertThatThrownBy(() -> STRESSED.zeroYield(0, 0, 0, 0)).hasMessageContaining("maturity");
    }

    private record MonteCarlo(double mean, double standardError) {
    }

    /**
     * E[exp(−∫_0^τ r)] under the pricing measure: the factors revert to θ_i (simulated as the
     * mean-zero deviations x_i − θ_i), the gap decays at κ, the integral by the trapezoid rule on
     * a weekly grid. Antithetic pairs share their normals with opposite signs.
     */
    private static MonteCarlo discountFactor(TwoFactorModel m, double tau, double x1, double x2, double gap, int pairs,
                                             int stepsPerYear, long seed) {
        int steps = (int) Math.round(tau * stepsPerYear);
        double h = tau / steps;
        double theta1 = m.fast().pricedMean();
        double theta2 = m.slow().pricedMean();
        double sum = 0;
        double sumSq = 0;
        Random plain = new Random(seed);
        Random mirrored = new Random(seed) {
            @Override
            public synchronized double nextGaussian() {
                return -super.nextGaussian();
            }
        };
        for (int p = 0; p < pairs; p++) {
            double a = discountedPath(m, x1 - theta1, x2 - theta2, gap, steps, h, plain);
            double b = discountedPath(m, x1 - theta1, x2 - theta2, gap, steps, h, mirrored);
            double pair = (a + b) / 2;
            sum += pair;
            sumSq += pair * pair;
        }
        double mean = sum / pairs;
        double variance = (sumSq - pairs * mean * mean) / (pairs - 1);
        return new MonteCarlo(mean, Math.sqrt(variance / pairs));
    }

    private static double discountedPath(TwoFactorModel m, double y1, double y2, double gap, int steps, double h, Random random) {
        double theta = m.fast().pricedMean() + m.slow().pricedMean();
        double[] y = {y1, y2};
        double rate = m.longRunRate() + theta + gap + y[0] + y[1];
        double integral = 0;
        for (int k = 1; k <= steps; k++) {
            m.step(y, h, random);
            double g = gap * Math.exp(-m.policyReversion() * k * h);
            double next = m.longRunRate() + theta + g + y[0] + y[1];
            integral += (rate + next) / 2 * h;
            rate = next;
        }
        return Math.exp(-integral);
    }

    private static double average(double[] values) {
        double s = 0;
        for (double v : values) {
            s += v;
        }
        return s / values.length;
    }
}
