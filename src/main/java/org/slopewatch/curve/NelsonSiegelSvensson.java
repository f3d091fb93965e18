package org.slopewatch.curve;

/**
 * A Nelson–Siegel–Svensson curve: zero rates and forward rates as smooth functions of maturity.
 *
 * <p>Rates come out in the unit the betas are in (basis points inside the engine), continuously
 * compounded. With {@code beta3 = 0} it is the plain Nelson–Siegel curve and {@code tau2} is unused.
 *
 * <pre>
 * y(t) = b0 + b1·g(t/τ1) + b2·(g(t/τ1) − e^(−t/τ1)) + b3·(g(t/τ2) − e^(−t/τ2)),  g(x) = (1 − e^(−x)) / x
 * f(t) = b0 + b1·e^(−t/τ1) + b2·(t/τ1)·e^(−t/τ1) + b3·(t/τ2)·e^(−t/τ2)
 * </pre>
 */
public record NelsonSiegelSvensson(double beta0, double beta1, double beta2, double beta3, double tau1, double tau2) {

    public NelsonSiegelSvensson {
        if (!(tau1 > 0) || !(tau2 > 0)) {
            throw new IllegalArgumentException("decay parameters must be positive, got tau1=" + tau1 + ", tau2=" + tau2);
        }
    }

    /** The zero rate for a maturity in years; at zero maturity the limit b0 + b1. */
    public double zeroRate(double years) {
        if (years <= 0) {
            return beta0 + beta1;
        }
        double x1 = years / tau1;
        double x2 = years / tau2;
        double e1 = Math.exp(-x1);
        double e2 = Math.exp(-x2);
        double g1 = loading(x1);
        double g2 = loading(x2);
        return beta0 + beta1 * g1 + beta2 * (g1 - e1) + beta3 * (g2 - e2);
    }

    /** The instantaneous forward rate at a maturity in years. */
    public double instantaneousForward(double years) {
        double x1 = Math.max(years, 0) / tau1;
        double x2 = Math.max(years, 0) / tau2;
        double e1 = Math.exp(-x1);
        return beta0 + beta1 * e1 + beta2 * x1 * e1 + beta3 * x2 * Math.exp(-x2);
    }

    /** The forward rate between two maturities (in years, {@code from < to}), continuously compounded. */
    public double forwardRate(double fromYears, double toYears) {
        if (!(toYears > fromYears)) {
            throw new IllegalArgumentException("forward period must end after it starts: " + fromYears + " .. " + toYears);
        }
        return (zeroRate(toYears) * toYears - zeroRate(fromYears) * fromYears) / (toYears - fromYears);
    }

    /** (1 − e^(−x)) / x, with its series near zero where the quotient loses precision. */
    static double loading(double x) {
        if (Math.abs(x) < 1e-6) {
            return 1 - x / 2 + x * x / 6;
        }
        return -Math.expm1(-x) / x;
    }
}
