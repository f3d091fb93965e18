package org.slopewatch.probability;

/**
 * A 2×2 covariance matrix of the probit coefficients (α, β).
 */
public record Covariance(double varAlpha, double covAlphaBeta, double varBeta) {

    public Covariance {
        if (!(varAlpha >= 0.0) || !(varBeta >= 0.0) || !Double.isFinite(covAlphaBeta)
                || Double.isInfinite(varAlpha) || Double.isInfinite(varBeta)) {
            throw new IllegalArgumentException("not a covariance matrix: var(alpha)=" + varAlpha
                    + " cov=" + covAlphaBeta + " var(beta)=" + varBeta);
        }
    }

    public double seAlpha() {
        return Math.sqrt(varAlpha);
    }

    public double seBeta() {
        return Math.sqrt(varBeta);
    }

    /** Variance of the index α + β·s: (1, s) V (1, s)'. */
    public double indexVariance(double spreadPct) {
        // The exact variance of a linear combination; clamp rounding just below zero.
        return Math.max(0.0, varAlpha + 2.0 * spreadPct * covAlphaBeta + spreadPct * spreadPct * varBeta);
    }
}
