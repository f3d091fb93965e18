package org.slopewatch.ingest.demo;

import java.util.Random;

/**
 * A two-factor Gaussian short-rate model with a policy gap, and its closed-form zero-coupon
 * bond prices. Rates are decimals per year, times in years.
 *
 * <p>The short rate is {@code r = φ∞ + g + x1 + x2}: a long-run level {@code φ∞}, a policy gap
 * {@code g} (the scripted policy stance relative to its long-run level, so {@code φ(t) = φ∞ + g(t)})
 * and two mean-reverting Gaussian factors, a fast one and a slow one, with correlated shocks:
 * <pre>
 * pricing measure:  dx_i = a_i·(θ_i − x_i)·dt + σ_i·dW_i,   dW_1·dW_2 = ρ·dt
 *                   dg   = −κ·g·dt
 * simulation:       dx_i = −a_i·x_i·dt + σ_i·dW_i           (θ_i is the term premium the market charges)
 *                   g(t) follows the scenario's script
 * </pre>
 * The market does not foresee the script: it prices today's gap as decaying at rate {@code κ}.
 * That is what inverts the curve when the gap is wide, since short yields carry the whole gap and
 * long yields only its expected average.
 *
 * <p>Bond prices are exponential-affine. With {@code B_c(τ) = (1 − e^{−cτ})/c}:
 * <pre>
 * P(τ)  = exp( A(τ) − B_{a1}(τ)·x1 − B_{a2}(τ)·x2 − B_κ(τ)·g )
 * A(τ)  = −φ∞·τ − θ1·(τ − B_{a1}(τ)) − θ2·(τ − B_{a2}(τ)) + V(τ)/2
 * V(τ)  = σ1²/a1²·(τ − 2·B_{a1}(τ) + B_{2a1}(τ)) + σ2²/a2²·(τ − 2·B_{a2}(τ) + B_{2a2}(τ))
 *         + 2ρ·σ1·σ2/(a1·a2)·(τ − B_{a1}(τ) − B_{a2}(τ) + B_{a1+a2}(τ))
 * y(τ)  = −ln P(τ)/τ        (continuously compounded zero yield)
 * </pre>
 * {@code V(τ)} is the variance of {@code ∫x1 + ∫x2} over {@code τ}. As {@code τ → 0} the yield tends
 * to the short rate; as {@code τ → ∞} it tends to {@link #longYieldLimit()}
 * {@code = φ∞ + θ1 + θ2 − σ1²/(2a1²) − σ2²/(2a2²) − ρ·σ1·σ2/(a1·a2)}.
 *
 * <p>The factors are stepped exactly ({@link #step}): over {@code Δ} years each decays by
 * {@code e^{−a_i·Δ}} and receives a Gaussian shock with variance {@code σ_i²·B_{2a_i}(Δ)} and
 * covariance {@code ρ·σ1·σ2·B_{a1+a2}(Δ)}, so a Monday after a weekend is one step of three days.
 *
 * @param longRunRate     φ∞, the level the policy rate returns to
 * @param fast            the fast factor (speed, volatility, term premium)
 * @param slow            the slow factor
 * @param correlation     ρ between the two factors' shocks, in (−1, 1)
 * @param policyReversion κ, the rate at which the market expects the policy gap to close
 */
public record TwoFactorModel(double longRunRate, Factor fast, Factor slow, double correlation, double policyReversion) {

    /**
     * One Gaussian factor.
     *
     * @param speed       mean-reversion speed a, per year (positive)
     * @param volatility  σ, per square-root year (non-negative)
     * @param pricedMean  θ, the level the market prices it as reverting to (the term premium)
     */
    public record Factor(double speed, double volatility, double pricedMean) {

        public Factor {
            if (!(speed > 0) || !Double.isFinite(speed)) {
                throw new IllegalArgumentException("factor speed must be positive and finite, got " + speed);
            }
            if (!(volatility >= 0) || !Double.isFinite(volatility)) {
                throw new IllegalArgumentException("factor volatility must be non-negative and finite, got " + volatility);
            }
            if (!Double.isFinite(pricedMean)) {
                throw new IllegalArgumentException("factor priced mean must be finite, got " + pricedMean);
            }
        }
    }

    public TwoFactorModel {
        if (!Double.isFinite(longRunRate)) {
            throw new IllegalArgumentException("long-run rate must be finite, got " + longRunRate);
        }
        if (!(correlation > -1 && correlation < 1)) {
            throw new IllegalArgumentException("correlation must lie in (-1, 1), got " + correlation);
        }
        if (!(policyReversion > 0) || !Double.isFinite(policyReversion)) {
            throw new IllegalArgumentException("policy reversion must be positive and finite, got " + policyReversion);
        }
    }

    /** The instantaneous short rate for a state. */
    public double shortRate(double x1, double x2, double gap) {
        return longRunRate + gap + x1 + x2;
    }

    // StrictMath rather than Math throughout: the demo promises the same numbers for a seed on
    // every JVM and platform, and Math's intrinsics may differ in the last bit.

    /** {@code B_c(τ) = (1 − e^{−cτ})/c}, computed without cancellation for small {@code cτ}. */
    static double b(double c, double tau) {
        return -StrictMath.expm1(-c * tau) / c;
    }

    /** {@code A(τ)} of the bond price, the part that does not depend on the state. */
    public double affineConstant(double tau) {
        double a1 = fast.speed();
        double a2 = slow.speed();
        return -longRunRate * tau - fast.pricedMean() * (tau - b(a1, tau)) - slow.pricedMean() * (tau - b(a2, tau))
                + variance(tau) / 2;
    }

    /** {@code V(τ)}, the variance of the integrated factors over {@code τ}. */
    public double variance(double tau) {
        double a1 = fast.speed();
        double a2 = slow.speed();
        double s1 = fast.volatility();
        double s2 = slow.volatility();
        return s1 * s1 / (a1 * a1) * (tau - 2 * b(a1, tau) + b(2 * a1, tau))
                + s2 * s2 / (a2 * a2) * (tau - 2 * b(a2, tau) + b(2 * a2, tau))
                + 2 * correlation * s1 * s2 / (a1 * a2) * (tau - b(a1, tau) - b(a2, tau) + b(a1 + a2, tau));
    }

    /** The zero-coupon bond price for maturity {@code tau} years. */
    public double bondPrice(double tau, double x1, double x2, double gap) {
        checkMaturity(tau);
        return StrictMath.exp(affineConstant(tau) - b(fast.speed(), tau) * x1 - b(slow.speed(), tau) * x2 - b(policyReversion, tau) * gap);
    }

    /** The continuously compounded zero yield for maturity {@code tau} years. */
    public double zeroYield(double tau, double x1, double x2, double gap) {
        checkMaturity(tau);
        return -(affineConstant(tau) - b(fast.speed(), tau) * x1 - b(slow.speed(), tau) * x2 - b(policyReversion, tau) * gap) / tau;
    }

    /** The limit of the zero yield as the maturity grows without bound, the same for every state. */
    public double longYieldLimit() {
        double a1 = fast.speed();
        double a2 = slow.speed();
        double s1 = fast.volatility();
        double s2 = slow.volatility();
        return longRunRate + fast.pricedMean() + slow.pricedMean() - s1 * s1 / (2 * a1 * a1) - s2 * s2 / (2 * a2 * a2)
                - correlation * s1 * s2 / (a1 * a2);
    }

    /**
     * Advances the factors {@code x = {x1, x2}} in place by {@code dtYears} under the simulation
     * dynamics (mean zero), exactly, drawing two standard normals from {@code random}.
     */
    public void step(double[] x, double dtYears, Random random) {
        if (!(dtYears > 0)) {
            throw new IllegalArgumentException("time step must be positive, got " + dtYears);
        }
        double a1 = fast.speed();
        double a2 = slow.speed();
        double s1 = fast.volatility();
        double s2 = slow.volatility();
        double var1 = s1 * s1 * b(2 * a1, dtYears);
        double var2 = s2 * s2 * b(2 * a2, dtYears);
        double cov = correlation * s1 * s2 * b(a1 + a2, dtYears);
        double z1 = random.nextGaussian();
        double z2 = random.nextGaussian();
        // Cholesky factor of [[var1, cov], [cov, var2]]
        double l11 = StrictMath.sqrt(var1);
        double l21 = l11 > 0 ? cov / l11 : 0;
        double l22 = StrictMath.sqrt(StrictMath.max(0, var2 - l21 * l21));
        x[0] = x[0] * StrictMath.exp(-a1 * dtYears) + l11 * z1;
        x[1] = x[1] * StrictMath.exp(-a2 * dtYears) + l21 * z1 + l22 * z2;
    }

    private static void checkMaturity(double tau) {
        if (!(tau > 0) || !Double.isFinite(tau)) {
            throw new IllegalArgumentException("maturity must be positive and finite, got " + tau);
        }
    }
}
